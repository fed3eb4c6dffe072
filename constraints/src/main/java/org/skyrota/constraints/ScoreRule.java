package org.skyrota.constraints;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.optaplanner.core.api.score.stream.ConstraintBuilder;
import org.optaplanner.core.api.score.stream.ConstraintFactory;
import org.skyrota.plugin.SkyrotaPlugin;

/**
 * A plugin that adds one score rule to the planner: an OptaPlanner constraint over the planning domain
 * ({@link org.skyrota.planning.domain.Visit} with its placement, and the problem facts
 * {@link org.skyrota.planning.domain.TelescopeMount}, {@link org.skyrota.planning.domain.ClosedNight},
 * {@link org.skyrota.planning.domain.ProgramGrant}), with a default weight that a run may override by the rule's
 * name like any built-in rule's.
 *
 * <p>Found with {@link java.util.ServiceLoader} (a {@code META-INF/services/org.skyrota.constraints.ScoreRule} file
 * in the plugin's jar), on the class path or in the server's plugins folder. Like the built-in rules, a rule only
 * reads numbers that were precomputed before solving; it must not ask the sky engine while the solver runs.
 */
public interface ScoreRule extends SkyrotaPlugin {

    /**
     * The rule's name: the constraint's name in score explanations and the key of its weight in a run's
     * {@code weights}. Not blank, at most 80 characters, no line feed, not the name of a built-in rule.
     */
    String ruleName();

    /**
     * The weight used unless a run overrides it; not negative at any level. A hard weight makes the rule a limit,
     * a medium one competes with placed time, a soft one only chooses between plans of equal placed time.
     */
    HardMediumSoftLongScore defaultWeight();

    /**
     * The rule as a constraint stream that penalizes (or rewards) with the weight given, up to but not including
     * {@code asConstraint}: the planner names the constraint {@link #ruleName()} itself. For example
     * {@code factory.forEach(Visit.class).filter(...).penalizeLong(weight, v -> minutes)}.
     *
     * @param factory the constraint factory; not null
     * @param weight  the run's weight of this rule, never zero (a rule weighted zero is left out of the run)
     */
    ConstraintBuilder define(ConstraintFactory factory, HardMediumSoftLongScore weight);
}
