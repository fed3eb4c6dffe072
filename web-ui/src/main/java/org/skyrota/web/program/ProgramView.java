package org.skyrota.web.program;

import java.util.List;

/** A stored program as the API shows it. */
record ProgramView(long id, long version, String code, String title, String principalInvestigator, boolean active,
                   List<ProgramForm.GrantForm> grants) {

    static ProgramView of(Program p) {
        return new ProgramView(p.getId(), p.getVersion(), p.getCode(), p.getTitle(), p.getPrincipalInvestigator(), p.isActive(),
                p.getGrants().stream().map(g -> new ProgramForm.GrantForm(g.getTelescopeId(), g.getSiteId(), g.getHours(),
                        g.getFirstNight(), g.getLastNight())).toList());
    }
}
