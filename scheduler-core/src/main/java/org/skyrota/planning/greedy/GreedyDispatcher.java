package org.skyrota.planning.greedy;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.PriorityQueue;
import java.util.TreeMap;

import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.domain.Visit;

/**
 * Greedy dispatch: each telescope walks through its nights; at every free moment on the grid it starts the
 * highest-priority visit that can start right now, provided its program still has time and its repeats stay far
 * enough apart. Pinned visits are placed first and are never moved. Works in place on the prepared schedule.
 *
 * <p>Two ways to break ties between visits of equal priority: {@link #byHand()}, the baseline, takes them in queue
 * order, the way a club schedules by hand; {@link #urgencyAware()} takes the one whose range closes first, then the
 * longest. {@link #grantAware()}, the solver's start, walks the urgency-aware way twice so that programs keep their
 * grants for their high priorities.
 */
public final class GreedyDispatcher {

    private final boolean urgencyAware;
    private final boolean grantAware;

    /** The baseline of the benchmarks: equal priorities in queue order. */
    public GreedyDispatcher() {
        this(false, false);
    }

    private GreedyDispatcher(boolean urgencyAware, boolean grantAware) {
        this.urgencyAware = urgencyAware;
        this.grantAware = grantAware;
    }

    /** The club's way by hand: highest priority first, equal priorities in queue order. */
    public static GreedyDispatcher byHand() {
        return new GreedyDispatcher(false, false);
    }

    /** Highest priority first, then the request whose range closes first, then the longest visit. */
    public static GreedyDispatcher urgencyAware() {
        return new GreedyDispatcher(true, false);
    }

    /**
     * {@link #urgencyAware()} in two walks, the solver's start. A walk through time spends a program's grant on
     * whatever comes first, so a program with more requests than grant runs out early in the term on low priorities
     * while its high priorities later on stay out. Here the first walk leaves out each program's visits below the
     * priority at which its visits would fill its grant on their own ({@link #grantThresholds}); the second walk fills
     * the time and grant left with everything else.
     */
    public static GreedyDispatcher grantAware() {
        return new GreedyDispatcher(true, true);
    }

    /**
     * Fits the unplaced visits around those already placed, which stay where they are (a re-plan that starts from
     * the published plan fills the gaps this way).
     */
    public void fill(PreparedProblem prepared) {
        Map<Integer, TreeMap<Integer, Integer>> taken = new HashMap<>();
        for (Visit v : prepared.schedule().visits()) {
            if (v.isPlaced() && !v.isPinned()) {
                taken.computeIfAbsent(v.telescopeIndex(), k -> new TreeMap<>()).put(v.startMinute(), v.endMinute());
            }
        }
        if (taken.isEmpty()) {
            dispatch(prepared);
        } else {
            walk(prepared, v -> true, taken);
        }
    }

    public void dispatch(PreparedProblem prepared) {
        if (!grantAware) {
            walk(prepared, v -> true, new HashMap<>());
            return;
        }
        Map<String, Integer> threshold = grantThresholds(prepared.schedule());
        walk(prepared, v -> v.priority() >= threshold.getOrDefault(v.programId(), 0), new HashMap<>());
        // The second walk keeps the first one's visits where they are and fits the rest around them.
        Map<Integer, TreeMap<Integer, Integer>> taken = new HashMap<>();
        for (Visit v : prepared.schedule().visits()) {
            if (v.isPlaced() && !v.isPinned()) {
                taken.computeIfAbsent(v.telescopeIndex(), k -> new TreeMap<>()).put(v.startMinute(), v.endMinute());
            }
        }
        walk(prepared, v -> true, taken);
    }

    /**
     * Per program with a grant: the lowest priority whose visits, together with all of higher priority, still fit
     * in the grant at their nominal lengths, counting only visits that have a candidate at all. Priority 1 (nothing
     * held back) where everything fits.
     */
    static Map<String, Integer> grantThresholds(org.skyrota.planning.domain.Schedule schedule) {
        Map<String, long[]> minutesByPriority = new HashMap<>();
        for (Visit v : schedule.visits()) {
            if (v.candidateCount() > 0 && !v.isPinned()) {
                minutesByPriority.computeIfAbsent(v.programId(), k -> new long[6])[Math.max(1, Math.min(5, v.priority()))]
                        += v.nominalMinutes();
            }
        }
        Map<String, Long> granted = new HashMap<>();
        for (ProgramGrant g : schedule.grants()) {
            granted.merge(g.programId(), g.grantMinutes(), Long::sum);
        }
        Map<String, Integer> threshold = new HashMap<>();
        granted.forEach((program, grantMinutes) -> {
            long[] minutes = minutesByPriority.getOrDefault(program, new long[6]);
            long sum = 0;
            int lowest = 1;
            for (int priority = 5; priority >= 1; priority--) {
                sum += minutes[priority];
                if (sum > grantMinutes) {
                    lowest = priority;
                    break;
                }
            }
            threshold.put(program, lowest);
        });
        return threshold;
    }

    /**
     * One walk through time over the unplaced visits {@code allowed} accepts; {@code taken} holds, per telescope,
     * intervals an earlier walk filled (start to end, not overlapping), which this walk keeps clear of.
     */
    private void walk(PreparedProblem prepared, java.util.function.Predicate<Visit> allowed,
                      Map<Integer, TreeMap<Integer, Integer>> taken) {
        List<Visit> visits = prepared.schedule().visits();
        int telescopes = prepared.telescopes().size();
        Map<Integer, List<Visit>> startsAt = new HashMap<>();
        Map<Integer, Map<Integer, List<Visit>>> byTelescopeMinute = new HashMap<>();
        int[] busyUntil = new int[telescopes];
        Map<Integer, Long> grantUsed = new HashMap<>();
        Map<String, List<Visit>> placedByRequest = new HashMap<>();
        Map<Integer, Long> grants = new HashMap<>();
        for (ProgramGrant g : prepared.schedule().grants()) {
            grants.put(g.index(), g.grantMinutes());
        }
        Map<String, Integer> queueOrder = new HashMap<>();
        for (int i = 0; i < visits.size(); i++) {
            queueOrder.put(visits.get(i).id(), i);
        }
        List<int[]> pinnedIntervals = new ArrayList<>();
        for (Visit v : visits) {
            if (v.isPinned()) {
                commit(v, v.getPlacement(), grantUsed, placedByRequest);
                pinnedIntervals.add(new int[] {v.telescopeIndex(), v.startMinute(), v.endMinute()});
                continue;
            }
            if (v.isPlaced() && !taken.isEmpty()) {
                // Placed by an earlier walk: it counts against its grant and its repeats, and stays.
                commit(v, v.getPlacement(), grantUsed, placedByRequest);
                continue;
            }
            v.setPlacement(null);
            if (!allowed.test(v)) {
                continue;
            }
            for (Placement p : v.getCandidates()) {
                byTelescopeMinute.computeIfAbsent(p.telescopeIndex(), k -> new HashMap<>())
                        .computeIfAbsent(p.startMinute(), k -> new ArrayList<>()).add(v);
            }
        }
        // Events: (minute, telescope), earliest first, so that all telescopes advance through time together.
        PriorityQueue<int[]> clock = new PriorityQueue<>((a, b) -> a[0] != b[0] ? Integer.compare(a[0], b[0])
                : Integer.compare(a[1], b[1]));
        for (int t = 0; t < telescopes; t++) {
            Map<Integer, List<Visit>> minutes = byTelescopeMinute.get(t);
            if (minutes != null) {
                for (int m : minutes.keySet()) {
                    clock.add(new int[] {m, t});
                }
            }
        }
        while (!clock.isEmpty()) {
            int[] event = clock.poll();
            int minute = event[0];
            int t = event[1];
            if (minute < busyUntil[t]) {
                continue;
            }
            Visit best = null;
            Placement bestPlacement = null;
            for (Visit v : byTelescopeMinute.get(t).get(minute)) {
                if (v.isPlaced()) {
                    continue;
                }
                int end = minute + v.lengthOn(t);
                Placement p = v.getCandidates().stream()
                        .filter(c -> c.telescopeIndex() == t && c.startMinute() == minute).findFirst().orElseThrow();
                if (!fits(v, p, end, pinnedIntervals, grantUsed, grants, placedByRequest)
                        || overlapsTaken(taken.get(t), minute, end)) {
                    continue;
                }
                if (best == null || better(v, best, prepared, queueOrder)) {
                    best = v;
                    bestPlacement = p;
                }
            }
            if (best != null) {
                commit(best, bestPlacement, grantUsed, placedByRequest);
                busyUntil[t] = minute + best.lengthOn(t);
            }
        }
    }

    private static boolean overlapsTaken(TreeMap<Integer, Integer> taken, int start, int end) {
        if (taken == null) {
            return false;
        }
        Map.Entry<Integer, Integer> before = taken.floorEntry(start);
        if (before != null && before.getValue() > start) {
            return true;
        }
        Integer next = taken.higherKey(start);
        return next != null && next < end;
    }

    private static boolean fits(Visit v, Placement placement, int end, List<int[]> pinned, Map<Integer, Long> used,
                                Map<Integer, Long> grants, Map<String, List<Visit>> placedByRequest) {
        int t = placement.telescopeIndex();
        int start = placement.startMinute();
        for (int[] p : pinned) {
            if (p[0] == t && p[1] < end && start < p[2]) {
                return false;
            }
        }
        int grantIndex = v.grantOf(placement);
        Long grant = grants.get(grantIndex);
        if (grant != null && used.getOrDefault(grantIndex, 0L) + v.lengthOn(t) > grant) {
            return false;
        }
        for (Visit sibling : placedByRequest.getOrDefault(v.requestId(), List.of())) {
            if (Math.abs(sibling.startMinute() - start) < v.repeatMinGapMinutes()) {
                return false;
            }
        }
        return true;
    }

    private boolean better(Visit a, Visit b, PreparedProblem prepared, Map<String, Integer> queueOrder) {
        if (a.priority() != b.priority()) {
            return a.priority() > b.priority();
        }
        if (!urgencyAware) {
            return queueOrder.get(a.id()) < queueOrder.get(b.id());
        }
        var ra = prepared.requestByVisit().get(a.id()).latestNight();
        var rb = prepared.requestByVisit().get(b.id()).latestNight();
        if (!ra.equals(rb)) {
            return ra.isBefore(rb);
        }
        if (a.nominalMinutes() != b.nominalMinutes()) {
            return a.nominalMinutes() > b.nominalMinutes();
        }
        return a.id().compareTo(b.id()) < 0;
    }

    private static void commit(Visit v, Placement p, Map<Integer, Long> used, Map<String, List<Visit>> placedByRequest) {
        v.setPlacement(p);
        used.merge(v.grantIndex(), (long) v.placedMinutes(), Long::sum);
        placedByRequest.computeIfAbsent(v.requestId(), k -> new ArrayList<>()).add(v);
    }
}
