package org.skyrota.web.plan;

import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.SolveOptions;
import org.springframework.stereotype.Component;

/**
 * Scores a plan as it stands with the constraints module's rules (the facade's {@link Planner#evaluate}, which is
 * OptaPlanner's {@code SolutionManager.explain}): every placed visit is held where it is, so nothing moves.
 */
@Component
class PlanScorer {

    private final Planner planner;
    private final PlanInputs inputs;

    PlanScorer(Planner planner, PlanInputs inputs) {
        this.planner = planner;
        this.inputs = inputs;
    }

    /** The score, the score per rule, and the planner's view of every visit (for the lengths of moved visits). */
    record Scored(HardMediumSoftLongScore score, Map<String, HardMediumSoftLongScore> byRule, List<PlanVisit> visits) {

        /** Hard rules broken worse in {@code this} than in {@code before}. */
        List<String> hardBrokenSince(Scored before) {
            List<String> out = new ArrayList<>();
            byRule.forEach((rule, s) -> {
                long was = before.byRule.getOrDefault(rule, HardMediumSoftLongScore.ZERO).hardScore();
                if (s.hardScore() < 0 && s.hardScore() < was) {
                    out.add(rule);
                }
            });
            return out;
        }
    }

    Scored score(LocalDate first, LocalDate last, List<PlanVisit> visits, List<PlanNight> nights) {
        List<PlanVisit> held = visits.stream().filter(PlanVisit::isPlaced).toList();
        PlanningMapper.Mapped mapped = inputs.problem(first, last, null, held, nights);
        PlanResult result = planner.evaluate(planner.prepare(mapped.problem(), SolveOptions.of(Duration.ofSeconds(1))));
        return new Scored(result.score(), result.scoreByRule(), mapped.visits(result));
    }
}
