package org.skyrota.planning.solver;

import java.util.List;
import java.util.Map;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.model.Assignment;

/**
 * The outcome of a run.
 *
 * @param planned         placed visits, by start
 * @param leftOut         unplaced visits, each with its reason
 * @param score           the total score
 * @param scoreByRule     the score of every rule that matched, by rule name
 * @param hardViolations  one line per broken hard rule match, naming the visits (empty for an executable plan)
 * @param prepared        the prepared problem with the solved schedule, for re-planning
 * @param violations      the same matches as {@code hardViolations}, as data
 */
public record PlanResult(List<PlannedVisit> planned, List<LeftOutVisit> leftOut, HardMediumSoftLongScore score,
                         Map<String, HardMediumSoftLongScore> scoreByRule, List<String> hardViolations,
                         PreparedProblem prepared, List<Violation> violations) {

    public PlanResult(List<PlannedVisit> planned, List<LeftOutVisit> leftOut, HardMediumSoftLongScore score,
                      Map<String, HardMediumSoftLongScore> scoreByRule, List<String> hardViolations,
                      PreparedProblem prepared) {
        this(planned, leftOut, score, scoreByRule, hardViolations, prepared, List.of());
    }

    /** The priority-weighted time of the plan and the most any plan of its problem could reach (see PlanBound). */
    public long weightedPlaced() {
        return PlanBound.weighted(prepared);
    }

    /** The plan as assignments, ready to be published or passed to a re-plan. */
    public List<Assignment> assignments() {
        return planned.stream().map(p -> new Assignment(p.visitId(), p.telescopeId(), p.start())).toList();
    }
}
