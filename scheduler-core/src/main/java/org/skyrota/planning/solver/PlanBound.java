package org.skyrota.planning.solver;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.domain.Visit;

/**
 * Upper bounds on the priority-weighted time (priority weight × nominal minutes, summed over the placed visits: what
 * the medium level of the score rewards) that any plan of a prepared problem can reach. Each comes from a relaxation
 * that every plan satisfies, so no plan can beat either one, and the smaller is what a run's result holds its plan
 * against ("within 2.4 % of the best possible plan"). They are cheap: one pass over the candidates.
 */
public final class PlanBound {

    private PlanBound() {}

    /** The smaller of {@link #telescopeTime} and {@link #grants}. */
    public static long of(PreparedProblem p) {
        return Math.min(telescopeTime(p), grants(p));
    }

    /**
     * The telescope time that any candidate can use at all (the union of candidate intervals per telescope), filled
     * with the visits of highest weight per minute first as if visits could go anywhere and be split. Every placed
     * visit uses at least its nominal minutes of that time, so no plan is worth more.
     */
    public static long telescopeTime(PreparedProblem p) {
        Map<Integer, TreeMap<Integer, Integer>> busy = new HashMap<>();
        List<Visit> visits = new ArrayList<>();
        for (Visit v : p.schedule().visits()) {
            if (v.candidateCount() > 0) {
                visits.add(v);
            }
            for (Placement c : v.getCandidates()) {
                busy.computeIfAbsent(c.telescopeIndex(), k -> new TreeMap<>())
                        .merge(c.startMinute(), c.startMinute() + v.lengthOn(c.telescopeIndex()), Math::max);
            }
        }
        long capacity = 0;
        for (TreeMap<Integer, Integer> intervals : busy.values()) {
            int end = Integer.MIN_VALUE;
            for (Map.Entry<Integer, Integer> e : intervals.entrySet()) {
                int s = Math.max(e.getKey(), end);
                if (e.getValue() > s) {
                    capacity += e.getValue() - s;
                    end = e.getValue();
                }
            }
        }
        visits.sort((a, b) -> Long.compare(b.priorityWeight(), a.priorityWeight()));
        long bound = 0;
        for (Visit v : visits) {
            long take = Math.min(capacity, v.nominalMinutes());
            bound += take * v.priorityWeight();
            capacity -= take;
            if (capacity == 0) {
                break;
            }
        }
        return bound;
    }

    /**
     * A program can at best fill its grants with its most valuable visits per granted minute (weighted time over the
     * shortest length any candidate gives the visit), the last one split; a program whose visits all fit counts all
     * of them. Grants are a hard rule, so no plan beats the sum over programs. (Pooling a program's grants only
     * loosens the bound: each visit pays from one of them.)
     */
    public static long grants(PreparedProblem p) {
        Map<String, Long> granted = new HashMap<>();
        for (ProgramGrant g : p.schedule().grants()) {
            granted.merge(g.programId(), g.grantMinutes(), Long::sum);
        }
        Map<String, List<Visit>> byProgram = new HashMap<>();
        for (Visit v : p.schedule().visits()) {
            if (v.candidateCount() > 0) {
                byProgram.computeIfAbsent(v.programId(), k -> new ArrayList<>()).add(v);
            }
        }
        double bound = 0;
        for (Map.Entry<String, List<Visit>> e : byProgram.entrySet()) {
            Map<Visit, Integer> shortest = new HashMap<>();
            for (Visit v : e.getValue()) {
                shortest.put(v, v.getCandidates().stream().mapToInt(c -> v.lengthOn(c.telescopeIndex())).min()
                        .orElseThrow());
            }
            List<Visit> visits = new ArrayList<>(e.getValue());
            visits.sort((a, b) -> Double.compare((double) b.priorityWeight() * b.nominalMinutes() / shortest.get(b),
                    (double) a.priorityWeight() * a.nominalMinutes() / shortest.get(a)));
            double left = granted.getOrDefault(e.getKey(), Long.MAX_VALUE);
            for (Visit v : visits) {
                if (left <= 0) {
                    break;
                }
                double share = Math.min(1.0, left / shortest.get(v));
                bound += share * v.priorityWeight() * v.nominalMinutes();
                left -= share * shortest.get(v);
            }
        }
        return (long) Math.floor(bound);
    }

    /** The priority-weighted time of a plan as it stands: priority weight × nominal minutes of each placed visit. */
    public static long weighted(PreparedProblem p) {
        long sum = 0;
        for (Visit v : p.schedule().visits()) {
            if (v.isPlaced()) {
                sum += v.priorityWeight() * v.nominalMinutes();
            }
        }
        return sum;
    }
}
