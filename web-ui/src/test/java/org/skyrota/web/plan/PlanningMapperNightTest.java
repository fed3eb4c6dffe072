package org.skyrota.web.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import java.time.LocalDate;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.skyrota.web.site.Site;

/**
 * The night a stored visit belongs to is the core's night of its start (local noon to local noon at its site), also
 * on the days the clocks change. Clock changes: EU summer time from the last Sunday of March to the last Sunday of
 * October at 01:00 UTC (Directive 2000/84/EC); US daylight time from the second Sunday of March to the first Sunday of
 * November at 02:00 local (Energy Policy Act of 2005, section 110). The expected nights are worked by hand from the
 * local wall-clock times; the core's own table is {@code NightContainingTest}. Invented sites.
 */
class PlanningMapperNightTest {

    @ParameterizedTest(name = "{0}: {1} ({2}) is in the night of {3}")
    @CsvSource({
            "Europe/Berlin,  2025-03-30T10:30:00Z, 12:30 CEST on the day summer time begins, 2025-03-30",
            "Europe/Berlin,  2025-03-30T09:30:00Z, 11:30 CEST,                               2025-03-29",
            "Europe/Berlin,  2025-10-26T10:30:00Z, 11:30 CET on the day summer time ends,    2025-10-25",
            "Europe/Berlin,  2025-10-26T11:30:00Z, 12:30 CET,                                2025-10-26",
            "America/Denver, 2025-03-09T18:30:00Z, 12:30 MDT on the day daylight time begins, 2025-03-09",
            "America/Denver, 2025-11-02T18:30:00Z, 11:30 MST on the day daylight time ends,  2025-11-01",
    })
    void aVisitStartingOnAClockChangeDayIsInTheNightOfItsLocalNoons(String zone, Instant start, String local,
                                                                     LocalDate expected) {
        Site stored = new Site("Clock-change hill", 48, 11, 500);
        stored.setTimeZone(zone);
        assertThat(PlanningMapper.nightOf(start, PlanningMapper.site(stored).nightZone())).as(local).isEqualTo(expected);
    }
}
