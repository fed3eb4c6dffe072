package org.skyrota.sky.coords;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.skyrota.sky.time.TimeScales;

class ApparentPlaceTest {

    private static final double ARCSEC = Math.PI / 648000.0;

    // The star of Meeus Example 21.b (and 23.a): J2000 place and proper motion as printed.
    private static final double RA0 = Math.toRadians((2 + 44 / 60.0 + 11.986 / 3600) * 15);
    private static final double DEC0 = Math.toRadians(49 + 13 / 60.0 + 42.48 / 3600);
    private static final double PM_RA_COS_DEC = 0.03425 * 15 * ARCSEC * Math.cos(DEC0);
    private static final double PM_DEC = -0.0895 * ARCSEC;
    private static final double JD = TimeScales.julianDay(2028, 11, 13.19, false);

    // Meeus Example 23.a (value from memory of the book): apparent place α = 2h46m14.390s, δ = +49°21′07.45″.
    private static final double RA_23A_SECONDS = 2 * 3600 + 46 * 60 + 14.390;
    private static final double DEC_23A_ARCSEC = 49 * 3600 + 21 * 60 + 7.45;
    // Meeus Example 21.b: mean place of date α = 2h46m11.331s, δ = +49°20′54.54″.
    private static final double RA_21B_SECONDS = 2 * 3600 + 46 * 60 + 11.331;
    private static final double DEC_21B_ARCSEC = 49 * 3600 + 20 * 60 + 54.54;

    /**
     * Our precession is IAU 2006, the book's IAU 1976: they differ here by 0.007 s and 0.035″ (see
     * PrecessionTest), so the absolute place is checked to 0.010 s and 0.06″.
     */
    private static final double RA_TOLERANCE_S = 0.010;
    private static final double DEC_TOLERANCE_ARCSEC = 0.06;

    private static double raSeconds(double[] out) {
        return Math.toDegrees(out[0]) / 15 * 3600;
    }

    private static double decArcsec(double[] out) {
        return Math.toDegrees(out[1]) * 3600;
    }

    @Test
    void meeusExample23aApparentPlace() {
        double[] out = new double[2];
        ApparentPlace.ofDate(RA0, DEC0, PM_RA_COS_DEC, PM_DEC, JD, out);
        assertThat(raSeconds(out)).isCloseTo(RA_23A_SECONDS, within(RA_TOLERANCE_S));
        assertThat(decArcsec(out)).isCloseTo(DEC_23A_ARCSEC, within(DEC_TOLERANCE_ARCSEC));
    }

    @Test
    void nutationPlusAberrationMatchTheBookClosely() {
        // Apparent minus mean place of date, Meeus 23.a minus 21.b: +3.059 s and +12.91″; both
        // models share the precession, so the difference isolates nutation and aberration.
        double[] app = new double[2];
        double[] mean = new double[2];
        ApparentPlace.ofDate(RA0, DEC0, PM_RA_COS_DEC, PM_DEC, JD, app);
        ApparentPlace.ofDate(RA0, DEC0, PM_RA_COS_DEC, PM_DEC, JD, false, false, mean);
        assertThat(raSeconds(app) - raSeconds(mean)).isCloseTo(RA_23A_SECONDS - RA_21B_SECONDS, within(0.003));
        assertThat(decArcsec(app) - decArcsec(mean)).isCloseTo(DEC_23A_ARCSEC - DEC_21B_ARCSEC, within(0.03));
    }

    @Test
    void leavingOutNutationMissesTheBook() {
        // Without nutation the place is off by about 1 s of RA (Meeus 23.a: Δα1 = +15.8″): beyond tolerance.
        double[] out = new double[2];
        ApparentPlace.ofDate(RA0, DEC0, PM_RA_COS_DEC, PM_DEC, JD, false, true, out);
        assertThat(Math.abs(raSeconds(out) - RA_23A_SECONDS)).isGreaterThan(10 * RA_TOLERANCE_S);
    }

    @Test
    void leavingOutAberrationMissesTheBook() {
        // Without annual aberration (Meeus 23.a: Δα2 = +30.0″, Δδ2 = +6.7″) both coordinates miss.
        double[] out = new double[2];
        ApparentPlace.ofDate(RA0, DEC0, PM_RA_COS_DEC, PM_DEC, JD, true, false, out);
        assertThat(Math.abs(raSeconds(out) - RA_23A_SECONDS)).isGreaterThan(10 * RA_TOLERANCE_S);
        assertThat(Math.abs(decArcsec(out) - DEC_23A_ARCSEC)).isGreaterThan(10 * DEC_TOLERANCE_ARCSEC);
    }

    @Test
    void meanPlaceOfDateMatchesExample21b() {
        double[] out = new double[2];
        ApparentPlace.ofDate(RA0, DEC0, PM_RA_COS_DEC, PM_DEC, JD, false, false, out);
        assertThat(raSeconds(out)).isCloseTo(RA_21B_SECONDS, within(RA_TOLERANCE_S));
        assertThat(decArcsec(out)).isCloseTo(DEC_21B_ARCSEC, within(DEC_TOLERANCE_ARCSEC));
    }

    @Test
    void atJ2000WithoutCorrectionsThePlaceIsUnchanged() {
        double[] out = new double[2];
        ApparentPlace.ofDate(1.0, -0.5, 1e-6, 1e-6, TimeScales.J2000_JD, false, false, out);
        assertThat(out[0]).isCloseTo(1.0, within(1e-12));
        assertThat(out[1]).isCloseTo(-0.5, within(1e-12));
    }

    @Test
    void annualAberrationNeverExceeds20_5Arcseconds() {
        // Common practice, no source: the constant of aberration is 20.5″; the shift is at most that (plus e·κ).
        double[] with = new double[2];
        double[] without = new double[2];
        java.util.Random random = new java.util.Random(7);
        for (int i = 0; i < 1000; i++) {
            double ra = random.nextDouble() * 2 * Math.PI;
            double dec = Math.asin(2 * random.nextDouble() - 1);
            double jd = TimeScales.J2000_JD + random.nextDouble() * 36525;
            ApparentPlace.ofDate(ra, dec, 0, 0, jd, true, true, with);
            ApparentPlace.ofDate(ra, dec, 0, 0, jd, true, false, without);
            double shift = Horizontal.separationRad(with[0], with[1], without[0], without[1]) / ARCSEC;
            assertThat(shift).isLessThan(20.5 * 1.0168);
        }
    }

    @Test
    void resultsAreNormalised() {
        double[] out = new double[2];
        ApparentPlace.ofDate(Math.toRadians(359.9999), 0.2, 0, 0, JD, out);
        assertThat(out[0]).isBetween(0.0, 2 * Math.PI);
        ApparentPlace.ofDate(0.0, Math.toRadians(89.9999), 0, 0, JD, out);
        assertThat(out[0]).isBetween(0.0, 2 * Math.PI);
        assertThat(out[1]).isLessThanOrEqualTo(Math.PI / 2);
    }
}
