package org.skyrota.planning.candidates;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.skyrota.planning.domain.PlannerWeights;
import org.skyrota.planning.explain.LeftOutExplainer;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.model.Assignment;
import org.skyrota.planning.model.Closure;
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
 * A repeat left open keeps its spacing from the repeats already observed, as repeats keep it from each other. On the
 * synthetic sky (dark 20:00 to 05:00 local) the target at RA 165° is in its window from dusk to about 20:55 local
 * on these nights.
 */
class ObservedRepeatSpacingTest {
    private static final LocalDate NIGHT = LocalDate.of(2027, 3, 1);
    private static final Site SITE = Site.of("hill", "Hill Station (invented)", 40, -105, 1600, "America/Denver", 21.5);
    private static final Telescope SCOPE = new Telescope("hill-a", "hill", 0.4, MountKind.EQUATORIAL, 5, 0, 10, 90);
    /** 23:00 local (UTC−7 before the change to daylight time) on the first night: when repeat 1 was observed. */
    private static final Instant OBSERVED = NIGHT.plusDays(1).atTime(6, 0).toInstant(ZoneOffset.UTC);
    private static final Duration INTERVAL = Duration.ofDays(2);
    private static final Duration TOLERANCE = Duration.ofHours(6);
    /** The reason for the open repeat when only the first two nights are asked for. */
    private static final String NO_ROOM_AFTER_OBSERVED = "observable on 2 nights between 2027-03-01 and 2027-03-02,"
            + " but on the open ones only too close to the Sun or within its repeat spacing from the repeats already"
            + " observed or planned on other nights";

    @Test
    void noCandidateOfTheOpenRepeatStartsCloserToTheObservedOneThanTheIntervalLessItsTolerance() {
        PreparedProblem without = prepare(request(List.of()), List.of(), List.of());
        PreparedProblem with = prepare(request(List.of(OBSERVED)), List.of(), List.of());
        Visit free = without.schedule().visits().get(0);
        Visit spaced = with.schedule().visits().get(0);

        Instant earliestAllowed = OBSERVED.plus(INTERVAL.minus(TOLERANCE));
        assertThat(starts(without, free)).anyMatch(s -> s.isBefore(earliestAllowed));
        assertThat(starts(with, spaced)).isNotEmpty().allMatch(s -> !s.isBefore(earliestAllowed));
        // Only the nights too close are lost: from the third night on, the candidates are the same.
        assertThat(starts(with, spaced)).containsExactlyElementsOf(
                starts(without, free).stream().filter(s -> !s.isBefore(earliestAllowed)).toList());
    }

    @Test
    void aPublishedPlaceTooCloseIsGivenUpButAPinStays() {
        // A start the visit could take if nothing had been observed, a night after the observed repeat.
        PreparedProblem without = prepare(request(List.of()), List.of(), List.of());
        Visit free = without.schedule().visits().get(0);
        Instant tooClose = starts(without, free).stream().filter(s -> s.isAfter(OBSERVED.plus(Duration.ofHours(12))))
                .findFirst().orElseThrow();
        assertThat(tooClose).isBefore(OBSERVED.plus(INTERVAL.minus(TOLERANCE)));
        Assignment there = new Assignment("q", "hill-a", tooClose);
        Visit unspaced = prepare(request(List.of()), List.of(), List.of(there)).schedule().visits().get(0);
        assertThat(unspaced.hasCandidate(unspaced.getPublished())).isTrue();

        Visit published = prepare(request(List.of(OBSERVED)), List.of(), List.of(there)).schedule().visits().get(0);
        assertThat(published.getPublished()).isNotNull();
        assertThat(published.hasCandidate(published.getPublished())).isFalse();

        Visit pinned = prepare(request(List.of(OBSERVED)), List.of(there), List.of()).schedule().visits().get(0);
        assertThat(pinned.isPinned()).isTrue();
        assertThat(pinned.isPlaced()).isTrue();
        // Kept, but flagged so that the plan names the broken spacing as a hard violation.
        assertThat(pinned.has(Visit.TOO_CLOSE_TO_OBSERVED)).isTrue();
        Visit pinnedFree = prepare(request(List.of()), List.of(there), List.of()).schedule().visits().get(0);
        assertThat(pinnedFree.has(Visit.TOO_CLOSE_TO_OBSERVED)).isFalse();
    }

    @Test
    void theSpacingIsKeptToTheSecondAtTheBoundary() {
        // The open repeat may start from 20:10:30 local on the fourth night (42 h after the observed one), inside
        // that night's window: the grid start at 20:10 is 30 s short and goes, the next one at 20:15 stays.
        Instant gridStartShort = NIGHT.plusDays(3).atTime(3, 10).toInstant(ZoneOffset.UTC);
        Instant earliestAllowed = gridStartShort.plusSeconds(30);
        Instant observed = earliestAllowed.minus(INTERVAL.minus(TOLERANCE));
        Instant firstOnGridAfter = gridStartShort.plus(Duration.ofMinutes(5));

        PreparedProblem without = prepare(request(List.of()), List.of(), List.of());
        assertThat(starts(without, without.schedule().visits().get(0)))
                .contains(gridStartShort.minus(Duration.ofMinutes(5)), gridStartShort, firstOnGridAfter);

        PreparedProblem with = prepare(request(List.of(observed)), List.of(), List.of());
        List<Instant> spaced = starts(with, with.schedule().visits().get(0));
        assertThat(spaced).doesNotContain(gridStartShort).allMatch(s -> !s.isBefore(earliestAllowed));
        assertThat(spaced.get(0)).isEqualTo(firstOnGridAfter);
    }

    @Test
    void aRepeatWithNoPlaceLeftAfterTheObservedOneIsExplainedSo() {
        // Only the first two nights: every start lies within 42 h of the repeat observed on the first night.
        Request shortRange = request(List.of(OBSERVED), NIGHT.plusDays(1));
        PreparedProblem prepared = prepare(shortRange, List.of(), List.of());
        Visit visit = prepared.schedule().visits().get(0);
        assertThat(visit.candidateCount()).isZero();
        assertThat(new LeftOutExplainer().explain(prepared).get(visit.id()))
                .isEqualTo(NO_ROOM_AFTER_OBSERVED);
    }

    @Test
    void oneTelescopeClosedAndTheOtherTooCloseIsNotCalledOnlyClosedNights() {
        // Two telescopes at the site; the second is closed on both nights, the first has only starts too close.
        Request shortRange = request(List.of(OBSERVED), NIGHT.plusDays(1));
        Telescope second = new Telescope("hill-b", "hill", 0.4, MountKind.EQUATORIAL, 5, 0, 10, 90);
        PlanningProblem problem = new PlanningProblem(List.of(SITE), List.of(SCOPE, second),
                List.of(new Instrument("cam", "hill-a", Set.of("V"), 0, 0, false),
                        new Instrument("cam-b", "hill-b", Set.of("V"), 0, 0, false)),
                List.of(new Program("lab", "Lab (invented)", 100, 1)), List.of(shortRange),
                List.of(Closure.telescope("hill", "hill-b", NIGHT, "maintenance"),
                        Closure.telescope("hill", "hill-b", NIGHT.plusDays(1), "maintenance")),
                List.of(), List.of(), NIGHT, NIGHT.plusDays(4), 5, 5);
        PreparedProblem prepared = new CandidateGenerator(new SyntheticSky(Duration.ofHours(3))).prepare(problem,
                PlannerWeights.defaults().withOverrides(Map.of()));
        Visit visit = prepared.schedule().visits().get(0);
        assertThat(visit.candidateCount()).isZero();
        assertThat(new LeftOutExplainer().explain(prepared).get(visit.id()))
                .isEqualTo(NO_ROOM_AFTER_OBSERVED);
    }

    @Test
    void anEmptyObservedTimeIsRefusedByName() {
        assertThatThrownBy(() -> request(Arrays.asList(OBSERVED, null)))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("observedStarts of request q");
    }

    private static Request request(List<Instant> observed) {
        return request(observed, NIGHT.plusDays(4));
    }

    private static Request request(List<Instant> observed, LocalDate lastNight) {
        return new Request("q", "lab", "member", Target.fixed("invented field q", 165, 20),
                List.of(new ExposureStep("V", 60, 30)), ObservingLimits.dark(30), NIGHT, lastNight, 1, INTERVAL,
                TOLERANCE, 3, observed);
    }

    private static List<Instant> starts(PreparedProblem prepared, Visit v) {
        return v.getCandidates().stream().map(p -> prepared.schedule().instantOf(p.startMinute())).sorted().toList();
    }

    private static PreparedProblem prepare(Request request, List<Assignment> pins, List<Assignment> published) {
        PlanningProblem problem = new PlanningProblem(List.of(SITE), List.of(SCOPE),
                List.of(new Instrument("cam", "hill-a", Set.of("V"), 0, 0, false)),
                List.of(new Program("lab", "Lab (invented)", 100, 1)), List.of(request), List.of(), pins, published,
                NIGHT, NIGHT.plusDays(4), 5, 5);
        return new CandidateGenerator(new SyntheticSky(Duration.ofHours(3))).prepare(problem,
                PlannerWeights.defaults().withOverrides(Map.of()));
    }
}
