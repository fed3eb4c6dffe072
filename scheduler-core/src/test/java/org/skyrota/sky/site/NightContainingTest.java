package org.skyrota.sky.site;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.util.stream.Stream;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.junit.jupiter.api.Test;
import org.skyrota.planning.model.Site;

/**
 * The one definition of "the night of an instant": the night whose local-noon-to-local-noon span holds it.
 *
 * <p>Clock-change dates, each the rule's own statement of when clocks move:
 * <ul>
 *   <li>Europe/Berlin: summer time from the last Sunday of March to the last Sunday of October, changing at 01:00 UTC
 *       (Directive 2000/84/EC, articles 2 and 3): 2025-03-30 and 2025-10-26.</li>
 *   <li>America/Denver: from the second Sunday of March to the first Sunday of November at 02:00 local (US Energy
 *       Policy Act of 2005, section 110): 2025-03-09 and 2025-11-02.</li>
 *   <li>Australia/Sydney (southern hemisphere): from the first Sunday of October to the first Sunday of April
 *       (Standard Time Act 1987 of New South Wales, as amended in 2007): 2025-04-06 and 2025-10-05.</li>
 * </ul>
 * Each expected night is the local date of the row's wall-clock time, less a day before noon; the wall-clock times
 * and their offsets are written out by hand from the rules above, not computed by the code under test.
 */
class NightContainingTest {

    static Stream<Arguments> cases() {
        return Stream.of(
                // zone, instant (UTC), what it is locally, expected night
                // Berlin, spring forward on 2025-03-30 (CET +01 → CEST +02 at 01:00 UTC).
                row("Europe/Berlin", "2025-03-30T10:30:00Z", "12:30 CEST on the day summer time begins", "2025-03-30"),
                row("Europe/Berlin", "2025-03-30T09:59:59Z", "11:59:59 CEST, just before noon", "2025-03-29"),
                row("Europe/Berlin", "2025-03-30T10:00:00Z", "12:00 CEST, noon itself", "2025-03-30"),
                row("Europe/Berlin", "2025-03-30T00:30:00Z", "01:30 CET, before the change", "2025-03-29"),
                // Berlin, fall back on 2025-10-26 (CEST +02 → CET +01 at 01:00 UTC).
                row("Europe/Berlin", "2025-10-26T10:30:00Z", "11:30 CET on the day summer time ends", "2025-10-25"),
                row("Europe/Berlin", "2025-10-26T11:30:00Z", "12:30 CET, half an hour after noon", "2025-10-26"),
                row("Europe/Berlin", "2025-10-26T00:30:00Z", "02:30 CEST, the first of the two 02:30s", "2025-10-25"),
                // Denver, spring forward on 2025-03-09 (MST −07 → MDT −06 at 02:00 local).
                row("America/Denver", "2025-03-09T18:30:00Z", "12:30 MDT on the day daylight time begins", "2025-03-09"),
                row("America/Denver", "2025-03-09T17:30:00Z", "11:30 MDT", "2025-03-08"),
                // Denver, fall back on 2025-11-02 (MDT −06 → MST −07 at 02:00 local).
                row("America/Denver", "2025-11-02T18:30:00Z", "11:30 MST on the day daylight time ends", "2025-11-01"),
                row("America/Denver", "2025-11-02T19:30:00Z", "12:30 MST", "2025-11-02"),
                // An ordinary day: the half-hour after local noon and the second before it.
                row("America/Denver", "2025-06-15T18:30:00Z", "12:30 MDT", "2025-06-15"),
                row("America/Denver", "2025-06-15T17:59:59Z", "11:59:59 MDT", "2025-06-14"),
                // Sydney, southern hemisphere: summer time ends on 2025-04-06 (AEDT +11 → AEST +10 at 03:00 local) and
                // begins on 2025-10-05 (AEST +10 → AEDT +11 at 02:00 local).
                row("Australia/Sydney", "2025-04-06T02:30:00Z", "12:30 AEST on the day summer time ends", "2025-04-06"),
                row("Australia/Sydney", "2025-04-06T01:30:00Z", "11:30 AEST", "2025-04-05"),
                row("Australia/Sydney", "2025-10-05T01:30:00Z", "12:30 AEDT on the day summer time begins", "2025-10-05"),
                row("Australia/Sydney", "2025-10-05T00:30:00Z", "11:30 AEDT", "2025-10-04"),
                // Local mean solar time at the date line: +12 h at 180° E, −12 h at 180° W (UTC + longitude/15 h).
                row("+12:00", "2027-01-01T00:00:00Z", "local mean noon at 180° E", "2027-01-01"),
                row("+12:00", "2026-12-31T23:59:59Z", "a second before it", "2026-12-31"),
                row("-12:00", "2027-01-02T00:00:00Z", "local mean noon at 180° W", "2027-01-01"),
                row("-12:00", "2027-01-02T00:30:00Z", "half an hour after it", "2027-01-01"),
                row("-12:00", "2027-01-01T23:59:59Z", "a second before it", "2026-12-31"));
    }

    private static Arguments row(String zone, String instant, String local, String night) {
        return Arguments.of(ZoneId.of(zone), Instant.parse(instant), local, LocalDate.parse(night));
    }

    @ParameterizedTest(name = "{0} {1} ({2}) is in the night of {3}")
    @MethodSource("cases")
    void theNightOfAnInstantHoldsItBetweenItsLocalNoons(ZoneId zone, Instant instant, String local, LocalDate expected) {
        Night night = Night.containing(zone, instant);
        assertThat(night.date()).as(local).isEqualTo(expected);
        assertThat(night.contains(instant)).isTrue();
        assertThat(night).isEqualTo(Night.of(zone, expected));
    }

    @ParameterizedTest(name = "{0} {1} ({2})")
    @MethodSource("cases")
    void aSiteWithTheZoneOrTheLongitudeGetsTheSameNight(ZoneId zone, Instant instant, String local, LocalDate expected) {
        SiteLocation site = zone instanceof ZoneOffset offset
                ? SiteLocation.of(-33, offset.getTotalSeconds() / 240.0, 0)
                : SiteLocation.of(-33, 0, 0, zone);
        assertThat(Night.containing(site, instant).date()).as(local).isEqualTo(expected);
    }

    @Test
    void theSiteModelsOfTheSkyEngineAndThePlannerShareLocalMeanSolarTime() {
        // A longitude whose mean solar offset is not a whole second: 7.1234567° / 15 h = 1709.6296 s, rounded to 1710 s.
        double longitude = 7.1234567;
        LocalDate date = LocalDate.of(2027, 2, 3);
        SiteLocation location = SiteLocation.of(45, longitude, 0);
        Site site = Site.of("lmst", "Mean-time hill (invented)", 45, longitude, 0, null, 21.5);
        assertThat(site.nightZone()).isEqualTo(ZoneOffset.ofTotalSeconds(1710));
        assertThat(Night.of(location, date).start())
                .isEqualTo(date.atTime(12, 0).atZone(site.nightZone()).toInstant())
                .isEqualTo(Instant.parse("2027-02-03T11:31:30Z"));
        Instant start = Night.of(location, date).start();
        assertThat(Night.containing(location, start).date()).isEqualTo(date);
        assertThat(Night.containing(site.nightZone(), start.minusNanos(1)).date()).isEqualTo(date.minusDays(1));
    }

    @Test
    void aLongitudeOutsideItsRangeIsRefusedByName() {
        assertThatThrownBy(() -> Night.meanSolarOffset(181)).hasMessageContaining("longitudeDeg");
        assertThatThrownBy(() -> Night.meanSolarOffset(Double.NaN)).hasMessageContaining("longitudeDeg");
    }
}
