package org.skyrota.planning.sky;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.skyrota.planning.candidates.CandidateGenerator;
import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.PlannerWeights;
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
import org.skyrota.sky.site.HorizonPoint;
import org.skyrota.sky.site.HorizonProfile;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.visibility.Darkness;
import org.skyrota.sky.visibility.FixedTarget;
import org.skyrota.sky.visibility.ObservingConstraints;
import org.skyrota.sky.visibility.VisibilityCalculator;
import org.skyrota.sky.visibility.VisibilityWindow;

/**
 * The rule the planner's candidates and the request previews share. Invented sites at one place (45° N, 0°): one with
 * a flat horizon, one with a 40° wall to the east. The planner's candidates are the yardstick for the rule (they must
 * fill exactly its windows), and the sky engine's per-instant path ({@link VisibilityCalculator}), held to published
 * references in its own tests, for what the wall and a pointing limit do.
 */
class TelescopeWindowsTest {
    private static final LocalDate FIRST = LocalDate.of(2027, 1, 15);
    private static final LocalDate LAST = FIRST.plusDays(1);
    // Dec +20° seen from 45° N culminates due south at 65° (90 − 45 + 20), near local midnight in mid-January for
    // RA 120° (spherical astronomy, worked by hand); it climbs through the east in the evening.
    private static final Target TARGET = Target.fixed("invented field east", 120, 20);
    private static final double REQUEST_MIN_ALTITUDE = 15;
    /** A 40° wall from azimuth 60° to 150°, falling to nothing 10° beyond each end: it hides the climb. */
    private static final HorizonProfile EAST_WALL = HorizonProfile.of(List.of(HorizonPoint.of(50, 0),
            HorizonPoint.of(60, 40), HorizonPoint.of(150, 40), HorizonPoint.of(160, 0)));
    private static final int STEP_MINUTES = 5;
    /** The engine's batch path against its per-instant path: the bound of the sky engine's own cross-check. */
    private static final long ENGINE_TOLERANCE_S = 60;

    private final EngineSkyModel sky = new EngineSkyModel();
    private final Site open = site("open", HorizonProfile.flat());
    private final Site walled = site("walled", EAST_WALL);
    private final Telescope openLow = telescope("open-low", "open", 5);
    private final Telescope walledLow = telescope("walled-low", "walled", 5);
    private final Telescope walledHigh = telescope("walled-high", "walled", 50);
    private final Telescope walledNoFilter = telescope("walled-no-filter", "walled", 5);
    private final List<Telescope> telescopes = List.of(openLow, walledLow, walledHigh, walledNoFilter);
    private final List<Instrument> instruments = List.of(camera(openLow, "V", "R"), camera(walledLow, "V", "R"),
            camera(walledHigh, "V", "R"), camera(walledNoFilter, "B"));
    private final Request request = new Request("r1", "lab", "member", TARGET, List.of(new ExposureStep("V", 60, 10),
            new ExposureStep("R", 60, 10)), ObservingLimits.dark(REQUEST_MIN_ALTITUDE), FIRST, LAST, 1, null, null, 3);

    @Test
    void theCandidatesFillExactlyTheRulesWindowsOnEveryTelescope() {
        PreparedProblem prepared = prepare();
        Visit visit = prepared.schedule().visits().get(0);
        for (Telescope t : List.of(openLow, walledLow, walledHigh)) {
            Site site = t.siteId().equals("open") ? open : walled;
            int index = prepared.telescopeIndex(t.id());
            List<SkyWindow> windows = TelescopeWindows.windows(sky, site, t, request, FIRST, LAST);
            assertThat(windows).as(t.id()).hasSize(2);
            for (SkyWindow w : windows) {
                List<Placement> inNight = visit.getCandidates().stream()
                        .filter(p -> p.telescopeIndex() == index && p.nightEpochDay() == w.night().toEpochDay())
                        .toList();
                assertThat(inNight).as(t.id() + " " + w.night()).isNotEmpty();
                Instant first = prepared.schedule().instantOf(inNight.get(0).startMinute());
                Placement last = inNight.get(inNight.size() - 1);
                Instant lastEnd = prepared.schedule().instantOf(last.startMinute() + visit.lengthOn(index));
                // Every candidate lies inside the window, and the first and last lie within one candidate step of its
                // ends: the candidates are cut by exactly these windows (to the minute grid).
                assertThat(first).isAfterOrEqualTo(w.start());
                assertThat(lastEnd).isBeforeOrEqualTo(w.end());
                assertThat(Duration.between(w.start(), first)).isLessThan(Duration.ofMinutes(STEP_MINUTES + 1));
                assertThat(Duration.between(lastEnd, w.end())).isLessThan(Duration.ofMinutes(STEP_MINUTES + 1));
            }
        }
        // The telescope without the plan's filters gets no candidate, and the rule says why.
        int noFilter = prepared.telescopeIndex(walledNoFilter.id());
        assertThat(visit.getCandidates()).noneMatch(p -> p.telescopeIndex() == noFilter);
        assertThat(TelescopeWindows.whyNot(request, walledNoFilter, instruments)).hasValueSatisfying(
                why -> assertThat(why).contains("V, R"));
    }

    @Test
    void theWallAndThePointingLimitCutTheWindowsAsTheSkyEngineSays() {
        List<SkyWindow> flat = TelescopeWindows.windows(sky, open, openLow, request, FIRST, FIRST);
        List<SkyWindow> wall = TelescopeWindows.windows(sky, walled, walledLow, request, FIRST, FIRST);
        List<SkyWindow> high = TelescopeWindows.windows(sky, walled, walledHigh, request, FIRST, FIRST);
        VisibilityWindow engineWall = VisibilityCalculator.windows(location(EAST_WALL), fixed(),
                constraints(REQUEST_MIN_ALTITUDE), FIRST).get(0);
        VisibilityWindow engineHigh = VisibilityCalculator.windows(location(EAST_WALL), fixed(), constraints(50), FIRST)
                .get(0);

        assertThat(seconds(wall.get(0).start(), engineWall.start())).isLessThanOrEqualTo(ENGINE_TOLERANCE_S);
        assertThat(seconds(wall.get(0).end(), engineWall.end())).isLessThanOrEqualTo(ENGINE_TOLERANCE_S);
        assertThat(seconds(high.get(0).start(), engineHigh.start())).isLessThanOrEqualTo(ENGINE_TOLERANCE_S);
        assertThat(seconds(high.get(0).end(), engineHigh.end())).isLessThanOrEqualTo(ENGINE_TOLERANCE_S);
        // The wall hides the climb: the window opens more than an hour later than at the open site, and ends with it.
        assertThat(Duration.between(flat.get(0).start(), wall.get(0).start())).isGreaterThan(Duration.ofHours(1));
        assertThat(seconds(flat.get(0).end(), wall.get(0).end())).isLessThanOrEqualTo(ENGINE_TOLERANCE_S);
        // The 50° pointing limit cuts the evening and the morning.
        assertThat(high.get(0).start()).isAfter(wall.get(0).start());
        assertThat(high.get(0).end()).isBefore(wall.get(0).end().minus(Duration.ofHours(1)));
    }

    @Test
    void aSiteAnswersEachTelescopeAndTheUnionOfThoseThatCanTakeTheRequest() {
        TelescopeWindows.AtSite atSite = TelescopeWindows.atSite(sky, walled, telescopes, instruments, request, FIRST,
                LAST);
        assertThat(atSite.telescopes()).extracting(o -> o.telescope().id())
                .containsExactly("walled-low", "walled-high", "walled-no-filter");
        assertThat(atSite.telescopes().get(2).canTake()).isFalse();
        assertThat(atSite.telescopes().get(2).windows()).isEmpty();
        // The 50° telescope's windows lie inside the low one's: the union is the low telescope's windows.
        assertThat(atSite.windows()).isEqualTo(atSite.telescopes().get(0).windows());
        // Asked night by night, as the candidate generator asks, the rule gives the same windows as over the range.
        for (LocalDate night = FIRST; !night.isAfter(LAST); night = night.plusDays(1)) {
            LocalDate n = night;
            assertThat(TelescopeWindows.windows(sky, walled, walledHigh, request, night)).isEqualTo(
                    atSite.telescopes().get(1).windows().stream().filter(w -> w.night().equals(n)).toList());
        }
    }

    @Test
    void solarTargetsNeedACertifiedSolarFilter() {
        // Caution: solar observing needs a certified solar filter over the front of the optics.
        Request solar = new Request("sun", "lab", "member", Target.sun(), List.of(new ExposureStep("V", 1, 10)),
                new ObservingLimits(10, Double.POSITIVE_INFINITY, org.skyrota.planning.model.DarknessLimit.ANY, 0, 1, 0),
                FIRST, FIRST, 1, null, null, 3);
        Instrument plain = camera(openLow, "V");
        Instrument certified = new Instrument("cam-sun", openLow.id(), Set.of("V"), 0, 0, true);
        assertThat(TelescopeWindows.instrumentFor(solar, openLow, List.of(plain))).isEmpty();
        assertThat(TelescopeWindows.whyNot(solar, openLow, List.of(plain))).hasValueSatisfying(
                why -> assertThat(why).contains("certified solar filter"));
        assertThat(TelescopeWindows.instrumentFor(solar, openLow, List.of(plain, certified))).contains(certified);
        TelescopeWindows.AtSite atSite = TelescopeWindows.atSite(sky, open, List.of(openLow), List.of(certified), solar,
                FIRST, FIRST);
        // Daytime windows, the afternoon and the next morning of the noon-to-noon night, as the sky model answers.
        assertThat(atSite.windows()).isNotEmpty()
                .isEqualTo(sky.windows(open, Target.sun(), solar.limits(), FIRST));
    }

    @Test
    void theUnionJoinsOverlappingWindowsOfOneNightOnly() {
        LocalDate n1 = LocalDate.of(2027, 1, 1);
        LocalDate n2 = n1.plusDays(1);
        Instant t = Instant.parse("2027-01-01T20:00:00Z");
        List<SkyWindow> union = TelescopeWindows.union(List.of(
                new SkyWindow(n1, t, t.plusSeconds(3600), 40),
                new SkyWindow(n1, t.plusSeconds(1800), t.plusSeconds(5400), 50),
                new SkyWindow(n1, t.plusSeconds(5400), t.plusSeconds(6000), 30),
                new SkyWindow(n1, t.plusSeconds(7200), t.plusSeconds(9000), 20),
                new SkyWindow(n2, t.plusSeconds(86400), t.plusSeconds(90000), 60)));
        assertThat(union).containsExactly(
                new SkyWindow(n1, t, t.plusSeconds(6000), 50),
                new SkyWindow(n1, t.plusSeconds(7200), t.plusSeconds(9000), 20),
                new SkyWindow(n2, t.plusSeconds(86400), t.plusSeconds(90000), 60));
    }

    private PreparedProblem prepare() {
        PlanningProblem problem = new PlanningProblem(List.of(open, walled), telescopes, instruments,
                List.of(new Program("lab", "Lab (invented)", 10, 1)), List.of(request), List.of(), List.of(), List.of(),
                FIRST, LAST, 5, STEP_MINUTES);
        return new CandidateGenerator(sky).prepare(problem, PlannerWeights.defaults().withOverrides(Map.of()));
    }

    private static Site site(String id, HorizonProfile horizon) {
        // No zone: nights in local mean solar time, as SiteLocation.of(lat, lon, elevation) has them.
        return Site.of(id, id + " station (invented)", 45.0, 0.0, 300, null, SiteLocation.DEFAULT_DARK_SKY_ZENITH_VMAG)
                .withHorizon(horizon);
    }

    private static Telescope telescope(String id, String siteId, double minAltitudeDeg) {
        return new Telescope(id, siteId, 0.4, MountKind.EQUATORIAL, 5, 0, minAltitudeDeg, 90);
    }

    private static Instrument camera(Telescope t, String... filters) {
        return new Instrument("cam-" + t.id() + "-" + String.join("", filters), t.id(), Set.of(filters), 0, 0, false);
    }

    private static SiteLocation location(HorizonProfile horizon) {
        return SiteLocation.of(45.0, 0.0, 300).withHorizon(horizon);
    }

    private static FixedTarget fixed() {
        return FixedTarget.of(TARGET.raDeg(), TARGET.decDeg());
    }

    /** What the planner asks of the engine for {@code ObservingLimits.dark(minAltitude)}. */
    private static ObservingConstraints constraints(double minAltitudeDeg) {
        return ObservingConstraints.of(minAltitudeDeg, Darkness.ASTRONOMICAL)
                .withMinSunSeparationDeg(ObservingLimits.DEFAULT_MIN_SUN_SEPARATION_DEG);
    }

    private static long seconds(Instant a, Instant b) {
        return Math.abs(Duration.between(a, b).toSeconds());
    }
}
