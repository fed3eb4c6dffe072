package org.skyrota.sky.time;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.Duration;
import java.time.Instant;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class TimeScalesTest {

    private static final double DAY = 86400.0;

    @ParameterizedTest(name = "{0}: TAI-UTC = {1}")
    @CsvSource({
        // IERS Bulletin C / the leap-second table (the values are those of the table, from memory of it)
        "1972-01-01T00:00:00Z, 10",
        "1972-06-30T23:59:59Z, 10",
        "1972-07-01T00:00:00Z, 11",
        "1985-06-30T23:59:59Z, 22",
        "1985-07-01T00:00:00Z, 23",
        "1999-01-01T00:00:00Z, 32",
        "2005-12-31T23:59:59Z, 32",
        "2006-01-01T00:00:00Z, 33",
        "2016-12-31T23:59:59Z, 36",
        "2017-01-01T00:00:00Z, 37",
        "2026-06-01T00:00:00Z, 37",
        "2040-01-01T00:00:00Z, 37",
    })
    void leapSecondTable(String instant, int expected) {
        assertThat(LeapSeconds.taiMinusUtcSeconds(Instant.parse(instant))).isEqualTo(expected);
    }

    @Test
    void ttMinusUtcWithinTheTable() {
        // TT = TAI + 32.184 s (IAU definition); TAI - UTC = 37 s since 2017 (IERS Bulletin C)
        Instant t = Instant.parse("2020-06-01T00:00:00Z");
        assertThat(TimeScales.ttMinusUtcSeconds(t)).isEqualTo(69.184);
        assertThat((TimeScales.jdTt(t) - TimeScales.jdUtc(t)) * DAY).isCloseTo(69.184, within(1e-4));
        // UT1 = UTC in the table's span (|DUT1| < 0.9 s): the documented choice.
        assertThat(TimeScales.jdUt1(t)).isEqualTo(TimeScales.jdUtc(t));
        assertThat(TimeScales.deltaTSeconds(t)).isEqualTo(69.184);
    }

    @Test
    void noJumpAtTheEndOfTheTable() {
        Instant end = LeapSeconds.TABLE_VALID_UNTIL;
        Instant before = end.minusMillis(1);
        assertThat(TimeScales.deltaTSeconds(end)).isCloseTo(TimeScales.deltaTSeconds(before), within(0.01));
        double ut1Before = TimeScales.jdUt1(before) * DAY;
        double ut1After = TimeScales.jdUt1(end) * DAY;
        assertThat(ut1After - ut1Before).isCloseTo(0.001, within(0.01));
        double ttBefore = TimeScales.jdTt(before) * DAY;
        double ttAfter = TimeScales.jdTt(end) * DAY;
        assertThat(ttAfter - ttBefore).isCloseTo(0.001, within(0.01));
    }

    @Test
    void noJumpAtTheStartOfTheTable() {
        Instant start = LeapSeconds.TABLE_START;
        Instant before = start.minusMillis(1);
        assertThat(TimeScales.deltaTSeconds(before)).isCloseTo(42.184, within(0.01));
        assertThat(TimeScales.ttMinusUtcSeconds(start)).isEqualTo(42.184);
        double ttBefore = TimeScales.jdTt(before) * DAY;
        double ttAfter = TimeScales.jdTt(start) * DAY;
        assertThat(ttAfter - ttBefore).isCloseTo(0.001, within(0.01));
    }

    @Test
    void deltaTIsSmoothAcrossTheCenturyAfterTheTable() {
        // No step of more than a small fraction of a second from one day to the next.
        Instant t = LeapSeconds.TABLE_VALID_UNTIL.minus(Duration.ofDays(400));
        double previous = TimeScales.deltaTSeconds(t);
        for (int day = 0; day < 365 * 30; day++) {
            t = t.plus(Duration.ofDays(1));
            double d = TimeScales.deltaTSeconds(t);
            assertThat(Math.abs(d - previous)).as("ΔT step at %s", t).isLessThan(0.01);
            previous = d;
        }
    }

    @Test
    void beforeTheTableUtcIsTakenAsUt1() {
        Instant t = Instant.parse("1900-01-01T00:00:00Z");
        assertThat(TimeScales.jdUt1(t)).isEqualTo(TimeScales.jdUtc(t));
        // Espenak–Meeus: ΔT(1900.0) = -2.79 s (constant term of the 1900-1920 polynomial), plus the
        // small join offset (< 0.1 s) documented in TimeScales.
        assertThat(TimeScales.deltaTSeconds(t)).isCloseTo(-2.79, within(0.1));
        assertThat((TimeScales.jdTt(t) - TimeScales.jdUt1(t)) * DAY).isCloseTo(TimeScales.deltaTSeconds(t), within(1e-4));
    }

    @Test
    void afterTheTableUt1DriftsFromUtcByTheModel() {
        Instant t = Instant.parse("2040-01-01T00:00:00Z");
        double ut1MinusUtc = (TimeScales.jdUt1(t) - TimeScales.jdUtc(t)) * DAY;
        assertThat(ut1MinusUtc).isCloseTo(69.184 - TimeScales.deltaTSeconds(t), within(1e-4));
        // ΔT keeps growing by the polynomial's slope (≈0.32 + 0.011 t s/yr): a fact of the model.
        assertThat(TimeScales.deltaTSeconds(t)).isGreaterThan(70).isLessThan(90);
    }
}
