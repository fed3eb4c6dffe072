package org.skyrota.web.program;

import java.util.ArrayList;
import java.util.List;

import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.site.SiteRepository;
import org.skyrota.web.system.AuditLog;
import org.skyrota.web.system.ConflictException;
import org.skyrota.web.system.FieldProblem;
import org.skyrota.web.system.InvalidParametersException;
import org.skyrota.web.system.NotFoundException;
import org.skyrota.web.system.PageView;
import org.springframework.data.domain.Pageable;
import org.springframework.stereotype.Service;
import org.springframework.transaction.annotation.Transactional;

/** Reads and changes programs and their grants, one transaction per call. */
@Service
@Transactional
public class ProgramService {

    private final ProgramRepository programs;
    private final TelescopeRepository telescopes;
    private final SiteRepository sites;
    private final AuditLog audit;

    ProgramService(ProgramRepository programs, TelescopeRepository telescopes, SiteRepository sites, AuditLog audit) {
        this.audit = audit;
        this.programs = programs;
        this.telescopes = telescopes;
        this.sites = sites;
    }

    @Transactional(readOnly = true)
    public PageView<ProgramView> list(Boolean active, Pageable pageable) {
        return PageView.of(active == null ? programs.findAll(pageable) : programs.findByActive(active, pageable), ProgramView::of);
    }

    @Transactional(readOnly = true)
    public ProgramView get(long id) {
        return ProgramView.of(find(id));
    }

    /** The stored program, for other features' services inside their own transaction. */
    @Transactional(readOnly = true)
    public Program find(long id) {
        return programs.findById(id).orElseThrow(() -> new NotFoundException("program", id));
    }

    public ProgramView create(ProgramForm form) {
        if (programs.existsByCodeIgnoreCase(form.code())) {
            throw new ConflictException("A program with code '" + form.code() + "' exists already");
        }
        Program p = new Program(form.code(), form.title().trim(), form.principalInvestigator().trim());
        apply(form, p);
        ProgramView created = ProgramView.of(programs.saveAndFlush(p));
        audit.record("create", "program", created.id(), null, created);
        return created;
    }

    public ProgramView update(long id, ProgramForm form) {
        Program p = find(id);
        if (form.version() == null) {
            throw new InvalidParametersException(List.of(new FieldProblem("version", "is required when editing: send the version you read")));
        }
        p.requireVersion("program", form.version());
        ProgramView before = ProgramView.of(p);
        if (!p.getCode().equalsIgnoreCase(form.code()) && programs.existsByCodeIgnoreCase(form.code())) {
            throw new ConflictException("A program with code '" + form.code() + "' exists already");
        }
        p.setCode(form.code());
        p.setTitle(form.title().trim());
        p.setPrincipalInvestigator(form.principalInvestigator().trim());
        apply(form, p);
        ProgramView after = ProgramView.of(programs.saveAndFlush(p));
        audit.record("update", "program", id, before, after);
        return after;
    }

    public void delete(long id, Long version) {
        Program p = find(id);
        if (version != null) {
            p.requireVersion("program", version);
        }
        audit.record("delete", "program", id, ProgramView.of(p), null);
        programs.delete(p);
        programs.flush();
    }

    private void apply(ProgramForm form, Program p) {
        p.setActive(form.active() == null || form.active());
        List<Grant> grants = new ArrayList<>();
        List<FieldProblem> problems = new ArrayList<>();
        List<ProgramForm.GrantForm> given = form.grants() == null ? List.of() : form.grants();
        for (int i = 0; i < given.size(); i++) {
            ProgramForm.GrantForm g = given.get(i);
            if (g.telescopeId() != null && !telescopes.existsById(g.telescopeId())) {
                problems.add(new FieldProblem("grants[" + i + "].telescopeId", "names no stored telescope: " + g.telescopeId()));
            }
            if (g.siteId() != null && !sites.existsById(g.siteId())) {
                problems.add(new FieldProblem("grants[" + i + "].siteId", "names no stored site: " + g.siteId()));
            }
            grants.add(new Grant(g.telescopeId(), g.siteId(), g.hours(), g.firstNight(), g.lastNight()));
        }
        if (!problems.isEmpty()) {
            throw new InvalidParametersException(problems);
        }
        p.setGrants(grants);
    }
}
