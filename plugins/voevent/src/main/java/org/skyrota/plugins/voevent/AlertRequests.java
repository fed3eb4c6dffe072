package org.skyrota.plugins.voevent;

import java.time.Duration;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Locale;
import java.util.Map;
import org.skyrota.plugin.RequestRecord;

/** Turns an alert into a time-critical request of the target-of-opportunity program. */
public final class AlertRequests {

    private AlertRequests() {
    }

    /**
     * The request for an alert: a fixed target at the alert's position, open from the night of the
     * event for {@link AlertSettings#validityNights()} nights, one visit. Its {@link RequestRecord#sourceId()} is the
     * packet's IVORN, by which the server knows a packet sent again.
     *
     * <p>The night of the event is taken in mean solar time at Greenwich (the date of the event time
     * minus 12 hours), because a packet names no site: for a site far east or west that night may be
     * one off, which the short window absorbs.
     *
     * <p>Priority from importance (0 to 1) in five equal steps: [0, 0.2) is 1, ... [0.8, 1] is 5.
     */
    public static RequestRecord toRequest(VoEventAlert alert, AlertSettings settings) {
        LocalDate night = alert.eventTime().minus(Duration.ofHours(12)).atOffset(ZoneOffset.UTC).toLocalDate();
        int priority = alert.importance() == null
                ? settings.defaultPriority()
                : 1 + Math.min(4, (int) Math.floor(alert.importance() * 5));
        StringBuilder notes = new StringBuilder("VOEvent ").append(alert.ivorn())
                .append("; role ").append(alert.role())
                .append("; event time ").append(alert.eventTime())
                .append("; coordinate system ").append(alert.coordSystem());
        if (alert.errorRadiusDeg() != null) {
            notes.append(String.format(Locale.ROOT, "; error radius %.4f deg", alert.errorRadiusDeg()));
        }
        if (alert.importance() != null) {
            notes.append(String.format(Locale.ROOT, "; importance %.2f", alert.importance()));
        }
        return new RequestRecord(
                "Alert " + alert.name(),
                alert.name(),
                "fixed",
                alert.raDeg(),
                alert.decDeg(),
                Map.of(),
                settings.exposures(),
                null,
                null,
                null,
                null,
                night,
                night.plusDays(settings.validityNights() - 1L),
                1,
                0,
                priority,
                settings.program(),
                null,
                notes.toString(),
                alert.ivorn());
    }
}
