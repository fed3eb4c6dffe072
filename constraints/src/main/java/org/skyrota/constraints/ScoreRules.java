package org.skyrota.constraints;

import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicLong;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.skyrota.planning.domain.RuleNames;
import org.skyrota.planning.sky.SkyModel;
import org.skyrota.planning.solver.ExtraRules;
import org.skyrota.planning.solver.Planner;
import org.skyrota.plugin.PluginRegistry;

/**
 * The score-rule plugins of one planner, checked: names unique, none a built-in rule's, weights not negative.
 * A rule that fails a check is left out and described in {@link #problems()}.
 *
 * <p>OptaPlanner makes the constraint provider from its class with no arguments, so the rule instances cannot be
 * handed to it. Each set is therefore held in a small static map under a key of its own, and the planner passes the
 * key (and each run's weights) to {@link ExtendedConstraints} as OptaPlanner custom properties. The map holds one
 * entry per set ever made (the server makes one when it loads its plugins), never per run.
 */
public final class ScoreRules {

    /** The custom property naming the rule set, see {@link ExtendedConstraints#setScoreRuleSet(String)}. */
    public static final String SET_PROPERTY = "scoreRuleSet";

    private static final Map<String, ScoreRules> SETS = new ConcurrentHashMap<>();
    private static final AtomicLong NEXT_KEY = new AtomicLong();
    private static final int MAX_NAME_LENGTH = 80;

    private final List<ScoreRule> rules;
    private final List<String> problems;
    private final Map<String, HardMediumSoftLongScore> defaults;
    private volatile String key;

    private ScoreRules(List<ScoreRule> rules, List<String> problems) {
        this.rules = List.copyOf(rules);
        this.problems = List.copyOf(problems);
        Map<String, HardMediumSoftLongScore> d = new LinkedHashMap<>();
        for (ScoreRule r : rules) {
            d.put(r.ruleName(), r.defaultWeight());
        }
        this.defaults = java.util.Collections.unmodifiableMap(d);
    }

    /** No plugin rules. */
    public static ScoreRules none() {
        return new ScoreRules(List.of(), List.of());
    }

    /** The score rules a registry loaded (load it with {@link ScoreRule} among its services). */
    public static ScoreRules from(PluginRegistry registry) {
        return of(registry.plugins(ScoreRule.class));
    }

    /** The score rules found by {@link java.util.ServiceLoader} in a class loader. */
    public static ScoreRules load(ClassLoader loader) {
        return from(PluginRegistry.load(loader, List.of(), List.of(ScoreRule.class)));
    }

    /** The rules given, each checked; those that fail are left out with the reason. */
    public static ScoreRules of(Collection<? extends ScoreRule> candidates) {
        List<ScoreRule> kept = new ArrayList<>();
        List<String> problems = new ArrayList<>();
        Map<String, ScoreRule> byName = new LinkedHashMap<>();
        for (ScoreRule r : candidates) {
            String provider = r.getClass().getName();
            String name;
            HardMediumSoftLongScore weight;
            try {
                name = r.ruleName();
                weight = r.defaultWeight();
            } catch (RuntimeException | LinkageError e) {
                problems.add(provider + ": ruleName() or defaultWeight() failed: " + e);
                continue;
            }
            if (name == null || name.isBlank() || name.length() > MAX_NAME_LENGTH || name.contains("\n")
                    || name.contains("=")) {
                problems.add(provider + ": rule name must be 1-" + MAX_NAME_LENGTH
                        + " characters without a line feed or '=': " + name);
            } else if (RuleNames.ALL.contains(name)) {
                problems.add(provider + ": rule name '" + name + "' is a built-in rule's");
            } else if (byName.containsKey(name)) {
                problems.add(provider + ": rule name '" + name + "' is already taken by "
                        + byName.get(name).getClass().getName() + "; the second is skipped");
            } else if (weight == null || weight.hardScore() < 0 || weight.mediumScore() < 0 || weight.softScore() < 0) {
                problems.add(provider + ": default weight of rule '" + name + "' must not be negative, got " + weight);
            } else {
                byName.put(name, r);
                kept.add(r);
            }
        }
        return new ScoreRules(kept, problems);
    }

    /** The rules kept, in the order they were given. */
    public List<ScoreRule> rules() {
        return rules;
    }

    /** Each kept rule's default weight by rule name. */
    public Map<String, HardMediumSoftLongScore> defaultWeights() {
        return defaults;
    }

    /** Why a rule was left out, one line each. */
    public List<String> problems() {
        return problems;
    }

    /** These rules as the planner sees them: names, default weights, and the key the provider finds them by. */
    public ExtraRules extraRules() {
        if (rules.isEmpty()) {
            return ExtraRules.NONE;
        }
        return new ExtraRules(defaults, Map.of(SET_PROPERTY, key()));
    }

    /** A planner with the built-in rules and these. */
    public Planner planner(SkyModel sky) {
        return new Planner(sky, ExtendedConstraints.class, extraRules());
    }

    private String key() {
        String k = key;
        if (k == null) {
            synchronized (this) {
                if (key == null) {
                    key = "set-" + NEXT_KEY.incrementAndGet();
                    SETS.put(key, this);
                }
                k = key;
            }
        }
        return k;
    }

    static ScoreRules byKey(String key) {
        ScoreRules set = SETS.get(key);
        if (set == null) {
            throw new IllegalStateException("no score-rule set '" + key + "' was made in this process");
        }
        return set;
    }
}
