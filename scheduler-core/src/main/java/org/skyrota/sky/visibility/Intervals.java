package org.skyrota.sky.visibility;

/**
 * Sorted lists of disjoint closed intervals stored flat in primitive arrays
 * ({@code [s0, e0, s1, e1, …]}, with a count of intervals), so the batch path combines them
 * without allocating per sample. The caller supplies output arrays with room for
 * {@code na + nb} intervals (intersection) or {@code n + 1} (complement).
 */
public final class Intervals {

    private Intervals() {
    }

    /**
     * Intersection of two interval lists.
     *
     * @return the number of intervals written to {@code out}
     */
    public static int intersect(double[] a, int na, double[] b, int nb, double[] out) {
        int i = 0;
        int j = 0;
        int n = 0;
        while (i < na && j < nb) {
            double s = Math.max(a[2 * i], b[2 * j]);
            double e = Math.min(a[2 * i + 1], b[2 * j + 1]);
            if (s < e) {
                out[2 * n] = s;
                out[2 * n + 1] = e;
                n++;
            }
            if (a[2 * i + 1] < b[2 * j + 1]) {
                i++;
            } else {
                j++;
            }
        }
        return n;
    }

    /**
     * The parts of {@code [from, to]} not covered by the list.
     *
     * @return the number of intervals written to {@code out}
     */
    public static int complement(double[] a, int na, double from, double to, double[] out) {
        int n = 0;
        double cursor = from;
        for (int i = 0; i < na; i++) {
            double s = Math.max(a[2 * i], from);
            double e = Math.min(a[2 * i + 1], to);
            if (e <= s) {
                continue;
            }
            if (s > cursor) {
                out[2 * n] = cursor;
                out[2 * n + 1] = s;
                n++;
            }
            cursor = Math.max(cursor, e);
        }
        if (cursor < to) {
            out[2 * n] = cursor;
            out[2 * n + 1] = to;
            n++;
        }
        return n;
    }

    /**
     * The intervals where a quantity that is true at the start {@code startInside} and flips at
     * each of the sorted {@code flips} holds, within {@code [from, to]}.
     *
     * @return the number of intervals written to {@code out} (room for flips/2 + 1 needed)
     */
    public static int fromFlips(boolean startInside, double[] flips, int nFlips, double from, double to, double[] out) {
        int n = 0;
        boolean inside = startInside;
        double open = from;
        for (int i = 0; i < nFlips; i++) {
            double t = flips[i];
            if (inside) {
                if (t > open) {
                    out[2 * n] = open;
                    out[2 * n + 1] = Math.min(t, to);
                    n++;
                }
            } else {
                open = t;
            }
            inside = !inside;
        }
        if (inside && to > open) {
            out[2 * n] = open;
            out[2 * n + 1] = to;
            n++;
        }
        return n;
    }

    /**
     * Removes intervals shorter than {@code minLength} in place.
     *
     * @return the new count
     */
    public static int dropShorterThan(double[] a, int na, double minLength) {
        int n = 0;
        for (int i = 0; i < na; i++) {
            if (a[2 * i + 1] - a[2 * i] >= minLength) {
                a[2 * n] = a[2 * i];
                a[2 * n + 1] = a[2 * i + 1];
                n++;
            }
        }
        return n;
    }

    /** Sum of the lengths. */
    public static double totalLength(double[] a, int na) {
        double sum = 0;
        for (int i = 0; i < na; i++) {
            sum += a[2 * i + 1] - a[2 * i];
        }
        return sum;
    }

    /**
     * Union of two sorted lists of disjoint intervals, touching intervals merged.
     *
     * @return the number of intervals written to {@code out} (room for na + nb needed)
     */
    public static int union(double[] a, int na, double[] b, int nb, double[] out) {
        int i = 0;
        int j = 0;
        int n = 0;
        while (i < na || j < nb) {
            double s;
            double e;
            if (j >= nb || (i < na && a[2 * i] <= b[2 * j])) {
                s = a[2 * i];
                e = a[2 * i + 1];
                i++;
            } else {
                s = b[2 * j];
                e = b[2 * j + 1];
                j++;
            }
            if (n > 0 && s <= out[2 * n - 1]) {
                out[2 * n - 1] = Math.max(out[2 * n - 1], e);
            } else {
                out[2 * n] = s;
                out[2 * n + 1] = e;
                n++;
            }
        }
        return n;
    }

    /**
     * Appends {@code [s, e]} to a sorted list, merging with the last interval when they touch.
     *
     * @return the new count
     */
    public static int append(double[] a, int na, double s, double e) {
        if (na > 0 && s <= a[2 * na - 1]) {
            a[2 * na - 1] = Math.max(a[2 * na - 1], e);
            return na;
        }
        a[2 * na] = s;
        a[2 * na + 1] = e;
        return na + 1;
    }
}
