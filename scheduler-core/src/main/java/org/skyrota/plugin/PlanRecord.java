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
 */
public record PlanRecord(String title, long revision, Instant publishedAt, List<PlannedVisitRecord> visits) {

    public PlanRecord {
        visits = List.copyOf(visits);
    }
}
