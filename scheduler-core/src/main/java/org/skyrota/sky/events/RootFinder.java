package org.skyrota.sky.events;

import java.util.function.DoubleUnaryOperator;

/** Brent's method (bracketing, inverse quadratic interpolation, bisection fallback). */
public final class RootFinder {

    private RootFinder() {
    }

    /**
     * A root of {@code f} in {@code [a, b]} to within {@code tolerance}, given values of
     * opposite sign (or zero) at the ends.
     *
     * @throws IllegalArgumentException when the ends do not bracket a root
     */
    public static double brent(DoubleUnaryOperator f, double a, double b, double tolerance) {
        return brent(f, a, f.applyAsDouble(a), b, f.applyAsDouble(b), tolerance);
    }

    /** As {@link #brent(DoubleUnaryOperator, double, double, double)} with the end values known. */
    public static double brent(DoubleUnaryOperator f, double a, double fa, double b, double fb, double tolerance) {
        if (fa == 0) {
            return a;
        }
        if (fb == 0) {
            return b;
        }
        if (Math.signum(fa) == Math.signum(fb)) {
            throw new IllegalArgumentException("no bracket: f(" + a + ")=" + fa + ", f(" + b + ")=" + fb);
        }
        double c = a;
        double fc = fa;
        double d = b - a;
        double e = d;
        for (int iter = 0; iter < 200; iter++) {
            if (Math.signum(fb) == Math.signum(fc)) {
                c = a;
                fc = fa;
                d = b - a;
                e = d;
            }
            if (Math.abs(fc) < Math.abs(fb)) {
                a = b;
                b = c;
                c = a;
                fa = fb;
                fb = fc;
                fc = fa;
            }
            double tol = 2 * Math.ulp(b) + 0.5 * tolerance;
            double m = 0.5 * (c - b);
            if (Math.abs(m) <= tol || fb == 0) {
                return b;
            }
            if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
                double s = fb / fa;
                double p;
                double q;
                if (a == c) {
                    p = 2 * m * s;
                    q = 1 - s;
                } else {
                    double qa = fa / fc;
                    double r = fb / fc;
                    p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
                    q = (qa - 1) * (r - 1) * (s - 1);
                }
                if (p > 0) {
                    q = -q;
                } else {
                    p = -p;
                }
                if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
                    e = d;
                    d = p / q;
                } else {
                    d = m;
                    e = m;
                }
            } else {
                d = m;
                e = m;
            }
            a = b;
            fa = fb;
            b += Math.abs(d) > tol ? d : Math.copySign(tol, m);
            fb = f.applyAsDouble(b);
        }
        return b;
    }

    /**
     * The abscissa of the maximum (or, with {@code maximum} false, the minimum) of a unimodal
     * {@code f} on {@code [a, b]}, by golden-section search to within {@code tolerance}.
     */
    public static double extremum(DoubleUnaryOperator f, double a, double b, boolean maximum, double tolerance) {
        final double g = 0.5 * (Math.sqrt(5) - 1);
        double sign = maximum ? -1 : 1;
        double x1 = b - g * (b - a);
        double x2 = a + g * (b - a);
        double f1 = sign * f.applyAsDouble(x1);
        double f2 = sign * f.applyAsDouble(x2);
        while (b - a > tolerance) {
            if (f1 < f2) {
                b = x2;
                x2 = x1;
                f2 = f1;
                x1 = b - g * (b - a);
                f1 = sign * f.applyAsDouble(x1);
            } else {
                a = x1;
                x1 = x2;
                f1 = f2;
                x2 = a + g * (b - a);
                f2 = sign * f.applyAsDouble(x2);
            }
        }
        return 0.5 * (a + b);
    }
}
