package org.skyrota.sky.visibility;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import org.junit.jupiter.api.Test;

/** Interval-list arithmetic on flat primitive arrays. */
class IntervalsTest {

    @Test
    void intersectsTwoLists() {
        double[] a = {0, 10, 20, 30};
        double[] b = {5, 25, 28, 40};
        double[] out = new double[8];
        int n = Intervals.intersect(a, 2, b, 2, out);
        assertThat(Arrays.copyOf(out, 2 * n)).containsExactly(5, 10, 20, 25, 28, 30);
    }

    @Test
    void complementsWithinBounds() {
        double[] a = {-5, 2, 4, 6, 9, 20};
        double[] out = new double[8];
        int n = Intervals.complement(a, 3, 0, 10, out);
        assertThat(Arrays.copyOf(out, 2 * n)).containsExactly(2, 4, 6, 9);
        assertThat(Intervals.complement(a, 0, 0, 10, out)).isEqualTo(1);
    }

    @Test
    void buildsIntervalsFromFlips() {
        double[] out = new double[8];
        int n = Intervals.fromFlips(true, new double[] {3, 5, 8}, 3, 0, 10, out);
        assertThat(Arrays.copyOf(out, 2 * n)).containsExactly(0, 3, 5, 8);
        n = Intervals.fromFlips(false, new double[] {3, 5, 8}, 3, 0, 10, out);
        assertThat(Arrays.copyOf(out, 2 * n)).containsExactly(3, 5, 8, 10);
    }

    @Test
    void unitesAndMergesTouchingIntervals() {
        double[] out = new double[8];
        int n = Intervals.union(new double[] {0, 2, 6, 7}, 2, new double[] {2, 3, 10, 11}, 2, out);
        assertThat(Arrays.copyOf(out, 2 * n)).containsExactly(0, 3, 6, 7, 10, 11);
    }

    @Test
    void dropsShortIntervals() {
        double[] a = {0, 30, 100, 200};
        int n = Intervals.dropShorterThan(a, 2, 60);
        assertThat(Arrays.copyOf(a, 2 * n)).containsExactly(100, 200);
        assertThat(Intervals.totalLength(a, n)).isEqualTo(100);
    }
}
