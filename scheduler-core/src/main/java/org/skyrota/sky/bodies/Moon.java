package org.skyrota.sky.bodies;

import org.skyrota.sky.coords.Nutation;
import org.skyrota.sky.coords.Obliquity;
import org.skyrota.sky.time.TimeScales;

/**
 * Geocentric apparent place and illumination of the Moon.
 *
 * <p>Position by Meeus, Astronomical Algorithms, 2nd ed., ch. 47 (after Chapront's ELP-2000/82,
 * mean elements of Chapront-Touzé and Chapront 1991): the full Tables 47.A and 47.B with the
 * additive terms for Venus, Jupiter and the flattening of the Earth; the apparent longitude
 * adds the nutation in longitude (the aberration of the Moon, 0.7″, is neglected as in the
 * book). Meeus gives the accuracy as about 10″ in longitude and 4″ in latitude.
 *
 * <p>Phase angle and illuminated fraction by ch. 48 (formulae 48.2 and 48.3) from this
 * position and {@link Sun}.
 */
public final class Moon {

    private static final double TWO_PI = 2 * Math.PI;

    /**
     * Table 47.A: multiples of D, M, M′, F, then the coefficient of the sine for Σl
     * (1e-6 degree) and of the cosine for Σr (1e-3 km).
     */
    private static final double[] LR = {
        0, 0, 1, 0, 6288774, -20905355,
        2, 0, -1, 0, 1274027, -3699111,
        2, 0, 0, 0, 658314, -2955968,
        0, 0, 2, 0, 213618, -569925,
        0, 1, 0, 0, -185116, 48888,
        0, 0, 0, 2, -114332, -3149,
        2, 0, -2, 0, 58793, 246158,
        2, -1, -1, 0, 57066, -152138,
        2, 0, 1, 0, 53322, -170733,
        2, -1, 0, 0, 45758, -204586,
        0, 1, -1, 0, -40923, -129620,
        1, 0, 0, 0, -34720, 108743,
        0, 1, 1, 0, -30383, 104755,
        2, 0, 0, -2, 15327, 10321,
        0, 0, 1, 2, -12528, 0,
        0, 0, 1, -2, 10980, 79661,
        4, 0, -1, 0, 10675, -34782,
        0, 0, 3, 0, 10034, -23210,
        4, 0, -2, 0, 8548, -21636,
        2, 1, -1, 0, -7888, 24208,
        2, 1, 0, 0, -6766, 30824,
        1, 0, -1, 0, -5163, -8379,
        1, 1, 0, 0, 4987, -16675,
        2, -1, 1, 0, 4036, -12831,
        2, 0, 2, 0, 3994, -10445,
        4, 0, 0, 0, 3861, -11650,
        2, 0, -3, 0, 3665, 14403,
        0, 1, -2, 0, -2689, -7003,
        2, 0, -1, 2, -2602, 0,
        2, -1, -2, 0, 2390, 10056,
        1, 0, 1, 0, -2348, 6322,
        2, -2, 0, 0, 2236, -9884,
        0, 1, 2, 0, -2120, 5751,
        0, 2, 0, 0, -2069, 0,
        2, -2, -1, 0, 2048, -4950,
        2, 0, 1, -2, -1773, 4130,
        2, 0, 0, 2, -1595, 0,
        4, -1, -1, 0, 1215, -3958,
        0, 0, 2, 2, -1110, 0,
        3, 0, -1, 0, -892, 3258,
        2, 1, 1, 0, -810, 2616,
        4, -1, -2, 0, 759, -1897,
        0, 2, -1, 0, -713, -2117,
        2, 2, -1, 0, -700, 2354,
        2, 1, -2, 0, 691, 0,
        2, -1, 0, -2, 596, 0,
        4, 0, 1, 0, 549, -1423,
        0, 0, 4, 0, 537, -1117,
        4, -1, 0, 0, 520, -1571,
        1, 0, -2, 0, -487, -1739,
        2, 1, 0, -2, -399, 0,
        0, 0, 2, -2, -381, -4421,
        1, 1, 1, 0, 351, 0,
        3, 0, -2, 0, -340, 0,
        4, 0, -3, 0, 330, 0,
        2, -1, 2, 0, 327, 0,
        0, 2, 1, 0, -323, 1165,
        1, 1, -1, 0, 299, 0,
        2, 0, 3, 0, 294, 0,
        2, 0, -1, -2, 0, 8752,
    };

    /** Table 47.B: multiples of D, M, M′, F, then the coefficient of the sine for Σb (1e-6°). */
    private static final double[] B = {
        0, 0, 0, 1, 5128122,
        0, 0, 1, 1, 280602,
        0, 0, 1, -1, 277693,
        2, 0, 0, -1, 173237,
        2, 0, -1, 1, 55413,
        2, 0, -1, -1, 46271,
        2, 0, 0, 1, 32573,
        0, 0, 2, 1, 17198,
        2, 0, 1, -1, 9266,
        0, 0, 2, -1, 8822,
        2, -1, 0, -1, 8216,
        2, 0, -2, -1, 4324,
        2, 0, 1, 1, 4200,
        2, 1, 0, -1, -3359,
        2, -1, -1, 1, 2463,
        2, -1, 0, 1, 2211,
        2, -1, -1, -1, 2065,
        0, 1, -1, -1, -1870,
        4, 0, -1, -1, 1828,
        0, 1, 0, 1, -1794,
        0, 0, 0, 3, -1749,
        0, 1, -1, 1, -1565,
        1, 0, 0, 1, -1491,
        0, 1, 1, 1, -1475,
        0, 1, 1, -1, -1410,
        0, 1, 0, -1, -1344,
        1, 0, 0, -1, -1335,
        0, 0, 3, 1, 1107,
        4, 0, 0, -1, 1021,
        4, 0, -1, 1, 833,
        0, 0, 1, -3, 777,
        4, 0, -2, 1, 671,
        2, 0, 0, -3, 607,
        2, 0, 2, -1, 596,
        2, -1, 1, -1, 491,
        2, 0, -2, 1, -451,
        0, 0, 3, -1, 439,
        2, 0, 2, 1, 422,
        2, 0, -3, -1, 421,
        2, 1, -1, 1, -366,
        2, 1, 0, 1, -351,
        4, 0, 0, 1, 331,
        2, -1, 1, 1, 315,
        2, -2, 0, -1, 302,
        0, 0, 1, 3, -283,
        2, 1, 1, -1, -229,
        1, 1, 0, -1, 223,
        1, 1, 0, 1, 223,
        0, 1, -2, -1, -220,
        2, 1, -1, -1, -220,
        1, 0, 1, 1, -185,
        2, -1, -2, -1, 181,
        0, 1, 2, 1, -177,
        4, 0, -2, -1, 176,
        4, -1, -1, -1, 166,
        1, 0, 1, -1, -164,
        4, 0, 1, -1, 132,
        1, 0, -1, -1, -119,
        4, -1, 0, -1, 115,
        2, -2, 0, 1, 107,
    };

    /** Scratch for the Sun's place in the illumination methods, one per thread. */
    private static final ThreadLocal<double[]> SCRATCH = ThreadLocal.withInitial(() -> new double[10]);

    private Moon() {
    }

    /**
     * Geocentric apparent place of date.
     *
     * @param jdTt Julian Date in TT
     * @param out receives out[0] = right ascension in [0, 2π), out[1] = declination,
     *     out[2] = distance between the centres of the Earth and the Moon in km,
     *     out[3] = apparent ecliptic longitude in [0, 2π), out[4] = ecliptic latitude
     */
    public static void apparent(double jdTt, double[] out) {
        geocentricEcliptic(jdTt, out);
        double lon = out[0];
        double lat = out[1];
        double dist = out[2];
        Nutation.angles(jdTt, out);
        lon += out[0];
        double eps = Obliquity.meanRad(jdTt) + out[1];
        lon = lon % TWO_PI;
        if (lon < 0) {
            lon += TWO_PI;
        }
        double sl = Math.sin(lon);
        double cl = Math.cos(lon);
        double sb = Math.sin(lat);
        double cb = Math.cos(lat);
        double se = Math.sin(eps);
        double ce = Math.cos(eps);
        double ra = Math.atan2(sl * ce * cb - sb * se, cl * cb);
        if (ra < 0) {
            ra += TWO_PI;
        }
        out[0] = ra >= TWO_PI ? ra - TWO_PI : ra;
        out[1] = Math.asin(sb * ce + cb * se * sl);
        out[2] = dist;
        out[3] = lon;
        out[4] = lat;
    }

    /**
     * Geometric ecliptic place referred to the mean equinox of date (no nutation).
     *
     * @param out receives out[0] = longitude (radians, not reduced), out[1] = latitude,
     *     out[2] = distance in km
     */
    public static void geocentricEcliptic(double jdTt, double[] out) {
        double t = TimeScales.centuriesTt(jdTt);
        double lp = 218.3164477 + t * (481267.88123421 + t * (-0.0015786 + t * (1.0 / 538841.0 - t / 65194000.0)));
        double d = 297.8501921 + t * (445267.1114034 + t * (-0.0018819 + t * (1.0 / 545868.0 - t / 113065000.0)));
        double m = 357.5291092 + t * (35999.0502909 + t * (-0.0001536 + t / 24490000.0));
        double mp = 134.9633964 + t * (477198.8675055 + t * (0.0087414 + t * (1.0 / 69699.0 - t / 14712000.0)));
        double f = 93.2720950 + t * (483202.0175233 + t * (-0.0036539 + t * (-1.0 / 3526000.0 + t / 863310000.0)));
        double a1 = Math.toRadians(119.75 + 131.849 * t);
        double a2 = Math.toRadians(53.09 + 479264.290 * t);
        double a3 = Math.toRadians(313.45 + 481266.484 * t);
        double e = 1 - t * (0.002516 + t * 0.0000074);
        double e2 = e * e;
        double lpr = Math.toRadians(lp % 360.0);
        double dr = Math.toRadians(d % 360.0);
        double mr = Math.toRadians(m % 360.0);
        double mpr = Math.toRadians(mp % 360.0);
        double fr = Math.toRadians(f % 360.0);

        double sl = 0;
        double sr = 0;
        for (int i = 0; i < LR.length; i += 6) {
            double arg = LR[i] * dr + LR[i + 1] * mr + LR[i + 2] * mpr + LR[i + 3] * fr;
            double mult = LR[i + 1];
            double w = mult == 0 ? 1 : (mult == 1 || mult == -1) ? e : e2;
            sl += w * LR[i + 4] * Math.sin(arg);
            if (LR[i + 5] != 0) {
                sr += w * LR[i + 5] * Math.cos(arg);
            }
        }
        double sb = 0;
        for (int i = 0; i < B.length; i += 5) {
            double arg = B[i] * dr + B[i + 1] * mr + B[i + 2] * mpr + B[i + 3] * fr;
            double mult = B[i + 1];
            double w = mult == 0 ? 1 : (mult == 1 || mult == -1) ? e : e2;
            sb += w * B[i + 4] * Math.sin(arg);
        }
        sl += 3958 * Math.sin(a1) + 1962 * Math.sin(lpr - fr) + 318 * Math.sin(a2);
        sb += -2235 * Math.sin(lpr) + 382 * Math.sin(a3) + 175 * Math.sin(a1 - fr) + 175 * Math.sin(a1 + fr)
                + 127 * Math.sin(lpr - mpr) - 115 * Math.sin(lpr + mpr);
        out[0] = Math.toRadians(lp % 360.0 + sl * 1e-6);
        out[1] = Math.toRadians(sb * 1e-6);
        out[2] = 385000.56 + sr * 1e-3;
    }

    /**
     * Phase angle i of the Moon (Sun–Moon–Earth angle), Meeus ch. 48, formulae 48.2 and 48.3,
     * with the geocentric places of the Moon and the Sun.
     *
     * @param jdTt Julian Date in TT
     * @return phase angle in [0, π]; 0 at full Moon
     */
    public static double phaseAngleRad(double jdTt) {
        double[] s = SCRATCH.get();
        Sun.apparent(jdTt, s);
        double ra0 = s[0];
        double dec0 = s[1];
        double r = s[2];
        apparent(jdTt, s);
        double ra = s[0];
        double dec = s[1];
        double delta = s[2];
        double cpsi = Math.sin(dec0) * Math.sin(dec) + Math.cos(dec0) * Math.cos(dec) * Math.cos(ra0 - ra);
        double psi = Math.acos(Math.max(-1.0, Math.min(1.0, cpsi)));
        return Math.atan2(r * Math.sin(psi), delta - r * Math.cos(psi));
    }

    /**
     * Illuminated fraction of the Moon's disk, k = (1 + cos i)/2 (Meeus 48.1).
     *
     * @param jdTt Julian Date in TT
     * @return fraction in [0, 1]
     */
    public static double illuminatedFraction(double jdTt) {
        return (1 + Math.cos(phaseAngleRad(jdTt))) / 2;
    }
}
