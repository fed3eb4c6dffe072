package org.skyrota.planning.model;

import java.util.Objects;

/**
 * A telescope at a site.
 *
 * @param id                 stable identifier
 * @param siteId             the site it stands at
 * @param apertureM          clear aperture in metres
 * @param mount              mount kind
 * @param slewDegPerSecond   slew rate in degrees per second
 * @param settleSeconds      time to settle after a slew, seconds
 * @param minAltitudeDeg     lowest altitude the mount or dome can reach
 * @param maxAltitudeDeg     highest altitude it can track through (alt-azimuth mounts stop short of the zenith)
 * @param needsMeridianFlip  an equatorial mount that must flip sides when the target crosses the meridian (a German
 *                           equatorial mount); false for alt-azimuth mounts
 * @param eastHourAngleLimitDeg the most negative (eastern) hour angle the mount reaches, degrees, -180..0;
 *                           -180 means no limit
 * @param westHourAngleLimitDeg the most positive (western) hour angle the mount reaches, degrees, 0..180;
 *                           180 means no limit
 */
public record Telescope(String id, String siteId, double apertureM, MountKind mount, double slewDegPerSecond,
                        double settleSeconds, double minAltitudeDeg, double maxAltitudeDeg, boolean needsMeridianFlip,
                        double eastHourAngleLimitDeg, double westHourAngleLimitDeg) {
    /** A typical slew between two queue targets, used for the overhead inside a visit's length (common practice, no source). */
    public static final double TYPICAL_SLEW_DEG = 60.0;

    public Telescope {
        Checks.notBlank("telescope id", id);
        Checks.notBlank("siteId of telescope " + id, siteId);
        Checks.positive("apertureM of telescope " + id, apertureM);
        Checks.notNull("mount of telescope " + id, mount);
        Checks.positive("slewDegPerSecond of telescope " + id, slewDegPerSecond);
        Checks.notNegative("settleSeconds of telescope " + id, settleSeconds);
        Checks.range("minAltitudeDeg of telescope " + id, minAltitudeDeg, -5, 89);
        Checks.range("maxAltitudeDeg of telescope " + id, maxAltitudeDeg, minAltitudeDeg, 90);
        Checks.range("eastHourAngleLimitDeg of telescope " + id, eastHourAngleLimitDeg, -180, 0);
        Checks.range("westHourAngleLimitDeg of telescope " + id, westHourAngleLimitDeg, 0, 180);
        if (mount == MountKind.ALT_AZIMUTH && (needsMeridianFlip || eastHourAngleLimitDeg > -180
                || westHourAngleLimitDeg < 180)) {
            throw new IllegalArgumentException("telescope " + id
                    + " has an alt-azimuth mount: meridian flip and hour-angle limits apply to equatorial mounts only");
        }
    }

    /** A telescope with no hour-angle limits that never flips: what every telescope was before mounts had limits. */
    public Telescope(String id, String siteId, double apertureM, MountKind mount, double slewDegPerSecond,
                     double settleSeconds, double minAltitudeDeg, double maxAltitudeDeg) {
        this(id, siteId, apertureM, mount, slewDegPerSecond, settleSeconds, minAltitudeDeg, maxAltitudeDeg, false,
                -180, 180);
    }

    /** This telescope with an equatorial mount's flip and hour-angle limits. */
    public Telescope withEquatorialLimits(boolean flips, double eastLimitDeg, double westLimitDeg) {
        return new Telescope(id, siteId, apertureM, MountKind.EQUATORIAL, slewDegPerSecond, settleSeconds,
                minAltitudeDeg, maxAltitudeDeg, flips, eastLimitDeg, westLimitDeg);
    }

    /** Whether the planner needs the target's hour angle on this telescope: it flips or has a limit. */
    public boolean hourAngleMatters() {
        return needsMeridianFlip || eastHourAngleLimitDeg > -180 || westHourAngleLimitDeg < 180;
    }

    /** Slew and settle time before each visit, in seconds. */
    public double slewAndSettleSeconds() {
        return TYPICAL_SLEW_DEG / slewDegPerSecond + settleSeconds;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Telescope t && t.id.equals(id);
    }

    @Override
    public int hashCode() {
        return Objects.hash(id);
    }
}
