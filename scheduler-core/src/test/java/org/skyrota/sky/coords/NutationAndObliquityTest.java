package org.skyrota.sky.coords;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.skyrota.sky.time.TimeScales;

class NutationAndObliquityTest {

    private static final double ARCSEC = Math.PI / 648000.0;

    /** Meeus Example 22.a: 1987 April 10, 0h TD. */
    private static final double JD_22A = TimeScales.julianDay(1987, 4, 10.0, false);

    @Test
    void meeusExample22aNutation() {
        // Meeus, Astronomical Algorithms 2nd ed., Example 22.a: Δψ = -3.788″, Δε = +9.443″ (printed to 0.001″)
        double[] out = new double[2];
        Nutation.angles(JD_22A, out);
        assertThat(out[0] / ARCSEC).isCloseTo(-3.788, within(0.0006));
        assertThat(out[1] / ARCSEC).isCloseTo(9.443, within(0.0006));
        assertThat(Nutation.longitudeRad(JD_22A)).isEqualTo(out[0]);
        assertThat(Nutation.obliquityRad(JD_22A)).isEqualTo(out[1]);
    }

    @Test
    void meeusExample22aObliquity() {
        // Meeus Example 22.a: ε0 = 23°26′27.407″, ε = 23°26′36.850″ (IAU 1980 mean obliquity, formula 22.2)
        double eps0 = 23 * 3600 + 26 * 60 + 27.407;
        double eps = 23 * 3600 + 26 * 60 + 36.850;
        assertThat(Obliquity.meanIau1980Rad(JD_22A) / ARCSEC).isCloseTo(eps0, within(0.0006));
        assertThat((Obliquity.meanIau1980Rad(JD_22A) + Nutation.obliquityRad(JD_22A)) / ARCSEC).isCloseTo(eps, within(0.001));
        // The IAU 2006 mean obliquity used by the engine is 0.042″ smaller at J2000 (84381.406″ vs 84381.448″)
        // and falls 0.0218″ per century faster (46.8368″ vs 46.8150″): 0.0392″ smaller in 1987 (T = -0.127).
        assertThat(Obliquity.meanRad(JD_22A) / ARCSEC).isCloseTo(eps0 - 0.0392, within(0.001));
        assertThat(Obliquity.trueRad(JD_22A) / ARCSEC).isCloseTo(eps - 0.0392, within(0.001));
    }

    @Test
    void obliquityIsAbout23_44DegreesNow() {
        // Common practice, no source: the obliquity of the ecliptic is about 23.44° today.
        double jd = TimeScales.julianDay(2026, 12, 1.0, false);
        assertThat(Math.toDegrees(Obliquity.meanRad(jd))).isCloseTo(23.44, within(0.005));
    }

    @Test
    void nutationStaysWithinItsKnownAmplitude() {
        // Common practice, no source: |Δψ| < 17.3″ + a few, |Δε| < 9.3″ + a few, over the 18.6-year cycle.
        double[] out = new double[2];
        for (double jd = 2451545; jd < 2451545 + 19 * 365.25; jd += 5) {
            Nutation.angles(jd, out);
            assertThat(Math.abs(out[0]) / ARCSEC).isLessThan(19.5);
            assertThat(Math.abs(out[1]) / ARCSEC).isLessThan(10.5);
        }
    }
}
