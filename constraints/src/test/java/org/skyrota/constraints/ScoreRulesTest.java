package org.skyrota.constraints;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Duration;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.optaplanner.core.api.score.stream.ConstraintBuilder;
import org.optaplanner.core.api.score.stream.ConstraintFactory;
import org.skyrota.planning.domain.RuleNames;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.SolveOptions;
import org.skyrota.plugin.PluginApi;
import org.skyrota.plugin.PluginDescriptor;

/** The checks on score-rule plugins, and a plugin rule's weight reaching a real planner run. */
class ScoreRulesTest {

    /** A rule of our own: every placed visit costs its minutes at the given weight. */
    record EveryPlacedMinute(String id, String name, HardMediumSoftLongScore weight) implements ScoreRule {
        @Override
        public PluginDescriptor descriptor() {
            return new PluginDescriptor(id, "Test rule " + id, "1", PluginApi.VERSION);
        }

        @Override
        public String ruleName() {
            return name;
        }

        @Override
        public HardMediumSoftLongScore defaultWeight() {
            return weight;
        }

        @Override
        public ConstraintBuilder define(ConstraintFactory factory, HardMediumSoftLongScore w) {
            return factory.forEach(Visit.class).penalizeLong(w, Visit::placedMinutes);
        }
    }

    @Test
    void aBuiltInNameADuplicateNameAndANegativeWeightAreLeftOutWithTheReason() {
        ScoreRules rules = ScoreRules.of(List.of(
                new EveryPlacedMinute("a", "Placed minutes", HardMediumSoftLongScore.ofSoft(1)),
                new EveryPlacedMinute("b", RuleNames.URGENCY, HardMediumSoftLongScore.ofSoft(1)),
                new EveryPlacedMinute("c", "Placed minutes", HardMediumSoftLongScore.ofSoft(2)),
                new EveryPlacedMinute("d", "Negative", HardMediumSoftLongScore.ofSoft(-1)),
                new EveryPlacedMinute("e", "Bad=name", HardMediumSoftLongScore.ofSoft(1))));
        assertThat(rules.defaultWeights()).containsOnlyKeys("Placed minutes");
        assertThat(rules.problems()).hasSize(4);
        assertThat(rules.problems().get(0)).contains("built-in");
        assertThat(rules.problems().get(1)).contains("already taken");
        assertThat(rules.problems().get(2)).contains("must not be negative");
        assertThat(rules.problems().get(3)).contains("'='");
    }

    @Test
    void aPluginRulesWeightIsOverriddenPerRunByName() {
        ScoreRules rules = ScoreRules.of(List.of(
                new EveryPlacedMinute("a", "Placed minutes", HardMediumSoftLongScore.ofSoft(1))));
        Planner planner = rules.planner(TestProblems.SKY);
        var problem = TestProblems.problem(TestProblems.TELESCOPES.subList(0, 1), List.of(TestProblems.request("r1",
                "lab", 270, 30, 3, TestProblems.FIRST, TestProblems.FIRST)), 1, 100);
        SolveOptions options = SolveOptions.of(Duration.ofSeconds(10)).withEvaluationLimit(2_000).withSeed(1);

        PlanResult byDefault = planner.solve(problem, options);
        long minutes = byDefault.prepared().schedule().visits().get(0).placedMinutes();
        assertThat(minutes).isPositive();
        assertThat(byDefault.scoreByRule().get("Placed minutes")).isEqualTo(HardMediumSoftLongScore.ofSoft(-minutes));

        // A run that moves the rule to the medium level, as one may move a built-in rule; the visit is still worth
        // placing (priority 3 × its minutes outweighs 1 × its minutes), and the explanation uses the run's weight.
        PlanResult medium = planner.solve(problem,
                options.withWeights(Map.of("Placed minutes", HardMediumSoftLongScore.ofMedium(1))));
        assertThat(medium.scoreByRule().get("Placed minutes")).isEqualTo(HardMediumSoftLongScore.ofMedium(-minutes));
    }

    @Test
    void aRunNamingAnUnknownRuleIsRefusedNamingIt() {
        Planner planner = ScoreRules.none().planner(TestProblems.SKY);
        var problem = TestProblems.problem(TestProblems.TELESCOPES, List.of(), 1, 100);
        assertThatThrownBy(() -> planner.prepare(problem, SolveOptions.of(Duration.ofSeconds(1))
                .withWeights(Map.of("No such rule", HardMediumSoftLongScore.ofSoft(1)))))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("No such rule");
    }
}
