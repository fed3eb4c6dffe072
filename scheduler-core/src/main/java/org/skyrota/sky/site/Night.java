package org.skyrota.sky.site;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalTime;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.util.Objects;

/**
 * The night of a date at a site: from local noon of that date to local noon of the next, in
 * the site's time zone, or in local mean solar time (UTC + longitude/15 h) where the site has
 * none. Across a daylight-saving change a night lasts 23 or 25 hours.
 *
 * <p>This is the one definition of a night in Skyrota: the sky engine, the planner and the server all take a night's
 * span from {@link #of}, and the night an instant belongs to from {@link #containing}. Local mean solar time is the
 * fixed offset {@link #meanSolarOffset}, rounded to the second, everywhere.
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

    /** The night of {@code date} at a site, in its time zone or, without one, in local mean solar time. */
    public static Night of(SiteLocation site, LocalDate date) {
        Objects.requireNonNull(site, "site");
        return of(zoneOf(site), date);
    }

    /**
     * The night of {@code date} in a zone: from local noon of {@code date} to local noon of the next date. Where a
     * zone's clocks skip local noon, the night begins at the first instant after the gap (as
     * {@link java.time.ZonedDateTime} resolves it).
     *
     * @param zone a region or a fixed offset, not null
     */
    public static Night of(ZoneId zone, LocalDate date) {
        Objects.requireNonNull(zone, "zone");
        Objects.requireNonNull(date, "date");
        return new Night(date, localNoon(zone, date), localNoon(zone, date.plusDays(1)));
    }

    /**
     * The night whose noon-to-noon span holds {@code instant} ({@code start ≤ instant < end}) at a site, in its time
     * zone or, without one, in local mean solar time.
     */
    public static Night containing(SiteLocation site, Instant instant) {
        Objects.requireNonNull(site, "site");
        return containing(zoneOf(site), instant);
    }

    /**
     * The night whose noon-to-noon span holds {@code instant} ({@code start ≤ instant < end}) in a zone: the night
     * of the local date when the instant is at or after that date's local noon, else the night of the day before.
     * Unlike subtracting twelve hours, this holds on the days the clocks change.
     *
     * @param zone a region or a fixed offset ({@link #meanSolarOffset} for a site without a zone), not null
     */
    public static Night containing(ZoneId zone, Instant instant) {
        Objects.requireNonNull(zone, "zone");
        Objects.requireNonNull(instant, "instant");
        LocalDate date = LocalDate.ofInstant(instant, zone);
        return of(zone, instant.isBefore(localNoon(zone, date)) ? date.minusDays(1) : date);
    }

    /** The zone that defines a site's nights: its own, else local mean solar time ({@link #meanSolarOffset}). */
    public static ZoneId zoneOf(SiteLocation site) {
        return zoneOf(site.zone(), site.longitudeDeg());
    }

    /**
     * The zone that defines the nights of a place: {@code zone} when given, else local mean solar time at the
     * longitude ({@link #meanSolarOffset}).
     *
     * @param zone an IANA zone, or null for local mean solar time
     * @param longitudeDeg east-positive, −180 to 180
     */
    public static ZoneId zoneOf(ZoneId zone, double longitudeDeg) {
        return zone != null ? zone : meanSolarOffset(longitudeDeg);
    }

    /**
     * Local mean solar time as a fixed offset from UTC: longitude/15 hours, rounded to the nearest second (a
     * {@link ZoneOffset} holds whole seconds; the rounding moves noon by at most half a second).
     *
     * @param longitudeDeg east-positive, −180 to 180
     * @throws IllegalArgumentException when the longitude is outside −180 to 180 or not a number
     */
    public static ZoneOffset meanSolarOffset(double longitudeDeg) {
        if (!(longitudeDeg >= -180 && longitudeDeg <= 180)) {
            throw new IllegalArgumentException("longitudeDeg must be in [-180.0, 180.0]: " + longitudeDeg);
        }
        return ZoneOffset.ofTotalSeconds((int) Math.round(longitudeDeg / 15.0 * 3600.0));
    }

    private static Instant localNoon(ZoneId zone, LocalDate date) {
        return date.atTime(NOON).atZone(zone).toInstant();
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
