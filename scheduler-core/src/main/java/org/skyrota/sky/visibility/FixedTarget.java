package org.skyrota.sky.visibility;

/**
 * A target fixed among the stars: ICRS / J2000 mean position with optional proper motion.
 *
 * @param raDeg right ascension, degrees, 0 (inclusive) to 360 (exclusive)
 * @param decDeg declination, degrees, −90 to 90
 * @param pmRaMasPerYear proper motion in right ascension times cos(dec), mas/yr, |μ| ≤ 20,000
 * @param pmDecMasPerYear proper motion in declination, mas/yr, |μ| ≤ 20,000
 */
public record FixedTarget(double raDeg, double decDeg, double pmRaMasPerYear, double pmDecMasPerYear) {

    private static final double MAX_PM_MAS_PER_YEAR = 20_000;
    private static final double MAS_TO_RAD = Math.PI / (180.0 * 3600e3);

    public FixedTarget {
        if (!(raDeg >= 0 && raDeg < 360)) {
            throw new IllegalArgumentException("raDeg must be in [0, 360): " + raDeg);
        }
        if (!(decDeg >= -90 && decDeg <= 90)) {
            throw new IllegalArgumentException("decDeg must be in [-90, 90]: " + decDeg);
        }
        if (!(Math.abs(pmRaMasPerYear) <= MAX_PM_MAS_PER_YEAR)) {
            throw new IllegalArgumentException("pmRaMasPerYear must be within ±20000: " + pmRaMasPerYear);
        }
        if (!(Math.abs(pmDecMasPerYear) <= MAX_PM_MAS_PER_YEAR)) {
            throw new IllegalArgumentException("pmDecMasPerYear must be within ±20000: " + pmDecMasPerYear);
        }
    }

    /** A target without proper motion. */
    public static FixedTarget of(double raDeg, double decDeg) {
        return new FixedTarget(raDeg, decDeg, 0, 0);
    }

    public static FixedTarget of(double raDeg, double decDeg, double pmRaMasPerYear, double pmDecMasPerYear) {
        return new FixedTarget(raDeg, decDeg, pmRaMasPerYear, pmDecMasPerYear);
    }

    public double raRad() {
        return Math.toRadians(raDeg);
    }

    public double decRad() {
        return Math.toRadians(decDeg);
    }

    public double pmRaCosDecRadPerYear() {
        return pmRaMasPerYear * MAS_TO_RAD;
    }

    public double pmDecRadPerYear() {
        return pmDecMasPerYear * MAS_TO_RAD;
    }
}
