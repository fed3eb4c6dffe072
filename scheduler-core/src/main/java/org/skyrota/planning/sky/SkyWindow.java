package org.skyrota.planning.sky;

import java.time.Instant;
import java.time.LocalDate;

/** One visibility window: the night it belongs to, its ends, and the target's highest altitude in it (degrees). */
public record SkyWindow(LocalDate night, Instant start, Instant end, double maxAltitudeDeg) {
    public SkyWindow {
        if (night == null || start == null || end == null) {
            throw new IllegalArgumentException("window night, start and end must not be null");
        }
        if (end.isBefore(start)) {
            throw new IllegalArgumentException("window end " + end + " is before its start " + start);
        }
    }
}
