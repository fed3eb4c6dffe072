package org.skyrota.sky.visibility;

/**
 * A smooth quantity sampled on equally spaced nodes and read back by three-point (quadratic)
 * Lagrange interpolation, Meeus eq. 3.3. For the Moon's geocentric position on 4-hour nodes the
 * interpolation error is below 0.3″ (its third derivative is about 0.08° per day³).
 */
final class QuadraticTrack {

    private final double t0;
    private final double step;
    private final double[] values;

    QuadraticTrack(double t0, double step, double[] values) {
        if (values.length < 3) {
            throw new IllegalArgumentException("values must hold at least 3 nodes: " + values.length);
        }
        this.t0 = t0;
        this.step = step;
        this.values = values;
    }

    /** Number of nodes needed to cover [t0, t1] with the given step, at least 3. */
    static int nodesFor(double t0, double t1, double step) {
        return Math.max(3, (int) Math.ceil((t1 - t0) / step) + 1);
    }

    double at(double t) {
        double x = (t - t0) / step;
        int i = (int) Math.rint(x);
        if (i < 1) {
            i = 1;
        } else if (i > values.length - 2) {
            i = values.length - 2;
        }
        double n = x - i;
        double a = values[i] - values[i - 1];
        double b = values[i + 1] - values[i];
        return values[i] + 0.5 * n * (a + b + n * (b - a));
    }
}
