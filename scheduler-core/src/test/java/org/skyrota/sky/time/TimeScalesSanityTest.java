package org.skyrota.sky.time;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.Instant;
import org.junit.jupiter.api.Test;

class TimeScalesSanityTest {

    @Test
    void j2000IsJulianDate2451545() {
        // Meeus, Astronomical Algorithms 2nd ed., ch. 7: 2000 Jan 1.5 = JD 2451545.0
        assertThat(TimeScales.jdUtc(Instant.parse("2000-01-01T12:00:00Z"))).isEqualTo(2451545.0);
    }

    @Test
    void ttMinusUtcIs69_184SecondsAfter2017() {
        // IERS Bulletin C: TAI - UTC = 37 s since 2017-01-01; TT - TAI = 32.184 s by definition
        assertThat(TimeScales.ttMinusUtcSeconds(Instant.parse("2020-06-01T00:00:00Z"))).isEqualTo(69.184);
    }

    @Test
    void gmst06MatchesSofa() {
        // IAU SOFA t_sofa_c.c, t_gmst06: UT1 = TT = 2400000.5 + 53736.0 -> 1.754174971870091203 rad
        double jd = 2400000.5 + 53736.0;
        assertThat(SiderealTime.gmstRad(jd, jd)).isCloseTo(1.754174971870091203, within(1e-12));
    }
}
