package org.skyrota.sky.time;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class SiderealTimeTest {

    private static final double SECONDS_OF_TIME_PER_RAD = 86400.0 / (2 * Math.PI);

    private static double hms(int h, int m, double s) {
        return h * 3600.0 + m * 60.0 + s;
    }

    @Test
    void sofaEarthRotationAngle() {
        // IAU SOFA t_sofa_c.c, t_era00: UT1 = 2400000.5 + 54388.0 -> 0.4022837240028158102 rad (SOFA checks 1e-12)
        assertThat(SiderealTime.earthRotationAngleRad(2400000.5 + 54388.0))
                .isCloseTo(0.4022837240028158102, within(1e-12));
    }

    @Test
    void sofaGmst06() {
        // IAU SOFA t_sofa_c.c, t_gmst06: UT1 = TT = 2400000.5 + 53736.0 -> 1.754174971870091203 rad (SOFA checks 1e-12)
        double jd = 2400000.5 + 53736.0;
        assertThat(SiderealTime.gmstRad(jd, jd)).isCloseTo(1.754174971870091203, within(1e-12));
    }

    @Test
    void meeusExample12aMeanSiderealTime() {
        // Meeus, Astronomical Algorithms 2nd ed., Example 12.a: 1987 Apr 10, 0h UT -> 13h10m46.3668s
        double jd = TimeScales.julianDay(1987, 4, 10.0, false);
        double expected = hms(13, 10, 46.3668);
        // The book's formula 12.4 (IAU 1982), to the printed 0.0001 s:
        assertThat(SiderealTime.gmst1982Rad(jd) * SECONDS_OF_TIME_PER_RAD).isCloseTo(expected, within(0.0001));
        // IAU 2006 differs from IAU 1982 by a few ms of time in 1987 (precession-rate change); TT = UT + 55 s
        assertThat(SiderealTime.gmstRad(jd, jd + 55.0 / 86400) * SECONDS_OF_TIME_PER_RAD).isCloseTo(expected, within(0.005));
    }

    @Test
    void meeusExample12aApparentSiderealTime() {
        // Meeus Example 12.a: apparent sidereal time 13h10m46.1351s (mean + Δψ cos ε, Δψ = -3.788″)
        double jd = TimeScales.julianDay(1987, 4, 10.0, false);
        double gast = SiderealTime.gastRad(jd, jd + 55.0 / 86400) * SECONDS_OF_TIME_PER_RAD;
        assertThat(gast).isCloseTo(hms(13, 10, 46.1351), within(0.005));
        // and the equation of the equinoxes alone, -0.2317 s, to 0.0005 s
        assertThat(SiderealTime.equationOfEquinoxesRad(jd) * SECONDS_OF_TIME_PER_RAD).isCloseTo(-0.2317, within(0.0005));
    }

    @Test
    void meeusExample12b() {
        // Meeus Example 12.b: 1987 Apr 10, 19h21m00s UT -> mean sidereal time 8h34m57.0896s = 128.7378734°
        double jd = TimeScales.julianDay(1987, 4, 10.0 + (19 + 21 / 60.0) / 24.0, false);
        assertThat(Math.toDegrees(SiderealTime.gmst1982Rad(jd))).isCloseTo(128.7378734, within(2e-7));
        assertThat(SiderealTime.gmst1982Rad(jd) * SECONDS_OF_TIME_PER_RAD).isCloseTo(hms(8, 34, 57.0896), within(0.0001));
        assertThat(SiderealTime.gmstRad(jd, jd + 55.0 / 86400) * SECONDS_OF_TIME_PER_RAD)
                .isCloseTo(hms(8, 34, 57.0896), within(0.005));
    }

    @Test
    void siderealDayIsShorterThanTheSolarDay() {
        // Common practice, no source: the Earth turns 360.9856° per solar day (one sidereal day ≈ 23h56m04s).
        double jd = 2460000.5;
        double turn = SiderealTime.earthRotationAngleRad(jd + 1) - SiderealTime.earthRotationAngleRad(jd);
        double deg = Math.toDegrees((turn + 2 * Math.PI) % (2 * Math.PI)) + 360.0;
        assertThat(deg).isCloseTo(360.9856, within(0.0001));
    }
}
