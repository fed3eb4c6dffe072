package org.skyrota.planning.solver.moves;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Random;

import org.optaplanner.core.api.score.director.ScoreDirector;
import org.optaplanner.core.impl.heuristic.selector.move.factory.MoveIteratorFactory;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;

/**
 * Trade grant time inside one grant: place an unplaced visit (taking off the telescope whatever it overlaps) and,
 * if that would take the grant it pays from over, leave out enough of that grant's placed visits of lower value
 * per granted minute to stay within it.
 *
 * <p>Why: the greedy start fills a program's grant in time order, so a program that runs out of grant early in
 * the term holds low-priority visits while its high-priority ones later in the term stay out. No other move can
 * swap them: placing the high-priority visit first is a hard violation (over grant) and leaving the low-priority
 * one out first loses value, and the two are rarely on the same telescope-night, where a repack could do both.
 */
public final class GrantTradeMoveFactory implements MoveIteratorFactory<Schedule, ReassignMove> {

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
        throw new UnsupportedOperationException("grant trade moves are only selected at random");
    }

    @Override
    public Iterator<ReassignMove> createRandomMoveIterator(ScoreDirector<Schedule> scoreDirector, Random random) {
        Schedule schedule = scoreDirector.getWorkingSolution();
        List<Visit> visits = schedule.visits();
        // The solution is back in the step's state whenever a move is asked for, so one index per step is enough.
        Map<Long, List<Visit>> byTelescopeNight = new HashMap<>();
        Map<Integer, List<Visit>> placedByGrant = new HashMap<>();
        Map<Integer, Long> used = new HashMap<>();
        List<Visit> unplaced = new ArrayList<>();
        for (Visit o : visits) {
            if (o.isPlaced()) {
                byTelescopeNight.computeIfAbsent(o.telescopeNightKey(), k -> new ArrayList<>()).add(o);
                placedByGrant.computeIfAbsent(o.grantIndex(), k -> new ArrayList<>()).add(o);
                used.merge(o.grantIndex(), (long) o.placedMinutes(), Long::sum);
            } else if (o.candidateCount() > 0 && !o.isPinned()) {
                unplaced.add(o);
            }
        }
        Map<Integer, Long> grants = new HashMap<>();
        for (ProgramGrant g : schedule.grants()) {
            grants.put(g.index(), g.grantMinutes());
        }
        return new Iterator<>() {
            @Override
            public boolean hasNext() {
                return !visits.isEmpty();
            }

            @Override
            public ReassignMove next() {
                for (int attempt = 0; attempt < 20 && !unplaced.isEmpty(); attempt++) {
                    ReassignMove move = tryTrade(unplaced.get(random.nextInt(unplaced.size())));
                    if (move != null) {
                        return move;
                    }
                }
                // Nothing to trade this time: a move that changes nothing, which the solver skips as not doable.
                Visit v = visits.get(random.nextInt(visits.size()));
                return new ReassignMove(new Visit[] {v}, new Placement[] {v.getPlacement()});
            }

            private boolean isFree(Visit v, Placement p) {
                int start = p.startMinute();
                int end = start + v.lengthOn(p.telescopeIndex());
                for (Visit o : byTelescopeNight.getOrDefault(p.telescopeIndex() * 1_000_000L + p.nightEpochDay(),
                        List.of())) {
                    if (o.startMinute() < end && start < o.endMinute()) {
                        return false;
                    }
                }
                return true;
            }

            private ReassignMove tryTrade(Visit v) {
                // A few tries for a free candidate first: taking other visits off loses what they were worth.
                Placement p = null;
                for (int i = 0; i < 4 && (p == null || !isFree(v, p)); i++) {
                    p = v.getCandidates().get(random.nextInt(v.candidateCount()));
                }
                int start = p.startMinute();
                int end = start + v.lengthOn(p.telescopeIndex());
                List<Visit> moved = new ArrayList<>();
                List<Placement> to = new ArrayList<>();
                moved.add(v);
                to.add(p);
                int grantIndex = v.grantOf(p);
                long grantMinutesUsed = used.getOrDefault(grantIndex, 0L) + (end - start);
                for (Visit o : byTelescopeNight.getOrDefault(p.telescopeIndex() * 1_000_000L + p.nightEpochDay(),
                        List.of())) {
                    if (o.startMinute() < end && start < o.endMinute()) {
                        if (o.isPinned()) {
                            return null;
                        }
                        moved.add(o);
                        to.add(null);
                        if (o.grantIndex() == grantIndex) {
                            grantMinutesUsed -= o.placedMinutes();
                        }
                    }
                }
                Long grant = grants.get(grantIndex);
                if (grant == null || grantMinutesUsed <= grant) {
                    // No trade needed: the ejection move covers this case, and it also re-fits what it takes off.
                    return null;
                }
                // Give up the program's visits worth least per granted minute, all of them worth less per minute
                // than the visit that comes in; a random key among equals so repeated tries explore.
                double incoming = (double) v.priorityWeight() * v.nominalMinutes() / (end - start);
                List<Visit> cheaper = new ArrayList<>();
                Map<Visit, Double> key = new HashMap<>();
                for (Visit o : placedByGrant.getOrDefault(grantIndex, List.of())) {
                    double perMinute = (double) o.priorityWeight() * o.nominalMinutes() / o.placedMinutes();
                    if (!o.isPinned() && perMinute < incoming && !moved.contains(o)) {
                        cheaper.add(o);
                        key.put(o, perMinute + random.nextDouble() * 0.5);
                    }
                }
                cheaper.sort((a, b) -> Double.compare(key.get(a), key.get(b)));
                for (Visit o : cheaper) {
                    if (grantMinutesUsed <= grant) {
                        break;
                    }
                    moved.add(o);
                    to.add(null);
                    grantMinutesUsed -= o.placedMinutes();
                }
                if (grantMinutesUsed > grant) {
                    return null;
                }
                return new ReassignMove(moved.toArray(new Visit[0]), to.toArray(new Placement[0]));
            }
        };
    }
}
