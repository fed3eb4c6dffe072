package org.skyrota.planning.domain;

import java.lang.reflect.Field;
import java.util.LinkedHashMap;
import java.util.Map;

import org.optaplanner.core.api.domain.constraintweight.ConstraintConfiguration;
import org.optaplanner.core.api.domain.constraintweight.ConstraintWeight;
import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;

/**
 * The weight of every score rule, adjustable per run: start from {@link #defaults()} and apply
 * {@link #withOverrides(Map)}. A weight of zero switches a rule off; moving "Program over grant" from the hard
 * to the medium level makes grants a strong wish instead of a limit. The README, "Planner score rules and their default weights", explains each default.
 */
@ConstraintConfiguration(constraintPackage = "org.skyrota.constraints")
public final class PlannerWeights {
    @ConstraintWeight(RuleNames.TELESCOPE_OVERLAP)
    private HardMediumSoftLongScore telescopeOverlap = HardMediumSoftLongScore.ofHard(1);
    @ConstraintWeight(RuleNames.OUTSIDE_WINDOW)
    private HardMediumSoftLongScore outsideWindow = HardMediumSoftLongScore.ofHard(1);
    @ConstraintWeight(RuleNames.INSTRUMENT_MISSING)
    private HardMediumSoftLongScore instrumentMissing = HardMediumSoftLongScore.ofHard(1);
    @ConstraintWeight(RuleNames.REPEATS_TOO_CLOSE)
    private HardMediumSoftLongScore repeatsTooClose = HardMediumSoftLongScore.ofHard(1);
    @ConstraintWeight(RuleNames.TOO_CLOSE_TO_OBSERVED)
    private HardMediumSoftLongScore tooCloseToObserved = HardMediumSoftLongScore.ofHard(1);
    @ConstraintWeight(RuleNames.CLOSED_NIGHT)
    private HardMediumSoftLongScore closedNight = HardMediumSoftLongScore.ofHard(1);
    @ConstraintWeight(RuleNames.SUN_AVOIDANCE)
    private HardMediumSoftLongScore sunAvoidance = HardMediumSoftLongScore.ofHard(10);
    @ConstraintWeight(RuleNames.PROGRAM_OVER_GRANT)
    private HardMediumSoftLongScore programOverGrant = HardMediumSoftLongScore.ofHard(1);
    @ConstraintWeight(RuleNames.UNPLACED_VISIT)
    private HardMediumSoftLongScore unplacedVisit = HardMediumSoftLongScore.ofMedium(1);
    @ConstraintWeight(RuleNames.AIRMASS_QUALITY)
    private HardMediumSoftLongScore airmassQuality = HardMediumSoftLongScore.ofSoft(1);
    @ConstraintWeight(RuleNames.SKY_BRIGHTNESS)
    private HardMediumSoftLongScore skyBrightness = HardMediumSoftLongScore.ofSoft(1);
    @ConstraintWeight(RuleNames.IDLE_TIME)
    private HardMediumSoftLongScore idleTime = HardMediumSoftLongScore.ofSoft(1);
    @ConstraintWeight(RuleNames.OVERHEAD_TIME)
    private HardMediumSoftLongScore overheadTime = HardMediumSoftLongScore.ofSoft(1);
    @ConstraintWeight(RuleNames.PROGRAM_FAIRNESS)
    private HardMediumSoftLongScore programFairness = HardMediumSoftLongScore.ofSoft(1);
    @ConstraintWeight(RuleNames.URGENCY)
    private HardMediumSoftLongScore urgency = HardMediumSoftLongScore.ofSoft(1);
    @ConstraintWeight(RuleNames.STABILITY)
    private HardMediumSoftLongScore stability = HardMediumSoftLongScore.ofSoft(200);

    /** Weights of score rules added by plugins, by rule name; not read by OptaPlanner (see the planner's extra rules). */
    private Map<String, HardMediumSoftLongScore> extra = Map.of();

    public static PlannerWeights defaults() {
        return new PlannerWeights();
    }

    /**
     * A copy with some weights replaced, keyed by rule name ({@link RuleNames}).
     *
     * @throws IllegalArgumentException naming an unknown rule or a negative weight
     */
    public PlannerWeights withOverrides(Map<String, HardMediumSoftLongScore> overrides) {
        PlannerWeights copy = new PlannerWeights();
        try {
            for (Field f : PlannerWeights.class.getDeclaredFields()) {
                if (f.isAnnotationPresent(ConstraintWeight.class)) {
                    f.set(copy, f.get(this));
                }
            }
            for (Map.Entry<String, HardMediumSoftLongScore> e : overrides.entrySet()) {
                Field f = field(e.getKey());
                HardMediumSoftLongScore w = e.getValue();
                if (w == null || w.hardScore() < 0 || w.mediumScore() < 0 || w.softScore() < 0) {
                    throw new IllegalArgumentException("weight of rule '" + e.getKey() + "' must not be negative, got " + w);
                }
                f.set(copy, w);
            }
        } catch (IllegalAccessException ex) {
            throw new IllegalStateException(ex);
        }
        copy.extra = extra;
        return copy;
    }

    /** A copy that also records the weights of the plugins' score rules used in this run. */
    public PlannerWeights withExtra(Map<String, HardMediumSoftLongScore> extraWeights) {
        PlannerWeights copy = withOverrides(Map.of());
        copy.extra = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(extraWeights));
        return copy;
    }

    /** The weights of the plugins' score rules in this run, by rule name; empty when there are none. */
    public Map<String, HardMediumSoftLongScore> extra() {
        return extra;
    }

    /** Every weight by rule name, in the order of {@link RuleNames#ALL}. */
    public Map<String, HardMediumSoftLongScore> asMap() {
        Map<String, HardMediumSoftLongScore> map = new LinkedHashMap<>();
        for (String name : RuleNames.ALL) {
            try {
                map.put(name, (HardMediumSoftLongScore) field(name).get(this));
            } catch (IllegalAccessException ex) {
                throw new IllegalStateException(ex);
            }
        }
        return map;
    }

    private static Field field(String ruleName) {
        for (Field f : PlannerWeights.class.getDeclaredFields()) {
            ConstraintWeight w = f.getAnnotation(ConstraintWeight.class);
            if (w != null && w.value().equals(ruleName)) {
                f.setAccessible(true);
                return f;
            }
        }
        throw new IllegalArgumentException("unknown score rule '" + ruleName + "'; known: " + RuleNames.ALL);
    }
}
