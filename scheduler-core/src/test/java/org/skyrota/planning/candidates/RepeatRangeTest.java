package org.skyrota.planning.candidates;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.skyrota.planning.domain.PlannerWeights;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.explain.LeftOutExplainer;
import org.skyrota.planning.model.ExposureStep;
import org.skyrota.planning.model.Instrument;
import org.skyrota.planning.model.MountKind;
import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.model.Program;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Target;
import org.skyrota.planning.model.Telescope;
import org.skyrota.planning.sky.SyntheticSky;

/**
 * When a request's range, or the part of it inside the planning horizon, has room for fewer repeats than it asks,
 * the repeats that do fit still get places. On the synthetic sky this target is in its window early every night.
 */
class RepeatRangeTest {
    private static final LocalDate NIGHT = LocalDate.of(2027, 3, 1);
    private static final Site SITE = Site.of("hill", "Hill Station (invented)", 40, -105, 1600, "America/Denver", 21.5);
    private static final Telescope SCOPE = new Telescope("hill-a", "hill", 0.4, MountKind.EQUATORIAL, 5, 0, 10, 90);
    /** Three repeats 72 h apart less 4 h of tolerance: at least 68 h, so at least two nights, start to start. */
    private static final Request THREE_REPEATS = new Request("q", "lab", "member",
            Target.fixed("invented field q", 200, 20), List.of(new ExposureStep("V", 60, 30)), ObservingLimits.dark(30),
            NIGHT, NIGHT.plusDays(9), 3, Duration.ofHours(72), Duration.ofHours(4), 3);

    @Test
    void aHorizonWithRoomForTwoOfThreeRepeatsGivesTheFirstTwoPlacesAndExplainsTheThird() {
        // The horizon holds the last four nights of the range: room for two repeats, not three.
        PreparedProblem prepared = prepare(NIGHT.plusDays(6), NIGHT.plusDays(9));
        List<Visit> visits = prepared.schedule().visits();
        assertThat(visits).hasSize(3);
        assertThat(nights(prepared, visits.get(0))).containsExactly(6L, 7L, 8L, 9L);
        assertThat(nights(prepared, visits.get(1))).containsExactly(8L, 9L);
        assertThat(visits.get(2).getCandidates()).isEmpty();
        assertThat(new LeftOutExplainer().explain(prepared).get(visits.get(2).id())).isEqualTo(
                "the nights of its range inside the planning horizon leave no room for this many repeats 68.0 h apart");
    }

    @Test
    void aRangeOutsideTheHorizonIsExplainedSo() {
        PreparedProblem prepared = prepare(NIGHT.plusDays(20), NIGHT.plusDays(25));
        Visit first = prepared.schedule().visits().get(0);
        assertThat(first.getCandidates()).isEmpty();
        assertThat(new LeftOutExplainer().explain(prepared).get(first.id()))
                .isEqualTo("its nights (2027-03-01 and 2027-03-10) fall outside the planning horizon");
    }

    @Test
    void withRoomForAllRepeatsAnyOneOfThemMayStillTakeTheLastNight() {
        // Only one repeat may find a free night in the end; whichever it is, it may be the range's last night.
        PreparedProblem prepared = prepare(NIGHT, NIGHT.plusDays(9));
        for (Visit v : prepared.schedule().visits()) {
            assertThat(nights(prepared, v)).as(v.id()).contains(9L).startsWith(2L * v.repeatIndex());
        }
    }

    /** The nights of a visit's candidates, counted from the first night of the range. */
    private static List<Long> nights(PreparedProblem prepared, Visit v) {
        ZoneId zone = ZoneId.of("America/Denver");
        return v.getCandidates().stream()
                .map(p -> prepared.schedule().instantOf(p.startMinute()).atZone(zone).minusHours(12).toLocalDate())
                .map(d -> d.toEpochDay() - NIGHT.toEpochDay()).distinct().sorted().toList();
    }

    private static PreparedProblem prepare(LocalDate first, LocalDate last) {
        PlanningProblem problem = new PlanningProblem(List.of(SITE), List.of(SCOPE),
                List.of(new Instrument("cam", "hill-a", Set.of("V"), 0, 0, false)),
                List.of(new Program("lab", "Lab (invented)", 100, 1)), List.of(THREE_REPEATS), List.of(), List.of(),
                List.of(), first, last, 5, 5);
        return new CandidateGenerator(new SyntheticSky(Duration.ofHours(3))).prepare(problem,
                PlannerWeights.defaults().withOverrides(Map.of()));
    }
}
