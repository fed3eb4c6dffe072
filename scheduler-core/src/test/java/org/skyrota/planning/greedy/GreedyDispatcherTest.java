package org.skyrota.planning.greedy;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.skyrota.planning.candidates.CandidateGenerator;
import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.PlannerWeights;
import org.skyrota.planning.domain.Visit;
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

/** The greedy dispatch baseline on the synthetic sky (dark 20:00 to 05:00 local, targets up ±3 h). */
class GreedyDispatcherTest {
    private static final LocalDate NIGHT = LocalDate.of(2027, 3, 8);
    private static final Site SITE = Site.of("hill", "Hill Station (invented)", 40, -105, 1600, "America/Denver", 21.5);
    private static final Telescope SCOPE = new Telescope("hill-a", "hill", 0.4, MountKind.EQUATORIAL, 5, 0, 10, 90);

    @Test
    void atTheFirstFreeMomentTheHighestPriorityVisitThatFitsStartsAndNothingOverlaps() {
        List<Request> requests = new ArrayList<>();
        for (int i = 0; i < 12; i++) {
            requests.add(request("q" + i, 1 + i % 5, 40, 270));
        }
        PreparedProblem prepared = prepare(requests, 100);

        GreedyDispatcher.byHand().dispatch(prepared);

        List<Visit> placed = prepared.schedule().visits().stream().filter(Visit::isPlaced)
                .sorted((a, b) -> Integer.compare(a.startMinute(), b.startMinute())).toList();
        assertThat(placed).isNotEmpty();
        int earliestCandidate = prepared.schedule().visits().stream()
                .flatMap(v -> v.getCandidates().stream()).mapToInt(p -> p.startMinute()).min().orElseThrow();
        assertThat(placed.get(0).startMinute()).isEqualTo(earliestCandidate);
        assertThat(placed.get(0).priority()).isEqualTo(5);
        for (int i = 1; i < placed.size(); i++) {
            assertThat(placed.get(i).startMinute()).isGreaterThanOrEqualTo(placed.get(i - 1).endMinute());
        }
        // Oversubscribed: 12 visits of 45 min in a 6 h window; the ones left out are the lowest priorities.
        int lowestPlaced = placed.stream().mapToInt(Visit::priority).min().orElseThrow();
        assertThat(prepared.schedule().visits().stream().filter(v -> !v.isPlaced()))
                .isNotEmpty().allSatisfy(v -> assertThat(v.priority()).isLessThanOrEqualTo(lowestPlaced));
    }

    @Test
    void aProgramIsNotDispatchedPastItsGrant() {
        List<Request> requests = List.of(request("a", 5, 40, 260), request("b", 5, 40, 270), request("c", 5, 40, 280));
        PreparedProblem prepared = prepare(requests, 1.5);

        GreedyDispatcher.byHand().dispatch(prepared);

        long used = prepared.schedule().visits().stream().mapToLong(Visit::placedMinutes).sum();
        assertThat(used).isLessThanOrEqualTo(90);
        assertThat(prepared.schedule().visits().stream().filter(Visit::isPlaced)).hasSize(2);
    }

    @Test
    void byHandEqualPrioritiesGoInQueueOrderWhileTheUrgencyAwareVariantTakesTheRangeThatClosesFirst() {
        Request roomy = new Request("roomy", "lab", "member", Target.fixed("invented field roomy", 270, 20),
                List.of(new ExposureStep("V", 60, 40)), ObservingLimits.dark(30), NIGHT, NIGHT.plusDays(5), 1, null,
                null, 3);
        Request closing = new Request("closing", "lab", "member", Target.fixed("invented field closing", 270, 20),
                List.of(new ExposureStep("V", 60, 40)), ObservingLimits.dark(30), NIGHT, NIGHT, 1, null, null, 3);

        PreparedProblem byHand = prepare(List.of(roomy, closing), 100);
        GreedyDispatcher.byHand().dispatch(byHand);
        PreparedProblem urgent = prepare(List.of(roomy, closing), 100);
        GreedyDispatcher.urgencyAware().dispatch(urgent);

        assertThat(firstStarted(byHand).requestId()).isEqualTo("roomy");
        assertThat(firstStarted(urgent).requestId()).isEqualTo("closing");
    }

    @Test
    void theGrantAwareWalkKeepsAFullProgramsGrantForItsHighPriorities() {
        // Worked by hand: the grant (90 min) holds two of these 45-minute visits. The two priority-1 visits are up
        // hours before the three priority-5 ones, so a walk through time spends the whole grant on them. Priority 5
        // alone asks for 135 min, more than the grant, so the grant-aware walk holds priority 1 back until the
        // priority-5 visits had their turn; the grant is then full, and the priority-1 visits stay out.
        List<Request> requests = List.of(request("early1", 1, 40, 200), request("early2", 1, 40, 205),
                request("late1", 5, 40, 290), request("late2", 5, 40, 295), request("late3", 5, 40, 300));

        PreparedProblem walk = prepare(requests, 1.5);
        GreedyDispatcher.urgencyAware().dispatch(walk);
        PreparedProblem grantAware = prepare(requests, 1.5);
        GreedyDispatcher.grantAware().dispatch(grantAware);

        assertThat(placedIds(walk)).containsExactlyInAnyOrder("early1", "early2");
        assertThat(placedIds(grantAware)).hasSize(2).allSatisfy(id -> assertThat(id).startsWith("late"));
        assertThat(grantAware.schedule().visits().stream().mapToLong(Visit::placedMinutes).sum()).isLessThanOrEqualTo(90);
    }

    @Test
    void theGrantAwareWalkFillsWhatTheFirstWalkLeftWithTheVisitsItHeldBack() {
        // Worked by hand: three priority-5 visits of about two hours on one target ask for more than the 5.5 h grant,
        // so priority 1 is held back; only two of them fit in the target's six hours up, which leaves the grant room
        // for one 45-minute priority-1 visit, and the second walk places exactly one.
        List<Request> requests = List.of(request("early1", 1, 40, 200), request("early2", 1, 40, 205),
                request("long1", 5, 120, 300), request("long2", 5, 120, 300), request("long3", 5, 120, 300));

        PreparedProblem prepared = prepare(requests, 5.5);
        GreedyDispatcher.grantAware().dispatch(prepared);

        List<String> placed = placedIds(prepared);
        assertThat(placed).filteredOn(id -> id.startsWith("long")).hasSize(2);
        assertThat(placed).filteredOn(id -> id.startsWith("early")).hasSize(1);
        assertThat(prepared.schedule().visits().stream().mapToLong(Visit::placedMinutes).sum()).isLessThanOrEqualTo(330);
    }

    private static List<String> placedIds(PreparedProblem prepared) {
        return prepared.schedule().visits().stream().filter(Visit::isPlaced).map(Visit::requestId).toList();
    }

    private static Visit firstStarted(PreparedProblem prepared) {
        return prepared.schedule().visits().stream().filter(Visit::isPlaced)
                .min((a, b) -> Integer.compare(a.startMinute(), b.startMinute())).orElseThrow();
    }

    private static Request request(String id, int priority, int minutes, double raDeg) {
        return new Request(id, "lab", "member", Target.fixed("invented field " + id, raDeg, 20),
                List.of(new ExposureStep("V", 60, minutes)), ObservingLimits.dark(30), NIGHT, NIGHT, 1, null, null,
                priority);
    }

    private static PreparedProblem prepare(List<Request> requests, double grantHours) {
        PlanningProblem problem = new PlanningProblem(List.of(SITE), List.of(SCOPE),
                List.of(new Instrument("cam", "hill-a", Set.of("V"), 0, 0, false)),
                List.of(new Program("lab", "Lab (invented)", grantHours, 1)), requests, List.of(), List.of(), List.of(),
                NIGHT, NIGHT, 5, 5);
        return new CandidateGenerator(new SyntheticSky(Duration.ofHours(3))).prepare(problem,
                PlannerWeights.defaults().withOverrides(Map.of()));
    }
}
