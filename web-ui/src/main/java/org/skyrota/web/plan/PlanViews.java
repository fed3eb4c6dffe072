package org.skyrota.web.plan;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;

/** The plan documents of the API. */
public final class PlanViews {

    private PlanViews() {}

    /**
     * A plan between two nights. {@code revision} and {@code version} are null while there is no such plan;
     * {@code version} is what overrides send back ({@code ?version=}) to be refused when someone changed the plan since.
     * {@code now} is the server's time when the view was made: visits that started before it are history.
     */
    public record PlanView(Long revision, Long version, String state, LocalDate firstNight, LocalDate lastNight,
                           Instant publishedAt, String score, List<VisitView> visits, List<UnplacedView> unplaced,
                           List<NightView> closedNights, Instant now) {}

    /**
     * {@code ownerName} and {@code owner} (the same user name) are null on another requester's visit. For a moving
     * target ({@code targetKind} other than {@code fixed}) {@code raDeg} and {@code decDeg} are 0 and mean nothing.
     * {@code status} is how the visit stands now: planned, under way, awaiting report, observed, failed or missed.
     */
    public record VisitView(String id, long requestId, String targetName, double raDeg, double decDeg, long telescopeId,
                            long siteId, LocalDate night, Instant start, Instant end, boolean pinned, String ownerName,
                            String owner, long programId, String targetKind, String status) {

        /** This visit without its owner's name, for a reader who may not see it. */
        public VisitView withoutOwner() {
            return new VisitView(id, requestId, targetName, raDeg, decDeg, telescopeId, siteId, night, start, end, pinned,
                    null, null, programId, targetKind, status);
        }
    }

    public record UnplacedView(long requestId, String visitId, String targetName, String reason) {}

    public record NightView(long telescopeId, LocalDate night, String state, String reason) {}

    /** What an override does to the score, before it is made ({@code dryRun}) or as it was made. */
    public record EffectView(boolean dryRun, String scoreBefore, String scoreAfter, List<String> hardBroken,
                             Long revision, Long version) {}

    public record ChangeView(String id, long requestId, String targetName, Long telescopeId, Instant start, Instant end,
                             Long publishedTelescopeId, Instant publishedStart, Instant publishedEnd) {}

    public record CompareView(Long draftRevision, Long publishedRevision, List<ChangeView> placed, List<ChangeView> moved,
                              List<ChangeView> dropped) {}

    /**
     * A program's grants as a ledger, hours. {@code plannedHours} (kept for older clients) equals
     * {@code publishedHours}: published visits ahead or awaiting their report. {@code draftHours} is the draft's change
     * to that (negative when the draft drops time). {@code remainingHours} = granted − observed − published − draft.
     * {@code over} names the grants (or time no grant pays for) that are overdrawn.
     */
    public record UsageView(long programId, String code, double grantedHours, double plannedHours, double observedHours,
                            double publishedHours, double draftHours, double remainingHours, List<GrantUsage> grants,
                            List<String> over) {

        static UsageView of(org.skyrota.web.program.Program p, List<GrantLedger.Account> accounts) {
            double granted = 0;
            double observed = 0;
            double published = 0;
            double draft = 0;
            List<GrantUsage> grants = new java.util.ArrayList<>();
            List<String> over = new java.util.ArrayList<>();
            for (GrantLedger.Account a : accounts) {
                granted += a.granted();
                observed += a.observed();
                published += a.published();
                draft += a.draft();
                grants.add(new GrantUsage(a.grantNo() == 0 ? null : a.grantNo(), a.label(), a.telescopeId(), a.siteId(),
                        a.firstNight(), a.lastNight(), a.granted(), a.observed(), a.published(), a.draft(), a.remaining(),
                        a.over()));
                if (a.over()) {
                    over.add(a.label() + ": " + round(-a.remaining()) + " h over");
                }
            }
            return new UsageView(p.getId(), p.getCode(), round(granted), round(published), round(observed),
                    round(published), round(draft), round(granted - observed - published - draft), grants, over);
        }

        private static double round(double hours) {
            return Math.round(hours * 100) / 100.0;
        }
    }

    /** One grant's account; {@code grant} is its number in the program's list (null for time no grant pays for). */
    public record GrantUsage(Integer grant, String label, Long telescopeId, Long siteId, LocalDate firstNight,
                             LocalDate lastNight, double grantedHours, double observedHours, double publishedHours,
                             double draftHours, double remainingHours, boolean over) {}

    /** Where a request stands in the latest draft: each visit placed (telescope, night, start, end) or its reason. */
    public record PlanStatusView(long requestId, Long draftRevision, List<VisitStatus> visits) {}

    public record VisitStatus(String visitId, String status, Long telescopeId, Long siteId, LocalDate night,
                              Instant start, Instant end, String reason) {}
}
