package org.skyrota.plugins.mount;

import static org.skyrota.plugins.mount.MountVisits.germanEquatorial;
import static org.skyrota.plugins.mount.MountVisits.limited;
import static org.skyrota.plugins.mount.MountVisits.startToEndAt;
import static org.skyrota.plugins.mount.MountVisits.unlimited;
import static org.skyrota.plugins.mount.MountVisits.visit;

import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.optaplanner.test.api.score.stream.ConstraintVerifier;
import org.skyrota.constraints.ExtendedConstraints;
import org.skyrota.constraints.ScoreRule;
import org.skyrota.constraints.ScoreRules;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;

/**
 * One nested class per rule of the plugin, each with cases that fire and cases that do not. Hour angles follow the
 * usual convention (common practice): negative east of the meridian, zero on it, positive west.
 */
class MountRulesTest {
    private static final HourAngleLimitRule LIMITS = new HourAngleLimitRule();
    private static final MeridianFlipRule FLIP = new MeridianFlipRule();
    private final ConstraintVerifier<ExtendedConstraints, Schedule> verifier = ConstraintVerifier.build(
            new ExtendedConstraints(ScoreRules.of(List.of(LIMITS, FLIP)), Map.of()), Schedule.class, Visit.class);

    private static ConstraintVerifierFunction ruleOf(ScoreRule rule) {
        return (provider, factory) -> rule.define(factory, rule.defaultWeight()).asConstraint(rule.ruleName());
    }

    interface ConstraintVerifierFunction extends java.util.function.BiFunction<ExtendedConstraints,
            org.optaplanner.core.api.score.stream.ConstraintFactory, org.optaplanner.core.api.score.stream.Constraint> {
    }

    @Nested
    class OutsideHourAngleLimits {
        @Test
        void aVisitRunningPastTheWestLimitCostsTheMinutesBeyondIt() {
            // West limit 0: the mount cannot follow past the meridian (say a pier in the way). The visit starts
            // 20 minutes of sidereal time before the meridian and lasts 60 minutes: 40 minutes beyond.
            Visit v = visit(0, 60, startToEndAt(0, 20));
            verifier.verifyThat(ruleOf(LIMITS)).given(v, limited(0, -90, 0)).penalizesBy(40);
        }

        @Test
        void aVisitStartingBeforeTheEastLimitCostsTheMinutesBeforeIt() {
            // East limit -60°: the visit starts at -65°, 5° (20 minutes of sidereal time) too far east.
            Visit v = visit(0, 60, -65);
            verifier.verifyThat(ruleOf(LIMITS)).given(v, limited(0, -60, 60)).penalizesBy(20);
        }

        @Test
        void aVisitThroughTheLowerMeridianIsBeyondBothLimits() {
            // From 170° on for 80 minutes (20.05°): 10° to 180°, then on to -169.95°; limits ±150° leave it all outside.
            Visit v = visit(0, 80, 170);
            verifier.verifyThat(ruleOf(LIMITS)).given(v, limited(0, -150, 150)).penalizesBy(80);
        }

        @Test
        void aVisitInsideTheLimitsOrOnAnotherTelescopeOrWithoutLimitsCostsNothing() {
            Visit inside = visit(0, 60, startToEndAt(0, 60));
            Visit otherTelescope = visit(1, 60, 100);
            Visit noLimits = visit(2, 60, 170);
            verifier.verifyThat(ruleOf(LIMITS))
                    .given(inside, otherTelescope, noLimits, limited(0, -90, 0), unlimited(1), unlimited(2))
                    .penalizesBy(0);
        }
    }

    @Nested
    class MeridianFlipDuringVisit {
        @Test
        void aVisitThatCrossesTheMeridianOnAFlippingMountCostsOnce() {
            Visit crossing = visit(0, 60, -5);
            verifier.verifyThat(ruleOf(FLIP)).given(crossing, germanEquatorial(0)).penalizesBy(1);
        }

        @Test
        void visitsThatEndOnTheMeridianStartOnItOrRunOnAMountThatNeedNotFlipCostNothing() {
            Visit endsOnIt = visit(0, 60, startToEndAt(0, 60));
            Visit startsOnIt = visit(0, 60, 0);
            Visit lowerMeridian = visit(0, 60, 175);
            Visit noFlip = visit(1, 60, -5);
            verifier.verifyThat(ruleOf(FLIP))
                    .given(endsOnIt, startsOnIt, lowerMeridian, noFlip, germanEquatorial(0), unlimited(1))
                    .penalizesBy(0);
        }
    }

    @Test
    void theRunsWeightReplacesTheDefaultAndZeroSwitchesTheRuleOff() {
        Visit crossing = visit(0, 60, -5);
        ConstraintVerifier<ExtendedConstraints, Schedule> weighted = ConstraintVerifier.build(
                new ExtendedConstraints(ScoreRules.of(List.of(FLIP)),
                        Map.of(MeridianFlipRule.NAME, HardMediumSoftLongScore.ofMedium(7))),
                Schedule.class, Visit.class);
        // The whole score: the built-in rules find nothing to penalize beyond this placed visit's own costs (all 0).
        weighted.verifyThat().given(crossing, germanEquatorial(0)).scores(HardMediumSoftLongScore.ofMedium(-7));
        ConstraintVerifier<ExtendedConstraints, Schedule> off = ConstraintVerifier.build(
                new ExtendedConstraints(ScoreRules.of(List.of(FLIP)),
                        Map.of(MeridianFlipRule.NAME, HardMediumSoftLongScore.ZERO)),
                Schedule.class, Visit.class);
        off.verifyThat().given(crossing, germanEquatorial(0)).scores(HardMediumSoftLongScore.ZERO);
    }
}
