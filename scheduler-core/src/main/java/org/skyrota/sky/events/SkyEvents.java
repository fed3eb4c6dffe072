package org.skyrota.sky.events;

import java.time.Instant;
import java.util.List;
import java.util.Optional;
import java.util.function.DoubleUnaryOperator;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.visibility.FixedTarget;

/**
 * Rising, setting and transit of the Sun, the Moon and fixed targets, and the twilights, as
 * the first such event in {@code [from, to]}; empty when none happens there (midnight Sun,
 * polar night, circumpolar or never-rising targets), never a made-up time.
 *
 * <p>Definitions (DESIGN.md, Meeus ch. 15): sunrise/sunset when the Sun's centre is at
 * geometric altitude −0.8333° (upper limb, 34′ refraction, no dip); twilights when it is at
 * −6°, −12°, −18°; moonrise/moonset when the topocentric upper limb is at the horizon with 34′
 * refraction; a fixed target rises and sets at geometric altitude −0.5667° (34′ refraction).
 * Sampled every 10 minutes with a closer look at grazing extrema, refined to 0.05 s.
 */
public final class SkyEvents {

    /** A fixed target rises at geometric altitude −34′ (Meeus ch. 15, stars). */
    public static final double STAR_RISE_ALTITUDE_DEG = -SkyAtSite.HORIZON_REFRACTION_DEG;

    private static final CrossingFinder FINDER = CrossingFinder.forAltitudes();

    private SkyEvents() {
    }

    public static Optional<Instant> sunrise(SiteLocation site, Instant from, Instant to) {
        return sunCrossing(site, SkyAtSite.SUNRISE_ALTITUDE_DEG, true, from, to);
    }

    public static Optional<Instant> sunset(SiteLocation site, Instant from, Instant to) {
        return sunCrossing(site, SkyAtSite.SUNRISE_ALTITUDE_DEG, false, from, to);
    }

    /**
     * The first time in {@code [from, to]} that the Sun's centre crosses the given geometric
     * altitude going up ({@code rising}) or down.
     */
    public static Optional<Instant> sunCrossing(SiteLocation site, double altitudeDeg, boolean rising, Instant from,
            Instant to) {
        SkyAtSite sky = new SkyAtSite(site);
        return first(t -> sky.sunAltitudeDeg(t) - altitudeDeg, rising, from, to);
    }

    public static Optional<Instant> moonrise(SiteLocation site, Instant from, Instant to) {
        SkyAtSite sky = new SkyAtSite(site);
        return first(sky::moonUpperLimbDeg, true, from, to);
    }

    public static Optional<Instant> moonset(SiteLocation site, Instant from, Instant to) {
        SkyAtSite sky = new SkyAtSite(site);
        return first(sky::moonUpperLimbDeg, false, from, to);
    }

    public static Optional<Instant> targetRise(SiteLocation site, FixedTarget target, Instant from, Instant to) {
        SkyAtSite sky = new SkyAtSite(site);
        return first(t -> sky.targetTrueAltitudeDeg(target, t) - STAR_RISE_ALTITUDE_DEG, true, from, to);
    }

    public static Optional<Instant> targetSet(SiteLocation site, FixedTarget target, Instant from, Instant to) {
        SkyAtSite sky = new SkyAtSite(site);
        return first(t -> sky.targetTrueAltitudeDeg(target, t) - STAR_RISE_ALTITUDE_DEG, false, from, to);
    }

    /** Upper transit (local hour angle 0) of a fixed target. */
    public static Optional<Instant> targetTransit(SiteLocation site, FixedTarget target, Instant from, Instant to) {
        SkyAtSite sky = new SkyAtSite(site);
        double[] rd = new double[2];
        return first(t -> {
            sky.targetRaDec(target, t, rd);
            return Math.sin(sky.localSiderealTimeRad(t) - rd[0]);
        }, true, from, to);
    }

    /** Upper transit of the Sun (geocentric apparent place). */
    public static Optional<Instant> sunTransit(SiteLocation site, Instant from, Instant to) {
        SkyAtSite sky = new SkyAtSite(site);
        double[] rd = new double[2];
        return first(t -> {
            sky.sunRaDec(t, rd);
            return Math.sin(sky.localSiderealTimeRad(t) - rd[0]);
        }, true, from, to);
    }

    /** Upper transit of the Moon (topocentric place). */
    public static Optional<Instant> moonTransit(SiteLocation site, Instant from, Instant to) {
        SkyAtSite sky = new SkyAtSite(site);
        double[] m = new double[4];
        return first(t -> {
            sky.moon(t, m);
            return Math.sin(sky.localSiderealTimeRad(t) - m[0]);
        }, true, from, to);
    }

    /** Every crossing of {@code f} in the interval, for callers that need more than the first. */
    public static List<Crossing> crossings(DoubleUnaryOperator f, Instant from, Instant to) {
        return FINDER.find(f, SkyAtSite.toEpochSecond(from), SkyAtSite.toEpochSecond(to));
    }

    static Optional<Instant> first(DoubleUnaryOperator f, boolean rising, Instant from, Instant to) {
        if (!to.isAfter(from)) {
            throw new IllegalArgumentException("to must be after from: from " + from + ", to " + to);
        }
        return firstOf(crossings(f, from, to), rising);
    }

    static Optional<Instant> firstOf(List<Crossing> crossings, boolean rising) {
        for (Crossing c : crossings) {
            if (c.rising() == rising) {
                return Optional.of(SkyAtSite.toInstant(c.epochSecond()));
            }
        }
        return Optional.empty();
    }
}
