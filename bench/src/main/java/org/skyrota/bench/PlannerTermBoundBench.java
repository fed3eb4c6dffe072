package org.skyrota.bench;

import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import com.google.ortools.Loader;
import com.google.ortools.linearsolver.MPConstraint;
import com.google.ortools.linearsolver.MPObjective;
import com.google.ortools.linearsolver.MPSolver;
import com.google.ortools.linearsolver.MPVariable;
import org.skyrota.constraints.SkyrotaConstraints;
import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.greedy.GreedyDispatcher;
import org.skyrota.planning.sky.EngineSkyModel;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.SolveOptions;

/**
 * planner-term-bound: how much better than the greedy baseline any plan of the invented term could possibly be. The
 * CP-SAT model of {@link CpSatReference} is far too big to solve here (about 700,000 candidates), so this solves its
 * linear relaxation instead (each visit at most once, at most one running visit per telescope and grid minute, each
 * grant within its minutes; the repeat spacing is left out, which only loosens it) with OR-Tools' first-order LP
 * solver PDLP, and turns the solver's dual values into a certified upper bound by weak duality: for any
 * non-negative multipliers y of the rows, the sum of y times each row's limit plus, per candidate, the part of its
 * value that the multiplied rows do not pay for, is at least the value of every plan. The bound therefore holds
 * however roughly the LP solver converged; a rough solve only makes it looser.
 */
public final class PlannerTermBoundBench {
    public static void main(String[] args) {
        long seed = args.length > 0 ? Long.parseLong(args[0]) : 7L;
        double seconds = args.length > 1 ? Double.parseDouble(args[1]) : 600.0;
        Planner planner = new Planner(new EngineSkyModel(), SkyrotaConstraints.class);
        PreparedProblem prepared = planner.prepare(TermScenario.build(seed),
                SolveOptions.of(Duration.ofSeconds(1)).withSeed(seed));
        GreedyDispatcher.byHand().dispatch(prepared);
        long greedy = PlannerTermBench.weighted(prepared);
        long start = System.nanoTime();
        Bound bound = certifiedBound(prepared.schedule(), seconds);
        double lpSeconds = (System.nanoTime() - start) / 1e9;
        System.out.println(String.format(Locale.ROOT,
                "BENCH planner-term-bound lpBoundRatioToGreedy=%.3f lpValueRatioToGreedy=%.3f"
                        + " grantBoundRatioToGreedy=%.3f boundRatioToGreedy=%.3f status=%s lpSeconds=%.1f candidates=%d",
                bound.certified() / greedy, bound.lpValue() / greedy,
                (double) PlannerTermBench.grantUpperBound(prepared) / greedy,
                (double) PlannerTermBench.weightedUpperBound(prepared) / greedy, bound.status(), lpSeconds,
                bound.columns()));
    }

    record Bound(double certified, double lpValue, String status, int columns) {
    }

    /** One LP column: a visit at one candidate placement, and the rows it appears in. */
    private record Column(double value, int visitRow, int[] slotRows, int grantRow, int length) {
    }

    static Bound certifiedBound(Schedule schedule, double timeLimitSeconds) {
        Loader.loadNativeLibraries();
        MPSolver solver = MPSolver.createSolver("PDLP");
        if (solver == null) {
            throw new IllegalStateException("OR-Tools has no PDLP solver in this build");
        }
        List<MPConstraint> rows = new ArrayList<>();
        Map<Integer, Integer> grantRows = new HashMap<>();
        for (ProgramGrant g : schedule.grants()) {
            grantRows.put(g.index(), rows.size());
            rows.add(solver.makeConstraint(0, g.grantMinutes(), "grant " + g.index()));
        }
        Map<Long, Integer> slotRows = new HashMap<>();
        MPObjective objective = solver.objective();
        objective.setMaximization();
        List<Column> columns = new ArrayList<>();
        int grid = schedule.gridMinutes();
        for (Visit v : schedule.visits()) {
            if (v.candidateCount() == 0) {
                continue;
            }
            if (v.isPinned()) {
                throw new IllegalArgumentException("the bound is for a plan without pins");
            }
            int visitRow = rows.size();
            MPConstraint once = solver.makeConstraint(0, 1, "once " + v.id());
            rows.add(once);
            for (Placement c : v.getCandidates()) {
                Integer grantRow = grantRows.get(v.grantOf(c));
                MPConstraint grant = grantRow == null ? null : rows.get(grantRow);
                MPVariable x = solver.makeNumVar(0, 1, "");
                int length = v.lengthOn(c.telescopeIndex());
                double value = (double) v.priorityWeight() * v.nominalMinutes();
                once.setCoefficient(x, 1);
                int[] slots = new int[(length + grid - 1) / grid];
                for (int k = 0; k < slots.length; k++) {
                    long key = ((long) c.telescopeIndex() << 32) | (c.startMinute() + k * grid);
                    Integer row = slotRows.get(key);
                    if (row == null) {
                        row = rows.size();
                        rows.add(solver.makeConstraint(0, 1, ""));
                        slotRows.put(key, row);
                    }
                    rows.get(row).setCoefficient(x, 1);
                    slots[k] = row;
                }
                if (grant != null) {
                    grant.setCoefficient(x, length);
                }
                objective.setCoefficient(x, value);
                columns.add(new Column(value, visitRow, slots, grantRow == null ? -1 : grantRow, length));
            }
        }
        solver.setTimeLimit(Math.round(timeLimitSeconds * 1000));
        MPSolver.ResultStatus status = solver.solve();
        double[] duals = new double[rows.size()];
        double[] limits = new double[rows.size()];
        for (int i = 0; i < rows.size(); i++) {
            double dual = rows.get(i).dualValue();
            // Any non-negative multipliers give a valid bound, so a value the solver failed to give counts as zero.
            duals[i] = Double.isFinite(dual) ? dual : 0;
            limits[i] = rows.get(i).ub();
        }
        // The sign convention of the duals for a maximisation is the solver's business: both readings give a valid
        // bound (any non-negative multipliers do), so take the smaller.
        double bound = Math.min(dualBound(columns, duals, limits, 1), dualBound(columns, duals, limits, -1));
        return new Bound(bound, objective.value(), status.name(), columns.size());
    }

    private static double dualBound(List<Column> columns, double[] duals, double[] limits, int sign) {
        double bound = 0;
        for (int i = 0; i < duals.length; i++) {
            bound += Math.max(0, sign * duals[i]) * limits[i];
        }
        for (Column c : columns) {
            double paid = Math.max(0, sign * duals[c.visitRow()]);
            for (int row : c.slotRows()) {
                paid += Math.max(0, sign * duals[row]);
            }
            if (c.grantRow() >= 0) {
                paid += Math.max(0, sign * duals[c.grantRow()]) * c.length();
            }
            bound += Math.max(0, c.value() - paid);
        }
        return bound;
    }

    private PlannerTermBoundBench() {
    }
}
