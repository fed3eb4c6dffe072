package org.skyrota.sky.time;

import org.skyrota.sky.coords.Nutation;
import org.skyrota.sky.coords.Obliquity;

/**
 * Earth rotation angle and Greenwich sidereal time. All results in radians, [0, 2π).
 */
public final class SiderealTime {

    private static final double TWO_PI = 2 * Math.PI;
    private static final double ARCSEC = Math.PI / 648000.0;

    private SiderealTime() {
    }

    /**
     * Earth rotation angle, IAU 2000 (as SOFA {@code iauEra00}):
     * θ = 2π (0.7790572732640 + 1.00273781191135448 Tu), Tu = JD(UT1) − 2451545.0.
     *
     * @param jdUt1 Julian Date in UT1
     */
    public static double earthRotationAngleRad(double jdUt1) {
        double tu = jdUt1 - TimeScales.J2000_JD;
        // The integral part of Tu is a whole number of turns: take its fraction first so the
        // large number never multiplies the rate.
        double f = tu - Math.floor(tu);
        return normalize(TWO_PI * (f + 0.7790572732640 + 0.00273781191135448 * tu));
    }

    /**
     * Greenwich mean sidereal time, IAU 2006 (as SOFA {@code iauGmst06}): the Earth rotation
     * angle plus the IAU 2006 polynomial in TT.
     *
     * @param jdUt1 Julian Date in UT1
     * @param jdTt Julian Date in TT
     */
    public static double gmstRad(double jdUt1, double jdTt) {
        double t = TimeScales.centuriesTt(jdTt);
        double poly = 0.014506 + t * (4612.156534 + t * (1.3915817 + t * (-0.00000044
                + t * (-0.000029956 + t * -0.0000000368))));
        return normalize(earthRotationAngleRad(jdUt1) + poly * ARCSEC);
    }

    /**
     * Greenwich apparent sidereal time: {@link #gmstRad} plus the equation of the equinoxes
     * Δψ cos ε_A + 0.00264″ sin Ω + 0.000063″ sin 2Ω with the mean obliquity ε_A, as SOFA does
     * (nutation from {@link Nutation}, that is
     * IAU 1980 as tabulated by Meeus; the two complementary terms are the largest ones of the
     * IAU 2000 equation of the equinoxes).
     *
     * @param jdUt1 Julian Date in UT1
     * @param jdTt Julian Date in TT
     */
    public static double gastRad(double jdUt1, double jdTt) {
        return normalize(gmstRad(jdUt1, jdTt) + equationOfEquinoxesRad(jdTt));
    }

    /**
     * Local apparent sidereal time: {@link #gastRad} plus the east longitude, in [0, 2π).
     *
     * @param lonEastRad longitude, positive east
     */
    public static double localApparentRad(double jdUt1, double jdTt, double lonEastRad) {
        return normalize(gastRad(jdUt1, jdTt) + lonEastRad);
    }

    /** The equation of the equinoxes used by {@link #gastRad}, radians. */
    public static double equationOfEquinoxesRad(double jdTt) {
        double t = TimeScales.centuriesTt(jdTt);
        double omega = Math.toRadians(125.04452 + t * (-1934.136261 + t * (0.0020708 + t / 450000.0)));
        return Nutation.longitudeRad(jdTt) * Math.cos(Obliquity.meanRad(jdTt))
                + (0.00264096 * Math.sin(omega) + 0.00006352 * Math.sin(2 * omega)) * ARCSEC;
    }

    /**
     * Greenwich mean sidereal time by the IAU 1982 expression in UT1 alone (Meeus, Astronomical
     * Algorithms, 2nd ed., formula 12.4). Kept for comparison with the book's examples; it
     * differs from {@link #gmstRad} by a few milliseconds of time in this century.
     *
     * @param jdUt1 Julian Date in UT1
     */
    public static double gmst1982Rad(double jdUt1) {
        double d = jdUt1 - TimeScales.J2000_JD;
        double t = d / 36525.0;
        double whole = Math.floor(d);
        double frac = d - whole;
        // 360.98564736629 d = 360 d + 0.98564736629 d: drop the whole turns of the first part.
        double deg = 280.46061837 + 360.0 * frac + 0.98564736629 * d + t * t * (0.000387933 - t / 38710000.0);
        return normalize(Math.toRadians(deg % 360.0));
    }

    private static double normalize(double a) {
        double r = a % TWO_PI;
        return r < 0 ? r + TWO_PI : r;
    }
}
