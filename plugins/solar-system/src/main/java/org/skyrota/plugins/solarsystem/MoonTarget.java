package org.skyrota.plugins.solarsystem;

import org.skyrota.plugin.MovingTarget;
import org.skyrota.sky.bodies.Moon;

/**
 * The Moon, from the sky engine ({@link Moon#apparent}: Meeus, Astronomical Algorithms, 2nd ed.,
 * ch. 47, about 10″ in longitude and 4″ in latitude), geocentric: the site's parallax, up to a
 * degree, is the sky engine's to apply for a site.
 */
final class MoonTarget implements MovingTarget {

    /** Moon.apparent writes five values; the caller's array need only hold three. */
    private static final ThreadLocal<double[]> SCRATCH = ThreadLocal.withInitial(() -> new double[5]);

    @Override
    public String label() {
        return "Moon";
    }

    @Override
    public void apparentGeocentric(double jdTt, double[] out) {
        double[] s = SCRATCH.get();
        Moon.apparent(jdTt, s);
        out[0] = s[0];
        out[1] = s[1];
        out[2] = s[2];
    }
}
