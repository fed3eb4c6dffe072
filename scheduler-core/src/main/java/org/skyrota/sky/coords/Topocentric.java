package org.skyrota.sky.coords;

/**
 * Geocentric to topocentric place (diurnal parallax) for an observer on the WGS84 ellipsoid.
 * The correction is rigorous: the observer's geocentric position vector is subtracted from
 * the body's.
 */
public final class Topocentric {

    /** WGS84 equatorial radius, km. */
    public static final double WGS84_A_KM = 6378.137;

    /** WGS84 flattening. */
    public static final double WGS84_F = 1.0 / 298.257223563;

    private static final double TWO_PI = 2 * Math.PI;
    private static final double E2 = WGS84_F * (2 - WGS84_F);

    private Topocentric() {
    }

    /**
     * Topocentric right ascension and declination.
     *
     * @param raRad geocentric apparent right ascension of date
     * @param decRad geocentric apparent declination of date
     * @param distanceKm geocentric distance of the body, km (positive; use
     *     {@link Double#POSITIVE_INFINITY} for a star)
     * @param localSiderealTimeRad local apparent sidereal time (GAST + east longitude)
     * @param latRad geodetic latitude (WGS84)
     * @param elevationM height above the ellipsoid, metres
     * @param out receives out[0] = topocentric RA in [0, 2π), out[1] = topocentric declination;
     *     if out has a third element, out[2] = topocentric distance in km
     */
    public static void correct(double raRad, double decRad, double distanceKm, double localSiderealTimeRad,
            double latRad, double elevationM, double[] out) {
        if (Double.isInfinite(distanceKm)) {
            out[0] = raRad;
            out[1] = decRad;
            if (out.length > 2) {
                out[2] = distanceKm;
            }
            return;
        }
        double sl = Math.sin(latRad);
        double cl = Math.cos(latRad);
        double n = WGS84_A_KM / Math.sqrt(1 - E2 * sl * sl);
        double h = elevationM / 1000.0;
        double rxy = (n + h) * cl;
        double oz = (n * (1 - E2) + h) * sl;
        double ox = rxy * Math.cos(localSiderealTimeRad);
        double oy = rxy * Math.sin(localSiderealTimeRad);
        double cd = Math.cos(decRad);
        double x = distanceKm * cd * Math.cos(raRad) - ox;
        double y = distanceKm * cd * Math.sin(raRad) - oy;
        double z = distanceKm * Math.sin(decRad) - oz;
        double ra = Math.atan2(y, x);
        if (ra < 0) {
            ra += TWO_PI;
        }
        out[0] = ra >= TWO_PI ? ra - TWO_PI : ra;
        out[1] = Math.atan2(z, Math.sqrt(x * x + y * y));
        if (out.length > 2) {
            out[2] = Math.sqrt(x * x + y * y + z * z);
        }
    }
}
