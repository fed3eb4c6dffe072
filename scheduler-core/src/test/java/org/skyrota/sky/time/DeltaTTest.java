package org.skyrota.sky.time;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class DeltaTTest {

    @Test
    void espenakMeeus2010() {
        // Espenak and Meeus, five-millennium polynomials, 2005-2050: 62.92 + 0.32217 t + 0.005589 t², t = y - 2000
        // -> 66.70 s at y = 2010.0 (also /work/shared/CHECKS.md)
        assertThat(DeltaT.espenakMeeusSeconds(2010.0)).isCloseTo(66.70, within(0.005));
    }

    @Test
    void publishedConstantTermsOfThePieces() {
        // Espenak and Meeus: the constant terms are ΔT at each polynomial's origin (the published form).
        assertThat(DeltaT.espenakMeeusSeconds(1950.0)).isCloseTo(29.07, within(1e-9));
        assertThat(DeltaT.espenakMeeusSeconds(1975.0)).isCloseTo(45.45, within(1e-9));
        assertThat(DeltaT.espenakMeeusSeconds(1000.0)).isCloseTo(1574.2, within(1e-9));
        assertThat(DeltaT.espenakMeeusSeconds(0.0)).isCloseTo(10583.6, within(1e-9));
    }

    @ParameterizedTest(name = "join at {0}")
    @ValueSource(doubles = {-500, 500, 1600, 1700, 1800, 1860, 1900, 1920, 1941, 1961, 1986, 2005, 2050, 2150})
    void piecesMeetAtTheirJoins(double year) {
        // The published pieces were fitted to be continuous; at 1941 and 2050 they differ most
        // (about half a second). A 1 s step would be a typo in a coefficient.
        double before = DeltaT.espenakMeeusSeconds(year - 1e-9);
        double after = DeltaT.espenakMeeusSeconds(year);
        assertThat(after).isCloseTo(before, within(1.0));
    }

    @Test
    void longTermParabolaFarFromToday() {
        // Espenak and Meeus: before -500 and after 2150, ΔT = -20 + 32 u², u = (y - 1820)/100.
        assertThat(DeltaT.espenakMeeusSeconds(-1000)).isCloseTo(-20 + 32 * 28.2 * 28.2, within(1e-6));
        assertThat(DeltaT.espenakMeeusSeconds(3000)).isCloseTo(-20 + 32 * 11.8 * 11.8, within(1e-6));
    }
}
