package org.skyrota.planning.model;

import java.time.Instant;

/** Where and when one visit runs: a telescope and a start instant (on the planning grid). */
public record Assignment(String visitId, String telescopeId, Instant start) {
    public Assignment {
        Checks.notBlank("visitId of assignment", visitId);
        Checks.notBlank("telescopeId of assignment " + visitId, telescopeId);
        Checks.notNull("start of assignment " + visitId, start);
    }
}
