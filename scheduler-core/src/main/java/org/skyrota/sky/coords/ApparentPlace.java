package org.skyrota.sky.coords;

import org.skyrota.sky.time.TimeScales;

/**
 * Mean place (ICRS / J2000) of a star-like target to its geocentric apparent place of date.
 *
 * <p>Steps, all on unit vectors: space motion is taken as linear proper motion on the sky
 * from J2000.0 (no radial velocity); precession IAU 2006 ({@link Precession}); nutation
 * IAU 1980 ({@link Nutation}) as the rotation R1(−ε−Δε)·R3(−Δψ)·R1(ε); annual aberration to
 * first order with the Earth's velocity in an elliptic orbit (Meeus, Astronomical Algorithms,
 * 2nd ed., ch. 23, the formula with κ = 20.49552″ and the eccentricity terms, in vector form).
 *
 * <p>Neglected: the ICRS–J2000 frame bias (23 mas), gravitational light deflection by the Sun
 * (4 mas at 90° from it, 1.75″ at its limb), the annual parallax (below 0.8″ even for the
 * nearest stars) and the second-order aberration terms (below 1 mas).
 *
 * <p>Allocation-free: the caller supplies {@code out}.
 */
public final class ApparentPlace {

    private static final double TWO_PI = 2 * Math.PI;
    private static final double ARCSEC = Math.PI / 648000.0;
    private static final double KAPPA = 20.49552 * ARCSEC;

    private ApparentPlace() {
    }

    /**
     * Geocentric apparent right ascension and declination of date.
     *
     * @param raJ2000Rad right ascension at J2000.0, ICRS
     * @param decJ2000Rad declination at J2000.0, ICRS
     * @param pmRaCosDecRadPerYear proper motion in right ascension times cos(dec), radians per
     *     Julian year
     * @param pmDecRadPerYear proper motion in declination, radians per Julian year
     * @param jdTt Julian Date in TT
     * @param out receives out[0] = right ascension in [0, 2π), out[1] = declination
     */
    public static void ofDate(double raJ2000Rad, double decJ2000Rad, double pmRaCosDecRadPerYear,
            double pmDecRadPerYear, double jdTt, double[] out) {
        ofDate(raJ2000Rad, decJ2000Rad, pmRaCosDecRadPerYear, pmDecRadPerYear, jdTt, true, true, out);
    }

    /**
     * As {@link #ofDate(double, double, double, double, double, double[])}, with nutation and
     * aberration each optional (false leaves it out: mean place of date, or true place without
     * aberration). Meant for tests and comparisons.
     */
    public static void ofDate(double raJ2000Rad, double decJ2000Rad, double pmRaCosDecRadPerYear,
            double pmDecRadPerYear, double jdTt, boolean nutation, boolean aberration, double[] out) {
        double sa = Math.sin(raJ2000Rad);
        double ca = Math.cos(raJ2000Rad);
        double sd = Math.sin(decJ2000Rad);
        double cd = Math.cos(decJ2000Rad);
        double years = (jdTt - TimeScales.J2000_JD) / 365.25;
        double ma = pmRaCosDecRadPerYear * years;
        double md = pmDecRadPerYear * years;
        double x = cd * ca - ma * sa - md * sd * ca;
        double y = cd * sa + ma * ca - md * sd * sa;
        double z = sd + md * cd;

        // Precession, IAU 2006 (the matrix of Precession.fill written out in locals).
        double zeta = Precession.zetaRad(jdTt);
        double zz = Precession.zRad(jdTt);
        double theta = Precession.thetaRad(jdTt);
        double cze = Math.cos(zeta);
        double sze = Math.sin(zeta);
        double cz = Math.cos(zz);
        double sz = Math.sin(zz);
        double ct = Math.cos(theta);
        double st = Math.sin(theta);
        double px = (cze * ct * cz - sze * sz) * x + (-sze * ct * cz - cze * sz) * y + (-st * cz) * z;
        double py = (cze * ct * sz + sze * cz) * x + (-sze * ct * sz + cze * cz) * y + (-st * sz) * z;
        double pz = (cze * st) * x + (-sze * st) * y + ct * z;

        double eps0 = Obliquity.meanRad(jdTt);
        double dpsi = 0;
        double deps = 0;
        if (nutation) {
            Nutation.angles(jdTt, out);
            dpsi = out[0];
            deps = out[1];
        }
        double epsTrue = eps0 + deps;
        if (nutation) {
            // Equator of date to ecliptic of date, shift the longitude by Δψ, back with ε + Δε.
            double ce = Math.cos(eps0);
            double se = Math.sin(eps0);
            double ex = px;
            double ey = ce * py + se * pz;
            double ez = -se * py + ce * pz;
            double cp = Math.cos(dpsi);
            double sp = Math.sin(dpsi);
            double nx = cp * ex - sp * ey;
            double ny = sp * ex + cp * ey;
            double cet = Math.cos(epsTrue);
            double set = Math.sin(epsTrue);
            px = nx;
            py = cet * ny - set * ez;
            pz = set * ny + cet * ez;
        }

        if (aberration) {
            double t = TimeScales.centuriesTt(jdTt);
            double sun = sunTrueLongitudeRad(t);
            double e = 0.016708634 - t * (0.000042037 + t * 0.0000001267);
            double peri = Math.toRadians(102.93735 + t * (1.71946 + t * 0.00046));
            // Earth's velocity over c in the ecliptic of date: toward the apex, 90° west of the Sun.
            double vx = KAPPA * (Math.sin(sun) - e * Math.sin(peri));
            double vy = KAPPA * (-Math.cos(sun) + e * Math.cos(peri));
            double cet = Math.cos(epsTrue);
            double set = Math.sin(epsTrue);
            px += vx;
            py += vy * cet;
            pz += vy * set;
        }

        double ra = Math.atan2(py, px);
        if (ra < 0) {
            ra += TWO_PI;
        }
        out[0] = ra >= TWO_PI ? ra - TWO_PI : ra;
        out[1] = Math.atan2(pz, Math.sqrt(px * px + py * py));
    }

    /** Length of the array filled by {@link #prepare}. */
    public static final int FRAME_LENGTH = 13;

    /**
     * Precomputes everything that depends only on the date, for many targets at one instant: the
     * combined precession-nutation matrix (frame[0..8], row by row), the Earth's velocity over c in the
     * true equator of date (frame[9..11]) and the date itself (frame[12]).
     *
     * @param jdTt Julian Date in TT
     * @param frame receives the frame; length at least {@link #FRAME_LENGTH}
     */
    public static void prepare(double jdTt, double[] frame) {
        double eps0 = Obliquity.meanRad(jdTt);
        Nutation.angles(jdTt, frame);
        double dpsi = frame[0];
        double deps = frame[1];
        double epsTrue = eps0 + deps;
        Precession.fillMatrixJ2000ToDate(jdTt, frame);
        double ce = Math.cos(eps0);
        double se = Math.sin(eps0);
        double cp = Math.cos(dpsi);
        double sp = Math.sin(dpsi);
        double cet = Math.cos(epsTrue);
        double set = Math.sin(epsTrue);
        for (int col = 0; col < 3; col++) {
            double px = frame[col];
            double py = frame[3 + col];
            double pz = frame[6 + col];
            double ey = ce * py + se * pz;
            double ez = -se * py + ce * pz;
            double nx = cp * px - sp * ey;
            double ny = sp * px + cp * ey;
            frame[col] = nx;
            frame[3 + col] = cet * ny - set * ez;
            frame[6 + col] = set * ny + cet * ez;
        }
        double t = TimeScales.centuriesTt(jdTt);
        double sun = sunTrueLongitudeRad(t);
        double e = 0.016708634 - t * (0.000042037 + t * 0.0000001267);
        double peri = Math.toRadians(102.93735 + t * (1.71946 + t * 0.00046));
        double vx = KAPPA * (Math.sin(sun) - e * Math.sin(peri));
        double vy = KAPPA * (-Math.cos(sun) + e * Math.cos(peri));
        frame[9] = vx;
        frame[10] = vy * cet;
        frame[11] = vy * set;
        frame[12] = jdTt;
    }

    /**
     * The same apparent place as {@link #ofDate(double, double, double, double, double, double[])}, from a
     * frame filled by {@link #prepare}: about ten times cheaper when many targets share one instant.
     *
     * @param frame a frame from {@link #prepare}
     * @param out receives out[0] = right ascension in [0, 2π), out[1] = declination
     */
    public static void ofDate(double[] frame, double raJ2000Rad, double decJ2000Rad, double pmRaCosDecRadPerYear,
            double pmDecRadPerYear, double[] out) {
        double sa = Math.sin(raJ2000Rad);
        double ca = Math.cos(raJ2000Rad);
        double sd = Math.sin(decJ2000Rad);
        double cd = Math.cos(decJ2000Rad);
        double years = (frame[12] - TimeScales.J2000_JD) / 365.25;
        double ma = pmRaCosDecRadPerYear * years;
        double md = pmDecRadPerYear * years;
        double x = cd * ca - ma * sa - md * sd * ca;
        double y = cd * sa + ma * ca - md * sd * sa;
        double z = sd + md * cd;
        double px = frame[0] * x + frame[1] * y + frame[2] * z + frame[9];
        double py = frame[3] * x + frame[4] * y + frame[5] * z + frame[10];
        double pz = frame[6] * x + frame[7] * y + frame[8] * z + frame[11];
        double ra = Math.atan2(py, px);
        if (ra < 0) {
            ra += TWO_PI;
        }
        out[0] = ra >= TWO_PI ? ra - TWO_PI : ra;
        out[1] = Math.atan2(pz, Math.sqrt(px * px + py * py));
    }

    /**
     * The Sun's geometric true longitude of date, low precision (Meeus ch. 25, 0.01°): only
     * used for the direction of the Earth's velocity, where 0.01° changes the aberration by
     * less than 0.004″.
     */
    static double sunTrueLongitudeRad(double t) {
        double l0 = 280.46646 + t * (36000.76983 + t * 0.0003032);
        double m = Math.toRadians(357.52911 + t * (35999.05029 - t * 0.0001537));
        double c = (1.914602 - t * (0.004817 + t * 0.000014)) * Math.sin(m)
                + (0.019993 - t * 0.000101) * Math.sin(2 * m) + 0.000289 * Math.sin(3 * m);
        return Math.toRadians(l0 + c);
    }
}
