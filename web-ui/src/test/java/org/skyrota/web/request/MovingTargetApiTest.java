package org.skyrota.web.request;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.List;
import java.util.Map;
import java.util.ServiceLoader;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.plugin.TargetKind;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.time.SiderealTime;
import org.skyrota.sky.time.TimeScales;
import org.skyrota.sky.visibility.Darkness;
import org.skyrota.sky.visibility.ObservingConstraints;
import org.skyrota.sky.visibility.VisibilityCalculator;
import org.skyrota.sky.visibility.VisibilityWindow;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.PlanningNetwork;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.TestPropertySource;

/**
 * Requests for a moving target over HTTP, with the bundled solar-system plugin: a request for Jupiter is stored with
 * its kind and parameters, planned by a planner run, and its windows are served; bad kinds and parameters are 400s
 * naming them. The test network's site is at 45° N, 7° E and its nights are 2027 January 10 and 11; the plugin
 * through the sky engine puts Jupiter above 30° in astronomical darkness at 45° N from about 22:00 to 05:50 UT in
 * mid-January 2027 (computed, see MovingTargetPlanningTest), so it must be placed. Placed visits are checked against
 * Jupiter's altitude from the plugin's geocentric place with sin h = sin φ sin δ + cos φ cos δ cos H (Meeus,
 * Astronomical Algorithms, 2nd ed., eq. 13.6), without refraction and parallax (together under 2′ above 30°).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
// A context of its own: runs plan every stored site.
@TestPropertySource(properties = "skyrota.test.context=moving-targets")
class MovingTargetApiTest {

    static final String COORD = ApiClient.basic("mtcoord", "password1");
    static final String STUDENT = ApiClient.basic("mtstudent", "password1");
    static final String OTHER = ApiClient.basic("mtother", "password1");
    static PlanningNetwork network;

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    ApiClient api;

    @BeforeEach
    void setUp() {
        api = new ApiClient(port);
        if (accounts.findByUsername("mtcoord").isEmpty()) {
            accounts.save(new Account("mtcoord", encoder.encode("password1"), Role.COORDINATOR));
            accounts.save(new Account("mtstudent", encoder.encode("password1"), Role.REQUESTER));
            accounts.save(new Account("mtother", encoder.encode("password1"), Role.REQUESTER));
            network = PlanningNetwork.create(api, COORD, STUDENT, OTHER, "MT");
        }
    }

    private String body(String target, String kindAndParameters) {
        return "{\"programId\":" + network.programId + ",\"owner\":\"mtstudent\",\"targetName\":\"" + target + "\","
                + kindAndParameters + ",\"exposures\":[{\"filter\":\"V\",\"seconds\":60,\"count\":5}],"
                + "\"minAltitudeDeg\":30,\"earliestNight\":\"" + PlanningNetwork.FIRST_NIGHT + "\",\"latestNight\":\""
                + PlanningNetwork.LAST_NIGHT + "\",\"priority\":1}";
    }

    @Test
    void aRequestForJupiterIsStoredPlannedAndItsWindowsServed() throws Exception {
        Answer created = api.post("/api/requests", COORD,
                body("Jupiter", "\"targetKind\":\"planet\",\"targetParameters\":{\"body\":\"jupiter\"}"));
        assertThat(created.status()).as(created.body()).isEqualTo(201);
        assertThat((String) created.json("$.targetKind")).isEqualTo("planet");
        assertThat((String) created.json("$.targetParameters.body")).isEqualTo("jupiter");
        long id = created.id("$.id");
        Answer read = api.get("/api/requests/" + id, COORD);
        assertThat((String) read.json("$.targetParameters.body")).isEqualTo("jupiter");
        Answer submitted = api.post("/api/requests/" + id + "/submit?version=0", COORD, null);
        assertThat(submitted.status()).as(submitted.body()).isEqualTo(200);
        Answer accepted = api.post("/api/requests/" + id + "/accept?version=" + submitted.id("$.version"), COORD, null);
        assertThat(accepted.status()).as(accepted.body()).isEqualTo(200);

        // Its windows at the stored site, by the same path the planner takes.
        Answer observability = api.get("/api/requests/" + id + "/observability", COORD);
        assertThat(observability.status()).as(observability.body()).isEqualTo(200);
        List<Object> windows = observability.json("$.sites[?(@.siteId == " + network.siteId + ")].windows[*]");
        assertThat(windows).hasSize(2);

        Answer run = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"" + PlanningNetwork.FIRST_NIGHT
                + "\",\"lastNight\":\"" + PlanningNetwork.LAST_NIGHT + "\",\"seconds\":2}");
        assertThat(run.status()).as(run.body()).isEqualTo(202);
        api.events("/api/planner/runs/" + run.id("$.id") + "/events", COORD, "done", Duration.ofSeconds(120));
        Answer finished = api.get("/api/planner/runs/" + run.id("$.id"), COORD);
        assertThat((String) finished.json("$.state")).as(finished.body()).isEqualTo("finished");
        Answer draft = api.get("/api/plans/draft?from=" + PlanningNetwork.FIRST_NIGHT + "&to="
                + PlanningNetwork.LAST_NIGHT, COORD);
        List<Map<String, Object>> visits = draft.json("$.visits[?(@.requestId == " + id + ")]");
        assertThat(visits).as(draft.body()).singleElement().satisfies(v -> {
            Instant start = Instant.parse((String) v.get("start"));
            Instant end = Instant.parse((String) v.get("end"));
            MovingTarget jupiter = jupiter();
            for (Instant t = start; !t.isAfter(end); t = t.plusSeconds(60)) {
                assertThat(altitudeDeg(jupiter, t, 45, 7)).as("Jupiter's altitude at %s", t).isGreaterThan(29.9);
            }
        });
        assertThat((String) visits.get(0).get("targetKind")).isEqualTo("planet");

        // Published and exported, a moving target has no fixed position: its RA and Dec columns are empty.
        Answer published = api.post("/api/plans/draft/publish?revision=" + draft.id("$.revision"), COORD, null);
        assertThat(published.status()).as(published.body()).isIn(200, 201);
        Answer csv = api.get("/api/plans/published.csv", COORD);
        assertThat(csv.status()).as(csv.body()).isEqualTo(200);
        String row = csv.body().lines().filter(l -> l.startsWith((id * 1000 + 1) + ",")).findFirst().orElseThrow();
        assertThat(row).contains(",Jupiter (PMT),Jupiter,,,");
    }

    @Test
    void theComputeEndpointServesAPlanetsWindows() throws Exception {
        Answer a = api.get("/api/visibility?targetKind=planet&targetParameters.body=jupiter&lat=45&lon=7"
                + "&from=2027-01-10&to=2027-01-11&minAltitude=30&darkness=astronomical&tz=Europe/Rome", null);
        assertThat(a.status()).as(a.body()).isEqualTo(200);
        List<String> starts = a.json("$.windows[*].start");
        List<VisibilityWindow> expected = VisibilityCalculator.windows(
                SiteLocation.of(45, 7, 0, ZoneId.of("Europe/Rome")), jupiter(),
                ObservingConstraints.of(30, Darkness.ASTRONOMICAL), LocalDate.of(2027, 1, 10), LocalDate.of(2027, 1, 11));
        assertThat(starts).hasSameSizeAs(expected).hasSize(2);
        for (int i = 0; i < starts.size(); i++) {
            assertThat(Math.abs(Duration.between(Instant.parse(starts.get(i)), expected.get(i).start()).toSeconds()))
                    .isLessThanOrEqualTo(1);
        }
        Answer bad = api.get("/api/visibility?targetKind=planet&targetParameters.body=vulcan&lat=45&lon=7"
                + "&from=2027-01-10&to=2027-01-11", null);
        assertThat(bad.status()).isEqualTo(400);
        assertThat((String) bad.json("$.parameter")).isEqualTo("targetParameters.body");
        Answer unknown = api.get("/api/visibility?targetKind=nebula-drift&lat=45&lon=7&from=2027-01-10&to=2027-01-11",
                null);
        assertThat(unknown.status()).isEqualTo(400);
        assertThat((String) unknown.json("$.parameter")).isEqualTo("targetKind");
    }

    @Test
    void badKindsAndParametersAre400sNamingThem() {
        Answer badBody = api.post("/api/requests", COORD,
                body("Vulcan", "\"targetKind\":\"planet\",\"targetParameters\":{\"body\":\"vulcan\"}"));
        assertThat(badBody.status()).as(badBody.body()).isEqualTo(400);
        assertThat(badBody.contentType()).startsWith("application/problem+json");
        assertThat((String) badBody.json("$.parameter")).isEqualTo("targetParameters.body");
        assertThat((String) badBody.json("$.errors[0].message")).contains("vulcan");

        Answer missing = api.post("/api/requests", COORD, body("Nothing", "\"targetKind\":\"planet\""));
        assertThat(missing.status()).isEqualTo(400);
        assertThat((String) missing.json("$.parameter")).isEqualTo("targetParameters.body");

        Answer unknownKind = api.post("/api/requests", COORD,
                body("Drift", "\"targetKind\":\"nebula-drift\",\"targetParameters\":{\"x\":\"1\"}"));
        assertThat(unknownKind.status()).isEqualTo(400);
        assertThat((String) unknownKind.json("$.parameter")).isEqualTo("targetKind");

        // The small-bodies plugin's orbit kind names its own parameter too: an eccentricity cannot be negative.
        Answer badOrbit = api.post("/api/requests", COORD, body("Comet (invented)", "\"targetKind\":\"orbit\","
                + "\"targetParameters\":{\"q\":\"1.0\",\"e\":\"-0.5\",\"i\":\"10\",\"node\":\"0\","
                + "\"arg_perihelion\":\"0\",\"perihelion_time\":\"2027-01-01T00:00:00\"}"));
        assertThat(badOrbit.status()).as(badOrbit.body()).isEqualTo(400);
        assertThat((String) badOrbit.json("$.parameter")).isEqualTo("targetParameters.e");

        // A fixed target still needs its coordinates, and takes no parameters.
        Answer noRa = api.post("/api/requests", COORD, body("NGC 1952", "\"dec\":22"));
        assertThat(noRa.status()).isEqualTo(400);
        assertThat((String) noRa.json("$.parameter")).isEqualTo("ra");
        Answer fixedWithParameters = api.post("/api/requests", COORD,
                body("NGC 1952", "\"ra\":83.6,\"dec\":22,\"targetParameters\":{\"body\":\"jupiter\"}"));
        assertThat(fixedWithParameters.status()).isEqualTo(400);
        assertThat((String) fixedWithParameters.json("$.parameter")).isEqualTo("targetParameters");
    }

    /** The CSV plugin's target_kind and target_parameters columns reach the server's check too. */
    @Test
    void anImportedPlanetIsStoredAndABadBodyRefusesTheFile() {
        String good = "title,target,target_kind,target_parameters,filter_plan,priority,program\n"
                + "Ringed planet,Saturn,planet,body=saturn,V:30x5,3,PMT\n";
        Answer ok = api.send("POST", "/api/requests/import", COORD, good, "text/csv");
        assertThat(ok.status()).as(ok.body()).isEqualTo(201);
        assertThat(ok.<List<String>>json("$.requests[*].targetKind")).containsExactly("planet");
        assertThat(ok.<List<String>>json("$.requests[*].targetParameters.body")).containsExactly("saturn");
        String bad = "title,target,target_kind,target_parameters,filter_plan,priority,program\n"
                + "Nowhere,Vulcan,planet,body=vulcan,V:30x5,3,PMT\n";
        Answer refused = api.send("POST", "/api/requests/import", COORD, bad, "text/csv");
        assertThat(refused.status()).as(refused.body()).isEqualTo(400);
        assertThat((String) refused.json("$.parameter")).isEqualTo("record 1: targetParameters.body");
    }

    static MovingTarget jupiter() throws Exception {
        for (TargetKind kind : ServiceLoader.load(TargetKind.class)) {
            if (kind.kind().equals("planet")) {
                return kind.resolve(Map.of("body", "jupiter"));
            }
        }
        throw new AssertionError("the solar-system plugin is not on the server's class path");
    }

    private static double altitudeDeg(MovingTarget target, Instant t, double latDeg, double lonDeg) {
        double[] p = new double[3];
        double jdTt = TimeScales.jdTt(t);
        target.apparentGeocentric(jdTt, p);
        double lst = SiderealTime.gastRad(TimeScales.jdUt1(t), jdTt) + Math.toRadians(lonDeg);
        return Math.toDegrees(Horizontal.altitudeRad(lst - p[0], p[1], Math.toRadians(latDeg)));
    }
}
