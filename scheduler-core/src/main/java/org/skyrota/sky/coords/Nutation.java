package org.skyrota.sky.coords;

import org.skyrota.sky.time.TimeScales;

/**
 * Nutation in longitude (Δψ) and in obliquity (Δε) by the IAU 1980 theory, with the 63 terms
 * that Meeus tabulates (Astronomical Algorithms, 2nd ed., Table 22.A; terms below 0.0003″
 * left out). Accuracy about 0.5 mas against the full IAU 1980 series, and a few
 * milliarcseconds against IAU 2000A, far below what observation planning needs.
 */
public final class Nutation {

    private static final double ARCSEC = Math.PI / 648000.0;

    /**
     * One row per term: multiples of D, M, M′, F, Ω, then Δψ coefficients (sine, in 0.0001″,
     * constant and per Julian century) and Δε coefficients (cosine, same units). Meeus Table
     * 22.A, in the book's order.
     */
    private static final double[] TERMS = {
        0, 0, 0, 0, 1, -171996, -174.2, 92025, 8.9,
        -2, 0, 0, 2, 2, -13187, -1.6, 5736, -3.1,
        0, 0, 0, 2, 2, -2274, -0.2, 977, -0.5,
        0, 0, 0, 0, 2, 2062, 0.2, -895, 0.5,
        0, 1, 0, 0, 0, 1426, -3.4, 54, -0.1,
        0, 0, 1, 0, 0, 712, 0.1, -7, 0,
        -2, 1, 0, 2, 2, -517, 1.2, 224, -0.6,
        0, 0, 0, 2, 1, -386, -0.4, 200, 0,
        0, 0, 1, 2, 2, -301, 0, 129, -0.1,
        -2, -1, 0, 2, 2, 217, -0.5, -95, 0.3,
        -2, 0, 1, 0, 0, -158, 0, 0, 0,
        -2, 0, 0, 2, 1, 129, 0.1, -70, 0,
        0, 0, -1, 2, 2, 123, 0, -53, 0,
        2, 0, 0, 0, 0, 63, 0, 0, 0,
        0, 0, 1, 0, 1, 63, 0.1, -33, 0,
        2, 0, -1, 2, 2, -59, 0, 26, 0,
        0, 0, -1, 0, 1, -58, -0.1, 32, 0,
        0, 0, 1, 2, 1, -51, 0, 27, 0,
        -2, 0, 2, 0, 0, 48, 0, 0, 0,
        0, 0, -2, 2, 1, 46, 0, -24, 0,
        2, 0, 0, 2, 2, -38, 0, 16, 0,
        0, 0, 2, 2, 2, -31, 0, 13, 0,
        0, 0, 2, 0, 0, 29, 0, 0, 0,
        -2, 0, 1, 2, 2, 29, 0, -12, 0,
        0, 0, 0, 2, 0, 26, 0, 0, 0,
        -2, 0, 0, 2, 0, -22, 0, 0, 0,
        0, 0, -1, 2, 1, 21, 0, -10, 0,
        0, 2, 0, 0, 0, 17, -0.1, 0, 0,
        2, 0, -1, 0, 1, 16, 0, -8, 0,
        -2, 2, 0, 2, 2, -16, 0.1, 7, 0,
        0, 1, 0, 0, 1, -15, 0, 9, 0,
        -2, 0, 1, 0, 1, -13, 0, 7, 0,
        0, -1, 0, 0, 1, -12, 0, 6, 0,
        0, 0, 2, -2, 0, 11, 0, 0, 0,
        2, 0, -1, 2, 1, -10, 0, 5, 0,
        2, 0, 1, 2, 2, -8, 0, 3, 0,
        0, 1, 0, 2, 2, 7, 0, -3, 0,
        -2, 1, 1, 0, 0, -7, 0, 0, 0,
        0, -1, 0, 2, 2, -7, 0, 3, 0,
        2, 0, 0, 2, 1, -7, 0, 3, 0,
        2, 0, 1, 0, 0, 6, 0, 0, 0,
        -2, 0, 2, 2, 2, 6, 0, -3, 0,
        -2, 0, 1, 2, 1, 6, 0, -3, 0,
        2, 0, -2, 0, 1, -6, 0, 3, 0,
        2, 0, 0, 0, 1, -6, 0, 3, 0,
        0, -1, 1, 0, 0, 5, 0, 0, 0,
        -2, -1, 0, 2, 1, -5, 0, 3, 0,
        -2, 0, 0, 0, 1, -5, 0, 3, 0,
        0, 0, 2, 2, 1, -5, 0, 3, 0,
        -2, 0, 2, 0, 1, 4, 0, 0, 0,
        -2, 1, 0, 2, 1, 4, 0, 0, 0,
        0, 0, 1, -2, 0, 4, 0, 0, 0,
        -1, 0, 1, 0, 0, -4, 0, 0, 0,
        -2, 1, 0, 0, 0, -4, 0, 0, 0,
        1, 0, 0, 0, 0, -4, 0, 0, 0,
        0, 0, 1, 2, 0, 3, 0, 0, 0,
        0, 0, -2, 2, 2, -3, 0, 0, 0,
        -1, -1, 1, 0, 0, -3, 0, 0, 0,
        0, 1, 1, 0, 0, -3, 0, 0, 0,
        0, -1, 1, 2, 2, -3, 0, 0, 0,
        2, -1, -1, 2, 2, -3, 0, 0, 0,
        0, 0, 3, 2, 2, -3, 0, 0, 0,
        2, -1, 0, 2, 2, -3, 0, 0, 0,
    };

    private static final int ROW = 9;

    private Nutation() {
    }

    /** Nutation in longitude Δψ, radians. */
    public static double longitudeRad(double jdTt) {
        return sum(jdTt, true);
    }

    /** Nutation in obliquity Δε, radians. */
    public static double obliquityRad(double jdTt) {
        return sum(jdTt, false);
    }

    /**
     * Both nutation angles at once.
     *
     * @param jdTt Julian Date in TT
     * @param out receives out[0] = Δψ and out[1] = Δε, radians; length at least 2
     */
    public static void angles(double jdTt, double[] out) {
        double t = TimeScales.centuriesTt(jdTt);
        double d = Math.toRadians(297.85036 + t * (445267.111480 + t * (-0.0019142 + t / 189474.0)));
        double m = Math.toRadians(357.52772 + t * (35999.050340 + t * (-0.0001603 - t / 300000.0)));
        double mp = Math.toRadians(134.96298 + t * (477198.867398 + t * (0.0086972 + t / 56250.0)));
        double f = Math.toRadians(93.27191 + t * (483202.017538 + t * (-0.0036825 + t / 327270.0)));
        double om = Math.toRadians(125.04452 + t * (-1934.136261 + t * (0.0020708 + t / 450000.0)));
        double dpsi = 0;
        double deps = 0;
        for (int i = 0; i < TERMS.length; i += ROW) {
            double arg = TERMS[i] * d + TERMS[i + 1] * m + TERMS[i + 2] * mp + TERMS[i + 3] * f + TERMS[i + 4] * om;
            dpsi += (TERMS[i + 5] + TERMS[i + 6] * t) * Math.sin(arg);
            double c = TERMS[i + 7] + TERMS[i + 8] * t;
            if (c != 0) {
                deps += c * Math.cos(arg);
            }
        }
        out[0] = dpsi * 1e-4 * ARCSEC;
        out[1] = deps * 1e-4 * ARCSEC;
    }

    private static double sum(double jdTt, boolean longitude) {
        // Two locals instead of an array keep this path free of allocation.
        double t = TimeScales.centuriesTt(jdTt);
        double d = Math.toRadians(297.85036 + t * (445267.111480 + t * (-0.0019142 + t / 189474.0)));
        double m = Math.toRadians(357.52772 + t * (35999.050340 + t * (-0.0001603 - t / 300000.0)));
        double mp = Math.toRadians(134.96298 + t * (477198.867398 + t * (0.0086972 + t / 56250.0)));
        double f = Math.toRadians(93.27191 + t * (483202.017538 + t * (-0.0036825 + t / 327270.0)));
        double om = Math.toRadians(125.04452 + t * (-1934.136261 + t * (0.0020708 + t / 450000.0)));
        double s = 0;
        for (int i = 0; i < TERMS.length; i += ROW) {
            double arg = TERMS[i] * d + TERMS[i + 1] * m + TERMS[i + 2] * mp + TERMS[i + 3] * f + TERMS[i + 4] * om;
            if (longitude) {
                s += (TERMS[i + 5] + TERMS[i + 6] * t) * Math.sin(arg);
            } else {
                double c = TERMS[i + 7] + TERMS[i + 8] * t;
                if (c != 0) {
                    s += c * Math.cos(arg);
                }
            }
        }
        return s * 1e-4 * ARCSEC;
    }
}
