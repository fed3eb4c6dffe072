package org.skyrota.planning.solver.moves;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.reflect.Proxy;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Random;

import org.junit.jupiter.api.Test;
import org.optaplanner.core.api.score.director.ScoreDirector;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.PlannerWeights;
import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;

/**
 * The grant trade move on hand-made schedules (one telescope, one night, 60-minute visits on a 60-minute candidate
 * grid): the numbers are chosen so that the expected trade can be worked out by hand.
 */
class GrantTradeMoveFactoryTest {
    private static final int NIGHT = 20_000;

    @Test
    void aHighPriorityVisitComesInAndTheProgramsCheapestVisitGoesOutToKeepTheGrant() {
        // Program "lab" is granted 120 minutes and uses them all on two placed visits (priority 1 and 3); a priority-5
        // visit of the same program waits with one free candidate. Any trade must drop the priority-1 visit only:
        // 120 + 60 - 60 = 120 minutes, within the grant, and 5 > 1 per minute.
        List<Placement> slots = slots(4);
        Visit low = visit("low", "lab", 1, List.of(slots.get(0)));
        Visit mid = visit("mid", "lab", 3, List.of(slots.get(1)));
        Visit high = visit("high", "lab", 5, List.of(slots.get(3)));
        low.setPlacement(slots.get(0));
        mid.setPlacement(slots.get(1));
        Schedule schedule = schedule(List.of(low, mid, high), 120);

        List<ReassignMove> trades = trades(schedule, 50);

        assertThat(trades).isNotEmpty().allSatisfy(m -> {
            assertThat(new ArrayList<Object>(m.getPlanningEntities())).containsExactlyInAnyOrder(high, low);
            assertThat(new ArrayList<Object>(m.getPlanningValues())).containsExactly(slots.get(3));
        });
        ReassignMove move = trades.get(0);
        ScoreDirector<Schedule> director = director(schedule);
        move.doMoveOnly(director);
        assertThat(high.getPlacement()).isSameAs(slots.get(3));
        assertThat(low.isPlaced()).isFalse();
        assertThat(mid.getPlacement()).isSameAs(slots.get(1));
    }

    @Test
    void noTradeWhenTheGrantHasRoomOrOnlyVisitsWorthMorePerMinuteCouldGo() {
        List<Placement> slots = slots(4);
        Visit placed = visit("placed", "lab", 5, List.of(slots.get(0)));
        Visit waiting = visit("waiting", "lab", 2, List.of(slots.get(2)));
        placed.setPlacement(slots.get(0));

        // The grant has room: plain placement (ejection or change moves) does it, no trade is offered.
        assertThat(trades(schedule(List.of(placed, waiting), 240), 50)).isEmpty();
        // The grant is full, but the only visit that could go is worth more per minute than the one coming in.
        assertThat(trades(schedule(List.of(placed, waiting), 60), 50)).isEmpty();
    }

    @Test
    void pinnedVisitsAreNeverGivenUp() {
        List<Placement> slots = slots(4);
        Visit pinned = visit("pinned", "lab", 1, List.of(slots.get(0)));
        pinned.setPlacement(slots.get(0));
        pinned.setPinned(true);
        Visit high = visit("high", "lab", 5, List.of(slots.get(2)));

        assertThat(trades(schedule(List.of(pinned, high), 60), 50)).isEmpty();
    }

    /** The moves that change something among {@code count} drawn (the factory offers a no-op when it finds none). */
    private static List<ReassignMove> trades(Schedule schedule, int count) {
        ScoreDirector<Schedule> director = director(schedule);
        Iterator<ReassignMove> it = new GrantTradeMoveFactory().createRandomMoveIterator(director, new Random(1));
        List<ReassignMove> found = new ArrayList<>();
        for (int i = 0; i < count; i++) {
            ReassignMove m = it.next();
            if (m.isMoveDoable(director)) {
                found.add(m);
            }
        }
        return found;
    }

    private static List<Placement> slots(int n) {
        List<Placement> slots = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            slots.add(new Placement(i, 0, 0, 60 * i, NIGHT));
        }
        return slots;
    }

    private static Visit visit(String id, String program, int priority, List<Placement> candidates) {
        int n = candidates.size();
        Visit v = new Visit(id, id, 0, program, 1.0, 1.0, priority, priority, 60, 0, new int[] {60}, new int[] {0},
                candidates, new int[n], new int[n], new int[n], new byte[n]);
        v.setGrants(new int[n]);
        return v;
    }

    private static Schedule schedule(List<Visit> visits, long grantMinutes) {
        return new Schedule(Instant.EPOCH, 5, List.of("scope"), List.of(),
                List.of(new ProgramGrant(0, "lab", grantMinutes, 1.0, "lab's grant")), visits, PlannerWeights.defaults());
    }

    /**
     * A score director that only hands out the working solution: the factory reads nothing else, and the move's
     * change notifications have no score to update here.
     */
    @SuppressWarnings("unchecked")
    private static ScoreDirector<Schedule> director(Schedule schedule) {
        return (ScoreDirector<Schedule>) Proxy.newProxyInstance(GrantTradeMoveFactoryTest.class.getClassLoader(),
                new Class<?>[] {ScoreDirector.class}, (proxy, method, args) -> switch (method.getName()) {
                    case "getWorkingSolution" -> schedule;
                    case "hashCode" -> System.identityHashCode(proxy);
                    case "equals" -> proxy == args[0];
                    default -> null;
                });
    }
}
