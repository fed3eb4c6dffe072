package org.skyrota.plugins.solarsystem;

import java.util.Objects;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.sky.bodies.Moon;
import org.skyrota.sky.bodies.Sun;
import org.skyrota.sky.coords.ApparentPlace;
import org.skyrota.sky.coords.Obliquity;
import org.skyrota.sky.time.TimeScales;

/**
 * A major planet, from the JPL approximate Keplerian elements ({@link Planet}).
 *
 * <p>Steps: the Earth's heliocentric position from the Earth–Moon barycentre of the same table,
 * less the Moon's share (the Moon's geocentric position from the sky engine, divided by 1 + the
 * Earth–Moon mass ratio 81.30056); the planet's heliocentric position at t − τ with the light time
 * τ iterated three times (Meeus, Astronomical Algorithms, 2nd ed., ch. 33); the geocentric vector
 * rotated from the J2000 ecliptic to the J2000 equator (the ecliptic frame of the elements is
 * taken as ICRS, a difference of some 0.02″, far below the method's error); then precession,
 * nutation and annual aberration to the apparent place of date by {@link ApparentPlace}.
 * Light time plus annual aberration is the planetary aberration to first order; light deflection
 * is neglected.
 *
 * <p>Accuracy is that of the elements: the document's approximate errors for 1800–2050 are, in
 * right ascension / declination, Mercury 15″/1″, Venus 20″/1″, Earth–Moon barycentre 20″/8″,
 * Mars 40″/2″, Jupiter 400″/10″, Saturn 600″/25″, Uranus 50″/2″, Neptune 10″/1″ (heliocentric;
 * seen from the Earth they grow by about the ratio of the Sun's distance to the Earth's, and the
 * Earth's own error adds to them). Outside 1800–2050 the table is not meant to be used.
 *
 * <p>Immutable, thread-safe, and allocation-free: {@code out} is the only scratch space.
 */
final class PlanetTarget implements MovingTarget {

    /** Light time for one astronomical unit, days (IAU 2012: 1 AU = 149 597 870 700 m). */
    static final double LIGHT_DAYS_PER_AU = Sun.AU_KM / 299792.458 / 86400.0;
    static final double EARTH_MOON_MASS_RATIO = 81.30056;
    private static final double EPS_J2000 = Obliquity.meanRad(TimeScales.J2000_JD);
    private static final double COS_EPS = Math.cos(EPS_J2000);
    private static final double SIN_EPS = Math.sin(EPS_J2000);

    private final Planet planet;

    PlanetTarget(Planet planet) {
        this.planet = Objects.requireNonNull(planet, "planet");
    }

    Planet planet() {
        return planet;
    }

    @Override
    public String label() {
        return planet.label();
    }

    @Override
    public void apparentGeocentric(double jdTt, double[] out) {
        astrometricJ2000(planet, jdTt, out);
        double distanceKm = out[2];
        ApparentPlace.ofDate(out[0], out[1], 0, 0, jdTt, out);
        out[2] = distanceKm;
    }

    /**
     * The light-time corrected geocentric position on the J2000 equator (the "astrometric" place),
     * before precession, nutation and aberration.
     *
     * @param body the planet, or null for the Sun (used in tests to check the Earth's position)
     * @param out  receives right ascension [0, 2π) and declination in radians, and distance in km
     */
    static void astrometricJ2000(Planet body, double jdTt, double[] out) {
        Planet.EARTH_MOON_BARYCENTRE.heliocentricEclipticJ2000(jdTt, out);
        double ex = out[0];
        double ey = out[1];
        double ez = out[2];
        // The Moon's geocentric place is of date; the few tenths of a degree of precession matter
        // nothing for a shift of 4700 km.
        Moon.geocentricEcliptic(jdTt, out);
        double moonAu = out[2] / Sun.AU_KM / (1 + EARTH_MOON_MASS_RATIO);
        double cb = Math.cos(out[1]);
        ex -= moonAu * cb * Math.cos(out[0]);
        ey -= moonAu * cb * Math.sin(out[0]);
        ez -= moonAu * Math.sin(out[1]);

        double dx = -ex;
        double dy = -ey;
        double dz = -ez;
        if (body != null) {
            double tau = 0;
            for (int i = 0; i < 3; i++) {
                body.heliocentricEclipticJ2000(jdTt - tau, out);
                dx = out[0] - ex;
                dy = out[1] - ey;
                dz = out[2] - ez;
                tau = Math.sqrt(dx * dx + dy * dy + dz * dz) * LIGHT_DAYS_PER_AU;
            }
        }
        double x = dx;
        double y = COS_EPS * dy - SIN_EPS * dz;
        double z = SIN_EPS * dy + COS_EPS * dz;
        double ra = Math.atan2(y, x);
        if (ra < 0) {
            ra += 2 * Math.PI;
        }
        out[0] = ra >= 2 * Math.PI ? 0 : ra;
        out[1] = Math.atan2(z, Math.sqrt(x * x + y * y));
        out[2] = Math.sqrt(x * x + y * y + z * z) * Sun.AU_KM;
    }
}
