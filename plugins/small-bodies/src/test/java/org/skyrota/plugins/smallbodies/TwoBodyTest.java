package org.skyrota.plugins.smallbodies;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Two-body motion on every conic against Meeus, Astronomical Algorithms, 2nd ed. (1998). */
class TwoBodyTest {

    /**
     * Meeus ch. 30: Ex. 30.a (e = 0.1, M = 5°, E = 5.554589°) and the chapter's table of E for
     * M = 5° and growing e, with the hard cases at e = 0.99. Printed to 1e-6°.
     */
    @ParameterizedTest
    @CsvSource({
        "0.1, 5, 5.554589",
        "0.4, 5, 8.313903",
        "0.5, 5, 9.950063",
        "0.6, 5, 12.356653",
        "0.7, 5, 16.167990",
        "0.8, 5, 22.656579",
        "0.9, 5, 33.344447",
        "0.99, 5, 45.361023",
        "0.99, 1, 24.725822",
        "0.99, 33, 89.722155",
        "0.99, 2, 32.361007",
    })
    void keplersEquationMeeusCh30(double e, double meanDeg, double expectedDeg) {
        double eDeg = Math.toDegrees(TwoBody.eccentricAnomaly(Math.toRadians(meanDeg), e));
        assertThat(eDeg).isCloseTo(expectedDeg, within(1e-6));
        // and the mirror image before perihelion
        assertThat(Math.toDegrees(TwoBody.eccentricAnomaly(Math.toRadians(-meanDeg), e))).isCloseTo(-expectedDeg, within(1e-6));
    }

    @Test
    void keplersEquationHoldsEverywhere() {
        for (double e = 0; e < 1; e += 0.0371) {
            for (double m = -Math.PI; m <= Math.PI; m += 0.0137) {
                double ecc = TwoBody.eccentricAnomaly(m, e);
                assertThat(ecc - e * Math.sin(ecc)).as("e %s M %s", e, m).isCloseTo(m, within(1e-13));
            }
        }
        double ecc = TwoBody.eccentricAnomaly(1e-9, 0.999999);
        // the residual can only be judged to the rounding of E − e sin E itself, a few ulp of E (about 4e-19)
        assertThat(ecc - 0.999999 * Math.sin(ecc)).isCloseTo(1e-9, within(2e-18));
    }

    /**
     * Meeus Ex. 34.a, a parabola: q = 1.487469 AU, perihelion 1998 April 14.4358 TD, on 1998
     * August 5.0 TD (112.5642 days later): v = 66.78862°, r = 2.133911 AU.
     */
    @Test
    void parabolaMeeus34a() {
        double[] out = new double[2];
        TwoBody.anomalyAndRadius(1.487469, 1, 2451030.5 - 2450917.9358, out);
        assertThat(Math.toDegrees(out[0])).isCloseTo(66.78862, within(1e-5));
        assertThat(out[1]).isCloseTo(2.133911, within(1e-6));
    }

    /**
     * Meeus ch. 35, the test cases printed for near-parabolic motion (p. 247): q (AU), e, days from
     * perihelion, v (degrees), r (AU). They cover an ellipse of e 0.987 and one of e 0.99997, a
     * parabola, a hyperbola and Halley's comet's orbit. Printed to 1e-5° and 1e-6 AU; solving the
     * two-body problem exactly must give the same within the last printed digit.
     */
    @ParameterizedTest
    @CsvSource({
        "0.921326, 1, 138.4783, 102.74426, 2.364192",
        "0.1, 0.987, 254.9, 164.50029, 4.063777",
        "0.123456, 0.99997, -30.47, 221.91190, 0.965053",
        "3.363943, 1.05731, 1237.1, 109.40598, 10.668551",
        "0.5871018, 0.9672746, 20, 52.85331, 0.729116",
        "0.5871018, 0.9672746, 0, 0, 0.5871018",
    })
    void nearParabolicCasesMeeusCh35(double q, double e, double days, double vDeg, double r) {
        double[] out = new double[2];
        TwoBody.anomalyAndRadius(q, e, days, out);
        double v = Math.toDegrees(out[0]);
        assertThat(Math.IEEEremainder(v - vDeg, 360)).isCloseTo(0, within(1e-5));
        assertThat(out[1]).isCloseTo(r, within(1.5e-6));
    }

    /** The parabola is the limit of ellipses and hyperbolas of the same q (common practice, no source). */
    @Test
    void theThreeConicsMeetAtTheParabola() {
        double[] parabola = new double[2];
        double[] ellipse = new double[2];
        double[] hyperbola = new double[2];
        for (double days = -400; days <= 400; days += 17.3) {
            TwoBody.anomalyAndRadius(0.8, 1, days, parabola);
            TwoBody.anomalyAndRadius(0.8, 1 - 1e-7, days, ellipse);
            TwoBody.anomalyAndRadius(0.8, 1 + 1e-7, days, hyperbola);
            assertThat(ellipse[0]).isCloseTo(parabola[0], within(1e-6));
            assertThat(hyperbola[0]).isCloseTo(parabola[0], within(1e-6));
            assertThat(ellipse[1]).isCloseTo(parabola[1], within(1e-6));
            assertThat(hyperbola[1]).isCloseTo(parabola[1], within(1e-6));
        }
    }
}
