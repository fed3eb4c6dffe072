package org.skyrota.sky.atmosphere;

/**
 * Atmospheric refraction near the ground, degrees (these are boundary-style helpers: the
 * formulae are published in degrees and arcminutes).
 *
 * <p>Both formulae are those Meeus gives in Astronomical Algorithms, 2nd ed., ch. 16, with
 * his factor (P/1010)·(283/(273 + T)) for pressure P in hPa (= mbar) and temperature T in °C.
 * At P = 1010 hPa and T = 10 °C the factor is exactly 1.
 */
public final class Refraction {

    /** Temperature assumed when none is known, °C (the value Meeus's formulae are scaled to). */
    public static final double STANDARD_TEMPERATURE_C = 10.0;

    /** Pressure at which Meeus's formulae are scaled to a factor of 1, hPa. */
    public static final double REFERENCE_PRESSURE_HPA = 1010.0;

    /** Sea-level pressure of the ICAO standard atmosphere, hPa. */
    public static final double SEA_LEVEL_PRESSURE_HPA = 1013.25;

    /** Below this true altitude Saemundsson's formula is held at its value there. */
    public static final double LOWEST_TRUE_ALTITUDE_DEG = -2.0;

    private Refraction() {
    }

    /**
     * Standard pressure at a height: the barometric formula of the ICAO standard atmosphere
     * (troposphere, lapse rate 6.5 K/km from 288.15 K and 1013.25 hPa at sea level):
     * P = 1013.25 (1 − 2.25577e-5 h)^5.25588.
     *
     * @param elevationM height above sea level, metres (below 11 km)
     * @return pressure in hPa
     */
    public static double standardPressureHpa(double elevationM) {
        return SEA_LEVEL_PRESSURE_HPA * Math.pow(1 - 2.25577e-5 * elevationM, 5.25588);
    }

    /**
     * Refraction from the apparent altitude, Bennett's formula (Meeus ch. 16):
     * R = 1/tan(h0 + 7.31/(h0 + 4.4)) arcminutes, times the pressure and temperature factor.
     *
     * @param apparentAltDeg apparent (observed) altitude, degrees; meaningful from about −1°
     * @return refraction in degrees (apparent − true), never negative
     */
    public static double bennettDeg(double apparentAltDeg, double pressureHpa, double temperatureC) {
        double h = Math.max(apparentAltDeg, -1.5);
        double rArcmin = 1.0 / Math.tan(Math.toRadians(h + 7.31 / (h + 4.4)));
        return Math.max(0.0, rArcmin) / 60.0 * factor(pressureHpa, temperatureC);
    }

    /**
     * Refraction from the true (airless) altitude, Saemundsson's formula (Meeus ch. 16):
     * R = 1.02/tan(h + 10.3/(h + 5.11)) arcminutes, times the pressure and temperature factor.
     * Below {@link #LOWEST_TRUE_ALTITUDE_DEG} the value at that altitude is used, so the
     * result stays finite and apparent altitude stays an increasing function of true altitude.
     *
     * @param trueAltDeg true altitude, degrees
     * @return refraction in degrees (apparent − true), never negative
     */
    public static double saemundssonDeg(double trueAltDeg, double pressureHpa, double temperatureC) {
        double h = Math.max(trueAltDeg, LOWEST_TRUE_ALTITUDE_DEG);
        double rArcmin = 1.02 / Math.tan(Math.toRadians(h + 10.3 / (h + 5.11)));
        return Math.max(0.0, rArcmin) / 60.0 * factor(pressureHpa, temperatureC);
    }

    /** Apparent altitude from true altitude: true + {@link #saemundssonDeg}. */
    public static double apparentFromTrueDeg(double trueAltDeg, double pressureHpa, double temperatureC) {
        return trueAltDeg + saemundssonDeg(trueAltDeg, pressureHpa, temperatureC);
    }

    /**
     * True altitude from apparent altitude: the inverse of {@link #apparentFromTrueDeg}
     * (so that a round trip returns the input to 1e-9°), found by a few Newton steps from
     * apparent − {@link #bennettDeg}.
     */
    public static double trueFromApparentDeg(double apparentAltDeg, double pressureHpa, double temperatureC) {
        double h = apparentAltDeg - bennettDeg(apparentAltDeg, pressureHpa, temperatureC);
        for (int i = 0; i < 20; i++) {
            double g = apparentFromTrueDeg(h, pressureHpa, temperatureC) - apparentAltDeg;
            if (Math.abs(g) < 1e-12) {
                break;
            }
            double step = 1e-6;
            double slope = (apparentFromTrueDeg(h + step, pressureHpa, temperatureC)
                    - apparentFromTrueDeg(h - step, pressureHpa, temperatureC)) / (2 * step);
            h -= g / slope;
        }
        return h;
    }

    private static double factor(double pressureHpa, double temperatureC) {
        return (pressureHpa / REFERENCE_PRESSURE_HPA) * (283.0 / (273.0 + temperatureC));
    }
}
