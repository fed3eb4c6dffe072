package org.skyrota.web.compute;

import com.fasterxml.jackson.annotation.JsonPropertyOrder;

/** One window in the JSON of {@code GET /api/visibility}; the altitude in degrees to 0.01°. */
@JsonPropertyOrder({"night", "start", "end", "maxAltitude"})
record WindowResponse(String night, String start, String end, double maxAltitude) {

    static WindowResponse of(SkyComputations.Window w) {
        return new WindowResponse(
                w.night().toString(),
                UtcSeconds.format(w.start()),
                UtcSeconds.format(w.end()),
                Math.round(w.maxAltitudeDeg() * 100) / 100.0);
    }
}
