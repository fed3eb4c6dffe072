package org.skyrota.sky.coords;

/**
 * A direction in equatorial coordinates at a public boundary: right ascension and declination
 * in degrees.
 *
 * @param raDeg right ascension, [0, 360)
 * @param decDeg declination, [−90, 90]
 */
public record EquatorialDeg(double raDeg, double decDeg) {

    public EquatorialDeg {
        if (!(raDeg >= 0 && raDeg < 360)) {
            throw new IllegalArgumentException("raDeg must be in [0, 360): " + raDeg);
        }
        if (!(decDeg >= -90 && decDeg <= 90)) {
            throw new IllegalArgumentException("decDeg must be in [-90, 90]: " + decDeg);
        }
    }

    /**
     * Validating factory.
     *
     * @throws IllegalArgumentException naming the bad value if out of range or not a number
     */
    public static EquatorialDeg of(double raDeg, double decDeg) {
        return new EquatorialDeg(raDeg, decDeg);
    }

    /** From radians, normalising the right ascension into [0, 2π). */
    public static EquatorialDeg ofRadians(double raRad, double decRad) {
        double ra = Math.toDegrees(raRad) % 360.0;
        if (ra < 0) {
            ra += 360.0;
        }
        if (ra >= 360.0) {
            ra = 0.0;
        }
        return new EquatorialDeg(ra, Math.toDegrees(decRad));
    }

    public double raRad() {
        return Math.toRadians(raDeg);
    }

    public double decRad() {
        return Math.toRadians(decDeg);
    }
}
