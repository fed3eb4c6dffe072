package org.skyrota.planning.greedy;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.PriorityQueue;

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
 * longest, which is a better start for the solver's search.
 */
public final class GreedyDispatcher {

    private final boolean urgencyAware;

    /** The baseline of the benchmarks: equal priorities in queue order. */
    public GreedyDispatcher() {
        this(false);
    }

    private GreedyDispatcher(boolean urgencyAware) {
        this.urgencyAware = urgencyAware;
    }

    /** The club's way by hand: highest priority first, equal priorities in queue order. */
    public static GreedyDispatcher byHand() {
        return new GreedyDispatcher(false);
    }

    /** Highest priority first, then the request whose range closes first, then the longest visit. */
    public static GreedyDispatcher urgencyAware() {
        return new GreedyDispatcher(true);
    }

    public void dispatch(PreparedProblem prepared) {
        List<Visit> visits = prepared.schedule().visits();
        int telescopes = prepared.telescopes().size();
        Map<Integer, List<Visit>> startsAt = new HashMap<>();
        Map<Integer, Map<Integer, List<Visit>>> byTelescopeMinute = new HashMap<>();
        int[] busyUntil = new int[telescopes];
        Map<String, Long> programUsed = new HashMap<>();
        Map<String, List<Visit>> placedByRequest = new HashMap<>();
        Map<String, Long> grants = new HashMap<>();
        for (ProgramGrant g : prepared.schedule().grants()) {
            grants.put(g.programId(), g.grantMinutes());
        }
        Map<String, Integer> queueOrder = new HashMap<>();
        for (int i = 0; i < visits.size(); i++) {
            queueOrder.put(visits.get(i).id(), i);
        }
        List<int[]> pinnedIntervals = new ArrayList<>();
        for (Visit v : visits) {
            if (v.isPinned()) {
                commit(v, v.getPlacement(), programUsed, placedByRequest);
                pinnedIntervals.add(new int[] {v.telescopeIndex(), v.startMinute(), v.endMinute()});
                continue;
            }
            v.setPlacement(null);
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
            for (Visit v : byTelescopeMinute.get(t).get(minute)) {
                if (v.isPlaced()) {
                    continue;
                }
                int end = minute + v.lengthOn(t);
                if (!fits(v, t, minute, end, pinnedIntervals, programUsed, grants, placedByRequest)) {
                    continue;
                }
                if (best == null || better(v, best, prepared, queueOrder)) {
                    best = v;
                }
            }
            if (best != null) {
                Placement p = best.getCandidates().stream()
                        .filter(c -> c.telescopeIndex() == t && c.startMinute() == minute).findFirst().orElseThrow();
                commit(best, p, programUsed, placedByRequest);
                busyUntil[t] = minute + best.lengthOn(t);
            }
        }
    }

    private static boolean fits(Visit v, int t, int start, int end, List<int[]> pinned, Map<String, Long> used,
                                Map<String, Long> grants, Map<String, List<Visit>> placedByRequest) {
        for (int[] p : pinned) {
            if (p[0] == t && p[1] < end && start < p[2]) {
                return false;
            }
        }
        Long grant = grants.get(v.programId());
        if (grant != null && used.getOrDefault(v.programId(), 0L) + v.lengthOn(t) > grant) {
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

    private static void commit(Visit v, Placement p, Map<String, Long> used, Map<String, List<Visit>> placedByRequest) {
        v.setPlacement(p);
        used.merge(v.programId(), (long) v.placedMinutes(), Long::sum);
        placedByRequest.computeIfAbsent(v.requestId(), k -> new ArrayList<>()).add(v);
    }
}
