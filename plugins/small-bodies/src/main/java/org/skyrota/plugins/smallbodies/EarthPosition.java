package org.skyrota.plugins.smallbodies;

import org.skyrota.sky.bodies.Sun;
import org.skyrota.sky.coords.Nutation;
import org.skyrota.sky.coords.Obliquity;
import org.skyrota.sky.coords.Precession;

/**
 * The Earth's heliocentric position on the J2000 equator, from the sky engine's Sun ({@link Sun}:
 * the truncated VSOP87 of Meeus's Appendix III, about 1″, that is some 700 km): the geometric
 * Sun of date without nutation, turned from the mean ecliptic of date to the mean equator of date
 * and precessed back to J2000 (IAU 2006), then reversed.
 */
final class EarthPosition {

    private static final ThreadLocal<double[]> SCRATCH = ThreadLocal.withInitial(() -> new double[9]);

    private EarthPosition() {
    }

    /** @param out receives X, Y, Z in AU in out[0..2]; it must hold at least 5 values */
    static void heliocentricEquatorialJ2000(double jdTt, double[] out) {
        Sun.apparent(jdTt, false, out);
        double lon = out[3] - Nutation.longitudeRad(jdTt);
        double lat = out[4];
        double r = out[2] / Sun.AU_KM;
        double cb = Math.cos(lat);
        double x = r * cb * Math.cos(lon);
        double y = r * cb * Math.sin(lon);
        double z = r * Math.sin(lat);
        double eps = Obliquity.meanRad(jdTt);
        double ye = Math.cos(eps) * y - Math.sin(eps) * z;
        double ze = Math.sin(eps) * y + Math.cos(eps) * z;
        double[] m = SCRATCH.get();
        Precession.fillMatrixJ2000ToDate(jdTt, m);
        // The matrix is a rotation: its transpose takes the equator of date back to J2000.
        out[0] = -(m[0] * x + m[3] * ye + m[6] * ze);
        out[1] = -(m[1] * x + m[4] * ye + m[7] * ze);
        out[2] = -(m[2] * x + m[5] * ye + m[8] * ze);
    }
}
