package org.skyrota.sky.site;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalTime;
import java.time.ZoneOffset;
import java.util.Objects;

/**
 * The night of a date at a site: from local noon of that date to local noon of the next, in
 * the site's time zone, or in local mean solar time (UTC + longitude/15 h) where the site has
 * none. Across a daylight-saving change a night lasts 23 or 25 hours.
 *
 * @param date the calendar date on which the night begins (local)
 * @param start local noon of {@code date}
 * @param end local noon of the next date, after {@code start}
 */
public record Night(LocalDate date, Instant start, Instant end) {

    private static final LocalTime NOON = LocalTime.NOON;

    public Night {
        Objects.requireNonNull(date, "date");
        Objects.requireNonNull(start, "start");
        Objects.requireNonNull(end, "end");
        if (!end.isAfter(start)) {
            throw new IllegalArgumentException("end must be after start: start " + start + ", end " + end);
        }
    }

    public static Night of(SiteLocation site, LocalDate date) {
        Objects.requireNonNull(site, "site");
        Objects.requireNonNull(date, "date");
        return new Night(date, localNoon(site, date), localNoon(site, date.plusDays(1)));
    }

    private static Instant localNoon(SiteLocation site, LocalDate date) {
        if (site.zone() != null) {
            return date.atTime(NOON).atZone(site.zone()).toInstant();
        }
        // Local mean solar time: noon is when UTC = 12 h − longitude/15 h.
        long offsetNanos = Math.round(site.longitudeDeg() / 15.0 * 3600e9);
        return date.atTime(NOON).toInstant(ZoneOffset.UTC).minusNanos(offsetNanos);
    }

    public Duration duration() {
        return Duration.between(start, end);
    }

    /** The instant half-way between start and end. */
    public Instant middle() {
        return start.plus(duration().dividedBy(2));
    }

    /** True when {@code start ≤ t < end}. */
    public boolean contains(Instant t) {
        return !t.isBefore(start) && t.isBefore(end);
    }
}
