package org.skyrota.sky.events;

import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;

/**
 * Finds every zero crossing of a smooth function of time on an interval: samples on a fixed
 * step, brackets sign changes, and looks closer at each sampled local extremum whose value is
 * near zero, where a pair of crossings may hide between two samples (a target grazing the
 * horizon). Each bracket is refined with Brent's method.
 *
 * <p>The extremum test assumes at most one extremum per step and a bounded curvature; for
 * altitudes in degrees sampled every 10 minutes, the sampled value at a hidden extremum lies
 * within {@code nearZero} of zero (the Sun's or Moon's altitude changes its rate by at most
 * about 4° per hour², so between samples 10 minutes apart an extremum rises at most ~0.06°
 * above the best sample).
 */
public final class CrossingFinder {

    private final double stepSeconds;
    private final double toleranceSeconds;
    private final double nearZero;

    /**
     * @param stepSeconds sampling step
     * @param toleranceSeconds refinement tolerance of each crossing
     * @param nearZero how close to zero a sampled extremum must be to be examined (function units)
     */
    public CrossingFinder(double stepSeconds, double toleranceSeconds, double nearZero) {
        if (!(stepSeconds > 0)) {
            throw new IllegalArgumentException("stepSeconds must be positive: " + stepSeconds);
        }
        if (!(toleranceSeconds > 0)) {
            throw new IllegalArgumentException("toleranceSeconds must be positive: " + toleranceSeconds);
        }
        if (!(nearZero >= 0)) {
            throw new IllegalArgumentException("nearZero must not be negative: " + nearZero);
        }
        this.stepSeconds = stepSeconds;
        this.toleranceSeconds = toleranceSeconds;
        this.nearZero = nearZero;
    }

    /** Altitudes in degrees, 10-minute samples, refined to 0.05 s. */
    public static CrossingFinder forAltitudes() {
        return new CrossingFinder(600, 0.05, 1.0);
    }

    /** All crossings in {@code [from, to]}, in time order. */
    public List<Crossing> find(DoubleUnaryOperator f, double from, double to) {
        int n = Math.max(1, (int) Math.ceil((to - from) / stepSeconds));
        double[] t = new double[n + 1];
        double[] v = new double[n + 1];
        for (int i = 0; i <= n; i++) {
            t[i] = i == n ? to : from + i * (to - from) / n;
            v[i] = f.applyAsDouble(t[i]);
        }
        return find(f, t, v);
    }

    /** All crossings given samples {@code v[i] = f(t[i])}, {@code t} increasing. */
    public List<Crossing> find(DoubleUnaryOperator f, double[] t, double[] v) {
        List<Crossing> out = new ArrayList<>();
        int n = t.length - 1;
        for (int i = 0; i < n; i++) {
            if (v[i] == 0) {
                if (i > 0 && v[i - 1] != 0) {
                    out.add(new Crossing(t[i], v[i - 1] < 0));
                }
            } else if (v[i + 1] != 0 && (v[i] < 0) != (v[i + 1] < 0)) {
                double root = RootFinder.brent(f, t[i], v[i], t[i + 1], v[i + 1], toleranceSeconds);
                out.add(new Crossing(root, v[i] < 0));
            }
        }
        if (n > 0 && v[n] == 0 && v[n - 1] != 0) {
            out.add(new Crossing(t[n], v[n - 1] < 0));
        }
        // A pair of crossings can hide between samples of one sign around an extremum that
        // turns towards zero: examine every such sampled extremum near zero.
        for (int k = 0; k <= n; k++) {
            double vk = v[k];
            if (vk == 0 || Math.abs(vk) > nearZero) {
                continue;
            }
            double towardsZero = vk < 0 ? 1 : -1;
            int lo = Math.max(0, k - 1);
            int hi = Math.min(n, k + 1);
            if (lo == hi) {
                continue;
            }
            if ((v[lo] < 0) != (vk < 0) || (v[hi] < 0) != (vk < 0) || v[lo] == 0 || v[hi] == 0) {
                continue;
            }
            // Strict on the right so that two equal samples around a peak are examined once.
            if (towardsZero * v[lo] > towardsZero * vk || (hi > k && towardsZero * v[hi] >= towardsZero * vk)) {
                continue;
            }
            double tx = RootFinder.extremum(x -> towardsZero * f.applyAsDouble(x), t[lo], t[hi], true,
                    toleranceSeconds);
            double fx = f.applyAsDouble(tx);
            if (fx == 0 || (fx < 0) == (vk < 0)) {
                continue;
            }
            out.add(new Crossing(RootFinder.brent(f, t[lo], v[lo], tx, fx, toleranceSeconds), vk < 0));
            out.add(new Crossing(RootFinder.brent(f, tx, fx, t[hi], v[hi], toleranceSeconds), vk > 0));
        }
        out.sort((x, y) -> Double.compare(x.epochSecond(), y.epochSecond()));
        return out;
    }
}
