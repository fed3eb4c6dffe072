package org.skyrota.sky.bodies;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.OffsetDateTime;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.atmosphere.Refraction;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.coords.Topocentric;
import org.skyrota.sky.time.SiderealTime;
import org.skyrota.sky.time.TimeScales;

/**
 * The worked example of the NREL Solar Position Algorithm (Reda and Andreas, NREL/TP-560-34302, 2003/2008,
 * Table A5.1): 2003-10-17 12:30:30 local time at UTC-7, latitude 39.742476°, longitude -105.1786°,
 * elevation 1830.14 m, 820 mbar, 11 °C, ΔT = 67 s -> topocentric zenith angle 50.111622°,
 * azimuth (east of north) 194.340241°.
 */
class NrelSpaExampleTest {

    /** The report states an uncertainty of ±0.0003° for its algorithm; our chain should agree within it. */
    private static final double TOLERANCE_DEG = 0.0003;

    @Test
    void topocentricZenithAndAzimuth() {
        double jdUt1 = TimeScales.jdUtc(OffsetDateTime.parse("2003-10-17T12:30:30-07:00").toInstant());
        double jdTt = jdUt1 + 67.0 / 86400;
        double lat = Math.toRadians(39.742476);
        double lon = Math.toRadians(-105.1786);
        double[] sun = new double[4];
        Sun.apparent(jdTt, sun);
        double lst = SiderealTime.gastRad(jdUt1, jdTt) + lon;
        double[] topo = new double[2];
        Topocentric.correct(sun[0], sun[1], sun[2], lst, lat, 1830.14, topo);
        double h = lst - topo[0];
        double trueAltDeg = Math.toDegrees(Horizontal.altitudeRad(h, topo[1], lat));
        double apparentAltDeg = Refraction.apparentFromTrueDeg(trueAltDeg, 820, 11);
        assertThat(90 - apparentAltDeg).isCloseTo(50.111622, within(TOLERANCE_DEG));
        assertThat(Math.toDegrees(Horizontal.azimuthRad(h, topo[1], lat))).isCloseTo(194.340241, within(TOLERANCE_DEG));
    }
}
