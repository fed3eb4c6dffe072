package org.skyrota.planning.candidates;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.PlannerWeights;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.greedy.GreedyDispatcher;
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
import org.skyrota.planning.sky.SkyWindow;
import org.skyrota.sky.site.HorizonPoint;
import org.skyrota.sky.site.HorizonProfile;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.visibility.Darkness;
import org.skyrota.sky.visibility.FixedTarget;
import org.skyrota.sky.visibility.ObservingConstraints;
import org.skyrota.sky.visibility.VisibilityCalculator;
import org.skyrota.sky.visibility.VisibilityWindow;

/**
 * A site's horizon profile reaches the planner's candidates. Two invented sites stand at the same place (45° N, 0°),
 * one with a flat horizon and one with a wall; the sky engine's per-instant path ({@link VisibilityCalculator}),
 * already held to published references, is the yardstick: the planner's windows and candidates must agree with it.
 */
class HorizonProfileCandidatesTest {
    private static final LocalDate NIGHT = LocalDate.of(2027, 1, 15);
    // Dec −5° seen from 45° N culminates due south at about 40° (90 − 45 − 5) and, above 15°, stays between
    // azimuths of roughly 125° and 235° (spherical astronomy, worked by hand): always in the southern half.
    private static final Target SOUTHERN = Target.fixed("invented field south", 120, -5);
    private static final double MIN_ALTITUDE_DEG = 15;
    /** A 60° wall over the whole south, from azimuth 90° to 270°, falling to nothing 10° beyond each end. */
    private static final HorizonProfile SOUTH_WALL = HorizonProfile.of(List.of(HorizonPoint.of(80, 0),
            HorizonPoint.of(90, 60), HorizonPoint.of(270, 60), HorizonPoint.of(280, 0)));
    /** A 60° wall only from azimuth 100° to 180°: the target is hidden while it climbs and free once it has culminated. */
    private static final HorizonProfile EAST_WALL = HorizonProfile.of(List.of(HorizonPoint.of(90, 0),
            HorizonPoint.of(100, 60), HorizonPoint.of(180, 60), HorizonPoint.of(190, 0)));
    /** Batch windows against the per-instant path: the same bound as the sky engine's own cross-check. */
    private static final long TOLERANCE_S = 60;
    private static final int STEP_MINUTES = 5;

    private final EngineSkyModel sky = new EngineSkyModel();

    @Test
    void aTargetUpOnlyBehindAWallGetsNoCandidateThereAndIsPlacedAtTheOpenSite() {
        PreparedProblem prepared = prepare(SOUTH_WALL);
        Visit visit = prepared.schedule().visits().get(0);
        int open = prepared.telescopeIndex("open-a");
        int walled = prepared.telescopeIndex("walled-a");

        assertThat(visit.getCandidates()).anyMatch(p -> p.telescopeIndex() == open);
        assertThat(visit.getCandidates()).noneMatch(p -> p.telescopeIndex() == walled);
        // The per-instant path agrees: no window at all behind the wall.
        assertThat(VisibilityCalculator.windows(location(SOUTH_WALL), fixed(), constraints(), NIGHT)).isEmpty();

        GreedyDispatcher.urgencyAware().dispatch(prepared);
        assertThat(visit.isPlaced()).isTrue();
        assertThat(visit.telescopeIndex()).isEqualTo(open);
    }

    @Test
    void thePlannersWindowsBehindAPartialWallAreTheEnginesWindows() {
        Site walled = site("walled", EAST_WALL);
        List<SkyWindow> planner = sky.windows(walled, SOUTHERN, ObservingLimits.dark(MIN_ALTITUDE_DEG), NIGHT);
        List<VisibilityWindow> engine = VisibilityCalculator.windows(location(EAST_WALL), fixed(), constraints(), NIGHT);
        List<VisibilityWindow> flat = VisibilityCalculator.windows(location(HorizonProfile.flat()), fixed(), constraints(),
                NIGHT);

        assertThat(engine).hasSize(1);
        assertThat(planner).hasSameSizeAs(engine);
        assertThat(seconds(planner.get(0).start(), engine.get(0).start())).isLessThanOrEqualTo(TOLERANCE_S);
        assertThat(seconds(planner.get(0).end(), engine.get(0).end())).isLessThanOrEqualTo(TOLERANCE_S);
        // The wall bites: the climb is hidden (the window opens hours later), the descent west of south is not.
        assertThat(Duration.between(flat.get(0).start(), engine.get(0).start())).isGreaterThan(Duration.ofHours(2));
        assertThat(seconds(flat.get(0).end(), engine.get(0).end())).isLessThanOrEqualTo(TOLERANCE_S);
    }

    @Test
    void candidatesBehindAPartialWallLieInsideTheEnginesWindowAndFillIt() {
        PreparedProblem prepared = prepare(EAST_WALL);
        Visit visit = prepared.schedule().visits().get(0);
        int walled = prepared.telescopeIndex("walled-a");
        int open = prepared.telescopeIndex("open-a");
        VisibilityWindow engine = VisibilityCalculator.windows(location(EAST_WALL), fixed(), constraints(), NIGHT).get(0);

        List<Placement> behindWall = visit.getCandidates().stream().filter(p -> p.telescopeIndex() == walled).toList();
        assertThat(behindWall).isNotEmpty();
        for (Placement p : behindWall) {
            Instant start = prepared.schedule().instantOf(p.startMinute());
            Instant end = prepared.schedule().instantOf(p.startMinute() + visit.lengthOn(walled));
            assertThat(start).isAfterOrEqualTo(engine.start().minusSeconds(TOLERANCE_S));
            assertThat(end).isBeforeOrEqualTo(engine.end().plusSeconds(TOLERANCE_S));
        }
        // The first and last starts sit within one candidate step (plus the tolerance) of the window's ends.
        Instant first = prepared.schedule().instantOf(behindWall.get(0).startMinute());
        Placement lastPlacement = behindWall.get(behindWall.size() - 1);
        Instant lastEnd = prepared.schedule().instantOf(lastPlacement.startMinute() + visit.lengthOn(walled));
        long slack = 60L * STEP_MINUTES + TOLERANCE_S;
        assertThat(seconds(first, engine.start())).isLessThanOrEqualTo(slack);
        assertThat(seconds(lastEnd, engine.end())).isLessThanOrEqualTo(slack);
        // The open telescope at the same place may start during the climb; the walled one may not.
        long openCount = visit.getCandidates().stream().filter(p -> p.telescopeIndex() == open).count();
        assertThat(openCount).isGreaterThan(behindWall.size());
    }

    @Test
    void theSunBehindAWallIsHiddenLikeAnyTarget() {
        // Caution: solar visits need a certified solar filter over the front of the optics; this only checks times.
        // The night of 15 January runs noon to noon: the Sun (dec about −21°, so at most about 24° high) is up that
        // afternoon in the south-west and the next morning in the south-east, always in the southern half.
        ObservingLimits sunLimits = new ObservingLimits(10, Double.POSITIVE_INFINITY,
                org.skyrota.planning.model.DarknessLimit.ANY, 0, 1, 0);
        List<SkyWindow> flat = sky.windows(site("open", HorizonProfile.flat()), Target.sun(), sunLimits, NIGHT);
        List<SkyWindow> south = sky.windows(site("walled", SOUTH_WALL), Target.sun(), sunLimits, NIGHT);
        List<SkyWindow> east = sky.windows(site("east", EAST_WALL), Target.sun(), sunLimits, NIGHT);

        assertThat(flat).hasSize(2);
        assertThat(south).isEmpty();
        // The east wall hides the climbing morning Sun and the last minutes before noon; the afternoon stays.
        assertThat(east).hasSize(1);
        assertThat(east.get(0).end()).isEqualTo(flat.get(0).end());
        assertThat(east.get(0).start()).isAfter(flat.get(0).start());
    }

    private PreparedProblem prepare(HorizonProfile wall) {
        Request request = new Request("r1", "lab", "member", SOUTHERN, List.of(new ExposureStep("V", 60, 30)),
                ObservingLimits.dark(MIN_ALTITUDE_DEG), NIGHT, NIGHT, 1, null, null, 3);
        PlanningProblem problem = new PlanningProblem(List.of(site("open", HorizonProfile.flat()), site("walled", wall)),
                List.of(telescope("open-a", "open"), telescope("walled-a", "walled")),
                List.of(new Instrument("cam-open", "open-a", Set.of("V"), 0, 0, false),
                        new Instrument("cam-walled", "walled-a", Set.of("V"), 0, 0, false)),
                List.of(new Program("lab", "Lab (invented)", 10, 1)), List.of(request), List.of(), List.of(), List.of(),
                NIGHT, NIGHT, 5, STEP_MINUTES);
        return new CandidateGenerator(sky).prepare(problem, PlannerWeights.defaults().withOverrides(Map.of()));
    }

    private static Site site(String id, HorizonProfile horizon) {
        // No zone: nights in local mean solar time, as SiteLocation.of(lat, lon, elevation) has them.
        return Site.of(id, id + " station (invented)", 45.0, 0.0, 300, null, SiteLocation.DEFAULT_DARK_SKY_ZENITH_VMAG)
                .withHorizon(horizon);
    }

    private static Telescope telescope(String id, String siteId) {
        return new Telescope(id, siteId, 0.4, MountKind.EQUATORIAL, 5, 0, 5, 90);
    }

    private static SiteLocation location(HorizonProfile horizon) {
        return SiteLocation.of(45.0, 0.0, 300).withHorizon(horizon);
    }

    private static FixedTarget fixed() {
        return FixedTarget.of(SOUTHERN.raDeg(), SOUTHERN.decDeg());
    }

    /** What the planner asks of the engine for {@code ObservingLimits.dark(15)}. */
    private static ObservingConstraints constraints() {
        return ObservingConstraints.of(MIN_ALTITUDE_DEG, Darkness.ASTRONOMICAL)
                .withMinSunSeparationDeg(ObservingLimits.DEFAULT_MIN_SUN_SEPARATION_DEG);
    }

    private static long seconds(Instant a, Instant b) {
        return Math.abs(Duration.between(a, b).toSeconds());
    }
}
