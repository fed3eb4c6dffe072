package org.skyrota.plugin;

import java.time.Instant;
import java.util.List;

/**
 * A plan as exporters see it.
 *
 * @param title       what the plan covers, for example {@code "Published plan, 2027-03-01 to 2027-03-07"}
 * @param revision    the plan revision's number
 * @param publishedAt when it was published, or null for a draft
 * @param visits      the placed visits, ordered by start
 * @param cancelled   visits an earlier published plan held and this one gave up, with their last place and a higher
 *                    sequence, for exporters that tell subscribers (a calendar removes them); empty for a draft
 */
public record PlanRecord(String title, long revision, Instant publishedAt, List<PlannedVisitRecord> visits,
                         List<PlannedVisitRecord> cancelled) {

    public PlanRecord {
        visits = List.copyOf(visits);
        cancelled = cancelled == null ? List.of() : List.copyOf(cancelled);
    }

    /** A plan with nothing cancelled. */
    public PlanRecord(String title, long revision, Instant publishedAt, List<PlannedVisitRecord> visits) {
        this(title, revision, publishedAt, visits, List.of());
    }
}
