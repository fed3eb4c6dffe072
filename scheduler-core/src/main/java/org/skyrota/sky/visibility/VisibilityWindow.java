package org.skyrota.sky.visibility;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.Objects;

/**
 * A maximal interval within a night where every constraint holds.
 *
 * @param night the date the night begins on
 * @param start first instant of the window
 * @param end last instant of the window, after {@code start}
 * @param maxAltitudeDeg highest apparent altitude of the target inside the window
 */
public record VisibilityWindow(LocalDate night, Instant start, Instant end, double maxAltitudeDeg) {

    /**
     * Windows shorter than this are not reported by either path: no visit fits in them, and
     * the per-instant path, sampling once a minute, could not see them reliably.
     */
    public static final Duration MIN_DURATION = Duration.ofSeconds(60);

    public VisibilityWindow {
        Objects.requireNonNull(night, "night");
        Objects.requireNonNull(start, "start");
        Objects.requireNonNull(end, "end");
        if (!end.isAfter(start)) {
            throw new IllegalArgumentException("end must be after start: start " + start + ", end " + end);
        }
        if (!(maxAltitudeDeg >= -90 && maxAltitudeDeg <= 90)) {
            throw new IllegalArgumentException("maxAltitudeDeg must be in [-90, 90]: " + maxAltitudeDeg);
        }
    }

    public Duration duration() {
        return Duration.between(start, end);
    }
}
