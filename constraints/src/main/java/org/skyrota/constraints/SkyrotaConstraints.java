package org.skyrota.constraints;

import static org.optaplanner.core.api.score.stream.ConstraintCollectors.max;
import static org.optaplanner.core.api.score.stream.ConstraintCollectors.min;
import static org.optaplanner.core.api.score.stream.ConstraintCollectors.sum;

import org.optaplanner.core.api.score.stream.Constraint;
import org.optaplanner.core.api.score.stream.ConstraintFactory;
import org.optaplanner.core.api.score.stream.ConstraintProvider;
import org.optaplanner.core.api.score.stream.Joiners;
import org.skyrota.planning.domain.ClosedNight;
import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.domain.RuleNames;
import org.skyrota.planning.domain.Visit;

/**
 * Skyrota's score. Hard rules keep the plan executable and safe; the medium rule maximises priority-weighted
 * time on the sky; soft rules make the placed visits good ones. Weights come from
 * {@link org.skyrota.planning.domain.PlannerWeights}, so every rule penalizes "configurably".
 * Every number read here was precomputed from the sky engine before solving.
 */
public final class SkyrotaConstraints implements ConstraintProvider {

    @Override
    public Constraint[] defineConstraints(ConstraintFactory factory) {
        return new Constraint[] {
                telescopeOverlap(factory),
                outsideVisibilityWindow(factory),
                instrumentOrFilterMissing(factory),
                repeatsTooClose(factory),
                tooCloseToObservedRepeat(factory),
                closedNight(factory),
                sunAvoidance(factory),
                programOverGrant(factory),
                unplacedVisit(factory),
                airmassQuality(factory),
                skyBrightness(factory),
                idleTime(factory),
                overheadTime(factory),
                programFairness(factory),
                urgency(factory),
                stability(factory)
        };
    }

    // Hard

    Constraint telescopeOverlap(ConstraintFactory factory) {
        // Two visits may not use one telescope at the same time; the penalty is the minutes of overlap.
        // Candidates never span two nights, so the telescope-night key narrows the join without losing a pair.
        return factory.forEachUniquePair(Visit.class,
                        Joiners.equal(Visit::telescopeNightKey),
                        Joiners.overlapping(Visit::startMinute, Visit::endMinute))
                .penalizeConfigurableLong((a, b) -> Math.min(a.endMinute(), b.endMinute())
                        - Math.max(a.startMinute(), b.startMinute()))
                .asConstraint(RuleNames.TELESCOPE_OVERLAP);
    }

    Constraint outsideVisibilityWindow(ConstraintFactory factory) {
        // A visit must lie inside a visibility window; only pinned or forced placements can break this.
        return factory.forEach(Visit.class)
                .filter(v -> v.has(Visit.OUTSIDE_WINDOW))
                .penalizeConfigurableLong(Visit::placedMinutes)
                .asConstraint(RuleNames.OUTSIDE_WINDOW);
    }

    Constraint instrumentOrFilterMissing(ConstraintFactory factory) {
        // A visit needs an instrument on its telescope that carries every filter of its exposure plan.
        return factory.forEach(Visit.class)
                .filter(v -> v.has(Visit.INSTRUMENT_MISSING))
                .penalizeConfigurableLong(Visit::placedMinutes)
                .asConstraint(RuleNames.INSTRUMENT_MISSING);
    }

    Constraint repeatsTooClose(ConstraintFactory factory) {
        // Two visits of one request must start at least the repeat interval minus its tolerance apart.
        return factory.forEachUniquePair(Visit.class, Joiners.equal(Visit::requestId))
                .filter((a, b) -> Math.abs(a.startMinute() - b.startMinute()) < a.repeatMinGapMinutes())
                .penalizeConfigurableLong((a, b) -> a.repeatMinGapMinutes() - Math.abs(a.startMinute() - b.startMinute()))
                .asConstraint(RuleNames.REPEATS_TOO_CLOSE);
    }

    Constraint tooCloseToObservedRepeat(ConstraintFactory factory) {
        // A repeat observed already is fixed in the past, so it is not a visit here: its spacing was checked against
        // each candidate beforehand, and only a pin can still break it.
        return factory.forEach(Visit.class)
                .filter(v -> v.has(Visit.TOO_CLOSE_TO_OBSERVED))
                .penalizeConfigurableLong(Visit::placedMinutes)
                .asConstraint(RuleNames.TOO_CLOSE_TO_OBSERVED);
    }

    Constraint closedNight(ConstraintFactory factory) {
        // No visit may run on a night its telescope or site is closed.
        return factory.forEach(Visit.class)
                .join(ClosedNight.class,
                        Joiners.equal(Visit::telescopeIndex, ClosedNight::telescopeIndex),
                        Joiners.equal(v -> v.getPlacement().nightEpochDay(), ClosedNight::nightEpochDay))
                .penalizeConfigurableLong((v, c) -> v.placedMinutes())
                .asConstraint(RuleNames.CLOSED_NIGHT);
    }

    Constraint sunAvoidance(ConstraintFactory factory) {
        // Ordinary visits keep their minimum angle from the Sun, and solar visits need a certified solar filter.
        return factory.forEach(Visit.class)
                .filter(v -> v.has(Visit.SUN_VIOLATION))
                .penalizeConfigurableLong(Visit::placedMinutes)
                .asConstraint(RuleNames.SUN_AVOIDANCE);
    }

    Constraint programOverGrant(ConstraintFactory factory) {
        // A program may not use more telescope minutes than a grant holds; each visit pays from the grant its
        // placement names (a pin no grant covers pays from one of no minutes). The penalty is the excess.
        return factory.forEach(Visit.class)
                .groupBy(Visit::grantIndex, sum(Visit::placedMinutes))
                .join(ProgramGrant.class, Joiners.equal((grant, minutes) -> grant, ProgramGrant::index))
                .filter((index, minutes, grant) -> minutes > grant.grantMinutes())
                .penalizeConfigurableLong((index, minutes, grant) -> minutes - grant.grantMinutes())
                .asConstraint(RuleNames.PROGRAM_OVER_GRANT);
    }

    // Medium

    Constraint unplacedVisit(ConstraintFactory factory) {
        // Every visit left out costs its priority weight times its length, so the plan maximises weighted time.
        return factory.forEachIncludingNullVars(Visit.class)
                .filter(v -> !v.isPlaced())
                .penalizeConfigurableLong(v -> v.priorityWeight() * v.nominalMinutes())
                .asConstraint(RuleNames.UNPLACED_VISIT);
    }

    // Soft

    Constraint airmassQuality(ConstraintFactory factory) {
        // A visit should run near the best airmass its target reaches that night.
        return factory.forEach(Visit.class)
                .filter(v -> v.airmassCost() > 0)
                .penalizeConfigurableLong(Visit::airmassCost)
                .asConstraint(RuleNames.AIRMASS_QUALITY);
    }

    Constraint skyBrightness(ConstraintFactory factory) {
        // A visit should run under a sky as dark as the site's moonless dark sky.
        return factory.forEach(Visit.class)
                .filter(v -> v.skyCost() > 0)
                .penalizeConfigurableLong(Visit::skyCost)
                .asConstraint(RuleNames.SKY_BRIGHTNESS);
    }

    Constraint idleTime(ConstraintFactory factory) {
        // A telescope's visits in one night should follow each other without idle gaps.
        return factory.forEach(Visit.class)
                .groupBy(Visit::telescopeNightKey, min(Visit::startMinute), max(Visit::endMinute),
                        sum(Visit::placedMinutes))
                .filter((key, first, last, busy) -> last - first > busy)
                .penalizeConfigurableLong((key, first, last, busy) -> last - first - busy)
                .asConstraint(RuleNames.IDLE_TIME);
    }

    Constraint overheadTime(ConstraintFactory factory) {
        // Slew, settle, readout and filter-change time is time not spent on science: prefer faster telescopes.
        return factory.forEach(Visit.class)
                .filter(v -> v.overheadMinutes() > 0)
                .penalizeConfigurableLong(Visit::overheadMinutes)
                .asConstraint(RuleNames.OVERHEAD_TIME);
    }

    Constraint programFairness(ConstraintFactory factory) {
        // Each program's share of the placed time should match its share of the grants (squared deviation, times
        // the program's weight: a program of weight 2 counts twice, so a lighter program falls short first).
        return factory.forEachIncludingNullVars(Visit.class)
                .groupBy(new ProgramShareCollector())
                .filter(deviation -> deviation > 0)
                .penalizeConfigurableLong(deviation -> deviation)
                .asConstraint(RuleNames.PROGRAM_FAIRNESS);
    }

    Constraint urgency(ConstraintFactory factory) {
        // Visits whose window closes soon should go first: placing a visit late in its window costs.
        return factory.forEach(Visit.class)
                .filter(v -> v.urgencyCost() > 0)
                .penalizeConfigurableLong(Visit::urgencyCost)
                .asConstraint(RuleNames.URGENCY);
    }

    Constraint stability(ConstraintFactory factory) {
        // A visit of the published plan should stay where it was published.
        return factory.forEachIncludingNullVars(Visit.class)
                .filter(Visit::movedFromPublished)
                .penalizeConfigurableLong(v -> 1L)
                .asConstraint(RuleNames.STABILITY);
    }
}
