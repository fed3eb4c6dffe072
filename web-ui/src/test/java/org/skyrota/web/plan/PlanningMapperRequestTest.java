package org.skyrota.web.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.Target;
import org.skyrota.web.program.Program;
import org.skyrota.web.request.DarknessLimit;
import org.skyrota.web.request.Exposure;
import org.skyrota.web.request.ObservingRequest;

/**
 * A stored request becomes the planner's {@link Request} with the same priority (both count 1 as the lowest and 5 as
 * the highest, the planner's own documentation of {@code Request.priority}) and with its repeat spacing as durations.
 * No database: the entities are built in memory, so their ids are absent.
 */
class PlanningMapperRequestTest {

    static final LocalDate FIRST = LocalDate.of(2027, 1, 10);
    static final LocalDate LAST = LocalDate.of(2027, 1, 20);

    static ObservingRequest stored(int repeats, Double intervalHours, Double toleranceHours, int priority) {
        ObservingRequest r = new ObservingRequest(new Program("MAP-1", "Mapping test", "Dr. Test"), "student");
        r.setTarget("NGC 2632", 130.1, 19.7);
        r.setConditions(30, DarknessLimit.ASTRONOMICAL, null, null);
        r.setSchedule(null, null, repeats, priority);
        r.setRepeatSpacing(intervalHours, toleranceHours);
        r.setExposures(List.of(new Exposure("V", 60, 5)));
        return r;
    }

    /** The target the mapper would have built for the request; its own mapping is not what these tests are about. */
    static final Target TARGET = Target.fixed("NGC 2632", 130.1, 19.7);

    @ParameterizedTest(name = "stored priority {0} reaches the planner as {0}")
    @ValueSource(ints = {1, 2, 3, 4, 5})
    void priorityCrossesUnchanged(int priority) {
        Request planned = PlanningMapper.request(stored(1, null, null, priority), TARGET, 1, FIRST, LAST);
        assertThat(planned.priority()).isEqualTo(priority);
    }

    @Test
    void anAirmassLimitCrossesToThePlannersLimitsAndNoneMeansNone() {
        ObservingRequest limited = stored(1, null, null, 3);
        limited.setMaxAirmass(1.2);
        assertThat(PlanningMapper.request(limited, TARGET, 1, FIRST, LAST).limits().maxAirmass()).isEqualTo(1.2);
        assertThat(PlanningMapper.request(stored(1, null, null, 3), TARGET, 1, FIRST, LAST).limits().maxAirmass())
                .isEqualTo(Double.POSITIVE_INFINITY);
    }

    @Test
    void theSpacingOfRepeatsCrossesAsDurations() {
        Request planned = PlanningMapper.request(stored(3, 24.0, 2.0, 4), TARGET, 3, FIRST, LAST);
        assertThat(planned.repeats()).isEqualTo(3);
        assertThat(planned.interval()).isEqualTo(Duration.ofHours(24));
        assertThat(planned.tolerance()).isEqualTo(Duration.ofHours(2));
        // Fractions of an hour are kept to the second: 1.75 h is 105 minutes.
        Request quarter = PlanningMapper.request(stored(2, 1.75, 0.25, 3), TARGET, 2, FIRST, LAST);
        assertThat(quarter.interval()).isEqualTo(Duration.ofMinutes(105));
        assertThat(quarter.tolerance()).isEqualTo(Duration.ofMinutes(15));
        // The open window is the planning horizon where the request names no nights.
        assertThat(planned.earliestNight()).isEqualTo(FIRST);
        assertThat(planned.latestNight()).isEqualTo(LAST);
    }

    @Test
    void theRepeatLeftOpenKeepsItsSpacingFromTheObservedOnes() {
        // Two of three repeats observed already: the one left is spaced from when they were taken.
        List<Instant> observed = List.of(Instant.parse("2027-01-10T03:00:00Z"), Instant.parse("2027-01-11T03:00:00Z"));
        Request last = PlanningMapper.request(stored(3, 24.0, 2.0, 3), TARGET, 1, observed, FIRST, LAST);
        assertThat(last.repeats()).isEqualTo(1);
        assertThat(last.interval()).isEqualTo(Duration.ofHours(24));
        assertThat(last.tolerance()).isEqualTo(Duration.ofHours(2));
        assertThat(last.observedStarts()).containsExactlyElementsOf(observed);
    }

    @Test
    void oneVisitWithNothingObservedOrNoStoredIntervalMeansNoSpacing() {
        Request single = PlanningMapper.request(stored(1, 24.0, 2.0, 3), TARGET, 1, FIRST, LAST);
        assertThat(single.interval()).isZero();
        assertThat(single.tolerance()).isZero();
        // A request stored before the spacing fields existed.
        Request old = PlanningMapper.request(stored(2, null, null, 3), TARGET, 2, FIRST, LAST);
        assertThat(old.interval()).isZero();
        assertThat(old.tolerance()).isZero();
    }

    @Test
    void theRepeatsLeftToPlanAreTheAskedLessTheObservedByTheLowestFreeNumbers() {
        assertThat(PlanningMapper.openRepeats(3, java.util.Set.of())).containsExactly(1, 2, 3);
        assertThat(PlanningMapper.openRepeats(3, java.util.Set.of(2))).containsExactly(1, 3);
        // Lowered from 3 to 2 after repeats 1 and 3 were observed: nothing is left to plan.
        assertThat(PlanningMapper.openRepeats(2, java.util.Set.of(1, 3))).isEmpty();
        // Lowered from 4 to 3 after repeat 4 was observed: two more, numbered 1 and 2.
        assertThat(PlanningMapper.openRepeats(3, java.util.Set.of(4))).containsExactly(1, 2);
    }
}
