package org.skyrota.web.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.ServiceLoader;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.skyrota.constraints.SkyrotaConstraints;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.plugin.TargetKind;
import org.skyrota.planning.model.ExposureStep;
import org.skyrota.planning.model.Instrument;
import org.skyrota.planning.model.MountKind;
import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.model.PlanningProblem;
import org.skyrota.planning.model.Program;
import org.skyrota.planning.model.Request;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.SolarSafety;
import org.skyrota.planning.model.Target;
import org.skyrota.planning.model.Telescope;
import org.skyrota.planning.sky.EngineSkyModel;
import org.skyrota.planning.solver.PlanResult;
import org.skyrota.planning.solver.PlannedVisit;
import org.skyrota.planning.solver.Planner;
import org.skyrota.planning.solver.SolveOptions;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.events.SkyAtSite;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.time.SiderealTime;
import org.skyrota.sky.time.TimeScales;

/**
 * The planner with the real sky engine and the bundled solar-system plugin (found as the server finds it, through
 * its services file): a request for Jupiter is placed on a night it is up in a dark sky, and left out on a night it
 * is near the Sun. The nights were chosen with the plugin through the engine's moving-target windows for 45° N, 0°
 * (Jupiter above 30° in astronomical darkness: 2027-02-14 from 19:48 to 04:08 UT; no window from late May to early
 * November 2027, its conjunction with the Sun). The placement is checked against Jupiter's altitude worked out here
 * from the plugin's geocentric place with the plain formula sin h = sin φ sin δ + cos φ cos δ cos H (Meeus,
 * Astronomical Algorithms, 2nd ed., eq. 13.6), without parallax (under 2″ for Jupiter) and refraction (under 2′
 * above 30°), so the check allows 0.1°.
 */
class MovingTargetPlanningTest {
    private static final Site SITE = Site.of("mid", "Mid-latitude Station (invented)", 45.0, 0.0, 0, "UTC", 21.5);
    private static final Telescope SCOPE = new Telescope("mid-40", "mid", 0.4, MountKind.EQUATORIAL, 5, 10, 10, 90);

    static MovingTarget planet(String body) throws Exception {
        for (TargetKind kind : ServiceLoader.load(TargetKind.class)) {
            if (kind.kind().equals("planet")) {
                return kind.resolve(Map.of("body", body));
            }
        }
        throw new AssertionError("the solar-system plugin is not on the server's class path");
    }

    @Test
    void jupiterIsPlacedWhenItIsUpAndDarkAndLeftOutNearConjunction() throws Exception {
        Target jupiter = Target.moving("Jupiter", planet("jupiter"));
        LocalDate good = LocalDate.of(2027, 2, 14);
        LocalDate conjunction = LocalDate.of(2027, 8, 13);
        Request up = request("up", jupiter, good);
        Request hidden = request("hidden", jupiter, conjunction);
        PlanningProblem problem = new PlanningProblem(List.of(SITE), List.of(SCOPE),
                List.of(new Instrument("cam", "mid-40", Set.of("V"), 5, 5, false)),
                List.of(new Program("club", "Club (invented)", 10, 1)), List.of(up, hidden), List.of(), List.of(),
                List.of(), good, conjunction, 5, 5);

        PlanResult result = new Planner(new EngineSkyModel(), SkyrotaConstraints.class)
                .solve(problem, SolveOptions.of(Duration.ofSeconds(1)));

        assertThat(result.hardViolations()).isEmpty();
        assertThat(result.leftOut()).singleElement().satisfies(l -> assertThat(l.requestId()).isEqualTo("hidden"));
        PlannedVisit placed = result.planned().stream().filter(v -> v.requestId().equals("up")).findFirst()
                .orElseThrow();
        SiteLocation location = SiteLocation.of(45.0, 0.0, 0);
        SkyAtSite sky = new SkyAtSite(location);
        for (Instant t = placed.start(); !t.isAfter(placed.end()); t = t.plusSeconds(60)) {
            assertThat(jupiterAltitudeDeg(jupiter.moving(), t)).as("Jupiter's altitude at %s", t).isGreaterThan(29.9);
            assertThat(sky.sunAltitudeDeg(SkyAtSite.toEpochSecond(t))).as("the Sun at %s", t).isLessThan(-18);
        }
    }

    /**
     * A moving target that says it is solar (here the sky engine's Sun handed over as one) is planned like the Sun:
     * by day, only on an instrument with a certified solar filter, with the solar caution on the visit; with no such
     * instrument it is left out saying why, caution included.
     */
    @Test
    void aSolarMovingTargetGoesOnlyToACertifiedSolarFilter() {
        MovingTarget sun = new MovingTarget() {
            private final ThreadLocal<double[]> scratch = ThreadLocal.withInitial(() -> new double[5]);

            @Override
            public String label() {
                return "Sun";
            }

            @Override
            public void apparentGeocentric(double jdTt, double[] out) {
                double[] s = scratch.get();
                org.skyrota.sky.bodies.Sun.apparent(jdTt, s);
                System.arraycopy(s, 0, out, 0, 3);
            }

            @Override
            public boolean isSolar() {
                return true;
            }
        };
        Target solar = Target.moving("Sun (moving)", sun);
        assertThat(solar.solar()).isTrue();
        LocalDate day = LocalDate.of(2027, 6, 20);
        Request request = new Request("sun", "club", "member", solar, List.of(new ExposureStep("V", 60, 5)),
                ObservingLimits.dark(20), day, day, 1, null, null, 3);
        for (boolean certified : new boolean[] {false, true}) {
            PlanningProblem problem = new PlanningProblem(List.of(SITE), List.of(SCOPE),
                    List.of(new Instrument("cam", "mid-40", Set.of("V"), 5, 5, certified)),
                    List.of(new Program("club", "Club (invented)", 10, 1)), List.of(request), List.of(), List.of(),
                    List.of(), day, day, 5, 5);
            PlanResult result = new Planner(new EngineSkyModel(), SkyrotaConstraints.class)
                    .solve(problem, SolveOptions.of(Duration.ofSeconds(1)));
            if (!certified) {
                assertThat(result.planned()).isEmpty();
                assertThat(result.leftOut()).singleElement().satisfies(l ->
                        assertThat(l.reason()).contains("certified solar filter").contains(SolarSafety.CAUTION));
            } else {
                PlannedVisit placed = result.planned().stream().findFirst().orElseThrow();
                assertThat(placed.caution()).isEqualTo(SolarSafety.CAUTION);
                SkyAtSite sky = new SkyAtSite(SiteLocation.of(45.0, 0.0, 0));
                assertThat(sky.sunAltitudeDeg(SkyAtSite.toEpochSecond(placed.start()))).isGreaterThan(19);
            }
        }
    }

    /** Geometric altitude from the geocentric place and the local apparent sidereal time, degrees. */
    private static double jupiterAltitudeDeg(MovingTarget target, Instant t) {
        double[] p = new double[3];
        double jdTt = TimeScales.jdTt(t);
        target.apparentGeocentric(jdTt, p);
        double lst = SiderealTime.gastRad(TimeScales.jdUt1(t), jdTt);
        return Math.toDegrees(Horizontal.altitudeRad(lst - p[0], p[1], Math.toRadians(45.0)));
    }

    private static Request request(String id, Target target, LocalDate night) {
        return new Request(id, "club", "member", target, List.of(new ExposureStep("V", 60, 20)),
                ObservingLimits.dark(30), night, night, 1, null, null, 3);
    }
}
