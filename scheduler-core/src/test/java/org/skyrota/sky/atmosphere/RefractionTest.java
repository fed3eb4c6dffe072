package org.skyrota.sky.atmosphere;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class RefractionTest {

    @Test
    void meeusChapter16BennettAtHalfADegree() {
        // Meeus, Astronomical Algorithms 2nd ed., ch. 16: 28.754′ is Bennett's formula (refraction from the
        // APPARENT altitude) evaluated at an apparent altitude of 0.5°, with 1010 mb and 10 °C (factor 1).
        // Printed to 0.001′.
        assertThat(Refraction.bennettDeg(0.5, 1010, 10) * 60).isCloseTo(28.754, within(0.0005));
    }

    @Test
    void saemundssonIsConsistentWithBennett() {
        // Meeus ch. 16: Saemundsson's formula (from the TRUE altitude) was built to invert Bennett's; at the
        // true altitude h0 - R(h0) it returns nearly the same R. At 0.5° apparent (true 0.0208°) it gives
        // 28.80′. Our own check, no source for the bound: within 0.1′ at every apparent altitude from 0° up (below it they part: 0.3′ at -0.25°, 5′ at -1°).
        double trueAlt = 0.5 - Refraction.bennettDeg(0.5, 1010, 10);
        assertThat(Refraction.saemundssonDeg(trueAlt, 1010, 10) * 60).isCloseTo(28.754, within(0.06));
        for (double app = 0; app <= 90; app += 0.25) {
            double r = Refraction.bennettDeg(app, 1010, 10);
            assertThat(Refraction.saemundssonDeg(app - r, 1010, 10) * 60).isCloseTo(r * 60, within(0.1));
        }
    }

    @Test
    void standardValuesAtTheHorizonAndAt45Degrees() {
        // Common practice, no source: refraction is about 34′ at the horizon and about 1′ at 45°.
        assertThat(Refraction.saemundssonDeg(0, 1010, 10) * 60).isCloseTo(29.0, within(0.5));
        assertThat(Refraction.bennettDeg(0, 1010, 10) * 60).isCloseTo(34.5, within(0.5));
        assertThat(Refraction.bennettDeg(45, 1010, 10) * 60).isCloseTo(1.0, within(0.05));
    }

    @Test
    void pressureAndTemperatureScaleTheRefraction() {
        // Meeus ch. 16: multiply by (P/1010)(283/(273 + T)).
        double base = Refraction.bennettDeg(10, 1010, 10);
        assertThat(Refraction.bennettDeg(10, 505, 10)).isCloseTo(base / 2, within(1e-12));
        assertThat(Refraction.saemundssonDeg(10, 1010, -10)).isCloseTo(Refraction.saemundssonDeg(10, 1010, 10) * 283 / 263, within(1e-12));
        assertThat(Refraction.apparentFromTrueDeg(5, 0, 10)).isEqualTo(5.0);
    }

    @Test
    void wellBehavedFarBelowTheHorizon() {
        double previous = Double.NEGATIVE_INFINITY;
        for (double h = -90; h <= 90; h += 0.01) {
            double app = Refraction.apparentFromTrueDeg(h, 1013.25, 10);
            assertThat(app).isFinite().isGreaterThan(previous);
            previous = app;
            assertThat(Refraction.trueFromApparentDeg(app, 1013.25, 10)).isCloseTo(h, within(1e-9));
        }
        assertThat(Refraction.bennettDeg(-30, 1010, 10)).isFinite().isNotNegative();
        assertThat(Refraction.saemundssonDeg(90, 1010, 10)).isCloseTo(0.0, within(1e-4));
    }

    @Test
    void standardPressureFollowsTheStandardAtmosphere() {
        // ICAO standard atmosphere (values from memory of its table): 1013.25 hPa at sea level, 898.7 hPa at
        // 1000 m, 795.0 hPa at 2000 m, 701.1 hPa at 3000 m.
        assertThat(Refraction.standardPressureHpa(0)).isCloseTo(1013.25, within(1e-9));
        assertThat(Refraction.standardPressureHpa(1000)).isCloseTo(898.7, within(0.2));
        assertThat(Refraction.standardPressureHpa(2000)).isCloseTo(795.0, within(0.2));
        assertThat(Refraction.standardPressureHpa(3000)).isCloseTo(701.1, within(0.2));
    }
}
