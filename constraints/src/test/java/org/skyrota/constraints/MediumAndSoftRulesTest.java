package org.skyrota.constraints;

import static org.skyrota.constraints.Fixtures.at;
import static org.skyrota.constraints.Fixtures.visit;

import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.optaplanner.test.api.score.stream.ConstraintVerifier;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;

/** One nested class per medium or soft rule, each with a case that fires and one that does not. */
class MediumAndSoftRulesTest {
    private final ConstraintVerifier<SkyrotaConstraints, Schedule> verifier =
            ConstraintVerifier.build(new SkyrotaConstraints(), Schedule.class, Visit.class);

    @Nested
    class UnplacedVisit {
        @Test
        void anUnplacedVisitCostsPriorityWeightTimesLength() {
            Visit unplacedHighPriority = visit("unplacedHighPriority").priority(5).length(40).build();
            verifier.verifyThat(SkyrotaConstraints::unplacedVisit).given(unplacedHighPriority).penalizesBy(200);
        }

        @Test
        void theProgramsWeightDoesNotScaleIt() {
            // Program weight belongs to fairness; priority alone ranks visits across programs (README, score rules).
            Visit heavyProgram = visit("heavyProgram").program("A", 0.5, 2).priority(5).length(40).build();
            verifier.verifyThat(SkyrotaConstraints::unplacedVisit).given(heavyProgram).penalizesBy(200);
        }

        @Test
        void aPlacedVisitCostsNothing() {
            Visit placed = visit("placed").priority(5).length(40).at(at(0, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::unplacedVisit).given(placed).penalizesBy(0);
        }
    }

    @Nested
    class AirmassQuality {
        @Test
        void aVisitAboveItsBestAirmassIsPenalizedByThePrecomputedCost() {
            Visit lowInTheSky = visit("lowInTheSky").costs(35, 0, 0).at(at(0, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::airmassQuality).given(lowInTheSky).penalizesBy(35);
        }

        @Test
        void aVisitAtItsBestAirmassIsNot() {
            Visit atBest = visit("atBest").costs(0, 0, 0).at(at(0, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::airmassQuality).given(atBest).penalizesBy(0);
        }
    }

    @Nested
    class SkyBrightness {
        @Test
        void aVisitUnderABrightSkyIsPenalized() {
            Visit moonlit = visit("moonlit").costs(0, 150, 0).at(at(0, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::skyBrightness).given(moonlit).penalizesBy(150);
        }

        @Test
        void aVisitUnderADarkSkyIsNot() {
            Visit dark = visit("dark").costs(0, 0, 0).at(at(0, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::skyBrightness).given(dark).penalizesBy(0);
        }
    }

    @Nested
    class IdleTime {
        @Test
        void aGapBetweenTwoVisitsOfOneTelescopeNightIsPenalizedByItsMinutes() {
            Visit early = visit("early").length(30).at(at(0, 600)).build();
            Visit late = visit("late").length(30).at(at(0, 700)).build();
            verifier.verifyThat(SkyrotaConstraints::idleTime).given(early, late).penalizesBy(70);
        }

        @Test
        void backToBackVisitsOrVisitsOnOtherNightsAreNot() {
            Visit early = visit("early").length(30).at(at(0, 600)).build();
            Visit next = visit("next").length(30).at(at(0, 630)).build();
            Visit nextNight = visit("nextNight").length(30).at(at(0, 2000, Fixtures.NIGHT + 1)).build();
            verifier.verifyThat(SkyrotaConstraints::idleTime).given(early, next, nextNight).penalizesBy(0);
        }
    }

    @Nested
    class OverheadTime {
        @Test
        void overheadMinutesArePenalized() {
            Visit slowTelescope = visit("slowTelescope").overhead(7).at(at(0, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::overheadTime).given(slowTelescope).penalizesBy(7);
        }

        @Test
        void anUnplacedVisitHasNoOverhead() {
            Visit unplaced = visit("unplaced").overhead(7).build();
            verifier.verifyThat(SkyrotaConstraints::overheadTime).given(unplaced).penalizesBy(0);
        }
    }

    @Nested
    class ProgramFairness {
        @Test
        void allTimeToOneOfTwoEqualProgramsIsPenalizedByTheSquaredDeviationInPerMille() {
            // shares 1000‰ and 0‰ against grants of 500‰ each: 500² + 500² = 500000.
            Visit placed = visit("placed").program("A", 0.5).at(at(0, 0)).build();
            Visit leftOut = visit("leftOut").program("B", 0.5).build();
            verifier.verifyThat(SkyrotaConstraints::programFairness).given(placed, leftOut).penalizesBy(500_000);
        }

        @Test
        void sharesMatchingTheGrantsAreNot() {
            Visit a = visit("a").program("A", 0.5).length(30).at(at(0, 0)).build();
            Visit b = visit("b").program("B", 0.5).length(30).at(at(1, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::programFairness).given(a, b).penalizesBy(0);
        }

        @Test
        void aProgramOfWeightTwoCountsTwice() {
            // As the first case, but program A weighs 2: 2 × 500² + 1 × 500² = 750000.
            Visit placed = visit("placed").program("A", 0.5, 2).at(at(0, 0)).build();
            Visit leftOut = visit("leftOut").program("B", 0.5, 1).build();
            verifier.verifyThat(SkyrotaConstraints::programFairness).given(placed, leftOut).penalizesBy(750_000);
        }

        @Test
        void whenTimeIsShortLeavingOutALighterProgramCostsLessThanLeavingOutAHeavierOne() {
            // Three programs granted a third each (333.3‰), room for two of three equal visits. The one left out is
            // 333.3‰ short (111111.1 per mille²), the two placed are 166.7‰ over (27777.8 each); A weighs 2.
            // Leaving out A: 2 × 111111.1 + 27777.8 + 27777.8 = 277777.8 → 277778.
            verifier.verifyThat(SkyrotaConstraints::programFairness)
                    .given(visit("a").program("A", 1.0 / 3, 2).build(),
                            visit("b").program("B", 1.0 / 3, 1).at(at(0, 0)).build(),
                            visit("c").program("C", 1.0 / 3, 1).at(at(1, 0)).build())
                    .penalizesBy(277_778);
            // Leaving out B: 2 × 27777.8 + 111111.1 + 27777.8 = 194444.4 → 194444.
            verifier.verifyThat(SkyrotaConstraints::programFairness)
                    .given(visit("a").program("A", 1.0 / 3, 2).at(at(0, 0)).build(),
                            visit("b").program("B", 1.0 / 3, 1).build(),
                            visit("c").program("C", 1.0 / 3, 1).at(at(1, 0)).build())
                    .penalizesBy(194_444);
        }
    }

    @Nested
    class Urgency {
        @Test
        void aVisitLateInItsRangeIsPenalizedByThePrecomputedCost() {
            Visit late = visit("late").costs(0, 0, 67).at(at(0, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::urgency).given(late).penalizesBy(67);
        }

        @Test
        void aVisitOnTheFirstNightOfItsRangeIsNot() {
            Visit early = visit("early").costs(0, 0, 0).at(at(0, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::urgency).given(early).penalizesBy(0);
        }
    }

    @Nested
    class Stability {
        @Test
        void aVisitMovedOrDroppedFromThePublishedPlanIsPenalizedOncePerVisit() {
            Placement was = at(0, 0);
            Visit moved = visit("moved").published(was).at(at(1, 0)).build();
            Visit dropped = visit("dropped").published(at(0, 100)).build();
            verifier.verifyThat(SkyrotaConstraints::stability).given(moved, dropped).penalizesBy(2);
        }

        @Test
        void aVisitWhereItWasPublishedOrNeverPublishedIsNot() {
            Placement was = at(0, 0);
            Visit kept = visit("kept").published(was).at(was).build();
            Visit fresh = visit("fresh").at(at(1, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::stability).given(kept, fresh).penalizesBy(0);
        }
    }
}
