package org.skyrota.plugins.mount;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.skyrota.constraints.ScoreRule;
import org.skyrota.constraints.ScoreRules;
import org.skyrota.constraints.SkyrotaConstraints;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.model.ExposureStep;
import org.skyrota.planning.model.Instrument;
import org.skyrota.planning.model.MountKind;
import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.model.Program;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Target;
import org.skyrota.planning.model.Telescope;
import org.skyrota.planning.sky.SyntheticSky;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.SolveOptions;

/**
 * The bundled plugin as the server meets it: found by {@link java.util.ServiceLoader} and changing the plan. On the
 * synthetic sky a target is best at its culmination, so without the plugin the planner centres a visit on the
 * meridian (the airmass rule); on a mount that must flip, the plugin's cost moves the visit off it.
 */
class EquatorialMountPlanTest {
    private static final LocalDate NIGHT = LocalDate.of(2027, 3, 8);
    private static final SyntheticSky SKY = new SyntheticSky(Duration.ofHours(3));
    private static final Site SITE = Site.of("hill", "Hill Station (invented)", 40.0, -105.0, 1600, "America/Denver", 21.5);
    private static final Telescope PLAIN = new Telescope("hill-a", "hill", 0.4, MountKind.EQUATORIAL, 5, 0, 10, 90);
    private static final SolveOptions OPTIONS = SolveOptions.of(Duration.ofSeconds(20))
            .withUnimprovedTimeLimit(Duration.ofSeconds(3)).withEvaluationLimit(20_000).withSeed(7);

    @Test
    void serviceLoaderFindsBothRulesWithTheirDefaultWeights() {
        ScoreRules rules = ScoreRules.load(getClass().getClassLoader());
        assertThat(rules.problems()).isEmpty();
        assertThat(rules.rules()).extracting(ScoreRule::ruleName)
                .contains(HourAngleLimitRule.NAME, MeridianFlipRule.NAME);
        assertThat(rules.defaultWeights()).containsEntry(HourAngleLimitRule.NAME, HardMediumSoftLongScore.ofHard(1))
                .containsEntry(MeridianFlipRule.NAME, HardMediumSoftLongScore.ofSoft(10));
    }

    @Test
    void aVisitOnAFlippingMountIsMovedOffTheMeridian() {
        PlanningProblem problem = problem(PLAIN.withEquatorialLimits(true, -180, 180));
        Visit without = onlyVisit(new Planner(SKY, SkyrotaConstraints.class).solve(problem, OPTIONS));
        assertThat(crosses(without)).as("built-in rules alone centre the visit on the meridian").isTrue();

        PlanResult with = ScoreRules.load(getClass().getClassLoader()).planner(SKY).solve(problem, OPTIONS);
        Visit moved = onlyVisit(with);
        assertThat(crosses(moved)).as("hour angles %s to %s", moved.hourAngleAtStartDeg(), moved.hourAngleAtEndDeg())
                .isFalse();
        assertThat(with.score().hardScore()).isZero();
    }

    @Test
    void aWeightOfZeroForTheFlipRuleLeavesThePlanAsWithoutThePlugin() {
        PlanningProblem problem = problem(PLAIN.withEquatorialLimits(true, -180, 180));
        PlanResult off = ScoreRules.load(getClass().getClassLoader()).planner(SKY)
                .solve(problem, OPTIONS.withWeights(Map.of(MeridianFlipRule.NAME, HardMediumSoftLongScore.ZERO)));
        assertThat(crosses(onlyVisit(off))).isTrue();
    }

    @Test
    void aWestLimitOnTheMeridianKeepsTheVisitEastOfIt() {
        // A mount that cannot follow past the meridian (west limit 0°) and need not flip.
        PlanningProblem problem = problem(PLAIN.withEquatorialLimits(false, -90, 0));
        PlanResult with = ScoreRules.load(getClass().getClassLoader()).planner(SKY).solve(problem, OPTIONS);
        Visit v = onlyVisit(with);
        assertThat(with.score().hardScore()).isZero();
        assertThat(v.hourAngleAtEndDeg()).isLessThanOrEqualTo(0.001);
        assertThat(v.hourAngleAtStartDeg()).isGreaterThanOrEqualTo(-90);
    }

    private static boolean crosses(Visit v) {
        return v.hourAngleAtStartDeg() < 0 && v.hourAngleAtEndDeg() > 0;
    }

    private static Visit onlyVisit(PlanResult result) {
        List<Visit> visits = result.prepared().schedule().visits();
        assertThat(visits).hasSize(1);
        assertThat(visits.get(0).isPlaced()).isTrue();
        return visits.get(0);
    }

    /** One 60-minute visit of a field that culminates around local midnight (RA 270° in March on this sky). */
    private static PlanningProblem problem(Telescope telescope) {
        Request request = new Request("r1", "club", "member", Target.fixed("invented field r1", 270, 20),
                List.of(new ExposureStep("R", 60, 60)), ObservingLimits.dark(30), NIGHT, NIGHT, 1, null, null, 3);
        return new PlanningProblem(List.of(SITE), List.of(telescope),
                List.of(new Instrument("hill-a-cam", "hill-a", Set.of("R"), 0, 0, false)),
                List.of(new Program("club", "Club project (invented)", 100, 1)), List.of(request), List.of(), List.of(),
                List.of(), NIGHT, NIGHT, 5, 5);
    }
}
