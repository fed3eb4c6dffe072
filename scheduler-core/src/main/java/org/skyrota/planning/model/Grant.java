package org.skyrota.planning.model;

import java.time.LocalDate;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;

/**
 * Hours a program may still spend in this run: on one telescope, at one site, or anywhere, over a period of nights.
 * A visit pays from the most specific grant of its program that covers its telescope and night (a telescope's grant
 * before a site's, a site's before one for the whole network; among equals, the one whose period ends first); a
 * placement no grant covers is not offered to the planner, and a pin there breaks "Program over grant".
 *
 * @param id          stable identifier, for reports
 * @param programId   the program it belongs to
 * @param telescopeId the one telescope it pays for, or null
 * @param siteId      the one site it pays for (every telescope there), or null; ignored when telescopeId is given
 * @param firstNight  first night it pays for, or null for no start
 * @param lastNight   last night it pays for (inclusive), or null for no end
 * @param hours       hours still to spend: granted less what is observed, awaiting a report, or kept outside the run
 * @param label       how a person names it ("12.0 h on KF-35 from 2026-11-01 to 2027-04-30"), for reasons
 */
public record Grant(String id, String programId, String telescopeId, String siteId, LocalDate firstNight,
                    LocalDate lastNight, double hours, String label) {

    public Grant {
        Checks.notBlank("grant id", id);
        Checks.notBlank("programId of grant " + id, programId);
        Checks.notNegative("hours of grant " + id, hours);
        if (firstNight != null && lastNight != null && lastNight.isBefore(firstNight)) {
            throw new IllegalArgumentException("lastNight " + lastNight + " of grant " + id + " is before firstNight " + firstNight);
        }
        label = label == null || label.isBlank() ? "grant " + id : label;
    }

    /** A grant for the whole network and every night: what a program's {@code grantedHours} stands for. */
    public static Grant anywhere(String programId, double hours) {
        return new Grant(programId, programId, null, null, null, null, hours, "its grant");
    }

    /** Whether a visit on {@code telescope} in {@code night} may pay from this grant. */
    public boolean covers(Telescope telescope, LocalDate night) {
        if (firstNight != null && night.isBefore(firstNight) || lastNight != null && night.isAfter(lastNight)) {
            return false;
        }
        if (telescopeId != null) {
            return telescopeId.equals(telescope.id());
        }
        return siteId == null || siteId.equals(telescope.siteId());
    }

    /** 2 for one telescope, 1 for one site, 0 for the whole network: the more specific pays first. */
    public int specificity() {
        return telescopeId != null ? 2 : siteId != null ? 1 : 0;
    }

    /** The order in which a program's grants are asked to pay: most specific first, then the one ending first. */
    public static final Comparator<Grant> PAYING_ORDER = Comparator.comparingInt((Grant g) -> -g.specificity())
            .thenComparing(g -> g.lastNight() == null ? LocalDate.MAX : g.lastNight());

    /**
     * Of {@code grants}, the one that pays for a visit of program {@code programId} on {@code telescope} in
     * {@code night}: the first covering one in {@link #PAYING_ORDER} (among equals, the first given); empty when none
     * covers it. The planner and the server's grant ledger both ask here.
     */
    public static Optional<Grant> payer(List<Grant> grants, String programId, Telescope telescope, LocalDate night) {
        return grants.stream().filter(g -> g.programId().equals(programId) && g.covers(telescope, night))
                .min(PAYING_ORDER);
    }
}
