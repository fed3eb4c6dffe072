package org.skyrota.planning.model;

import java.time.Instant;

/**
 * Telescope time already taken by something the run does not plan: a visit under way or awaiting its report.
 * No candidate overlaps it.
 *
 * @param telescopeId the telescope
 * @param start       from, inclusive
 * @param end         to, exclusive, after start
 */
public record Occupied(String telescopeId, Instant start, Instant end) {
    public Occupied {
        Checks.notBlank("telescopeId of occupied time", telescopeId);
        Checks.notNull("start of occupied time", start);
        Checks.notNull("end of occupied time", end);
        if (!end.isAfter(start)) {
            throw new IllegalArgumentException("occupied time on " + telescopeId + " must end after it starts: "
                    + start + " to " + end);
        }
    }
}
