package org.skyrota.web.run;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.Comparator;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.ApiClient.Event;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.TestPropertySource;

/**
 * Priority and repeat spacing as a client sees them: requests made through the API, one planner run over HTTP, and
 * the draft it writes. Priority 5 is the highest (the "1 low to 5 high"); repeats start at least the interval
 * minus the tolerance apart.
 *
 * <p>The invented site is at 45° N, 7° E (Europe/Rome). Target coordinates are approximate catalogue values from
 * memory. For NGC 2632 (Dec +19.7°) the hour angle at 30° altitude follows from
 * cos H = (sin 30° − sin 45° sin 19.7°) / (cos 45° cos 19.7°) ≈ 0.39, H ≈ 67° ≈ 4.5 h (the standard altitude
 * formula of spherical astronomy): at most about 9 h above 30°, and less inside astronomical darkness, so two visits
 * of over 5 h each cannot both fit into one night.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
// A context of its own: a run plans every stored site, so another class's requests would compete for these nights.
@TestPropertySource(properties = "skyrota.test.context=priority-and-repeats")
class RequestPriorityAndRepeatsPlanningTest {

    static final String COORD = ApiClient.basic("priocoord", "password1");
    static final LocalDate FIRST = LocalDate.of(2027, 1, 10);
    static final LocalDate LAST = LocalDate.of(2027, 1, 14);

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;

    ApiClient api;

    @BeforeEach
    void coordinator() {
        api = new ApiClient(port);
        if (accounts.findByUsername("priocoord").isEmpty()) {
            accounts.save(new Account("priocoord", encoder.encode("password1"), Role.COORDINATOR));
        }
    }

    @Test
    void theHigherPriorityWinsTheSharedSlotAndRepeatsKeepTheirSpacing() {
        long site = created(api.post("/api/sites", COORD, "{\"name\":\"Priority hill\",\"latitudeDeg\":45,\"longitudeDeg\":7,"
                + "\"elevationM\":500,\"timeZone\":\"Europe/Rome\",\"darkSkyZenithVMag\":21.5}"));
        long telescope = created(api.post("/api/telescopes", COORD, "{\"siteId\":" + site + ",\"name\":\"P40\",\"apertureMm\":400,"
                + "\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10,\"active\":true}"));
        created(api.post("/api/instruments", COORD, "{\"telescopeId\":" + telescope + ",\"name\":\"P-CCD\",\"readoutSeconds\":5,"
                + "\"filterChangeSeconds\":10,\"certifiedSolarFilter\":false,\"filters\":[\"V\"]}"));
        long program = created(api.post("/api/programs", COORD, "{\"code\":\"PRIO\",\"title\":\"Priority test\","
                + "\"principalInvestigator\":\"Dr. Test\",\"active\":true,\"grants\":[{\"telescopeId\":" + telescope
                + ",\"hours\":100,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}]}"));

        // Two five-hour visits of one target on one night; the low priority is made first, so queue order favours it.
        String longVisit = "\"exposures\":[{\"filter\":\"V\",\"seconds\":300,\"count\":60}],\"earliestNight\":\"2027-01-10\","
                + "\"latestNight\":\"2027-01-10\",\"repeats\":1";
        long low = accepted(program, "NGC 2632 low", 130.1, 19.7, longVisit + ",\"priority\":1");
        long high = accepted(program, "NGC 2632 high", 130.1, 19.7, longVisit + ",\"priority\":5");
        // Three short visits at least 24 h − 2 h apart, with five nights to choose from.
        String shortRepeats = "\"exposures\":[{\"filter\":\"V\",\"seconds\":60,\"count\":5}],\"repeats\":3,"
                + "\"repeatIntervalHours\":24,\"repeatToleranceHours\":2,\"priority\":3";
        long spaced = accepted(program, "M45 spaced", 56.9, 24.1,
                shortRepeats + ",\"earliestNight\":\"2027-01-10\",\"latestNight\":\"2027-01-14\"");
        // The same on two nights only: three starts at least 22 h apart need 44 h, more than two nights hold.
        long cramped = accepted(program, "NGC 1912 cramped", 82.2, 35.8,
                shortRepeats + ",\"earliestNight\":\"2027-01-12\",\"latestNight\":\"2027-01-13\"");

        runToTheEnd();
        Answer draft = api.get("/api/plans/draft?from=" + FIRST + "&to=" + LAST, COORD);
        assertThat(draft.status()).as(draft.body()).isEqualTo(200);
        assertThat((String) draft.json("$.score")).as("no hard rule broken").startsWith("0hard/");
        List<Map<String, Object>> visits = draft.json("$.visits");
        List<Map<String, Object>> unplaced = draft.json("$.unplaced");

        assertThat(ofRequest(visits, high)).as("priority 5 placed").hasSize(1);
        assertThat(ofRequest(visits, low)).as("priority 1 gives way").isEmpty();
        assertThat(unplaced).anySatisfy(u -> {
            assertThat(((Number) u.get("requestId")).longValue()).isEqualTo(low);
            assertThat((String) u.get("reason")).isNotBlank();
        });

        List<Map<String, Object>> repeats = ofRequest(visits, spaced);
        assertThat(repeats).as("all three repeats placed").hasSize(3);
        assertThat(repeats.stream().map(v -> v.get("night")).distinct()).as("on different nights").hasSize(3);
        for (int i = 1; i < repeats.size(); i++) {
            Duration gap = Duration.between(start(repeats.get(i - 1)), start(repeats.get(i)));
            assertThat(gap).as("start-to-start spacing %d", i).isGreaterThanOrEqualTo(Duration.ofHours(22));
        }

        List<Map<String, Object>> tight = ofRequest(visits, cramped);
        assertThat(tight).as("two nights hold two of the three repeats").hasSize(2);
        assertThat(Duration.between(start(tight.get(0)), start(tight.get(1)))).isGreaterThanOrEqualTo(Duration.ofHours(22));
        assertThat(unplaced).anySatisfy(u -> assertThat(((Number) u.get("requestId")).longValue()).isEqualTo(cramped));
    }

    void runToTheEnd() {
        Answer started = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"" + FIRST + "\",\"lastNight\":\"" + LAST
                + "\",\"seconds\":3}");
        assertThat(started.status()).as(started.body()).isEqualTo(202);
        long id = started.id("$.id");
        List<Event> events = api.events("/api/planner/runs/" + id + "/events", COORD, "done", Duration.ofSeconds(120));
        assertThat(events).isNotEmpty();
        Answer run = api.get("/api/planner/runs/" + id, COORD);
        assertThat((String) run.json("$.state")).as(run.body()).isEqualTo("finished");
    }

    static List<Map<String, Object>> ofRequest(List<Map<String, Object>> visits, long requestId) {
        return visits.stream().filter(v -> ((Number) v.get("requestId")).longValue() == requestId)
                .sorted(Comparator.comparing(RequestPriorityAndRepeatsPlanningTest::start)).toList();
    }

    static Instant start(Map<String, Object> visit) {
        return Instant.parse((String) visit.get("start"));
    }

    long accepted(long program, String target, double ra, double dec, String rest) {
        long id = created(api.post("/api/requests", COORD, "{\"programId\":" + program + ",\"owner\":\"priocoord\","
                + "\"targetName\":\"" + target + "\",\"ra\":" + ra + ",\"dec\":" + dec + ",\"minAltitudeDeg\":30," + rest + "}"));
        Answer s = api.post("/api/requests/" + id + "/submit?version=0", COORD, null);
        assertThat(s.status()).as(s.body()).isEqualTo(200);
        Answer a = api.post("/api/requests/" + id + "/accept?version=" + s.id("$.version"), COORD, null);
        assertThat(a.status()).as(a.body()).isEqualTo(200);
        return id;
    }

    static long created(Answer a) {
        assertThat(a.status()).as(a.body()).isEqualTo(201);
        return a.id("$.id");
    }
}
