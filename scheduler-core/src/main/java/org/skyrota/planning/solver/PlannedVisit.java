package org.skyrota.planning.solver;

import java.time.Instant;

/** A visit in the plan: where, from when to when, and whether a coordinator pinned it there. */
public record PlannedVisit(String visitId, String requestId, String telescopeId, Instant start, Instant end,
                           boolean pinned) {
}
