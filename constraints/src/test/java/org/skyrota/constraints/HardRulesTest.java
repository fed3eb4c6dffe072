package org.skyrota.constraints;

import static org.skyrota.constraints.Fixtures.at;
import static org.skyrota.constraints.Fixtures.visit;

import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.optaplanner.test.api.score.stream.ConstraintVerifier;
import org.skyrota.planning.domain.ClosedNight;
import org.skyrota.planning.domain.ProgramGrant;
import org.skyrota.planning.domain.Schedule;
import org.skyrota.planning.domain.Visit;

/** One nested class per hard rule, each with a case that fires and one that does not. */
class HardRulesTest {
    private final ConstraintVerifier<SkyrotaConstraints, Schedule> verifier =
            ConstraintVerifier.build(new SkyrotaConstraints(), Schedule.class, Visit.class);

    @Nested
    class TelescopeOverlap {
        @Test
        void overlappingVisitsOnOneTelescopeArePenalizedByTheMinutesOfOverlap() {
            Visit first = visit("first").length(60).at(at(0, 1000)).build();
            Visit overlapping = visit("overlapping").length(60).at(at(0, 1045)).build();
            verifier.verifyThat(SkyrotaConstraints::telescopeOverlap).given(first, overlapping).penalizesBy(15);
        }

        @Test
        void backToBackVisitsAndVisitsOnOtherTelescopesDoNotOverlap() {
            Visit first = visit("first").length(60).at(at(0, 1000)).build();
            Visit next = visit("next").length(60).at(at(0, 1060)).build();
            Visit elsewhere = visit("elsewhere").length(60).at(at(1, 1000)).build();
            Visit unplaced = visit("unplaced").length(60).build();
            verifier.verifyThat(SkyrotaConstraints::telescopeOverlap).given(first, next, elsewhere, unplaced)
                    .penalizesBy(0);
        }
    }

    @Nested
    class OutsideVisibilityWindow {
        @Test
        void aPinnedVisitOutsideItsWindowIsPenalizedByItsLength() {
            Visit pinnedOutside = visit("pinnedOutside").length(40).flags(Visit.OUTSIDE_WINDOW).at(at(0, 100)).pinned()
                    .build();
            verifier.verifyThat(SkyrotaConstraints::outsideVisibilityWindow).given(pinnedOutside).penalizesBy(40);
        }

        @Test
        void aVisitInsideItsWindowIsNot() {
            Visit inside = visit("inside").length(40).at(at(0, 100)).build();
            verifier.verifyThat(SkyrotaConstraints::outsideVisibilityWindow).given(inside).penalizesBy(0);
        }
    }

    @Nested
    class InstrumentOrFilterMissing {
        @Test
        void aVisitOnATelescopeWithoutItsFiltersIsPenalized() {
            Visit wrongTelescope = visit("wrongTelescope").length(25).flags(Visit.INSTRUMENT_MISSING).at(at(1, 0))
                    .pinned().build();
            verifier.verifyThat(SkyrotaConstraints::instrumentOrFilterMissing).given(wrongTelescope).penalizesBy(25);
        }

        @Test
        void aVisitWithItsInstrumentIsNot() {
            Visit rightTelescope = visit("rightTelescope").length(25).at(at(1, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::instrumentOrFilterMissing).given(rightTelescope).penalizesBy(0);
        }
    }

    @Nested
    class RepeatsTooClose {
        @Test
        void repeatsCloserThanIntervalMinusToleranceArePenalizedByTheShortfall() {
            // interval 24 h, tolerance 2 h: the least spacing is 22 h = 1320 min; these start 1200 min apart.
            Visit first = visit("r#1").request("r", 1320).at(at(0, 0)).build();
            Visit second = visit("r#2").request("r", 1320).at(at(1, 1200)).build();
            verifier.verifyThat(SkyrotaConstraints::repeatsTooClose).given(first, second).penalizesBy(120);
        }

        @Test
        void repeatsFarEnoughApartAndVisitsOfOtherRequestsAreNot() {
            Visit first = visit("r#1").request("r", 1320).at(at(0, 0)).build();
            Visit second = visit("r#2").request("r", 1320).at(at(0, 1320)).build();
            Visit other = visit("s#1").request("s", 1320).at(at(1, 10)).build();
            verifier.verifyThat(SkyrotaConstraints::repeatsTooClose).given(first, second, other).penalizesBy(0);
        }
    }

    @Nested
    class TooCloseToAnObservedRepeat {
        @Test
        void aPinnedVisitTooCloseToAnObservedRepeatIsPenalizedByItsLength() {
            Visit pinnedTooClose = visit("r#2").request("r", 1320).length(30).flags(Visit.TOO_CLOSE_TO_OBSERVED)
                    .at(at(0, 600)).pinned().build();
            verifier.verifyThat(SkyrotaConstraints::tooCloseToObservedRepeat).given(pinnedTooClose).penalizesBy(30);
        }

        @Test
        void aVisitWithoutTheFlagAndAnUnplacedOneAreNot() {
            Visit spaced = visit("r#2").request("r", 1320).length(30).at(at(0, 600)).build();
            Visit unplaced = visit("r#3").request("r", 1320).length(30).flags(Visit.TOO_CLOSE_TO_OBSERVED).build();
            verifier.verifyThat(SkyrotaConstraints::tooCloseToObservedRepeat).given(spaced, unplaced).penalizesBy(0);
        }
    }

    @Nested
    class ClosedNightRule {
        @Test
        void aVisitOnAClosedTelescopeNightIsPenalizedByItsLength() {
            Visit onClosedNight = visit("onClosedNight").length(50).at(at(0, 100, 20_001)).pinned().build();
            ClosedNight closed = new ClosedNight(0, 20_001, "weather");
            verifier.verifyThat(SkyrotaConstraints::closedNight).given(onClosedNight, closed).penalizesBy(50);
        }

        @Test
        void anotherNightOrAnotherTelescopeIsNot() {
            Visit otherNight = visit("otherNight").length(50).at(at(0, 100, 20_002)).build();
            Visit otherTelescope = visit("otherTelescope").length(50).at(at(1, 100, 20_001)).build();
            ClosedNight closed = new ClosedNight(0, 20_001, "weather");
            verifier.verifyThat(SkyrotaConstraints::closedNight).given(otherNight, otherTelescope, closed)
                    .penalizesBy(0);
        }
    }

    @Nested
    class SunAvoidance {
        @Test
        void aVisitTooCloseToTheSunIsPenalized() {
            Visit nearSun = visit("nearSun").length(20).flags(Visit.SUN_VIOLATION).at(at(0, 0)).pinned().build();
            verifier.verifyThat(SkyrotaConstraints::sunAvoidance).given(nearSun).penalizesBy(20);
        }

        @Test
        void aVisitFarFromTheSunIsNot() {
            Visit farFromSun = visit("farFromSun").length(20).at(at(0, 0)).build();
            verifier.verifyThat(SkyrotaConstraints::sunAvoidance).given(farFromSun).penalizesBy(0);
        }
    }

    @Nested
    class ProgramOverGrant {
        @Test
        void aProgramOverItsGrantIsPenalizedByTheExcessMinutes() {
            Visit a = visit("a").program("club", 0.5).length(60).at(at(0, 0)).build();
            Visit b = visit("b").program("club", 0.5).length(60).at(at(0, 60)).build();
            ProgramGrant grant = new ProgramGrant(0, "club", 90, 0.5, "club's grant");
            verifier.verifyThat(SkyrotaConstraints::programOverGrant).given(a, b, grant).penalizesBy(30);
        }

        @Test
        void aProgramWithinItsGrantIsNot() {
            Visit a = visit("a").program("club", 0.5).length(60).at(at(0, 0)).build();
            Visit unplaced = visit("unplaced").program("club", 0.5).length(60).build();
            ProgramGrant grant = new ProgramGrant(0, "club", 90, 0.5, "club's grant");
            verifier.verifyThat(SkyrotaConstraints::programOverGrant).given(a, unplaced, grant).penalizesBy(0);
        }

        @Test
        void eachGrantHoldsOnlyWhatPaysFromItNotThePoolOfTheProgram() {
            // 60 min on each of two telescopes, a 60-min grant on each: within both, though 120 > either alone.
            Visit onFirst = visit("onFirst").program("club", 0.5).length(60).grant(0).at(at(0, 0)).build();
            Visit onSecond = visit("onSecond").program("club", 0.5).length(60).grant(1).at(at(1, 0)).build();
            ProgramGrant first = new ProgramGrant(0, "club", 60, 0.5, "60 min on telescope 0");
            ProgramGrant second = new ProgramGrant(1, "club", 60, 0.5, "60 min on telescope 1");
            verifier.verifyThat(SkyrotaConstraints::programOverGrant).given(onFirst, onSecond, first, second)
                    .penalizesBy(0);
            // Both on the first telescope's grant: 60 minutes over it, whatever the second still holds.
            Visit alsoOnFirst = visit("alsoOnFirst").program("club", 0.5).length(60).grant(0).at(at(0, 60)).build();
            verifier.verifyThat(SkyrotaConstraints::programOverGrant).given(onFirst, alsoOnFirst, first, second)
                    .penalizesBy(60);
        }

        @Test
        void aPinNoGrantCoversIsOverByItsWholeLength() {
            Visit pinned = visit("pinned").program("club", 0.5).length(45).grant(1).at(at(0, 0)).pinned().build();
            ProgramGrant grant = new ProgramGrant(0, "club", 600, 0.5, "club's grant");
            ProgramGrant none = new ProgramGrant(1, "club", 0, 0.5, "no grant of program club for that telescope and night");
            verifier.verifyThat(SkyrotaConstraints::programOverGrant).given(pinned, grant, none).penalizesBy(45);
        }
    }
}
