package org.skyrota.sky.time;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.Instant;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class JulianDayTest {

    /** The book prints Julian Days to 0.01 or to 0.1 day; the arithmetic is exact, so 1e-9 day. */
    private static final double JD_TOLERANCE = 1e-9;

    @ParameterizedTest(name = "{0}-{1}-{2} julian={3} -> {4}")
    @CsvSource({
        // Meeus, Astronomical Algorithms 2nd ed., Example 7.a: 1957 Oct 4.81
        "1957, 10, 4.81, false, 2436116.31",
        // Meeus ch. 7, list of dates after Example 7.b
        "2000, 1, 1.5, false, 2451545.0",
        "1987, 6, 19.5, false, 2446966.0",
        // Meeus Example 7.b: 333 Jan 27.5 in the Julian calendar
        "333, 1, 27.5, true, 1842713.0",
        // Meeus ch. 7, list of dates: 1582 Oct 15.0 (first Gregorian day) and the day before in the Julian calendar
        "1582, 10, 15.0, false, 2299160.5",
        "1582, 10, 4.0, true, 2299159.5",
        // Meeus ch. 7, list: 1988 Jan 27.0 and -4712 Jan 1.5 (Julian calendar, the origin)
        "1988, 1, 27.0, false, 2447187.5",
        "-4712, 1, 1.5, true, 0.0",
    })
    void meeusChapter7Dates(int year, int month, double day, boolean julian, double expectedJd) {
        assertThat(TimeScales.julianDay(year, month, day, julian)).isCloseTo(expectedJd, within(JD_TOLERANCE));
    }

    @Test
    void instantRoundTripsThroughJulianDate() {
        Instant t = Instant.parse("2026-12-01T21:45:30.123456Z");
        // Resolution of a double JD near 2.46e6 is about 40 microseconds.
        assertThat(TimeScales.instantOfJdUtc(TimeScales.jdUtc(t)).toEpochMilli()).isEqualTo(t.toEpochMilli());
        assertThat(TimeScales.jdUtc(Instant.parse("2000-01-01T12:00:00Z"))).isEqualTo(TimeScales.J2000_JD);
        // Unix epoch is JD 2440587.5 (common practice, no source).
        assertThat(TimeScales.jdUtc(Instant.EPOCH)).isEqualTo(2440587.5);
    }

    @Test
    void jdUtcAgreesWithTheCalendarFormula() {
        Instant t = Instant.parse("1957-10-04T19:26:24Z");
        assertThat(TimeScales.jdUtc(t)).isCloseTo(2436116.31, within(1e-8));
    }

    @Test
    void badMonthIsNamed() {
        assertThatThrownBy(() -> TimeScales.julianDay(2000, 13, 1, false))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("13");
    }
}
