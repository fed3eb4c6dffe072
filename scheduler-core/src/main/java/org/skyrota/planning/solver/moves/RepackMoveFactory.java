package org.skyrota.planning.solver.moves;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

import org.optaplanner.core.api.score.director.ScoreDirector;
import org.optaplanner.core.impl.heuristic.selector.move.factory.MoveIteratorFactory;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;

/**
 * Ruin and recreate one telescope-night: take every visit off it, then refill it from those visits and the unplaced
 * visits that could go there, in a random order biased to higher priority, each at its earliest free candidate on
 * that night. Visits that no longer fit are left out. Finds the tight packings that one-visit moves cannot reach.
 */
public final class RepackMoveFactory implements MoveIteratorFactory<Schedule, ReassignMove> {
    private Map<Long, List<Visit>> mayGoTo;
    private List<Long> keys;

    @Override
    public void phaseStarted(ScoreDirector<Schedule> scoreDirector) {
        // Candidates never change during a run, so who may go where is computed once.
        Map<Long, List<Visit>> index = new LinkedHashMap<>();
        for (Visit v : scoreDirector.getWorkingSolution().visits()) {
            long last = Long.MIN_VALUE;
            for (Placement p : v.getCandidates()) {
                long key = p.telescopeIndex() * 1_000_000L + p.nightEpochDay();
                if (key != last) {
                    List<Visit> list = index.computeIfAbsent(key, k -> new ArrayList<>());
                    if (list.isEmpty() || list.get(list.size() - 1) != v) {
                        list.add(v);
                    }
                    last = key;
                }
            }
        }
        mayGoTo = index;
        keys = new ArrayList<>(index.keySet());
    }

    @Override
    public long getSize(ScoreDirector<Schedule> scoreDirector) {
        return keys == null ? 0 : keys.size();
    }

    @Override
    public Iterator<ReassignMove> createOriginalMoveIterator(ScoreDirector<Schedule> scoreDirector) {
        throw new UnsupportedOperationException("repack moves are only selected at random");
    }

    @Override
    public Iterator<ReassignMove> createRandomMoveIterator(ScoreDirector<Schedule> scoreDirector, Random random) {
        return new Iterator<>() {
            @Override
            public boolean hasNext() {
                return keys != null && !keys.isEmpty();
            }

            @Override
            public ReassignMove next() {
                long key = keys.get(random.nextInt(keys.size()));
                int telescope = (int) (key / 1_000_000L);
                int night = (int) (key % 1_000_000L);
                List<Visit> pool = new ArrayList<>();
                for (Visit v : mayGoTo.get(key)) {
                    boolean here = v.isPlaced() && v.telescopeIndex() == telescope
                            && v.getPlacement().nightEpochDay() == night;
                    if (!v.isPinned() && (here || !v.isPlaced())) {
                        pool.add(v);
                    }
                }
                // Random order, higher priority first more often: sort by priority plus noise.
                Map<Visit, Double> order = new HashMap<>();
                for (Visit v : pool) {
                    order.put(v, v.priority() + 2.5 * random.nextDouble());
                }
                pool.sort((a, b) -> Double.compare(order.get(b), order.get(a)));
                List<int[]> taken = new ArrayList<>();
                for (Visit v : mayGoTo.get(key)) {
                    if (v.isPinned() && v.isPlaced() && v.telescopeIndex() == telescope) {
                        taken.add(new int[] {v.startMinute(), v.endMinute()});
                    }
                }
                List<Visit> moved = new ArrayList<>();
                List<Placement> to = new ArrayList<>();
                for (Visit v : pool) {
                    Placement chosen = null;
                    int length = v.lengthOn(telescope);
                    for (Placement p : v.getCandidates()) {
                        if (p.telescopeIndex() != telescope || p.nightEpochDay() != night) {
                            continue;
                        }
                        int s = p.startMinute();
                        boolean free = true;
                        for (int[] t : taken) {
                            if (t[0] < s + length && s < t[1]) {
                                free = false;
                                break;
                            }
                        }
                        if (free) {
                            chosen = p;
                            break;
                        }
                    }
                    if (chosen != null) {
                        taken.add(new int[] {chosen.startMinute(), chosen.startMinute() + length});
                    }
                    if (chosen != v.getPlacement()) {
                        moved.add(v);
                        to.add(chosen);
                    }
                }
                if (moved.isEmpty()) {
                    Visit any = pool.isEmpty() ? mayGoTo.get(key).get(0) : pool.get(0);
                    return new ReassignMove(new Visit[] {any}, new Placement[] {any.getPlacement()});
                }
                return new ReassignMove(moved.toArray(new Visit[0]), to.toArray(new Placement[0]));
            }
        };
    }
}
