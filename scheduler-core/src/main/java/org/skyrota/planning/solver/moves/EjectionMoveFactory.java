package org.skyrota.planning.solver.moves;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.Map;
import java.util.Iterator;
import java.util.List;
import java.util.Random;

import org.optaplanner.core.api.score.director.ScoreDirector;
import org.optaplanner.core.impl.heuristic.selector.move.factory.MoveIteratorFactory;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;

/**
 * Place a visit at one of its candidates and take off that telescope every visit it would overlap. Plain change
 * moves cannot do this in one step (the intermediate overlap is a hard violation), so without it the search rarely
 * trades a low-value visit for a high-value one. Mostly picks unplaced visits, which is where the gain is.
 */
public final class EjectionMoveFactory implements MoveIteratorFactory<Schedule, ReassignMove> {

    private static Placement firstFree(Visit o, Visit placedVisit, List<Visit> ejected, List<int[]> taken,
                                       Map<Long, List<Visit>> byTelescopeNight, Random random) {
        int n = o.candidateCount();
        if (n == 0) {
            return null;
        }
        // Half the time the free candidate nearest to where the visit was (keeps its night packed), otherwise the
        // first free one from a random offset (explores other nights and telescopes).
        boolean nearest = random.nextBoolean();
        Placement best = null;
        int bestDistance = Integer.MAX_VALUE;
        int[] bestInterval = null;
        int offset = random.nextInt(n);
        for (int i = 0; i < n; i++) {
            Placement c = o.getCandidates().get((offset + i) % n);
            if (nearest && best != null && Math.abs(c.startMinute() - o.startMinute()) >= bestDistance) {
                continue;
            }
            int s = c.startMinute();
            int e = s + o.lengthOn(c.telescopeIndex());
            boolean free = true;
            for (int[] t : taken) {
                if (t[0] == c.telescopeIndex() && t[1] < e && s < t[2]) {
                    free = false;
                    break;
                }
            }
            if (free) {
                for (Visit w : byTelescopeNight.getOrDefault(c.telescopeIndex() * 1_000_000L + c.nightEpochDay(),
                        List.of())) {
                    if (w != placedVisit && !ejected.contains(w) && w.startMinute() < e && s < w.endMinute()) {
                        free = false;
                        break;
                    }
                }
            }
            if (free) {
                if (!nearest) {
                    taken.add(new int[] {c.telescopeIndex(), s, e});
                    return c;
                }
                best = c;
                bestDistance = Math.abs(c.startMinute() - o.startMinute());
                bestInterval = new int[] {c.telescopeIndex(), s, e};
            }
        }
        if (best != null) {
            taken.add(bestInterval);
        }
        return best;
    }

    @Override
    public long getSize(ScoreDirector<Schedule> scoreDirector) {
        long size = 0;
        for (Visit v : scoreDirector.getWorkingSolution().visits()) {
            size += v.candidateCount();
        }
        return size;
    }

    @Override
    public Iterator<ReassignMove> createOriginalMoveIterator(ScoreDirector<Schedule> scoreDirector) {
        throw new UnsupportedOperationException("ejection moves are only selected at random");
    }

    @Override
    public Iterator<ReassignMove> createRandomMoveIterator(ScoreDirector<Schedule> scoreDirector, Random random) {
        List<Visit> visits = scoreDirector.getWorkingSolution().visits();
        // The solution is back in the step's state whenever a move is asked for, so one index per step is enough.
        Map<Long, List<Visit>> byTelescopeNight = new HashMap<>();
        List<Visit> unplaced = new ArrayList<>();
        for (Visit o : visits) {
            if (o.isPlaced()) {
                byTelescopeNight.computeIfAbsent(o.telescopeNightKey(), k -> new ArrayList<>()).add(o);
            } else if (o.candidateCount() > 0 && !o.isPinned()) {
                unplaced.add(o);
            }
        }
        return new Iterator<>() {
            @Override
            public boolean hasNext() {
                return !visits.isEmpty();
            }

            @Override
            public ReassignMove next() {
                for (int attempt = 0; attempt < 20; attempt++) {
                    // Three times in four an unplaced visit, higher priorities more often (that is where the gain
                    // is); otherwise any visit, which moves placed ones to make room.
                    Visit v = !unplaced.isEmpty() && random.nextInt(4) != 0
                            ? unplaced.get(random.nextInt(unplaced.size()))
                            : visits.get(random.nextInt(visits.size()));
                    if (v.isPinned() || v.candidateCount() == 0
                            || (!v.isPlaced() && random.nextInt(5) >= v.priority())) {
                        continue;
                    }
                    Placement p = v.getCandidates().get(random.nextInt(v.candidateCount()));
                    int start = p.startMinute();
                    int end = start + v.lengthOn(p.telescopeIndex());
                    List<Visit> moved = new ArrayList<>();
                    List<Placement> to = new ArrayList<>();
                    moved.add(v);
                    to.add(p);
                    boolean blocked = false;
                    List<Visit> ejected = new ArrayList<>();
                    long key = p.telescopeIndex() * 1_000_000L + p.nightEpochDay();
                    for (Visit o : byTelescopeNight.getOrDefault(key, List.of())) {
                        if (o != v && o.isPlaced() && o.telescopeIndex() == p.telescopeIndex()
                                && o.startMinute() < end && start < o.endMinute()) {
                            if (o.isPinned()) {
                                blocked = true;
                                break;
                            }
                            ejected.add(o);
                        }
                    }
                    if (blocked) {
                        continue;
                    }
                    // Repair: give each ejected visit the first free candidate, from a random offset, if it has one.
                    List<int[]> taken = new ArrayList<>();
                    taken.add(new int[] {p.telescopeIndex(), start, end});
                    for (Visit o : ejected) {
                        moved.add(o);
                        to.add(firstFree(o, v, ejected, taken, byTelescopeNight, random));
                    }
                    return new ReassignMove(moved.toArray(new Visit[0]), to.toArray(new Placement[0]));
                }
                Visit v = visits.get(random.nextInt(visits.size()));
                return new ReassignMove(new Visit[] {v}, new Placement[] {v.getPlacement()});
            }
        };
    }
}
