package org.skyrota.web.compute;

import com.fasterxml.jackson.annotation.JsonPropertyOrder;

import org.skyrota.planning.sky.SkyWindow;

/** One window in the JSON of {@code GET /api/visibility}; the altitude in degrees to 0.01°. */
@JsonPropertyOrder({"night", "start", "end", "maxAltitude"})
record WindowResponse(String night, String start, String end, double maxAltitude) {

    /** A window of the planner's sky model ({@code TelescopeWindows}). */
    static WindowResponse of(SkyWindow w) {
        return of(new SkyComputations.Window(w.night(), w.start(), w.end(), w.maxAltitudeDeg()));
    }

    static WindowResponse of(SkyComputations.Window w) {
        return new WindowResponse(
                w.night().toString(),
                UtcSeconds.format(w.start()),
                UtcSeconds.format(w.end()),
                Math.round(w.maxAltitudeDeg() * 100) / 100.0);
    }
}
