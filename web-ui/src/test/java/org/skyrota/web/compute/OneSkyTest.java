package org.skyrota.web.compute;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.planning.candidates.CandidateGenerator;
import org.skyrota.planning.candidates.PreparedProblem;
import org.skyrota.planning.domain.Placement;
import org.skyrota.planning.domain.PlannerWeights;
import org.skyrota.planning.domain.Visit;
import org.skyrota.planning.sky.EngineSkyModel;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.plan.PlanInputs;
import org.skyrota.web.plan.PlanningMapper;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.TransactionsConfig;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.context.annotation.Import;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.TestPropertySource;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * One sky for the preview and the plan: a request's observability preview answers, per site and telescope, exactly the
 * windows that cut the planner's candidates, with the site's horizon profile and each telescope's pointing limit; and
 * {@code /api/visibility?siteId=} answers the stored site's sky. Invented sites at 45° N, 7° E (Europe/Rome): one with
 * a 40° wall over the east, one open, one whose only telescope points no lower than 50°. The target (an invented field
 * at RA 120°, Dec +20°) culminates at 65° near local midnight in mid-January and climbs through the east in the evening
 * (spherical astronomy worked by hand); the sky engine behind both answers is checked against published references in
 * its own tests.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "skyrota.test.context=one-sky")
@Import(TransactionsConfig.class)
class OneSkyTest {

    static final String COORD = ApiClient.basic("skycoord", "password1");
    static final String OWNER = ApiClient.basic("skyowner", "password1");
    static final String FIRST = "2027-01-15";
    static final String LAST = "2027-01-16";
    /** A 40° wall from azimuth 60° to 150°, falling to nothing 10° beyond each end. */
    static final String EAST_WALL = "[{\"azimuthDeg\":50,\"altitudeDeg\":0},{\"azimuthDeg\":60,\"altitudeDeg\":40},"
            + "{\"azimuthDeg\":150,\"altitudeDeg\":40},{\"azimuthDeg\":160,\"altitudeDeg\":0}]";

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    @Autowired PlanInputs inputs;
    @Autowired TransactionTemplate tx;

    ApiClient api;
    static long walledSite;
    static long openSite;
    static long highSite;
    static long walledLow;
    static long walledHigh;
    static long walledNoFilter;
    static long walledOff;
    static long openLow;
    static long requestId;

    @BeforeEach
    void setUp() {
        api = new ApiClient(port);
        if (accounts.findByUsername("skycoord").isPresent()) {
            return;
        }
        accounts.save(new Account("skycoord", encoder.encode("password1"), Role.COORDINATOR));
        accounts.save(new Account("skyowner", encoder.encode("password1"), Role.REQUESTER));
        walledSite = site("Walled hill", EAST_WALL);
        openSite = site("Open hill", "[]");
        highSite = site("High-limit hill", "[]");
        walledLow = telescope(walledSite, "W low", 5, true, "V");
        walledHigh = telescope(walledSite, "W high", 50, true, "V");
        walledNoFilter = telescope(walledSite, "W no V", 5, true, "B");
        walledOff = telescope(walledSite, "W off", 5, false, "V");
        openLow = telescope(openSite, "O low", 5, true, "V");
        telescope(highSite, "H high", 50, true, "V");
        long program = created(api.post("/api/programs", COORD, "{\"code\":\"SKY\",\"title\":\"One sky\","
                + "\"principalInvestigator\":\"Dr. Sky\",\"active\":true,\"grants\":[{"
                // A grant for the whole network: each telescope's candidates are the sky's alone.
                + "\"hours\":40,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}]}"));
        requestId = created(api.post("/api/requests", COORD, "{\"programId\":" + program + ",\"owner\":\"skyowner\","
                + "\"targetName\":\"invented field east\",\"ra\":120,\"dec\":20,\"exposures\":[{\"filter\":\"V\","
                + "\"seconds\":60,\"count\":10}],\"minAltitudeDeg\":15,\"earliestNight\":\"" + FIRST + "\","
                + "\"latestNight\":\"" + LAST + "\",\"priority\":3}"));
        Answer submitted = api.post("/api/requests/" + requestId + "/submit?version=0", COORD, null);
        assertThat(submitted.status()).as(submitted.body()).isEqualTo(200);
        Answer accepted = api.post("/api/requests/" + requestId + "/accept?version=" + submitted.id("$.version"), COORD, null);
        assertThat(accepted.status()).as(accepted.body()).isEqualTo(200);
    }

    @Test
    void thePreviewCutsTheWindowsExactlyAsTheWallAndThePointingLimitsCutThePlannersCandidates() {
        Answer preview = api.get("/api/requests/" + requestId + "/observability", OWNER);
        assertThat(preview.status()).as(preview.body()).isEqualTo(200);
        PreparedProblem prepared = candidates();
        Visit visit = prepared.schedule().visits().stream().filter(v -> v.requestId().equals(String.valueOf(requestId)))
                .findFirst().orElseThrow();
        int step = prepared.problem().candidateStepMinutes();

        for (long telescope : List.of(walledLow, walledHigh, openLow)) {
            List<Map<String, Object>> windows = preview.json("$.sites[*].telescopes[?(@.telescopeId == " + telescope
                    + ")].windows[*]");
            assertThat(windows).as("telescope " + telescope).hasSize(2);
            int index = prepared.telescopeIndex(String.valueOf(telescope));
            for (Map<String, Object> w : windows) {
                LocalDate night = LocalDate.parse((String) w.get("night"));
                Instant start = Instant.parse((String) w.get("start"));
                Instant end = Instant.parse((String) w.get("end"));
                List<Placement> inNight = visit.getCandidates().stream()
                        .filter(p -> p.telescopeIndex() == index && p.nightEpochDay() == night.toEpochDay()).toList();
                assertThat(inNight).as(telescope + " " + night).isNotEmpty();
                Instant first = prepared.schedule().instantOf(inNight.get(0).startMinute());
                Instant lastEnd = prepared.schedule().instantOf(
                        inNight.get(inNight.size() - 1).startMinute() + visit.lengthOn(index));
                // The previewed window holds every candidate, and its first and last lie within one candidate step of
                // its ends (the preview's times are rounded to the second, hence the second of slack).
                assertThat(first).as(telescope + " " + night).isAfterOrEqualTo(start.minusSeconds(1));
                assertThat(lastEnd).as(telescope + " " + night).isBeforeOrEqualTo(end.plusSeconds(1));
                assertThat(Duration.between(start, first)).isLessThan(Duration.ofMinutes(step + 1));
                assertThat(Duration.between(lastEnd, end)).isLessThan(Duration.ofMinutes(step + 1));
            }
        }
        // The telescope without the plan's filter has no candidate, and the preview says why; the inactive one is absent.
        int noFilter = prepared.telescopeIndex(String.valueOf(walledNoFilter));
        assertThat(visit.getCandidates()).noneMatch(p -> p.telescopeIndex() == noFilter);
        List<Map<String, Object>> noV = preview.json("$.sites[*].telescopes[?(@.telescopeId == " + walledNoFilter + ")]");
        assertThat(noV).singleElement().satisfies(t -> {
            assertThat(t.get("canTake")).isEqualTo(false);
            assertThat((String) t.get("reason")).contains("filter").contains("V");
            assertThat((List<?>) t.get("windows")).isEmpty();
        });
        assertThat(preview.<List<Object>>json("$.sites[*].telescopes[?(@.telescopeId == " + walledOff + ")]")).isEmpty();
    }

    @Test
    void theWallAndThePointingLimitCutThePreview() {
        Answer preview = api.get("/api/requests/" + requestId + "/observability", OWNER);
        String walled = "$.sites[?(@.siteId == " + walledSite + ")]";
        List<String> walledStarts = preview.json(walled + ".windows[*].start");
        List<String> openStarts = preview.json("$.sites[?(@.siteId == " + openSite + ")].windows[*].start");
        List<String> lowStarts = preview.json(walled + ".telescopes[?(@.telescopeId == " + walledLow + ")].windows[*].start");
        List<String> highStarts = preview.json(walled + ".telescopes[?(@.telescopeId == " + walledHigh + ")].windows[*].start");
        List<String> highEnds = preview.json(walled + ".telescopes[?(@.telescopeId == " + walledHigh + ")].windows[*].end");
        List<String> lowEnds = preview.json(walled + ".telescopes[?(@.telescopeId == " + walledLow + ")].windows[*].end");
        assertThat(walledStarts).hasSize(2);
        for (int i = 0; i < 2; i++) {
            // The wall hides the climb: more than an hour later than at the open site the same night.
            assertThat(Duration.between(Instant.parse(openStarts.get(i)), Instant.parse(walledStarts.get(i))))
                    .isGreaterThan(Duration.ofHours(1));
            // The 50° limit cuts both ends of the low telescope's window; the site's window is their union.
            assertThat(Instant.parse(highStarts.get(i))).isAfter(Instant.parse(lowStarts.get(i)));
            assertThat(Instant.parse(highEnds.get(i))).isBefore(Instant.parse(lowEnds.get(i)).minus(Duration.ofHours(1)));
        }
        assertThat(walledStarts).isEqualTo(lowStarts);
        // The open site sees the target first.
        assertThat(preview.id("$.nextObservableNight.siteId")).isEqualTo(openSite);
    }

    @Test
    void visibilityAtAStoredSiteTakesItsHorizonAndItsLowestPointingLimitAndNeedsASignIn() {
        String query = "/api/visibility?ra=120&dec=20&from=" + FIRST + "&to=" + LAST + "&minAltitude=15&siteId=";
        Answer anonymous = api.get(query + walledSite, null);
        assertThat(anonymous.status()).isEqualTo(401);
        assertThat(anonymous.contentType()).startsWith("application/problem+json");

        // The walled site's lowest pointing limit (5°) is below the asked 15°: its windows are the preview's union.
        Answer walled = api.get(query + walledSite, OWNER);
        assertThat(walled.status()).as(walled.body()).isEqualTo(200);
        Answer preview = api.get("/api/requests/" + requestId + "/observability", OWNER);
        assertThat(walled.<List<String>>json("$.windows[*].start"))
                .isEqualTo(preview.json("$.sites[?(@.siteId == " + walledSite + ")].windows[*].start"));
        assertThat(walled.<List<String>>json("$.windows[*].end"))
                .isEqualTo(preview.json("$.sites[?(@.siteId == " + walledSite + ")].windows[*].end"));

        // The open site is the same place without a wall: the coordinates query answers the same.
        Answer open = api.get(query + openSite, OWNER);
        Answer byCoordinates = api.get("/api/visibility?ra=120&dec=20&lat=45&lon=7&elevation=500&tz=Europe/Rome"
                + "&from=" + FIRST + "&to=" + LAST + "&minAltitude=15", null);
        assertThat(open.body()).isEqualTo(byCoordinates.body());

        // The high-limit site's only telescope points no lower than 50°: that raises the asked 15°.
        Answer high = api.get(query + highSite, OWNER);
        Answer at50 = api.get("/api/visibility?ra=120&dec=20&lat=45&lon=7&elevation=500&tz=Europe/Rome"
                + "&from=" + FIRST + "&to=" + LAST + "&minAltitude=50", null);
        assertThat(high.body()).isEqualTo(at50.body()).isNotEqualTo(byCoordinates.body());

        Answer withCoordinates = api.get(query + walledSite + "&lat=45", OWNER);
        assertThat(withCoordinates.status()).isEqualTo(400);
        assertThat((String) withCoordinates.json("$.parameter")).isEqualTo("lat");
        Answer unknown = api.get(query + 999999, OWNER);
        assertThat(unknown.status()).isEqualTo(400);
        assertThat((String) unknown.json("$.parameter")).isEqualTo("siteId");
        Answer notANumber = api.get(query + "hill", OWNER);
        assertThat(notANumber.status()).isEqualTo(400);
        assertThat((String) notANumber.json("$.parameter")).isEqualTo("siteId");
    }

    /** The planner's candidates for the stored network, prepared from the server's own planner inputs. */
    private PreparedProblem candidates() {
        PlanningMapper.Mapped mapped = tx.execute(status -> inputs.forRun(inputs.term(), LocalDate.parse(FIRST),
                LocalDate.parse(LAST), null, List.of()).mapped());
        return new CandidateGenerator(new EngineSkyModel()).prepare(mapped.problem(),
                PlannerWeights.defaults().withOverrides(Map.of()));
    }

    private long site(String name, String horizon) {
        return created(api.post("/api/sites", COORD, "{\"name\":\"" + name + "\",\"latitudeDeg\":45,\"longitudeDeg\":7,"
                + "\"elevationM\":500,\"timeZone\":\"Europe/Rome\",\"darkSkyZenithVMag\":21.5,\"horizon\":" + horizon + "}"));
    }

    private long telescope(long site, String name, double minAltitude, boolean active, String filter) {
        long id = created(api.post("/api/telescopes", COORD, "{\"siteId\":" + site + ",\"name\":\"" + name
                + "\",\"apertureMm\":400,\"minAltitudeDeg\":" + minAltitude + ",\"slewRateDegPerS\":4,\"settleSeconds\":10,"
                + "\"active\":" + active + "}"));
        created(api.post("/api/instruments", COORD, "{\"telescopeId\":" + id + ",\"name\":\"CCD " + name
                + "\",\"readoutSeconds\":5,\"filterChangeSeconds\":10,\"certifiedSolarFilter\":false,\"filters\":[\""
                + filter + "\"]}"));
        return id;
    }

    private static long created(Answer a) {
        assertThat(a.status()).as(a.body()).isEqualTo(201);
        return a.id("$.id");
    }
}
