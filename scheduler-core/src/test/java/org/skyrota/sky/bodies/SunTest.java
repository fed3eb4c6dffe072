package org.skyrota.sky.bodies;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.skyrota.sky.time.TimeScales;

class SunTest {

    private static final double ARCSEC_PER_DEG = 3600.0;
    /** Meeus Examples 25.a and 25.b: 1992 October 13.0 TD. */
    private static final double JD_25 = TimeScales.julianDay(1992, 10, 13.0, false);

    private static double[] sun(double jdTt) {
        double[] out = new double[5];
        Sun.apparent(jdTt, out);
        return out;
    }

    @Test
    void meeusExample25aLowAccuracyMethod() {
        // Meeus, Astronomical Algorithms 2nd ed., Example 25.a (the low-accuracy method, "0.01°"):
        // λ = 199.90895°, α = 13h13m31.4s, δ = -7°47′06″, R = 0.99766 AU.
        // Our Sun is the VSOP87 method of 25.b, so the tolerance is the accuracy Meeus gives the method of 25.a.
        double[] s = sun(JD_25);
        assertThat(Math.toDegrees(s[3])).isCloseTo(199.90895, within(0.005));
        assertThat(Math.toDegrees(s[0])).isCloseTo((13 + 13 / 60.0 + 31.4 / 3600) * 15, within(0.01));
        assertThat(Math.toDegrees(s[1])).isCloseTo(-(7 + 47 / 60.0 + 6 / 3600.0), within(0.01));
        assertThat(s[2] / Sun.AU_KM).isCloseTo(0.99766, within(0.0001));
    }

    /*
     * Meeus Example 25.b (the VSOP87 method; values from memory of the book): apparent λ = 199°54′21.56″,
     * α = 13h13m30.749s, δ = -7°47′01.74″, R = 0.99760775 AU. The book evaluated the complete VSOP87;
     * the truncated series of its Appendix III used here differ by about 0.3″, hence 0.5″.
     */
    private static final double LAMBDA_25B_DEG = 199 + 54 / 60.0 + 21.56 / 3600;
    private static final double RA_25B_SECONDS = 13 * 3600 + 13 * 60 + 30.749;
    private static final double DEC_25B_DEG = -(7 + 47 / 60.0 + 1.74 / 3600);
    private static final double TOLERANCE_ARCSEC = 0.5;

    @Test
    void meeusExample25bHigherAccuracy() {
        double[] s = sun(JD_25);
        assertThat(Math.toDegrees(s[3]) * ARCSEC_PER_DEG).isCloseTo(LAMBDA_25B_DEG * ARCSEC_PER_DEG, within(TOLERANCE_ARCSEC));
        assertThat(Math.toDegrees(s[0]) / 15 * 3600).isCloseTo(RA_25B_SECONDS, within(TOLERANCE_ARCSEC / 15));
        assertThat(Math.toDegrees(s[1]) * ARCSEC_PER_DEG).isCloseTo(DEC_25B_DEG * ARCSEC_PER_DEG, within(TOLERANCE_ARCSEC));
        assertThat(s[2] / Sun.AU_KM).isCloseTo(0.99760775, within(2e-8));
    }

    @Test
    void leavingOutAberrationMissesExample25b() {
        // The aberration is -20.5″/R: without it the longitude misses the book by 40 times the tolerance.
        double[] s = new double[5];
        Sun.apparent(JD_25, false, s);
        double missArcsec = Math.abs(Math.toDegrees(s[3]) - LAMBDA_25B_DEG) * ARCSEC_PER_DEG;
        assertThat(missArcsec).isGreaterThan(20 * TOLERANCE_ARCSEC).isCloseTo(20.5, within(0.6));
    }

    @Test
    void longitudeAdvancesAbout0_9856DegreesPerDay() {
        // Common practice, no source: the Sun's ecliptic longitude advances 360° in a tropical year of
        // 365.2422 days, 0.9856° per day on average (0.953° to 1.019° through the year).
        double[] s = new double[5];
        double start = TimeScales.julianDay(2020, 1, 1.0, false);
        Sun.apparent(start, s);
        double previous = s[3];
        double total = 0;
        int days = (int) Math.round(365.2422 * 8);
        for (int d = 1; d <= days; d++) {
            Sun.apparent(start + d, s);
            double step = (s[3] - previous + 2 * Math.PI) % (2 * Math.PI);
            assertThat(Math.toDegrees(step)).isBetween(0.95, 1.02);
            total += step;
            previous = s[3];
        }
        assertThat(Math.toDegrees(total) / days).isCloseTo(0.9856, within(0.0001));
    }

    @Test
    void distanceStaysBetweenPerihelionAndAphelion() {
        // Common practice, no source: the Earth-Sun distance runs from 0.983 AU (early January) to 1.017 AU (early July).
        double[] s = new double[5];
        double start = TimeScales.julianDay(2026, 1, 1.0, false);
        double min = Double.MAX_VALUE;
        double max = 0;
        for (int d = 0; d < 366; d++) {
            Sun.apparent(start + d, s);
            min = Math.min(min, s[2] / Sun.AU_KM);
            max = Math.max(max, s[2] / Sun.AU_KM);
        }
        assertThat(min).isCloseTo(0.9833, within(0.0005));
        assertThat(max).isCloseTo(1.0167, within(0.0005));
    }
}
