package org.skyrota.constraints;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import com.google.ortools.Loader;
import com.google.ortools.sat.BoolVar;
import com.google.ortools.sat.CpModel;
import com.google.ortools.sat.CpSolver;
import com.google.ortools.sat.CpSolverStatus;
import com.google.ortools.sat.LinearArgument;
import com.google.ortools.sat.LinearExpr;
import com.google.ortools.sat.Literal;
import org.junit.jupiter.api.Test;
import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.SolveOptions;

/**
 * The planner against the exact optimum on a tiny seeded instance. Reference: Google OR-Tools CP-SAT (9.12, test
 * scope), solving a time-indexed model of the same candidates to proven optimality: one boolean per visit and
 * candidate, at most one per visit, at most one running visit per telescope and 5-minute slot, maximise priority
 * weight times nominal minutes (the planner's medium level).
 */
class CpSatOptimumTest {

    @Test
    void thePlannerReachesTheCpSatOptimumWithinOnePercentOnATinySeededInstance() {
        PlanningProblem problem = TestProblems.random(11, 2, 1, 30);
        Planner planner = new Planner(TestProblems.SKY, SkyrotaConstraints.class);
        // An evaluation limit, not only a time limit, so the run is the same on a busy machine (about 2 s on an idle one).
        SolveOptions options = SolveOptions.of(Duration.ofSeconds(20)).withSeed(11)
                .withEvaluationLimit(60_000);

        PreparedProblem forReference = planner.prepare(problem, options);
        long optimum = cpSatOptimum(forReference.schedule());
        PlanResult result = planner.solve(problem, options);
        long planned = totalWeight(result);

        assertThat(result.score().hardScore()).isZero();
        assertThat(optimum).isPositive();
        // Oversubscribed on purpose, else every visit fits and the test proves nothing.
        assertThat(result.leftOut()).isNotEmpty();
        assertThat(planned).isLessThanOrEqualTo(optimum);
        assertThat((double) planned).isGreaterThanOrEqualTo(0.99 * optimum);
    }

    private static long totalWeight(PlanResult result) {
        long sum = 0;
        for (Visit v : result.prepared().schedule().visits()) {
            if (v.isPlaced()) {
                sum += v.priorityWeight() * v.nominalMinutes();
            }
        }
        return sum;
    }

    private static long cpSatOptimum(Schedule schedule) {
        Loader.loadNativeLibraries();
        CpModel model = new CpModel();
        Map<Long, List<Literal>> running = new HashMap<>();
        List<LinearArgument> vars = new ArrayList<>();
        List<Long> weights = new ArrayList<>();
        for (Visit v : schedule.visits()) {
            List<Literal> mine = new ArrayList<>();
            for (Placement p : v.getCandidates()) {
                BoolVar x = model.newBoolVar(v.id() + "@" + p.id());
                mine.add(x);
                for (int m = p.startMinute(); m < p.startMinute() + v.lengthOn(p.telescopeIndex()); m += 5) {
                    running.computeIfAbsent(((long) p.telescopeIndex() << 32) | m, k -> new ArrayList<>()).add(x);
                }
                vars.add(x);
                weights.add(v.priorityWeight() * v.nominalMinutes());
            }
            model.addAtMostOne(mine);
        }
        running.values().forEach(model::addAtMostOne);
        model.maximize(LinearExpr.weightedSum(vars.toArray(new LinearArgument[0]),
                weights.stream().mapToLong(Long::longValue).toArray()));
        CpSolver solver = new CpSolver();
        solver.getParameters().setMaxTimeInSeconds(60).setNumWorkers(2);
        CpSolverStatus status = solver.solve(model);
        assertThat(status).as("CP-SAT must prove the optimum").isEqualTo(CpSolverStatus.OPTIMAL);
        return Math.round(solver.objectiveValue());
    }
}
