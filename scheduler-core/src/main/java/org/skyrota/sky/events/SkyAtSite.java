package org.skyrota.sky.events;

import java.time.Instant;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.sky.atmosphere.Refraction;
import org.skyrota.sky.bodies.Moon;
import org.skyrota.sky.bodies.Sun;
import org.skyrota.sky.coords.ApparentPlace;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.coords.Topocentric;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.time.SiderealTime;
import org.skyrota.sky.time.TimeScales;
import org.skyrota.sky.visibility.FixedTarget;

/**
 * The sky of one site at one instant, computed from scratch each call with the positional
 * layer (no interpolation, no caching): the reference against which the fast paths are tested.
 * Times are UTC seconds since 1970 as doubles so that root finders can work on them.
 * Not thread-safe (scratch arrays); make one per thread.
 */
public final class SkyAtSite {

    /** Standard refraction at the horizon used for rising and setting, 34′ (Meeus ch. 15). */
    public static final double HORIZON_REFRACTION_DEG = 34.0 / 60.0;
    /** Sunrise and sunset: geometric altitude of the Sun's centre (Meeus ch. 15, −0°50′). */
    public static final double SUNRISE_ALTITUDE_DEG = -0.8333;
    /** Mean radius of the Moon, km (IAU). */
    public static final double MOON_RADIUS_KM = 1737.4;

    private final SiteLocation site;
    private final double latRad;
    private final double lonRad;
    private final double[] sun = new double[4];
    private final double[] moon = new double[5];
    private final double[] topo = new double[3];
    private final double[] place = new double[2];
    private final double[] geocentric = new double[3];

    public SkyAtSite(SiteLocation site) {
        this.site = site;
        this.latRad = Math.toRadians(site.latitudeDeg());
        this.lonRad = Math.toRadians(site.longitudeDeg());
    }

    public SiteLocation site() {
        return site;
    }

    public static Instant toInstant(double epochSecond) {
        long s = (long) Math.floor(epochSecond);
        long nanos = Math.round((epochSecond - s) * 1e9);
        return Instant.ofEpochSecond(s, nanos);
    }

    public static double toEpochSecond(Instant t) {
        return t.getEpochSecond() + t.getNano() * 1e-9;
    }

    /** Local apparent sidereal time, radians. */
    public double localSiderealTimeRad(double epochSecond) {
        Instant t = toInstant(epochSecond);
        return SiderealTime.gastRad(TimeScales.jdUt1(t), TimeScales.jdTt(t)) + lonRad;
    }

    /** Geocentric apparent geometric (unrefracted) altitude of the Sun's centre, degrees. */
    public double sunAltitudeDeg(double epochSecond) {
        Instant t = toInstant(epochSecond);
        double jdTt = TimeScales.jdTt(t);
        Sun.apparent(jdTt, sun);
        double lst = SiderealTime.gastRad(TimeScales.jdUt1(t), jdTt) + lonRad;
        return Math.toDegrees(Horizontal.altitudeRad(lst - sun[0], sun[1], latRad));
    }

    /** The Sun's geocentric apparent right ascension and declination of date, radians. */
    public void sunRaDec(double epochSecond, double[] out) {
        Sun.apparent(TimeScales.jdTt(toInstant(epochSecond)), sun);
        out[0] = sun[0];
        out[1] = sun[1];
    }

    /**
     * The Moon's topocentric apparent right ascension and declination of date (radians), its
     * geometric topocentric altitude of the centre (degrees) and its semidiameter (degrees).
     */
    public void moon(double epochSecond, double[] out) {
        Instant t = toInstant(epochSecond);
        double jdTt = TimeScales.jdTt(t);
        Moon.apparent(jdTt, moon);
        double lst = SiderealTime.gastRad(TimeScales.jdUt1(t), jdTt) + lonRad;
        Topocentric.correct(moon[0], moon[1], moon[2], lst, latRad, site.elevationM(), topo);
        out[0] = topo[0];
        out[1] = topo[1];
        out[2] = Math.toDegrees(Horizontal.altitudeRad(lst - topo[0], topo[1], latRad));
        out[3] = Math.toDegrees(Math.asin(MOON_RADIUS_KM / moon[2]));
    }

    /**
     * Height of the Moon's upper limb above the apparent horizon, degrees, with standard
     * refraction at the horizon: positive while the Moon is up; zero at moonrise and moonset.
     */
    public double moonUpperLimbDeg(double epochSecond) {
        double[] m = new double[4];
        moon(epochSecond, m);
        return m[2] + m[3] + HORIZON_REFRACTION_DEG;
    }

    /** The Moon's illuminated fraction, 0 to 1. */
    public double moonIlluminatedFraction(double epochSecond) {
        return Moon.illuminatedFraction(TimeScales.jdTt(toInstant(epochSecond)));
    }

    /** The Moon's phase angle, degrees (0 full, 180 new). */
    public double moonPhaseAngleDeg(double epochSecond) {
        return Math.toDegrees(Moon.phaseAngleRad(TimeScales.jdTt(toInstant(epochSecond))));
    }

    /** The target's apparent right ascension and declination of date, radians. */
    public void targetRaDec(FixedTarget target, double epochSecond, double[] out) {
        double jdTt = TimeScales.jdTt(toInstant(epochSecond));
        ApparentPlace.ofDate(target.raRad(), target.decRad(), target.pmRaCosDecRadPerYear(),
                target.pmDecRadPerYear(), jdTt, place);
        out[0] = place[0];
        out[1] = place[1];
    }

    /** Geometric (unrefracted) altitude of the target, degrees. */
    public double targetTrueAltitudeDeg(FixedTarget target, double epochSecond) {
        targetRaDec(target, epochSecond, place);
        double lst = localSiderealTimeRad(epochSecond);
        return Math.toDegrees(Horizontal.altitudeRad(lst - place[0], place[1], latRad));
    }

    /** Apparent (refracted) altitude, degrees, from a geometric altitude at this site. */
    public double refract(double trueAltitudeDeg) {
        return Refraction.apparentFromTrueDeg(trueAltitudeDeg, site.pressureHpa(), site.temperatureC());
    }

    /** Geometric altitude, degrees, that shows as the given apparent altitude at this site. */
    public double unrefract(double apparentAltitudeDeg) {
        return Refraction.trueFromApparentDeg(apparentAltitudeDeg, site.pressureHpa(), site.temperatureC());
    }

    /**
     * Target's apparent altitude (degrees) and azimuth (degrees east of north), hour angle
     * (radians) and apparent place (radians) at one instant.
     *
     * @param out altitudeDeg, azimuthDeg, haRad, raRad, decRad
     */
    public void target(FixedTarget target, double epochSecond, double[] out) {
        targetRaDec(target, epochSecond, place);
        double lst = localSiderealTimeRad(epochSecond);
        double ha = lst - place[0];
        double alt = Math.toDegrees(Horizontal.altitudeRad(ha, place[1], latRad));
        out[0] = refract(alt);
        out[1] = Math.toDegrees(Horizontal.azimuthRad(ha, place[1], latRad));
        out[2] = ha;
        out[3] = place[0];
        out[4] = place[1];
    }

    /**
     * A moving target's apparent (refracted) topocentric altitude and azimuth (degrees), hour
     * angle (radians) and topocentric apparent place of date (radians), laid out as
     * {@link #target(FixedTarget, double, double[])}'s: the target's geocentric place at the
     * instant, moved to the site by the parallax of its distance (a distance that is not
     * positive is taken as a star's, without parallax).
     *
     * @param out altitudeDeg, azimuthDeg, haRad, raRad, decRad
     */
    public void target(MovingTarget target, double epochSecond, double[] out) {
        Instant t = toInstant(epochSecond);
        double jdTt = TimeScales.jdTt(t);
        target.apparentGeocentric(jdTt, geocentric);
        double lst = SiderealTime.gastRad(TimeScales.jdUt1(t), jdTt) + lonRad;
        double distanceKm = geocentric[2] > 0 ? geocentric[2] : Double.POSITIVE_INFINITY;
        Topocentric.correct(geocentric[0], geocentric[1], distanceKm, lst, latRad, site.elevationM(), topo);
        double ha = lst - topo[0];
        out[0] = refract(Math.toDegrees(Horizontal.altitudeRad(ha, topo[1], latRad)));
        out[1] = Math.toDegrees(Horizontal.azimuthRad(ha, topo[1], latRad));
        out[2] = ha;
        out[3] = topo[0];
        out[4] = topo[1];
    }
}
