package org.skyrota.sky.coords;

import org.skyrota.sky.time.TimeScales;

/**
 * Precession of the equator and equinox from J2000.0 to the mean equator and equinox of date.
 *
 * <p>The main model is <b>IAU 2006</b> (Capitaine, Wallace and Chapront 2003, "P03"), with the
 * equatorial angles ζ_A, z_A, θ_A of the IERS Conventions 2010, eq. 5.40:
 * P = R3(−z_A) · R2(θ_A) · R3(−ζ_A). The frame bias between ICRS and the J2000 mean equator
 * (about 23 mas) is not applied. The IAU 1976 (Lieske et al. 1977) model is kept for
 * comparison with Meeus's examples, which use it; the two differ by about 0.3″ per century.
 */
public final class Precession {

    private static final double ARCSEC = Math.PI / 648000.0;

    private Precession() {
    }

    /** ζ_A of IAU 2006, radians. */
    public static double zetaRad(double jdTt) {
        double t = TimeScales.centuriesTt(jdTt);
        return (2.650545 + t * (2306.083227 + t * (0.2988499 + t * (0.01801828
                + t * (-0.000005971 + t * -0.0000003173))))) * ARCSEC;
    }

    /** z_A of IAU 2006, radians. */
    public static double zRad(double jdTt) {
        double t = TimeScales.centuriesTt(jdTt);
        return (-2.650545 + t * (2306.077181 + t * (1.0927348 + t * (0.01826837
                + t * (-0.000028596 + t * -0.0000002904))))) * ARCSEC;
    }

    /** θ_A of IAU 2006, radians. */
    public static double thetaRad(double jdTt) {
        double t = TimeScales.centuriesTt(jdTt);
        return t * (2004.191903 + t * (-0.4294934 + t * (-0.04182264
                + t * (-0.000007089 + t * -0.0000001274)))) * ARCSEC;
    }

    /**
     * The IAU 2006 precession matrix, J2000 mean equator and equinox to mean of date
     * (a new 3×3 array: for loops use {@link #fillMatrixJ2000ToDate}).
     *
     * @param jdTt Julian Date in TT
     */
    public static double[][] matrixJ2000ToDate(double jdTt) {
        double[] m = new double[9];
        fillMatrixJ2000ToDate(jdTt, m);
        return toSquare(m);
    }

    /**
     * Writes the IAU 2006 precession matrix, row by row, into {@code m9[0..8]}.
     *
     * @param jdTt Julian Date in TT
     * @param m9 receives the matrix; length at least 9
     */
    public static void fillMatrixJ2000ToDate(double jdTt, double[] m9) {
        fill(zetaRad(jdTt), zRad(jdTt), thetaRad(jdTt), m9);
    }

    /**
     * The IAU 1976 precession matrix (Lieske et al. 1977; Meeus, Astronomical Algorithms,
     * 2nd ed., ch. 21, rigorous method with the angles ζ, z, θ counted from J2000.0).
     *
     * @param jdTt Julian Date in TT
     */
    public static double[][] matrixJ2000ToDateIau1976(double jdTt) {
        double t = TimeScales.centuriesTt(jdTt);
        double zeta = t * (2306.2181 + t * (0.30188 + t * 0.017998)) * ARCSEC;
        double z = t * (2306.2181 + t * (1.09468 + t * 0.018203)) * ARCSEC;
        double theta = t * (2004.3109 + t * (-0.42665 + t * -0.041833)) * ARCSEC;
        double[] m = new double[9];
        fill(zeta, z, theta, m);
        return toSquare(m);
    }

    static void fill(double zeta, double z, double theta, double[] m) {
        double cze = Math.cos(zeta);
        double sze = Math.sin(zeta);
        double cz = Math.cos(z);
        double sz = Math.sin(z);
        double ct = Math.cos(theta);
        double st = Math.sin(theta);
        m[0] = cze * ct * cz - sze * sz;
        m[1] = -sze * ct * cz - cze * sz;
        m[2] = -st * cz;
        m[3] = cze * ct * sz + sze * cz;
        m[4] = -sze * ct * sz + cze * cz;
        m[5] = -st * sz;
        m[6] = cze * st;
        m[7] = -sze * st;
        m[8] = ct;
    }

    private static double[][] toSquare(double[] m) {
        return new double[][] {{m[0], m[1], m[2]}, {m[3], m[4], m[5]}, {m[6], m[7], m[8]}};
    }
}
