package org.skyrota.sky.bodies;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.Instant;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.coords.Topocentric;
import org.skyrota.sky.time.SiderealTime;
import org.skyrota.sky.time.TimeScales;

/** Edge cases of the Sun's place at a site: pole, equator, date line (facts of the trade, no source). */
class SunEdgeCasesTest {

    private static double sunAltitudeDeg(Instant t, double latDeg, double lonDeg) {
        double jdTt = TimeScales.jdTt(t);
        double lst = SiderealTime.localApparentRad(TimeScales.jdUt1(t), jdTt, Math.toRadians(lonDeg));
        double[] s = new double[4];
        Sun.apparent(jdTt, s);
        double[] topo = new double[2];
        Topocentric.correct(s[0], s[1], s[2], lst, Math.toRadians(latDeg), 0, topo);
        return Math.toDegrees(Horizontal.altitudeRad(lst - topo[0], topo[1], Math.toRadians(latDeg)));
    }

    @Test
    void atTheNorthPoleInJuneTheSunCirclesAtItsDeclination() {
        // Common practice, no source: at the pole the altitude equals the declination, about +23.4° at
        // the June solstice, the same all day (polar day).
        Instant noon = Instant.parse("2026-06-21T12:00:00Z");
        for (int hour = 0; hour < 24; hour++) {
            assertThat(sunAltitudeDeg(noon.plusSeconds(3600L * hour), 89.9999, 0)).isCloseTo(23.44, within(0.05));
        }
    }

    @Test
    void northOfTheArcticCircleTheSunDoesNotSetAtTheJuneSolstice() {
        // Common practice, no source.
        Instant day = Instant.parse("2026-06-21T00:00:00Z");
        for (int minute = 0; minute < 24 * 60; minute += 10) {
            assertThat(sunAltitudeDeg(day.plusSeconds(60L * minute), 69.65, 18.96)).isPositive();
        }
    }

    @Test
    void atTheEquatorTheSunRisesPerpendicularlyToTheHorizon() {
        // Common practice, no source: at the equator near an equinox the altitude changes by 15° an hour
        // at rising.
        Instant t = Instant.parse("2026-03-20T06:07:00Z");
        double before = sunAltitudeDeg(t, 0, 0);
        double after = sunAltitudeDeg(t.plusSeconds(600), 0, 0);
        assertThat(Math.abs(before)).isLessThan(2.0);
        assertThat((after - before) * 6).isCloseTo(15.0, within(0.1));
    }

    @Test
    void theDateLineIsOneMeridian() {
        Instant t = Instant.parse("2026-12-01T22:00:00Z");
        assertThat(sunAltitudeDeg(t, -17.7, 180.0)).isCloseTo(sunAltitudeDeg(t, -17.7, -180.0), within(1e-9));
    }
}
