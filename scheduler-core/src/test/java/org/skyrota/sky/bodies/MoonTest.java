package org.skyrota.sky.bodies;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.skyrota.sky.coords.Obliquity;
import org.skyrota.sky.coords.Nutation;
import org.skyrota.sky.time.TimeScales;

class MoonTest {

    /** Meeus Examples 47.a and 48.a: 1992 April 12, 0h TD. */
    private static final double JD_47A = TimeScales.julianDay(1992, 4, 12.0, false);

    private static double[] moon(double jdTt) {
        double[] out = new double[5];
        Moon.apparent(jdTt, out);
        return out;
    }

    @Test
    void meeusExample47aEclipticPlaceAndDistance() {
        // Meeus, Astronomical Algorithms 2nd ed., Example 47.a: λ = 133.162655° (geometric), Δψ = +0.004610°,
        // apparent λ = 133.167265°, β = -3.229126°, Δ = 368409.7 km. Printed to 1e-6° and 0.1 km; these do not
        // depend on the obliquity, so they check Tables 47.A and 47.B term by term (a typo in any coefficient
        // of 1e-6° or more would show).
        double[] m = moon(JD_47A);
        assertThat(Math.toDegrees(m[3])).isCloseTo(133.167265, within(1.5e-6));
        assertThat(Math.toDegrees(m[4])).isCloseTo(-3.229126, within(1.5e-6));
        assertThat(m[2]).isCloseTo(368409.7, within(0.06));
        double[] geo = new double[3];
        Moon.geocentricEcliptic(JD_47A, geo);
        assertThat(Math.toDegrees(geo[0]) % 360 + 360).isCloseTo(133.162655, within(1.5e-6));
    }

    @Test
    void meeusExample47aRightAscensionAndDeclination() {
        // Meeus Example 47.a: α = 134.688470°, δ = 13.768368° (with the IAU 1980 obliquity, ε = 23.440636°).
        double[] m = moon(JD_47A);
        // The engine's IAU 2006 obliquity is 0.040″ smaller: up to 1.1e-5° in α and δ, hence 2e-5°.
        assertThat(Math.toDegrees(m[0])).isCloseTo(134.688470, within(2e-5));
        assertThat(Math.toDegrees(m[1])).isCloseTo(13.768368, within(2e-5));
        // With the book's obliquity, to the printed digits.
        double eps = Obliquity.meanIau1980Rad(JD_47A) + Nutation.obliquityRad(JD_47A);
        assertThat(Math.toDegrees(eps)).isCloseTo(23.440636, within(1e-6));
        double l = m[3];
        double b = m[4];
        double ra = Math.atan2(Math.sin(l) * Math.cos(eps) - Math.tan(b) * Math.sin(eps), Math.cos(l));
        double dec = Math.asin(Math.sin(b) * Math.cos(eps) + Math.cos(b) * Math.sin(eps) * Math.sin(l));
        assertThat(Math.toDegrees(ra)).isCloseTo(134.688470, within(1.5e-6));
        assertThat(Math.toDegrees(dec)).isCloseTo(13.768368, within(1.5e-6));
    }

    @Test
    void meeusExample48aIlluminatedFraction() {
        // Meeus Example 48.a (same instant): phase angle i = 69.0756°, k = 0.6786. The book takes the Sun from
        // ch. 25; ours is the VSOP87 Sun, which changes i by less than 0.0002°.
        assertThat(Math.toDegrees(Moon.phaseAngleRad(JD_47A))).isCloseTo(69.0756, within(0.0003));
        assertThat(Moon.illuminatedFraction(JD_47A)).isCloseTo(0.6786, within(0.00006));
    }

    @Test
    void meeusExample49aNewMoon() {
        // Meeus Example 49.a: new Moon of 1977 February at JDE 2443192.65118 (1977 Feb 18, 3h37m42s TD).
        // At that instant the Moon-Sun elongation in longitude is zero. The book's phase series is good to a
        // few seconds of time and our Moon to ~10″ (≈ 20 s of the Moon's relative motion of 0.5″/s): 30″.
        double jde = 2443192.65118;
        double[] m = moon(jde);
        double[] s = new double[4];
        Sun.apparent(jde, s);
        double elongationArcsec = Math.toDegrees(Math.IEEEremainder(m[3] - s[3], 2 * Math.PI)) * 3600;
        assertThat(elongationArcsec).isCloseTo(0.0, within(30.0));
        // The Moon may pass up to 5.3° from the Sun at new Moon (its latitude): k < (1 - cos 5.3°)/2 = 0.0022.
        assertThat(Moon.illuminatedFraction(jde)).isLessThan(0.0022);
    }

    @Test
    void fullMoonIsFullyLit() {
        // Half a synodic month (29.530589 d, common practice, no source) after the new Moon of Meeus 49.a.
        double jde = 2443192.65118 + 29.530589 / 2;
        assertThat(Moon.illuminatedFraction(jde)).isGreaterThan(0.99);
    }

    @Test
    void distanceStaysBetweenPerigeeAndApogee() {
        // Common practice, no source: the Moon's distance ranges from about 356,400 to 406,700 km.
        double[] m = new double[5];
        for (double jd = 2451545; jd < 2451545 + 3650; jd += 0.37) {
            Moon.apparent(jd, m);
            assertThat(m[2]).isBetween(356_000.0, 407_000.0);
            assertThat(Math.abs(Math.toDegrees(m[4]))).isLessThan(5.35);
        }
    }
}
