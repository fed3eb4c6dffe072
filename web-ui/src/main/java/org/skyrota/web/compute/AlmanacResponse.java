package org.skyrota.web.compute;

import java.time.Instant;
import java.util.Optional;

import com.fasterxml.jackson.annotation.JsonPropertyOrder;

/** The JSON of {@code GET /api/almanac}; instants as UTC ISO-8601 strings, null when absent. */
@JsonPropertyOrder({"date", "sunset", "civilDusk", "nauticalDusk", "astronomicalDusk", "astronomicalDawn",
        "nauticalDawn", "civilDawn", "sunrise", "moonrise", "moonset", "moonIllumination"})
record AlmanacResponse(
        String date,
        String sunset,
        String civilDusk,
        String nauticalDusk,
        String astronomicalDusk,
        String astronomicalDawn,
        String nauticalDawn,
        String civilDawn,
        String sunrise,
        String moonrise,
        String moonset,
        double moonIllumination) {

    static AlmanacResponse of(SkyComputations.NightEvents e) {
        return new AlmanacResponse(
                e.night().toString(),
                utc(e.sunset()),
                utc(e.civilDusk()),
                utc(e.nauticalDusk()),
                utc(e.astronomicalDusk()),
                utc(e.astronomicalDawn()),
                utc(e.nauticalDawn()),
                utc(e.civilDawn()),
                utc(e.sunrise()),
                utc(e.moonrise()),
                utc(e.moonset()),
                Math.round(e.moonIllumination() * 10_000) / 10_000.0);
    }

    private static String utc(Optional<Instant> instant) {
        return instant.map(UtcSeconds::format).orElse(null);
    }
}
