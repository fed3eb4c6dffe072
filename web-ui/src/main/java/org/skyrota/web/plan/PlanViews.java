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
     */
    public record PlanView(Long revision, Long version, String state, LocalDate firstNight, LocalDate lastNight,
                           Instant publishedAt, String score, List<VisitView> visits, List<UnplacedView> unplaced,
                           List<NightView> closedNights) {}

    /**
     * {@code ownerName} and {@code owner} (the same user name) are null on another requester's visit. For a moving
     * target ({@code targetKind} other than {@code fixed}) {@code raDeg} and {@code decDeg} are 0 and mean nothing.
     */
    public record VisitView(String id, long requestId, String targetName, double raDeg, double decDeg, long telescopeId,
                            long siteId, LocalDate night, Instant start, Instant end, boolean pinned, String ownerName,
                            String owner, long programId, String targetKind) {}

    public record UnplacedView(long requestId, String visitId, String targetName, String reason) {}

    public record NightView(long telescopeId, LocalDate night, String state, String reason) {}

    /** What an override does to the score, before it is made ({@code dryRun}) or as it was made. */
    public record EffectView(boolean dryRun, String scoreBefore, String scoreAfter, List<String> hardBroken,
                             Long revision, Long version) {}

    public record ChangeView(String id, long requestId, String targetName, Long telescopeId, Instant start, Instant end,
                             Long publishedTelescopeId, Instant publishedStart, Instant publishedEnd) {}

    public record CompareView(Long draftRevision, Long publishedRevision, List<ChangeView> placed, List<ChangeView> moved,
                              List<ChangeView> dropped) {}

    public record UsageView(long programId, double grantedHours, double plannedHours, double observedHours) {}

    /** Where a request stands in the latest draft: each visit placed (telescope, night, start, end) or its reason. */
    public record PlanStatusView(long requestId, Long draftRevision, List<VisitStatus> visits) {}

    public record VisitStatus(String visitId, String status, Long telescopeId, Long siteId, LocalDate night,
                              Instant start, Instant end, String reason) {}
}
