package org.skyrota.planning.domain;

import java.time.Instant;
import java.util.List;

import org.optaplanner.core.api.domain.constraintweight.ConstraintConfigurationProvider;
import org.optaplanner.core.api.domain.solution.PlanningEntityCollectionProperty;
import org.optaplanner.core.api.domain.solution.PlanningScore;
import org.optaplanner.core.api.domain.solution.PlanningSolution;
import org.optaplanner.core.api.domain.solution.ProblemFactCollectionProperty;
import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;

/**
 * The planning solution: visits with their candidates, closed nights, grants and the run's weights.
 * Minutes count from {@link #epoch()}.
 */
@PlanningSolution
public class Schedule {
    private Instant epoch;
    private int gridMinutes;
    private List<String> telescopeIds;

    @ProblemFactCollectionProperty
    private List<ClosedNight> closedNights;
    @ProblemFactCollectionProperty
    private List<ProgramGrant> grants;
    @ProblemFactCollectionProperty
    private List<TelescopeMount> mounts = List.of();
    @PlanningEntityCollectionProperty
    private List<Visit> visits;
    @ConstraintConfigurationProvider
    private PlannerWeights weights;
    @PlanningScore
    private HardMediumSoftLongScore score;

    @SuppressWarnings("unused")
    private Schedule() {
        // for the solution cloner
    }

    public Schedule(Instant epoch, int gridMinutes, List<String> telescopeIds, List<ClosedNight> closedNights,
                    List<ProgramGrant> grants, List<Visit> visits, PlannerWeights weights) {
        this.epoch = epoch;
        this.gridMinutes = gridMinutes;
        this.telescopeIds = List.copyOf(telescopeIds);
        this.closedNights = List.copyOf(closedNights);
        this.grants = List.copyOf(grants);
        this.visits = visits;
        this.weights = weights;
    }

    public Instant epoch() {
        return epoch;
    }

    public Instant instantOf(int minute) {
        return epoch.plusSeconds(60L * minute);
    }

    public int gridMinutes() {
        return gridMinutes;
    }

    public List<String> telescopeIds() {
        return telescopeIds;
    }

    public List<ClosedNight> closedNights() {
        return closedNights;
    }

    /** One per telescope whose mount the rules may look at; empty for schedules built without mounts. */
    public List<TelescopeMount> mounts() {
        return mounts;
    }

    public void setMounts(List<TelescopeMount> mounts) {
        this.mounts = List.copyOf(mounts);
    }

    public List<ProgramGrant> grants() {
        return grants;
    }

    public List<Visit> visits() {
        return visits;
    }

    public PlannerWeights weights() {
        return weights;
    }

    public void setWeights(PlannerWeights weights) {
        this.weights = weights;
    }

    public HardMediumSoftLongScore score() {
        return score;
    }

    public void setScore(HardMediumSoftLongScore score) {
        this.score = score;
    }
}
