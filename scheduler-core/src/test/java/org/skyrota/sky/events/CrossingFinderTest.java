package org.skyrota.sky.events;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Crossing search on synthetic altitude-like functions whose roots are known in closed form. */
class CrossingFinderTest {

    private final CrossingFinder finder = CrossingFinder.forAltitudes();

    @Test
    void findsBothCrossingsOfASinusoidToUnderASecond() {
        // altitude = 30 sin(2π t / day) − 10: roots where sin = 1/3.
        double day = 86400;
        List<Crossing> c = finder.find(t -> 30 * Math.sin(2 * Math.PI * t / day) - 10, 0, day);
        double r1 = Math.asin(1.0 / 3) / (2 * Math.PI) * day;
        double r2 = day / 2 - r1;
        assertThat(c).hasSize(2);
        assertThat(c.get(0).rising()).isTrue();
        assertThat(c.get(0).epochSecond()).isCloseTo(r1, offset(0.1));
        assertThat(c.get(1).rising()).isFalse();
        assertThat(c.get(1).epochSecond()).isCloseTo(r2, offset(0.1));
    }

    @Test
    void findsAGrazingPairHiddenBetweenTwoSamples() {
        // A parabola peaking 0.02° above zero for 4 minutes between samples 10 min apart.
        double peak = 3 * 600 + 300;
        double curvature = 0.02 / (120.0 * 120.0);
        List<Crossing> c = finder.find(t -> 0.02 - curvature * (t - peak) * (t - peak), 0, 7200);
        assertThat(c).hasSize(2);
        assertThat(c.get(0).rising()).isTrue();
        assertThat(c.get(0).epochSecond()).isCloseTo(peak - 120, offset(0.5));
        assertThat(c.get(1).rising()).isFalse();
        assertThat(c.get(1).epochSecond()).isCloseTo(peak + 120, offset(0.5));
    }

    @Test
    void reportsNoCrossingForAFunctionThatStaysBelowZero() {
        double peak = 3000;
        assertThat(finder.find(t -> -0.01 - 1e-6 * (t - peak) * (t - peak), 0, 7200)).isEmpty();
    }

    @Test
    void rejectsANonPositiveStep() {
        assertThatThrownBy(() -> new CrossingFinder(0, 1, 1)).hasMessageContaining("stepSeconds");
    }

    @Test
    void brentRejectsAnIntervalWithoutBracket() {
        assertThatThrownBy(() -> RootFinder.brent(x -> x * x + 1, -1, 1, 1e-6)).hasMessageContaining("no bracket");
    }

    @Test
    void brentFindsTheCubeRootOfTwo() {
        assertThat(RootFinder.brent(x -> x * x * x - 2, 0, 2, 1e-12)).isCloseTo(Math.cbrt(2), offset(1e-10));
    }
}
