package org.skyrota.sky.visibility;

import org.skyrota.plugin.MovingTarget;
import org.skyrota.sky.atmosphere.MoonlightSkyBrightness;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.events.SkyAtSite;
import org.skyrota.sky.site.SiteLocation;

/**
 * Whether every constraint holds at one instant, from the positional layer's exact values at
 * that instant: the plain definition that {@link VisibilityCalculator} samples and that
 * {@link BatchVisibility} is tested against. A {@link MovingTarget} is asked for its geocentric
 * place at each instant and moved to the site by the diurnal parallax of its distance (up to
 * about a degree for the Moon); the Moon and the Sun are compared with it as with a fixed target.
 * Not thread-safe (scratch arrays).
 */
final class InstantConditions {

    private final SiteLocation site;
    private final ObservingConstraints constraints;
    private final SkyAtSite sky;
    private final double minAltitudeDeg;
    private final double earliest;
    private final double latest;
    private final boolean needsMoon;
    private final double[] target = new double[5];
    private final double[] moon = new double[4];
    private final double[] sun = new double[2];
    private final double[] probe = new double[5];

    InstantConditions(SiteLocation site, ObservingConstraints constraints) {
        this.site = site;
        this.constraints = constraints;
        this.sky = new SkyAtSite(site);
        this.minAltitudeDeg = constraints.effectiveMinAltitudeDeg();
        this.earliest = constraints.earliest().map(SkyAtSite::toEpochSecond).orElse(Double.NEGATIVE_INFINITY);
        this.latest = constraints.latest().map(SkyAtSite::toEpochSecond).orElse(Double.POSITIVE_INFINITY);
        this.needsMoon = constraints.minMoonSeparationDeg().isPresent()
                || constraints.maxMoonIllumination().isPresent() || constraints.maxSkyBrightness().isPresent();
    }

    SkyAtSite sky() {
        return sky;
    }

    /** The target's apparent altitude at the instant of the last {@link #holds} call, degrees. */
    double lastAltitudeDeg() {
        return target[0];
    }

    /** The target's apparent altitude at an instant, degrees. */
    double altitudeDeg(FixedTarget t, double epochSecond) {
        double[] out = new double[5];
        sky.target(t, epochSecond, out);
        return out[0];
    }

    /** A moving target's apparent topocentric altitude at an instant, degrees. */
    double altitudeDeg(MovingTarget t, double epochSecond) {
        place(t, epochSecond, probe);
        return probe[0];
    }

    /** A moving target's place at an instant, as {@link SkyAtSite#target(MovingTarget, double, double[])}. */
    void place(MovingTarget t, double epochSecond, double[] out) {
        sky.target(t, epochSecond, out);
    }

    boolean holds(FixedTarget t, double epochSecond) {
        if (!timeAndDarkness(epochSecond)) {
            return false;
        }
        sky.target(t, epochSecond, target);
        return rest(epochSecond);
    }

    boolean holds(MovingTarget t, double epochSecond) {
        if (!timeAndDarkness(epochSecond)) {
            return false;
        }
        place(t, epochSecond, target);
        return rest(epochSecond);
    }

    private boolean timeAndDarkness(double epochSecond) {
        target[0] = Double.NaN;
        if (epochSecond < earliest || epochSecond > latest) {
            return false;
        }
        Darkness darkness = constraints.darkness();
        return darkness == Darkness.ANY || sky.sunAltitudeDeg(epochSecond) < darkness.sunAltitudeLimitDeg();
    }

    /** The constraints that need the target's place, already in {@code target}. */
    private boolean rest(double epochSecond) {
        double altitude = target[0];
        if (!(altitude >= minAltitudeDeg)) {
            return false;
        }
        if (!site.horizon().isFlat() && !(altitude >= site.horizon().minAltitudeDeg(target[1]))) {
            return false;
        }
        if (constraints.minSunSeparationDeg().isPresent()) {
            sky.sunRaDec(epochSecond, sun);
            double sep = Math.toDegrees(Horizontal.separationRad(target[3], target[4], sun[0], sun[1]));
            if (!(sep >= constraints.minSunSeparationDeg().getAsDouble())) {
                return false;
            }
        }
        if (needsMoon) {
            sky.moon(epochSecond, moon);
            boolean moonUp = moon[2] + moon[3] + SkyAtSite.HORIZON_REFRACTION_DEG > 0;
            double sepDeg = Math.toDegrees(Horizontal.separationRad(target[3], target[4], moon[0], moon[1]));
            if (moonUp && constraints.minMoonSeparationDeg().isPresent()
                    && !(sepDeg >= constraints.minMoonSeparationDeg().getAsDouble())) {
                return false;
            }
            if (moonUp && constraints.maxMoonIllumination().isPresent()
                    && !(sky.moonIlluminatedFraction(epochSecond) <= constraints.maxMoonIllumination().getAsDouble())) {
                return false;
            }
            if (constraints.maxSkyBrightness().isPresent()) {
                double brightness = skyBrightness(sky.moonPhaseAngleDeg(epochSecond), moon[2], altitude, sepDeg);
                if (!(brightness >= constraints.maxSkyBrightness().getAsDouble())) {
                    return false;
                }
            }
        }
        return true;
    }

    /** Sky brightness towards the target, V mag/arcsec² (dark sky plus moonlight). */
    double skyBrightness(double phaseAngleDeg, double moonTrueAltitudeDeg, double targetAltitudeDeg, double sepDeg) {
        return MoonlightSkyBrightness.skyBrightnessVMagPerArcsec2(site.darkSkyZenithVMag(), phaseAngleDeg,
                90 - moonTrueAltitudeDeg, 90 - targetAltitudeDeg, sepDeg, site.extinctionMagPerAirmass());
    }
}
