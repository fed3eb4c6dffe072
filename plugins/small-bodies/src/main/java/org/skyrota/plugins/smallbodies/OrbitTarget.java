package org.skyrota.plugins.smallbodies;

import org.skyrota.plugin.MovingTarget;
import org.skyrota.sky.bodies.Sun;
import org.skyrota.sky.coords.ApparentPlace;
import org.skyrota.sky.coords.Obliquity;
import org.skyrota.sky.time.TimeScales;

/**
 * A comet or asteroid on a fixed heliocentric conic: osculating elements referred to the mean
 * ecliptic and equinox of J2000, moved by two-body motion ({@link TwoBody}).
 *
 * <p>Steps (Meeus, Astronomical Algorithms, 2nd ed., ch. 33): the body's heliocentric position on
 * the J2000 equator at t − τ, the Earth's at t ({@link EarthPosition}, the sky engine's Sun, about
 * 1″), the light time τ iterated three times; that gives the astrometric J2000 place. Then
 * precession, nutation and annual aberration to the apparent place of date ({@link ApparentPlace}).
 *
 * <p>Accuracy: two-body motion has no planetary perturbations and no non-gravitational forces, so
 * it is good near the epoch of the elements and degrades away from it: for main-belt asteroids
 * typically some arcseconds to an arcminute within a few months of the epoch, for comets and for
 * bodies passing near a planet much faster. Use elements osculating near the dates planned. The
 * method itself (Kepler, Barker, light time, Earth) adds about 1″ to 2″ for bodies farther than
 * 0.1 AU from the Earth.
 *
 * <p>Immutable and thread-safe; per call it allocates nothing (scratch space is per thread).
 */
public final class OrbitTarget implements MovingTarget {

    static final double LIGHT_DAYS_PER_AU = Sun.AU_KM / 299792.458 / 86400.0;
    private static final double EPS_J2000 = Obliquity.meanRad(TimeScales.J2000_JD);
    private static final ThreadLocal<double[]> SCRATCH = ThreadLocal.withInitial(() -> new double[5]);

    private final String label;
    private final double qAu;
    private final double e;
    private final double perihelionJdTt;
    /** Unit vectors toward perihelion (P) and 90° ahead of it in the orbit (Q), J2000 equator. */
    private final double px;
    private final double py;
    private final double pz;
    private final double qx;
    private final double qy;
    private final double qz;

    /**
     * @param label            a label for the target; not null
     * @param qAu              perihelion distance, AU
     * @param e                eccentricity
     * @param perihelionJdTt   time of perihelion, Julian Date TT
     * @param iRad             inclination to the J2000 ecliptic
     * @param nodeRad          longitude of the ascending node, J2000
     * @param argPerihelionRad argument of perihelion
     */
    OrbitTarget(String label, double qAu, double e, double perihelionJdTt, double iRad, double nodeRad, double argPerihelionRad) {
        this.label = label;
        this.qAu = qAu;
        this.e = e;
        this.perihelionJdTt = perihelionJdTt;
        double cw = Math.cos(argPerihelionRad);
        double sw = Math.sin(argPerihelionRad);
        double cn = Math.cos(nodeRad);
        double sn = Math.sin(nodeRad);
        double ci = Math.cos(iRad);
        double si = Math.sin(iRad);
        // in the ecliptic
        double pxe = cw * cn - sw * sn * ci;
        double pye = cw * sn + sw * cn * ci;
        double pze = sw * si;
        double qxe = -sw * cn - cw * sn * ci;
        double qye = -sw * sn + cw * cn * ci;
        double qze = cw * si;
        double ce = Math.cos(EPS_J2000);
        double se = Math.sin(EPS_J2000);
        this.px = pxe;
        this.py = ce * pye - se * pze;
        this.pz = se * pye + ce * pze;
        this.qx = qxe;
        this.qy = ce * qye - se * qze;
        this.qz = se * qye + ce * qze;
    }

    @Override
    public String label() {
        return label;
    }

    public double perihelionDistanceAu() {
        return qAu;
    }

    public double eccentricity() {
        return e;
    }

    public double perihelionJdTt() {
        return perihelionJdTt;
    }

    /** Heliocentric position on the J2000 equator: out[0..2] = x, y, z in AU. */
    void heliocentricEquatorialJ2000(double jdTt, double[] out) {
        TwoBody.anomalyAndRadius(qAu, e, jdTt - perihelionJdTt, out);
        double v = out[0];
        double r = out[1];
        double a = r * Math.cos(v);
        double b = r * Math.sin(v);
        out[0] = a * px + b * qx;
        out[1] = a * py + b * qy;
        out[2] = a * pz + b * qz;
    }

    /**
     * The astrometric place: geocentric, light time included, J2000 equator, no aberration and no
     * nutation (the place Meeus prints in Ex. 33.b).
     *
     * @param out receives right ascension [0, 2π) and declination in radians and the distance in km
     */
    public void astrometricJ2000(double jdTt, double[] out) {
        double[] s = SCRATCH.get();
        EarthPosition.heliocentricEquatorialJ2000(jdTt, s);
        double ex = s[0];
        double ey = s[1];
        double ez = s[2];
        double dx = 0;
        double dy = 0;
        double dz = 0;
        double tau = 0;
        for (int i = 0; i < 3; i++) {
            heliocentricEquatorialJ2000(jdTt - tau, s);
            dx = s[0] - ex;
            dy = s[1] - ey;
            dz = s[2] - ez;
            tau = Math.sqrt(dx * dx + dy * dy + dz * dz) * LIGHT_DAYS_PER_AU;
        }
        double ra = Math.atan2(dy, dx);
        if (ra < 0) {
            ra += 2 * Math.PI;
        }
        out[0] = ra >= 2 * Math.PI ? 0 : ra;
        out[1] = Math.atan2(dz, Math.sqrt(dx * dx + dy * dy));
        out[2] = Math.sqrt(dx * dx + dy * dy + dz * dz) * Sun.AU_KM;
    }

    @Override
    public void apparentGeocentric(double jdTt, double[] out) {
        astrometricJ2000(jdTt, out);
        double distanceKm = out[2];
        ApparentPlace.ofDate(out[0], out[1], 0, 0, jdTt, out);
        out[2] = distanceKm;
    }
}
