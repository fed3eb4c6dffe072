package org.skyrota.sky.almanac;

import java.time.Instant;
import java.time.LocalDate;
import java.util.Objects;
import java.util.Optional;

/**
 * The Sun and Moon events of one night at one site: each the first such event inside the
 * night (local noon to local noon), empty when none happens in it.
 *
 * @param moonIllumination the Moon's illuminated fraction at the night's middle, 0 to 1
 */
public record NightAlmanac(
        LocalDate date,
        Optional<Instant> sunset,
        Optional<Instant> civilDusk,
        Optional<Instant> nauticalDusk,
        Optional<Instant> astronomicalDusk,
        Optional<Instant> astronomicalDawn,
        Optional<Instant> nauticalDawn,
        Optional<Instant> civilDawn,
        Optional<Instant> sunrise,
        Optional<Instant> moonrise,
        Optional<Instant> moonset,
        double moonIllumination) {

    public NightAlmanac {
        Objects.requireNonNull(date, "date");
        Objects.requireNonNull(sunset, "sunset");
        Objects.requireNonNull(civilDusk, "civilDusk");
        Objects.requireNonNull(nauticalDusk, "nauticalDusk");
        Objects.requireNonNull(astronomicalDusk, "astronomicalDusk");
        Objects.requireNonNull(astronomicalDawn, "astronomicalDawn");
        Objects.requireNonNull(nauticalDawn, "nauticalDawn");
        Objects.requireNonNull(civilDawn, "civilDawn");
        Objects.requireNonNull(sunrise, "sunrise");
        Objects.requireNonNull(moonrise, "moonrise");
        Objects.requireNonNull(moonset, "moonset");
        if (!(moonIllumination >= 0 && moonIllumination <= 1)) {
            throw new IllegalArgumentException("moonIllumination must be in [0, 1]: " + moonIllumination);
        }
    }
}
