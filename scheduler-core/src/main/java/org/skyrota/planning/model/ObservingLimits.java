package org.skyrota.planning.model;

/**
 * The conditions a visit needs, as the sky engine checks them.
 *
 * @param minAltitudeDeg        lowest apparent altitude
 * @param maxAirmass            highest airmass, or {@code Double.POSITIVE_INFINITY}
 * @param darkness              how dark the sky must be
 * @param minMoonSeparationDeg  least angle from the Moon's centre, 0 for none
 * @param maxMoonIllumination   largest illuminated fraction while the Moon is up, 1 for none
 * @param minSunSeparationDeg   least angle from the Sun for non-solar targets (eyes and optics)
 */
public record ObservingLimits(double minAltitudeDeg, double maxAirmass, DarknessLimit darkness,
                              double minMoonSeparationDeg, double maxMoonIllumination,
                              double minSunSeparationDeg) {
    /** Default least angle from the Sun for ordinary visits (common practice, no source). */
    public static final double DEFAULT_MIN_SUN_SEPARATION_DEG = 30.0;

    public ObservingLimits {
        Checks.range("minAltitudeDeg", minAltitudeDeg, -5, 90);
        if (!(maxAirmass >= 1.0)) {
            throw new IllegalArgumentException("maxAirmass must be at least 1, got " + maxAirmass);
        }
        Checks.notNull("darkness", darkness);
        Checks.range("minMoonSeparationDeg", minMoonSeparationDeg, 0, 180);
        Checks.range("maxMoonIllumination", maxMoonIllumination, 0, 1);
        Checks.range("minSunSeparationDeg", minSunSeparationDeg, 0, 180);
    }

    public static ObservingLimits dark(double minAltitudeDeg) {
        return new ObservingLimits(minAltitudeDeg, Double.POSITIVE_INFINITY, DarknessLimit.ASTRONOMICAL, 0, 1,
                DEFAULT_MIN_SUN_SEPARATION_DEG);
    }

    public ObservingLimits withMoon(double minSeparationDeg, double maxIllumination) {
        return new ObservingLimits(minAltitudeDeg, maxAirmass, darkness, minSeparationDeg, maxIllumination,
                minSunSeparationDeg);
    }

    /** The same limits with the highest airmass {@code airmass} (at least 1; infinity for none). */
    public ObservingLimits withMaxAirmass(double airmass) {
        return new ObservingLimits(minAltitudeDeg, airmass, darkness, minMoonSeparationDeg, maxMoonIllumination,
                minSunSeparationDeg);
    }

    public ObservingLimits withDarkness(DarknessLimit limit) {
        return new ObservingLimits(minAltitudeDeg, maxAirmass, limit, minMoonSeparationDeg, maxMoonIllumination,
                minSunSeparationDeg);
    }

    /** The constraints in plain words, for the left-out reasons. */
    public String words() {
        StringBuilder b = new StringBuilder(darkness.words()).append(" and above ")
                .append(Math.round(minAltitudeDeg)).append('°');
        if (Double.isFinite(maxAirmass)) {
            b.append(", airmass at most ").append(Math.round(maxAirmass * 100) / 100.0);
        }
        if (minMoonSeparationDeg > 0) {
            b.append(", at least ").append(Math.round(minMoonSeparationDeg)).append("° from the Moon");
        }
        if (maxMoonIllumination < 1) {
            b.append(", Moon at most ").append(Math.round(maxMoonIllumination * 100)).append("% lit while up");
        }
        return b.toString();
    }
}
