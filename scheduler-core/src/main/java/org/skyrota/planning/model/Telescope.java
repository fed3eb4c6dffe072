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
 */
public record Telescope(String id, String siteId, double apertureM, MountKind mount, double slewDegPerSecond,
                        double settleSeconds, double minAltitudeDeg, double maxAltitudeDeg) {
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
