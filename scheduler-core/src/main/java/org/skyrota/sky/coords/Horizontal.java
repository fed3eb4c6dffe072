package org.skyrota.sky.coords;

/**
 * Equatorial to horizontal coordinates, and angular separation. Radians throughout; the hour
 * angle is measured westwards from the meridian (local sidereal time − right ascension).
 */
public final class Horizontal {

    private static final double TWO_PI = 2 * Math.PI;

    private Horizontal() {
    }

    /**
     * Geometric altitude (no refraction) above the horizon plane.
     *
     * @param hourAngleRad local hour angle, positive westwards
     * @param decRad declination
     * @param latRad latitude of the observer (geodetic), positive north
     * @return altitude in [−π/2, π/2]
     */
    public static double altitudeRad(double hourAngleRad, double decRad, double latRad) {
        double s = Math.sin(latRad) * Math.sin(decRad) + Math.cos(latRad) * Math.cos(decRad) * Math.cos(hourAngleRad);
        return Math.asin(Math.max(-1.0, Math.min(1.0, s)));
    }

    /**
     * Azimuth measured from north through east (0 = north, π/2 = east).
     *
     * @param hourAngleRad local hour angle, positive westwards
     * @param decRad declination
     * @param latRad latitude of the observer, positive north
     * @return azimuth in [0, 2π)
     */
    public static double azimuthRad(double hourAngleRad, double decRad, double latRad) {
        double cd = Math.cos(decRad);
        double y = -cd * Math.sin(hourAngleRad);
        double x = Math.sin(decRad) * Math.cos(latRad) - cd * Math.cos(hourAngleRad) * Math.sin(latRad);
        double a = Math.atan2(y, x);
        if (a < 0) {
            a += TWO_PI;
        }
        return a >= TWO_PI ? a - TWO_PI : a;
    }

    /**
     * Angular distance between two directions by Vincenty's formula, accurate for tiny and for
     * nearly opposite separations alike.
     *
     * @return separation in [0, π]
     */
    public static double separationRad(double ra1Rad, double dec1Rad, double ra2Rad, double dec2Rad) {
        double dra = ra2Rad - ra1Rad;
        double sd1 = Math.sin(dec1Rad);
        double cd1 = Math.cos(dec1Rad);
        double sd2 = Math.sin(dec2Rad);
        double cd2 = Math.cos(dec2Rad);
        double cdra = Math.cos(dra);
        double a = cd2 * Math.sin(dra);
        double b = cd1 * sd2 - sd1 * cd2 * cdra;
        return Math.atan2(Math.sqrt(a * a + b * b), sd1 * sd2 + cd1 * cd2 * cdra);
    }
}
