package org.skyrota.sky.atmosphere;

/** Relative optical air mass. */
public final class Airmass {

    private Airmass() {
    }

    /**
     * Kasten and Young (1989, Applied Optics 28, 4735): X = 1/(cos z + 0.50572 (96.07995° − z)^−1.6364),
     * z the apparent zenith angle in degrees. About 38 at the horizon.
     *
     * @param apparentAltitudeDeg apparent (refracted) altitude, degrees
     * @return air mass ≥ 1; {@link Double#POSITIVE_INFINITY} when the apparent altitude is
     *     below 0° (the formula is fitted down to the horizon only)
     */
    public static double kastenYoung(double apparentAltitudeDeg) {
        if (Double.isNaN(apparentAltitudeDeg)) {
            throw new IllegalArgumentException("apparentAltitudeDeg is NaN");
        }
        if (apparentAltitudeDeg < 0) {
            return Double.POSITIVE_INFINITY;
        }
        double z = 90.0 - Math.min(apparentAltitudeDeg, 90.0);
        return 1.0 / (Math.cos(Math.toRadians(z)) + 0.50572 * Math.pow(96.07995 - z, -1.6364));
    }
}
