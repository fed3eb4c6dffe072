package org.skyrota.planning.sky;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.LocalTime;
import java.time.ZonedDateTime;
import java.util.ArrayList;
import java.util.List;

import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Target;
import org.skyrota.sky.site.Night;

/**
 * An invented, perfectly regular sky for tests and optimiser benchmarks: every night is dark from 20:00 to 05:00
 * local time, a target culminates at local hour {@code (ra / 15 + 12) mod 24} shifted 4 minutes earlier each
 * night, and it is above its limit for {@link #halfWindow} either side of culmination. Airmass grows with the hour
 * angle, the sky brightens with an invented 30-night moonlight cycle; altitude limits and the site's horizon
 * profile are not modelled. It measures the optimiser, never the sky:
 * real plans use the sky engine.
 */
public final class SyntheticSky implements SkyModel {
    private static final LocalTime DUSK = LocalTime.of(20, 0);
    private static final Duration DARK = Duration.ofHours(9);
    private final Duration halfWindow;

    public SyntheticSky(Duration halfWindow) {
        this.halfWindow = halfWindow;
    }

    @Override
    public List<SkyWindow> windows(Site site, Target target, ObservingLimits limits, LocalDate night) {
        Instant dusk = ZonedDateTime.of(night, DUSK, site.nightZone()).toInstant();
        Instant dawn = dusk.plus(DARK);
        Instant culmination = culmination(site, target, night);
        Instant start = max(dusk, culmination.minus(halfWindow));
        Instant end = min(dawn, culmination.plus(halfWindow));
        List<SkyWindow> windows = new ArrayList<>();
        if (start.isBefore(end)) {
            windows.add(new SkyWindow(night, start, end, 90 - Math.abs(site.latitudeDeg() - target.decDeg())));
        }
        return windows;
    }

    @Override
    public SkyConditions conditions(Site site, Target target, Instant instant) {
        LocalDate night = Night.containing(site.nightZone(), instant).date();
        double hourAngleH = Duration.between(culmination(site, target, night), instant).toSeconds() / 3600.0;
        double zenithDeg = Math.min(89, Math.abs(site.latitudeDeg() - target.decDeg()) + 12 * Math.abs(hourAngleH));
        double altitude = 90 - zenithDeg;
        double airmass = 1 / Math.cos(Math.toRadians(zenithDeg));
        double moonlight = 0.5 * (1 - Math.cos(2 * Math.PI * (night.toEpochDay() % 30) / 30.0));
        return new SkyConditions(altitude, airmass, site.darkSkyZenithVMag() - 2.0 * moonlight, 120);
    }

    /** The hour angle of this made-up sky: zero at its culmination, 15° per hour. */
    @Override
    public double hourAngleDeg(Site site, Target target, Instant instant) {
        LocalDate night = Night.containing(site.nightZone(), instant).date();
        double hours = Duration.between(culmination(site, target, night), instant).toSeconds() / 3600.0;
        return org.skyrota.sky.coords.HourAngle.normalizeDeg(15 * hours);
    }

    private static Instant culmination(Site site, Target target, LocalDate night) {
        double localHour = (target.raDeg() / 15.0 + 12) % 24;
        long minutes = Math.round(localHour * 60) - 4 * (night.toEpochDay() % 365);
        long fromNoon = Math.floorMod(minutes - 12 * 60, 24 * 60);
        return Night.of(site.nightZone(), night).start().plus(Duration.ofMinutes(fromNoon));
    }

    private static Instant max(Instant a, Instant b) {
        return a.isAfter(b) ? a : b;
    }

    private static Instant min(Instant a, Instant b) {
        return a.isBefore(b) ? a : b;
    }
}
