package org.skyrota.sky.bodies;

import org.skyrota.sky.coords.Nutation;
import org.skyrota.sky.coords.Obliquity;
import org.skyrota.sky.time.TimeScales;

/**
 * Geocentric apparent place of the Sun.
 *
 * <p>Method of Meeus, Astronomical Algorithms, 2nd ed., ch. 25 "higher accuracy": the Earth
 * from the truncated VSOP87D series of Appendix III ({@link EarthVsop87}), the conversion to
 * the FK5 system (formula 32.3), nutation ({@link Nutation}) and annual aberration
 * −20.4898″/R. Accuracy about 1″ in longitude and latitude between 1800 and 2200 (limited by
 * the truncation of the series).
 *
 * <p>Safety: never point unfiltered optics at or near the Sun; solar targets belong only on
 * instruments fitted with a certified solar filter.
 */
public final class Sun {

    /** The astronomical unit in km (IAU 2012). */
    public static final double AU_KM = 149597870.7;

    private static final double TWO_PI = 2 * Math.PI;
    private static final double ARCSEC = Math.PI / 648000.0;

    private Sun() {
    }

    /**
     * Geocentric apparent place of date.
     *
     * @param jdTt Julian Date in TT
     * @param out receives out[0] = right ascension in [0, 2π), out[1] = declination,
     *     out[2] = distance in km, out[3] = apparent ecliptic longitude in [0, 2π);
     *     if out has a fifth element, out[4] = apparent ecliptic latitude (radians)
     */
    public static void apparent(double jdTt, double[] out) {
        apparent(jdTt, true, out);
    }

    /**
     * As {@link #apparent(double, double[])}, optionally without the annual aberration (the
     * geometric place referred to the true equinox of date). Meant for tests and comparisons.
     */
    public static void apparent(double jdTt, boolean aberration, double[] out) {
        double tau = (jdTt - TimeScales.J2000_JD) / 365250.0;
        double t = tau * 10.0;
        double r = EarthVsop87.radiusAu(tau);
        double lon = EarthVsop87.longitudeRad(tau) + Math.PI;
        double lat = -EarthVsop87.latitudeRad(tau);
        // VSOP87 dynamical ecliptic and equinox to FK5 (Meeus 32.3).
        double lp = lon - Math.toRadians(t * (1.397 + t * 0.00031));
        lat += 0.03916 * ARCSEC * (Math.cos(lp) - Math.sin(lp));
        lon += -0.09033 * ARCSEC;

        Nutation.angles(jdTt, out);
        double dpsi = out[0];
        double deps = out[1];
        lon += dpsi;
        if (aberration) {
            lon -= 20.4898 * ARCSEC / r;
        }
        double eps = Obliquity.meanRad(jdTt) + deps;

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
        out[2] = r * AU_KM;
        out[3] = lon;
        if (out.length > 4) {
            out[4] = lat;
        }
    }
}
