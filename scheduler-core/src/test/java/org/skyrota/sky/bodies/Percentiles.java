package org.skyrota.sky.bodies;

import java.util.Arrays;

/** Collects absolute differences of a cross-check and reports the maximum and the 99th percentile. */
final class Percentiles {

    private final String name;
    private double[] values = new double[1024];
    private int count;

    Percentiles(String name) {
        this.name = name;
    }

    void add(double absDifference) {
        if (count == values.length) {
            values = Arrays.copyOf(values, count * 2);
        }
        values[count++] = Math.abs(absDifference);
    }

    int count() {
        return count;
    }

    double max() {
        double m = 0;
        for (int i = 0; i < count; i++) {
            m = Math.max(m, values[i]);
        }
        return m;
    }

    double p99() {
        double[] sorted = Arrays.copyOf(values, count);
        Arrays.sort(sorted);
        return sorted[(int) Math.ceil(0.99 * count) - 1];
    }

    /** One line for the test log, so the measured agreement is on record with each run. */
    String summary(String unit) {
        return String.format("CROSSCHECK %s n=%d max=%.6f%s p99=%.6f%s", name, count, max(), unit, p99(), unit);
    }
}
