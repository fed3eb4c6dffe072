package org.skyrota.planning.solver;

import java.time.Instant;

/**
 * A visit in the plan: where, from when to when, whether a coordinator pinned it there, and the safety caution for
 * solar visits ({@link org.skyrota.planning.model.SolarSafety#CAUTION}, null for every other visit).
 */
public record PlannedVisit(String visitId, String requestId, String telescopeId, Instant start, Instant end,
                           boolean pinned, String caution) {
}
