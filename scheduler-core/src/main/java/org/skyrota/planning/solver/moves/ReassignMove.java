package org.skyrota.planning.solver.moves;

import java.util.Arrays;
import java.util.Collection;
import java.util.List;

import org.optaplanner.core.api.score.director.ScoreDirector;
import org.optaplanner.core.impl.heuristic.move.AbstractMove;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;

/** Sets several visits' placements at once (one may be null each); its own undo is the same move backwards. */
final class ReassignMove extends AbstractMove<Schedule> {
    private final Visit[] visits;
    private final Placement[] to;

    ReassignMove(Visit[] visits, Placement[] to) {
        this.visits = visits;
        this.to = to;
    }

    @Override
    public boolean isMoveDoable(ScoreDirector<Schedule> scoreDirector) {
        boolean changes = false;
        for (int i = 0; i < visits.length; i++) {
            if (visits[i].isPinned()) {
                return false;
            }
            changes |= visits[i].getPlacement() != to[i];
        }
        return changes;
    }

    @Override
    protected ReassignMove createUndoMove(ScoreDirector<Schedule> scoreDirector) {
        Placement[] from = new Placement[visits.length];
        for (int i = 0; i < visits.length; i++) {
            from[i] = visits[i].getPlacement();
        }
        Visit[] reversed = visits.clone();
        reverse(reversed);
        reverse(from);
        return new ReassignMove(reversed, from);
    }

    @Override
    protected void doMoveOnGenuineVariables(ScoreDirector<Schedule> scoreDirector) {
        for (int i = 0; i < visits.length; i++) {
            scoreDirector.beforeVariableChanged(visits[i], "placement");
            visits[i].setPlacement(to[i]);
            scoreDirector.afterVariableChanged(visits[i], "placement");
        }
    }

    @Override
    public ReassignMove rebase(ScoreDirector<Schedule> destinationScoreDirector) {
        Visit[] rebased = new Visit[visits.length];
        for (int i = 0; i < visits.length; i++) {
            rebased[i] = destinationScoreDirector.lookUpWorkingObject(visits[i]);
        }
        // Placements are problem values shared by identity and never cloned.
        return new ReassignMove(rebased, to.clone());
    }

    @Override
    public Collection<?> getPlanningEntities() {
        return List.of(visits);
    }

    @Override
    public Collection<?> getPlanningValues() {
        return Arrays.stream(to).filter(p -> p != null).toList();
    }

    @Override
    public String toString() {
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < visits.length; i++) {
            b.append(i == 0 ? "" : ", ").append(visits[i].id()).append("->").append(to[i]);
        }
        return b.toString();
    }

    private static <T> void reverse(T[] a) {
        for (int i = 0, j = a.length - 1; i < j; i++, j--) {
            T t = a[i];
            a[i] = a[j];
            a[j] = t;
        }
    }
}
