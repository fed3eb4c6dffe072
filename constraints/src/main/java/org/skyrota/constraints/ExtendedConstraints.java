package org.skyrota.constraints;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.optaplanner.core.api.score.stream.Constraint;
import org.optaplanner.core.api.score.stream.ConstraintFactory;
import org.optaplanner.core.api.score.stream.ConstraintProvider;
import org.skyrota.planning.solver.ExtraRules;

/**
 * The built-in rules of {@link SkyrotaConstraints} followed by a set of {@link ScoreRule} plugins.
 *
 * <p>Why custom properties: OptaPlanner makes the provider from its class and then sets the solver configuration's
 * {@code constraintProviderCustomProperties} on it through setters, once per solver factory. The planner passes the
 * key of a {@link ScoreRules} set and the run's weights that way, so each run's provider is built for that run alone
 * and nothing is shared between runs but the (immutable) rule set. A rule weighted zero is switched off by leaving
 * its constraint out, as OptaPlanner does for a built-in rule weighted zero.
 */
public final class ExtendedConstraints implements ConstraintProvider {

    private ScoreRules rules = ScoreRules.none();
    private Map<String, HardMediumSoftLongScore> weights = Map.of();

    /** For OptaPlanner; the rules and weights arrive through the setters. */
    public ExtendedConstraints() {
    }

    /** For tests: these rules at these weights (a rule missing from {@code weights} has its default). */
    public ExtendedConstraints(ScoreRules rules, Map<String, HardMediumSoftLongScore> weights) {
        this.rules = rules;
        this.weights = Map.copyOf(weights);
    }

    /** Custom property {@value ScoreRules#SET_PROPERTY}: the key of the rule set. */
    public void setScoreRuleSet(String key) {
        this.rules = ScoreRules.byKey(key);
    }

    /** Custom property {@value ExtraRules#WEIGHTS_PROPERTY}: the run's weights, as {@link ExtraRules#encode(Map)}. */
    public void setRuleWeights(String encoded) {
        this.weights = ExtraRules.decode(encoded);
    }

    @Override
    public Constraint[] defineConstraints(ConstraintFactory factory) {
        List<Constraint> all = new ArrayList<>(List.of(new SkyrotaConstraints().defineConstraints(factory)));
        for (ScoreRule rule : rules.rules()) {
            HardMediumSoftLongScore weight = weights.getOrDefault(rule.ruleName(), rule.defaultWeight());
            if (!weight.isZero()) {
                all.add(rule.define(factory, weight).asConstraint(rule.ruleName()));
            }
        }
        return all.toArray(Constraint[]::new);
    }
}
