package org.skyrota.sky.bodies;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.time.TimeScales;

/** Far from 2000 the series lose accuracy, but the results must stay finite and in range. */
class LongSpanRobustnessTest {

    @Test
    void sunAndMoonStayFiniteFromMinus1000To3000() {
        double[] s = new double[5];
        double[] m = new double[5];
        Instant start = Instant.parse("-1000-01-01T00:00:00Z");
        Instant end = Instant.parse("3000-01-01T00:00:00Z");
        for (Instant t = start; t.isBefore(end); t = t.plusSeconds(86400L * 3653 + 12345)) {
            double jdTt = TimeScales.jdTt(t);
            assertThat(TimeScales.deltaTSeconds(t)).isFinite();
            Sun.apparent(jdTt, s);
            Moon.apparent(jdTt, m);
            assertThat(s[0]).isBetween(0.0, 2 * Math.PI);
            assertThat(Math.abs(s[1])).isLessThan(Math.toRadians(24.3));
            assertThat(s[2] / Sun.AU_KM).isBetween(0.98, 1.02);
            assertThat(m[0]).isBetween(0.0, 2 * Math.PI);
            assertThat(Math.abs(m[1])).isLessThan(Math.toRadians(29.5));
            assertThat(m[2]).isBetween(350_000.0, 410_000.0);
            assertThat(Moon.illuminatedFraction(jdTt)).isBetween(0.0, 1.0);
        }
    }
}
