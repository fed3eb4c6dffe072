package org.skyrota.web.compute;

import java.time.Instant;
import java.time.temporal.ChronoUnit;

/** Instants as the API shows them: UTC, ISO-8601, rounded to the nearest whole second. */
final class UtcSeconds {

    private UtcSeconds() {}

    static String format(Instant instant) {
        return instant.plusMillis(500).truncatedTo(ChronoUnit.SECONDS).toString();
    }
}
