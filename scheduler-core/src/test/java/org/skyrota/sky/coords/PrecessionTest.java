package org.skyrota.sky.coords;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.skyrota.sky.time.TimeScales;

class PrecessionTest {

    private static final double ARCSEC = Math.PI / 648000.0;

    /** Meeus Example 21.b: the star of Meeus Example 21.b, J2000 place and proper motion. */
    private static final double RA0_DEG = (2 + 44 / 60.0 + 11.986 / 3600) * 15;
    private static final double DEC0_DEG = 49 + 13 / 60.0 + 42.48 / 3600;
    private static final double PM_RA_SECONDS_PER_YEAR = 0.03425;
    private static final double PM_DEC_ARCSEC_PER_YEAR = -0.0895;
    private static final double JD_21B = TimeScales.julianDay(2028, 11, 13.19, false);
    /** Meeus Example 21.b result: α = 2h46m11.331s, δ = +49°20′54.54″. */
    private static final double RA_21B_SECONDS = 2 * 3600 + 46 * 60 + 11.331;
    private static final double DEC_21B_ARCSEC = 49 * 3600 + 20 * 60 + 54.54;

    private static double[] meanPlaceOfDate(double[][] p) {
        double years = (JD_21B - TimeScales.J2000_JD) / 365.25;
        // Meeus applies proper motion linearly in α and δ before precessing.
        double ra = Math.toRadians(RA0_DEG + PM_RA_SECONDS_PER_YEAR * 15 / 3600 * years);
        double dec = Math.toRadians(DEC0_DEG + PM_DEC_ARCSEC_PER_YEAR / 3600 * years);
        double[] v = {Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec)};
        double[] w = new double[3];
        for (int i = 0; i < 3; i++) {
            w[i] = p[i][0] * v[0] + p[i][1] * v[1] + p[i][2] * v[2];
        }
        double raOut = Math.atan2(w[1], w[0]);
        if (raOut < 0) {
            raOut += 2 * Math.PI;
        }
        return new double[] {raOut, Math.asin(w[2])};
    }

    @Test
    void meeusExample21bWithTheBooksIau1976Precession() {
        // Meeus, Astronomical Algorithms 2nd ed., Example 21.b (rigorous method, IAU 1976 angles):
        // α = 2h46m11.331s, δ = +49°20′54.54″; printed to 0.001 s and 0.01″.
        double[] place = meanPlaceOfDate(Precession.matrixJ2000ToDateIau1976(JD_21B));
        assertThat(Math.toDegrees(place[0]) / 15 * 3600).isCloseTo(RA_21B_SECONDS, within(0.0015));
        assertThat(Math.toDegrees(place[1]) * 3600).isCloseTo(DEC_21B_ARCSEC, within(0.015));
    }

    @Test
    void meeusExample21bWithIau2006Precession() {
        // Same example with the engine's IAU 2006 model: the precession rate of IAU 2006 is about 0.3″ per
        // century slower in longitude than IAU 1976, which over 28.9 years moves this star by < 0.1″.
        double[] place = meanPlaceOfDate(Precession.matrixJ2000ToDate(JD_21B));
        assertThat(Math.toDegrees(place[0]) / 15 * 3600).isCloseTo(RA_21B_SECONDS, within(0.010));
        assertThat(Math.toDegrees(place[1]) * 3600).isCloseTo(DEC_21B_ARCSEC, within(0.06));
    }

    @Test
    void matrixIsARotation() {
        double[][] p = Precession.matrixJ2000ToDate(TimeScales.J2000_JD + 36525 * 3);
        for (int i = 0; i < 3; i++) {
            for (int j = 0; j < 3; j++) {
                double dot = p[i][0] * p[j][0] + p[i][1] * p[j][1] + p[i][2] * p[j][2];
                assertThat(dot).isCloseTo(i == j ? 1.0 : 0.0, within(1e-15));
            }
        }
        double[][] atEpoch = Precession.matrixJ2000ToDate(TimeScales.J2000_JD);
        // At J2000 the IAU 2006 ζ_A and z_A constants (±2.650545″) cancel: identity to 1e-12.
        assertThat(atEpoch[0][0]).isCloseTo(1.0, within(1e-12));
        assertThat(atEpoch[0][1]).isCloseTo(0.0, within(1e-12));
    }

    @Test
    void equinoxPrecessesAbout50_3ArcsecondsPerYear() {
        // Common practice, no source: general precession in longitude ≈ 50.3″ a year, a cycle of ≈ 25,800 years.
        // Shown with the matrix: the longitude, on the ecliptic of date, of the J2000 vernal-equinox direction.
        double years = 100;
        double jd = TimeScales.J2000_JD + years * 365.25;
        double[][] p = Precession.matrixJ2000ToDate(jd);
        double x = p[0][0];
        double y = p[1][0];
        double z = p[2][0];
        double eps = Obliquity.meanRad(jd);
        double ye = Math.cos(eps) * y + Math.sin(eps) * z;
        double longitudeArcsec = Math.atan2(ye, x) / ARCSEC;
        double perYear = longitudeArcsec / years;
        assertThat(perYear).isCloseTo(50.3, within(0.05));
        assertThat(1296000.0 / perYear).isBetween(25_500.0, 26_100.0);
    }
}
