package org.skyrota.bench;

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
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;

/**
 * The exact reference: a time-indexed model of the same candidates solved by Google OR-Tools CP-SAT. One boolean
 * per visit and candidate; each visit at most once; at every grid minute of every telescope at most one running
 * visit; repeats of a request at least their spacing apart; each grant within its minutes. It maximises the medium
 * level (priority weight times nominal minutes of the placed visits); the soft level is not modelled.
 */
final class CpSatReference {

    record Result(long objective, long bound, boolean optimal, double seconds) {
    }

    static Result maximiseWeightedTime(Schedule schedule, double timeLimitSeconds) {
        Loader.loadNativeLibraries();
        CpModel model = new CpModel();
        List<Visit> visits = schedule.visits();
        int grid = schedule.gridMinutes();
        Map<Long, List<Literal>> running = new HashMap<>();
        Map<Integer, List<LinearArgument>> grantTerms = new HashMap<>();
        Map<Integer, List<Long>> grantSizes = new HashMap<>();
        List<LinearArgument> objectiveVars = new ArrayList<>();
        List<Long> objectiveWeights = new ArrayList<>();
        Map<Visit, BoolVar[]> vars = new HashMap<>();
        for (Visit v : visits) {
            List<Placement> candidates = v.getCandidates();
            BoolVar[] x = new BoolVar[candidates.size()];
            for (int c = 0; c < x.length; c++) {
                Placement p = candidates.get(c);
                x[c] = model.newBoolVar(v.id() + "@" + p.id());
                int length = v.lengthOn(p.telescopeIndex());
                for (int m = p.startMinute(); m < p.startMinute() + length; m += grid) {
                    running.computeIfAbsent(((long) p.telescopeIndex() << 32) | m, k -> new ArrayList<>()).add(x[c]);
                }
                objectiveVars.add(x[c]);
                objectiveWeights.add(v.priorityWeight() * v.nominalMinutes());
                grantTerms.computeIfAbsent(v.grantOf(p), k -> new ArrayList<>()).add(x[c]);
                grantSizes.computeIfAbsent(v.grantOf(p), k -> new ArrayList<>()).add((long) length);
            }
            if (v.isPinned()) {
                int pinned = candidates.indexOf(v.getPlacement());
                model.addEquality(x[pinned], 1);
            }
            model.addAtMostOne(x);
            vars.put(v, x);
        }
        for (List<Literal> slot : running.values()) {
            if (slot.size() > 1) {
                model.addAtMostOne(slot);
            }
        }
        for (int i = 0; i < visits.size(); i++) {
            for (int j = i + 1; j < visits.size(); j++) {
                Visit a = visits.get(i);
                Visit b = visits.get(j);
                if (!a.requestId().equals(b.requestId()) || a.repeatMinGapMinutes() == 0) {
                    continue;
                }
                BoolVar[] xa = vars.get(a);
                BoolVar[] xb = vars.get(b);
                for (int ca = 0; ca < xa.length; ca++) {
                    for (int cb = 0; cb < xb.length; cb++) {
                        int gap = Math.abs(a.getCandidates().get(ca).startMinute() - b.getCandidates().get(cb).startMinute());
                        if (gap < a.repeatMinGapMinutes()) {
                            model.addBoolOr(new Literal[] {xa[ca].not(), xb[cb].not()});
                        }
                    }
                }
            }
        }
        for (ProgramGrant g : schedule.grants()) {
            List<LinearArgument> terms = grantTerms.get(g.index());
            if (terms != null) {
                model.addLessOrEqual(LinearExpr.weightedSum(terms.toArray(new LinearArgument[0]),
                        grantSizes.get(g.index()).stream().mapToLong(Long::longValue).toArray()), g.grantMinutes());
            }
        }
        model.maximize(LinearExpr.weightedSum(objectiveVars.toArray(new LinearArgument[0]),
                objectiveWeights.stream().mapToLong(Long::longValue).toArray()));
        CpSolver solver = new CpSolver();
        solver.getParameters().setMaxTimeInSeconds(timeLimitSeconds).setNumWorkers(2).setRandomSeed(1);
        long start = System.nanoTime();
        CpSolverStatus status = solver.solve(model);
        double seconds = (System.nanoTime() - start) / 1e9;
        if (status != CpSolverStatus.OPTIMAL && status != CpSolverStatus.FEASIBLE) {
            throw new IllegalStateException("CP-SAT found no solution: " + status);
        }
        return new Result(Math.round(solver.objectiveValue()), Math.round(solver.bestObjectiveBound()),
                status == CpSolverStatus.OPTIMAL, seconds);
    }

    private CpSatReference() {
    }
}
