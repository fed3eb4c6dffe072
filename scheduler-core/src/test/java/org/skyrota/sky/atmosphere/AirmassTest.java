package org.skyrota.sky.atmosphere;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.Test;

class AirmassTest {

    @ParameterizedTest(name = "zenith angle {0}° -> {1}")
    @CsvSource({
        // Kasten and Young 1989, Applied Optics 28, 4735, their table (printed to 0.001); apparent zenith angle.
        "0, 1.000",
        "60, 1.994",
        "80, 5.586",
    })
    void kastenYoungTable(double zenithAngleDeg, double expected) {
        assertThat(Airmass.kastenYoung(90 - zenithAngleDeg)).isCloseTo(expected, within(0.0006));
    }

    @Test
    void horizonAndBelow() {
        // Common practice, no source: about 38 air masses at the horizon (the formula gives 37.92).
        assertThat(Airmass.kastenYoung(0)).isCloseTo(38.0, within(0.2));
        assertThat(Airmass.kastenYoung(-0.01)).isInfinite();
        assertThatThrownBy(() -> Airmass.kastenYoung(Double.NaN)).hasMessageContaining("NaN");
    }

    @Test
    void closeToSecantHighUp() {
        // Common practice, no source: X ≈ sec z within 0.3% above 60° altitude.
        for (double alt = 60; alt <= 90; alt += 1) {
            assertThat(Airmass.kastenYoung(alt)).isCloseTo(1 / Math.sin(Math.toRadians(alt)), within(0.003));
        }
    }
}
