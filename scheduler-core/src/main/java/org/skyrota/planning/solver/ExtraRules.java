package org.skyrota.planning.solver;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.stream.Collectors;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.skyrota.planning.domain.RuleNames;

/**
 * Score rules beyond the built-in ones (plugins), as the planner sees them: their names and default weights, and
 * the custom properties that tell the constraint provider which rule set to add. The planner knows no rule types
 * (they live in the constraints module); it only splits each run's weights between {@link
 * org.skyrota.planning.domain.PlannerWeights} and these rules and hands the latter to the provider.
 *
 * @param defaultWeights     rule name to default weight, in the order the rules are added; no built-in name
 * @param providerProperties custom properties set on the constraint provider instance (OptaPlanner's
 *                           {@code constraintProviderCustomProperties}), for example the key of a rule set
 */
public record ExtraRules(Map<String, HardMediumSoftLongScore> defaultWeights, Map<String, String> providerProperties) {

    /** The custom property carrying each run's weights of the extra rules, see {@link #encode(Map)}. */
    public static final String WEIGHTS_PROPERTY = "ruleWeights";

    /** No rules beyond the built-in ones. */
    public static final ExtraRules NONE = new ExtraRules(Map.of(), Map.of());

    public ExtraRules {
        defaultWeights = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(defaultWeights));
        providerProperties = Map.copyOf(providerProperties);
        for (Map.Entry<String, HardMediumSoftLongScore> e : defaultWeights.entrySet()) {
            if (RuleNames.ALL.contains(e.getKey())) {
                throw new IllegalArgumentException("score rule '" + e.getKey() + "' is built in and cannot be added again");
            }
            checkWeight(e.getKey(), e.getValue());
        }
        if (providerProperties.containsKey(WEIGHTS_PROPERTY)) {
            throw new IllegalArgumentException("provider property '" + WEIGHTS_PROPERTY + "' is set by the planner");
        }
    }

    /**
     * Every extra rule's weight for one run: the defaults with the run's overrides of extra rules applied; built-in
     * names in {@code overrides} are left to {@link org.skyrota.planning.domain.PlannerWeights}.
     *
     * @throws IllegalArgumentException naming an unknown rule or a negative weight
     */
    public Map<String, HardMediumSoftLongScore> weightsFor(Map<String, HardMediumSoftLongScore> overrides) {
        Map<String, HardMediumSoftLongScore> weights = new LinkedHashMap<>(defaultWeights);
        for (Map.Entry<String, HardMediumSoftLongScore> e : overrides.entrySet()) {
            if (RuleNames.ALL.contains(e.getKey())) {
                continue;
            }
            if (!defaultWeights.containsKey(e.getKey())) {
                throw new IllegalArgumentException("unknown score rule '" + e.getKey() + "'; known: " + RuleNames.ALL
                        + (defaultWeights.isEmpty() ? "" : " and " + defaultWeights.keySet()));
            }
            checkWeight(e.getKey(), e.getValue());
            weights.put(e.getKey(), e.getValue());
        }
        return weights;
    }

    /**
     * Weights as one property value: {@code name=score} pairs joined by a line feed, each score as
     * {@link HardMediumSoftLongScore#toString()} prints it ({@code 0hard/0medium/10soft}). Rule names hold no line feed.
     */
    public static String encode(Map<String, HardMediumSoftLongScore> weights) {
        return weights.entrySet().stream().map(e -> e.getKey() + "=" + e.getValue()).collect(Collectors.joining("\n"));
    }

    /** The inverse of {@link #encode(Map)}. */
    public static Map<String, HardMediumSoftLongScore> decode(String text) {
        Map<String, HardMediumSoftLongScore> weights = new LinkedHashMap<>();
        if (text == null || text.isEmpty()) {
            return weights;
        }
        for (String line : text.split("\n")) {
            int eq = line.lastIndexOf('=');
            weights.put(line.substring(0, eq), HardMediumSoftLongScore.parseScore(line.substring(eq + 1)));
        }
        return weights;
    }

    private static void checkWeight(String rule, HardMediumSoftLongScore w) {
        if (w == null || w.hardScore() < 0 || w.mediumScore() < 0 || w.softScore() < 0) {
            throw new IllegalArgumentException("weight of rule '" + rule + "' must not be negative, got " + w);
        }
    }
}
