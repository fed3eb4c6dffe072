package org.skyrota.bench;

import java.time.Duration;
import java.util.Locale;

import org.skyrota.constraints.SkyrotaConstraints;
import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.sky.SyntheticSky;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.SolveOptions;

/**
 * planner-small: 2 telescopes, 3 nights, 60 visits on a synthetic sky; the planner for 10 s against the exact
 * optimum of OR-Tools CP-SAT on the same candidates. score and optimum are priority-weighted placed minutes (the
 * medium level); gapToOptimum = (optimum - score) / optimum; seconds is the whole solve call (10 s of search plus
 * scoring and reasons); secondsToWithin1Percent is when the best plan first came within 1% of the optimum.
 * lpBound is the certified LP bound of planner-term-bound on the same candidates, never below the optimum.
 * Arguments: seed (42), search seconds (10); -Dcpsat.seconds caps the reference (120).
 */
public final class PlannerSmallBench {
    public static void main(String[] args) {
        long seed = args.length > 0 ? Long.parseLong(args[0]) : 42L;
        double seconds = args.length > 1 ? Double.parseDouble(args[1]) : 10.0;
        PlanningProblem problem = Scenarios.small(seed);
        Planner planner = new Planner(new SyntheticSky(Duration.ofHours(2)), SkyrotaConstraints.class);
        SolveOptions options = SolveOptions.of(Duration.ofMillis(Math.round(seconds * 1000))).withSeed(seed);

        PreparedProblem forExact = planner.prepare(problem, options);
        CpSatReference.Result exact = CpSatReference.maximiseWeightedTime(forExact.schedule(), Double.parseDouble(System.getProperty("cpsat.seconds", "120")));

        // The LP bound that planner-term-bound relies on, checked here against the proven optimum: it must not be lower.
        double lpBound = PlannerTermBoundBench.certifiedBound(forExact.schedule(), 60).certified();

        long start = System.nanoTime();
        double[] within1 = {Double.NaN};
        PlanResult result = planner.solve(problem, options, p -> {
            synchronized (within1) {
                if (Double.isNaN(within1[0]) && p.bestScore().hardScore() == 0
                        && p.weightedPlacedMinutes() >= 0.99 * exact.objective()) {
                    within1[0] = p.elapsed().toMillis() / 1000.0;
                }
            }
        });
        double elapsed = (System.nanoTime() - start) / 1e9;
        long score = 0;
        int placed = 0;
        for (Visit v : result.prepared().schedule().visits()) {
            if (v.isPlaced()) {
                score += v.priorityWeight() * v.nominalMinutes();
                placed++;
            }
        }
        double gap = exact.objective() == 0 ? 0 : (double) (exact.objective() - score) / exact.objective();
        System.out.println(String.format(Locale.ROOT,
                "BENCH planner-small score=%d optimum=%d gapToOptimum=%.4f seconds=%.1f hard=%d placed=%d visits=%d"
                        + " candidates=%d optimumProven=%b cpSatSeconds=%.1f optimumBound=%d secondsToWithin1Percent=%.1f"
                        + " lpBound=%.0f",
                score, exact.objective(), gap, elapsed, -result.score().hardScore(), placed,
                result.prepared().schedule().visits().size(), forExact.candidateCount(), exact.optimal(), exact.seconds(), exact.bound(), within1[0],
                lpBound));
    }
}
