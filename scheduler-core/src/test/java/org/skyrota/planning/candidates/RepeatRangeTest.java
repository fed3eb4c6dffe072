package org.skyrota.planning.candidates;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.PlannerWeights;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.explain.LeftOutExplainer;
import org.skyrota.planning.model.Assignment;
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
import org.skyrota.sky.site.Night;

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
        // The second repeat starts 68 h or more after the first can: after 08:00 on the morning after night 8,
        // so on night 9.
        assertThat(nights(prepared, visits.get(0))).containsExactly(6L, 7L, 8L, 9L);
        assertThat(nights(prepared, visits.get(1))).containsExactly(9L);
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
        // In time order the k-th repeat starts at least 68 k hours after the first could (noon of night 0): the
        // second from 08:00 after night 2, so on night 3; the third from 04:00 after night 5, so on night 6.
        PreparedProblem prepared = prepare(NIGHT, NIGHT.plusDays(9));
        long[] firstNight = {0, 3, 6};
        for (Visit v : prepared.schedule().visits()) {
            assertThat(nights(prepared, v)).as(v.id()).contains(9L).startsWith(firstNight[v.repeatIndex()]);
        }
    }

    @Test
    void aLaterRepeatMayTakeTheSameNightAtASiteFarWest() {
        // One night, two repeats at least 24 h apart: dusk at a site at UTC+9 and 8 h of night at one at UTC-10,
        // 19 h later by the clock, make room for both. Sky: the target is up all night at both.
        Site east = Site.of("east", "East Ridge (invented)", 35, 139, 800, "Asia/Tokyo", 21.0);
        Site west = Site.of("west", "West Crater (invented)", 20, -156, 3000, "Pacific/Honolulu", 21.8);
        List<Telescope> scopes = List.of(new Telescope("east-a", "east", 0.4, MountKind.EQUATORIAL, 5, 0, 10, 90),
                new Telescope("west-a", "west", 0.4, MountKind.EQUATORIAL, 5, 0, 10, 90));
        Request twice = new Request("d", "lab", "member", Target.fixed("invented field d", 200, 20),
                List.of(new ExposureStep("V", 60, 30)), ObservingLimits.dark(30), NIGHT, NIGHT, 2,
                Duration.ofHours(24), Duration.ZERO, 3);
        PlanningProblem problem = new PlanningProblem(List.of(east, west), scopes,
                List.of(new Instrument("cam-e", "east-a", Set.of("V"), 0, 0, false),
                        new Instrument("cam-w", "west-a", Set.of("V"), 0, 0, false)),
                List.of(new Program("lab", "Lab (invented)", 100, 1)), List.of(twice), List.of(), List.of(),
                List.of(), NIGHT, NIGHT, 5, 5);
        PreparedProblem prepared = new CandidateGenerator(new SyntheticSky(Duration.ofHours(12))).prepare(problem,
                PlannerWeights.defaults().withOverrides(Map.of()));
        Visit first = prepared.schedule().visits().get(0);
        Visit second = prepared.schedule().visits().get(1);
        int earliest = first.getCandidates().stream().mapToInt(p -> p.startMinute()).min().orElseThrow();
        assertThat(second.getCandidates()).allMatch(p -> p.telescopeIndex() == 1)
                .anyMatch(p -> p.startMinute() >= earliest + 24 * 60);
    }

    @Test
    void aPinnedRepeatLeavesTheOthersTheirEarlierNights() {
        // Repeat 1 is pinned on the last night: repeats 2 and 3 are the first and second of the free ones, so they
        // may start on nights 0 and 2 (48 h apart), not only from night 4 as the third repeat of three.
        Request thrice = new Request("p", "lab", "member", Target.fixed("invented field p", 200, 20),
                List.of(new ExposureStep("V", 60, 30)), ObservingLimits.dark(30), NIGHT, NIGHT.plusDays(4), 3,
                Duration.ofHours(48), Duration.ZERO, 3);
        PreparedProblem free = prepare(thrice, NIGHT, NIGHT.plusDays(4), List.of());
        Placement lastNight = free.schedule().visits().get(0).getCandidates().stream()
                .max(java.util.Comparator.comparingInt(Placement::startMinute)).orElseThrow();
        Assignment pin = new Assignment("p#1", "hill-a", free.schedule().instantOf(lastNight.startMinute()));
        PreparedProblem pinned = prepare(thrice, NIGHT, NIGHT.plusDays(4), List.of(pin));
        List<Visit> visits = pinned.schedule().visits();
        assertThat(visits.get(0).isPinned()).isTrue();
        assertThat(nights(pinned, visits.get(1))).startsWith(0L);
        assertThat(nights(pinned, visits.get(2))).startsWith(2L);
    }

    @Test
    void repeatsKeepAFractionalMinuteSpacingRoundedUp() {
        // 60.5 minutes between repeats: on whole-minute starts that is 61 minutes.
        Request close = new Request("c", "lab", "member", Target.fixed("invented field c", 200, 20),
                List.of(new ExposureStep("V", 60, 5)), ObservingLimits.dark(30), NIGHT, NIGHT, 2,
                Duration.ofSeconds(3630), Duration.ZERO, 3);
        Visit first = prepare(close, NIGHT, NIGHT, List.of()).schedule().visits().get(0);
        assertThat(first.repeatMinGapMinutes()).isEqualTo(61);
    }

    /** The nights of a visit's candidates, counted from the first night of the range. */
    private static List<Long> nights(PreparedProblem prepared, Visit v) {
        return v.getCandidates().stream()
                .map(p -> Night.containing(SITE.nightZone(), prepared.schedule().instantOf(p.startMinute())).date())
                .map(d -> d.toEpochDay() - NIGHT.toEpochDay()).distinct().sorted().toList();
    }

    private static PreparedProblem prepare(LocalDate first, LocalDate last) {
        return prepare(THREE_REPEATS, first, last, List.of());
    }

    private static PreparedProblem prepare(Request request, LocalDate first, LocalDate last, List<Assignment> pins) {
        PlanningProblem problem = new PlanningProblem(List.of(SITE), List.of(SCOPE),
                List.of(new Instrument("cam", "hill-a", Set.of("V"), 0, 0, false)),
                List.of(new Program("lab", "Lab (invented)", 100, 1)), List.of(request), List.of(), pins,
                List.of(), first, last, 5, 5);
        return new CandidateGenerator(new SyntheticSky(Duration.ofHours(3))).prepare(problem,
                PlannerWeights.defaults().withOverrides(Map.of()));
    }
}
