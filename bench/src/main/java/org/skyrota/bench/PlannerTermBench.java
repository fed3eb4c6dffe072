package org.skyrota.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.skyrota.constraints.SkyrotaConstraints;
import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.greedy.GreedyDispatcher;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.sky.EngineSkyModel;
import org.skyrota.planning.solver.PlanBound;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.Progress;
import org.skyrota.planning.solver.SolveOptions;

/**
 * planner-term: the invented term on the real sky engine. The greedy baseline and the planner (60 s) plan the same
 * candidates. placedHours are telescope hours of the placed visits; ratioToGreedy compares priority-weighted placed
 * time (priority weight times nominal minutes); secondsTo99 is when the best plan first reached 99% of the final
 * plan's weighted time with no hard violation; peakMemoryMb is the peak heap use over the run; boundRatioToGreedy and
 * grantBoundRatioToGreedy are two upper bounds on ratioToGreedy (telescope time, grants).
 */
public final class PlannerTermBench {
    public static void main(String[] args) {
        long seed = args.length > 0 ? Long.parseLong(args[0]) : 7L;
        double seconds = args.length > 1 ? Double.parseDouble(args[1]) : 60.0;
        Outcome o = run(seed, seconds);
        System.out.println(String.format(Locale.ROOT,
                "BENCH planner-term hard=%d placedHours=%.1f greedyPlacedHours=%.1f ratioToGreedy=%.3f secondsTo99=%.1f"
                        + " peakMemoryMb=%d visits=%d placed=%d greedyPlaced=%d candidates=%d placements=%d"
                        + " prepareSeconds=%.1f solveSeconds=%.1f greedyHard=%d boundRatioToGreedy=%.3f"
                        + " urgencyGreedyPlacedHours=%.1f ratioToUrgencyGreedy=%.3f grantBoundRatioToGreedy=%.3f",
                o.hard, o.placedHours, o.greedyHours, o.ratio, o.secondsTo99, peakHeapMb(), o.visits, o.placed,
                o.greedyPlaced, o.prepared.candidateCount(), o.prepared.placementCount(), o.prepareSeconds,
                o.solveSeconds, o.greedyHard, o.boundRatio, o.urgencyGreedyHours, o.ratioToUrgencyGreedy, o.grantBoundRatio));
    }

    record Outcome(PlanningProblem problem, PreparedProblem prepared, PlanResult result, Planner planner, int hard,
                   double placedHours, double greedyHours, double ratio, double secondsTo99, int visits, int placed,
                   int greedyPlaced, double prepareSeconds, double solveSeconds, int greedyHard, double boundRatio,
                   double urgencyGreedyHours, double ratioToUrgencyGreedy, double grantBoundRatio) {
    }

    static Outcome run(long seed, double seconds) {
        PlanningProblem problem = TermScenario.build(seed);
        Planner planner = new Planner(new EngineSkyModel(), SkyrotaConstraints.class);
        SolveOptions options = SolveOptions.of(Duration.ofMillis(Math.round(seconds * 1000))).withSeed(seed);
        long t0 = System.nanoTime();
        PreparedProblem prepared = planner.prepare(problem, options);
        double prepareSeconds = (System.nanoTime() - t0) / 1e9;

        // The urgency-aware variant is measured too, and reported beside the baseline, so the gain over a
        // stronger greedy is on record as well.
        GreedyDispatcher.urgencyAware().dispatch(prepared);
        long urgencyWeighted = weighted(prepared);
        double urgencyHours = placedMinutes(prepared) / 60.0;
        for (Visit v : prepared.schedule().visits()) {
            if (!v.isPinned()) {
                v.setPlacement(null);
            }
        }
        GreedyDispatcher.byHand().dispatch(prepared);
        PlanResult greedy = planner.evaluate(prepared);
        double greedyHours = placedMinutes(prepared) / 60.0;
        if (System.getenv("BENCH_VERBOSE") != null) {
            System.err.println("greedy " + greedy.score() + " weighted=" + weighted(prepared));
        }
        long greedyWeighted = weighted(prepared);
        double boundRatio = (double) weightedUpperBound(prepared) / greedyWeighted;
        double grantBoundRatio = (double) grantUpperBound(prepared) / greedyWeighted;
        int greedyPlaced = greedy.planned().size();
        int greedyHard = greedy.hardViolations().size();
        for (Visit v : prepared.schedule().visits()) {
            if (!v.isPinned()) {
                v.setPlacement(null);
            }
        }

        List<Progress> progress = new ArrayList<>();
        long t1 = System.nanoTime();
        PlanResult result = planner.solvePrepared(prepared, options, p -> {
            synchronized (progress) {
                progress.add(p);
            }
            if (System.getenv("BENCH_VERBOSE") != null) {
                System.err.println("progress " + p.elapsed().toMillis() + " ms " + p.bestScore() + " placed="
                        + p.placedVisits() + " weighted=" + p.weightedPlacedMinutes());
            }
        });
        double solveSeconds = (System.nanoTime() - t1) / 1e9;
        PreparedProblem solved = result.prepared();
        long finalWeighted = weighted(solved);
        double secondsTo99 = Double.NaN;
        synchronized (progress) {
            for (Progress p : progress) {
                if (p.bestScore().hardScore() == 0 && p.weightedPlacedMinutes() >= 0.99 * finalWeighted) {
                    secondsTo99 = p.elapsed().toMillis() / 1000.0;
                    break;
                }
            }
        }
        return new Outcome(problem, solved, result, planner, result.hardViolations().size(),
                placedMinutes(solved) / 60.0, greedyHours, (double) finalWeighted / greedyWeighted, secondsTo99,
                solved.schedule().visits().size(), result.planned().size(), greedyPlaced, prepareSeconds, solveSeconds,
                greedyHard, boundRatio, urgencyHours, (double) finalWeighted / urgencyWeighted, grantBoundRatio);
    }

    /** An upper bound from telescope time: see {@link PlanBound#telescopeTime}. */
    static long weightedUpperBound(PreparedProblem p) {
        return PlanBound.telescopeTime(p);
    }

    /** An upper bound from the grants: see {@link PlanBound#grants}. */
    static long grantUpperBound(PreparedProblem p) {
        return PlanBound.grants(p);
    }

    static long weighted(PreparedProblem p) {
        return PlanBound.weighted(p);
    }

    static long placedMinutes(PreparedProblem p) {
        long sum = 0;
        for (Visit v : p.schedule().visits()) {
            sum += v.placedMinutes();
        }
        return sum;
    }

    static long peakHeapMb() {
        long peak = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP) {
                peak += pool.getPeakUsage().getUsed();
            }
        }
        return peak / (1024 * 1024);
    }
}
