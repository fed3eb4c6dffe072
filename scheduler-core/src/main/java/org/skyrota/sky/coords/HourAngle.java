package org.skyrota.sky.coords;

import java.time.Instant;

import org.skyrota.sky.bodies.Sun;
import org.skyrota.sky.time.SiderealTime;
import org.skyrota.sky.time.TimeScales;

/**
 * Local hour angle: local apparent sidereal time minus the apparent right ascension of date, counted positive
 * west of the meridian (a target rises at a negative hour angle, transits at zero, sets at a positive one).
 * Results in degrees in [-180, 180).
 */
public final class HourAngle {

    /** Degrees of hour angle per minute of UT1: 360° per sidereal day, 1.00273790935 sidereal days per solar day. */
    public static final double DEG_PER_MINUTE = 360.0 * 1.00273790935 / 1440.0;

    private HourAngle() {
    }

    /**
     * The hour angle from a local apparent sidereal time and an apparent right ascension of date.
     *
     * @param lastRad local apparent sidereal time, radians
     * @param raRad   apparent right ascension of date, radians
     * @return degrees in [-180, 180)
     */
    public static double fromSiderealDeg(double lastRad, double raRad) {
        return normalizeDeg(Math.toDegrees(lastRad - raRad));
    }

    /**
     * The hour angle of a fixed ICRS / J2000 target (no proper motion) seen from a longitude at an instant.
     * Geocentric: the topocentric parallax of a star is nil.
     *
     * @param raJ2000Deg  right ascension at J2000.0, ICRS, degrees
     * @param decJ2000Deg declination at J2000.0, ICRS, degrees
     * @param lonEastDeg  longitude, positive east, degrees
     * @param instant     UTC
     */
    public static double ofFixedDeg(double raJ2000Deg, double decJ2000Deg, double lonEastDeg, Instant instant) {
        double jdTt = TimeScales.jdTt(instant);
        double[] place = new double[2];
        ApparentPlace.ofDate(Math.toRadians(raJ2000Deg), Math.toRadians(decJ2000Deg), 0, 0, jdTt, place);
        return fromSiderealDeg(SiderealTime.localApparentRad(TimeScales.jdUt1(instant), jdTt,
                Math.toRadians(lonEastDeg)), place[0]);
    }

    /** The Sun's hour angle (geocentric apparent place) from a longitude at an instant, degrees in [-180, 180). */
    public static double ofSunDeg(double lonEastDeg, Instant instant) {
        double jdTt = TimeScales.jdTt(instant);
        double[] sun = new double[4];
        Sun.apparent(jdTt, sun);
        return fromSiderealDeg(SiderealTime.localApparentRad(TimeScales.jdUt1(instant), jdTt,
                Math.toRadians(lonEastDeg)), sun[0]);
    }

    /** An angle in degrees to [-180, 180). */
    public static double normalizeDeg(double deg) {
        double r = (deg + 180.0) % 360.0;
        return (r < 0 ? r + 360.0 : r) - 180.0;
    }
}
