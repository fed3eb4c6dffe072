package org.skyrota.constraints;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.LocalDate;
import java.time.ZonedDateTime;
import java.util.List;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.skyrota.planning.model.DarknessLimit;
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
import org.skyrota.planning.sky.EngineSkyModel;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.PlannedVisit;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.SolveOptions;

/**
 * Candidates from the real sky engine at an invented site at 63.4° N in early May. Facts of the trade (common
 * practice, no source): there the Sun's midnight altitude is latitude + declination − 90° ≈ −10.3° (declination
 * about +16.3° on 5 May, from memory), so the night gets civilly dark (below −6°) but never astronomically dark
 * (below −18°); a target of declination +36.5° culminates at 90 − 63.4 + 36.5 ≈ 63° altitude.
 */
class RealSkyPlanningTest {
    private static final LocalDate NIGHT = LocalDate.of(2027, 5, 5);
    private static final Site NORTH = Site.of("north", "North Fjord Station (invented)", 63.4, 10.4, 100,
            "Europe/Oslo", 21.4);
    private static final Telescope SCOPE = new Telescope("north-35", "north", 0.35, MountKind.EQUATORIAL, 5, 10, 10, 90);
    // M 13, approximate demo coordinates from memory (RA 250.4°, Dec +36.5°).
    private static final Target CLUSTER = Target.fixed("M 13", 250.4, 36.5);

    @Test
    void aDarkSkyRequestIsLeftOutAsNeverDarkWhileACivilTwilightRequestIsPlacedInsideTheNight() {
        Request dark = request("dark", DarknessLimit.ASTRONOMICAL);
        Request twilight = request("twilight", DarknessLimit.CIVIL);
        PlanningProblem problem = new PlanningProblem(List.of(NORTH), List.of(SCOPE),
                List.of(new Instrument("cam", "north-35", Set.of("V"), 5, 5, false)),
                List.of(new Program("club", "Club (invented)", 10, 1)), List.of(dark, twilight), List.of(), List.of(),
                List.of(), NIGHT, NIGHT, 5, 5);

        PlanResult result = new Planner(new EngineSkyModel(), SkyrotaConstraints.class)
                .solve(problem, SolveOptions.of(Duration.ofSeconds(1)));

        assertThat(result.leftOut()).singleElement().satisfies(l -> {
            assertThat(l.visitId()).isEqualTo("dark");
            assertThat(l.reason()).startsWith("never dark and above 30°").contains("2027-05-05");
        });
        PlannedVisit placed = result.planned().get(0);
        assertThat(placed.visitId()).isEqualTo("twilight");
        // Sunset there is near 21:45 local summer time (approximate, from memory): a civil-twilight visit must lie
        // well inside the short night, between local 22:00 and 05:00.
        ZonedDateTime start = placed.start().atZone(NORTH.zone());
        ZonedDateTime end = placed.end().atZone(NORTH.zone());
        assertThat(start).isAfter(NIGHT.atTime(22, 0).atZone(NORTH.zone()));
        assertThat(end).isBefore(NIGHT.plusDays(1).atTime(5, 0).atZone(NORTH.zone()));
        assertThat(result.hardViolations()).isEmpty();
    }

    private static Request request(String id, DarknessLimit darkness) {
        return new Request(id, "club", "member", CLUSTER, List.of(new ExposureStep("V", 60, 20)),
                ObservingLimits.dark(30).withDarkness(darkness), NIGHT, NIGHT, 1, null, null, 3);
    }
}
