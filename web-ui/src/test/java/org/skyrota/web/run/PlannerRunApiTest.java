package org.skyrota.web.run;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;

import com.jayway.jsonpath.JsonPath;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.ApiClient.Event;
import org.skyrota.web.support.PlanningNetwork;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;

/**
 * Planner runs over HTTP: start, follow the event stream to its end, read the run and then the draft it wrote;
 * one run at a time per horizon; cancelling; pins kept across a re-run; publish and compare.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class PlannerRunApiTest {

    static final String COORD = ApiClient.basic("runcoord", "password1");
    static final String STUDENT = ApiClient.basic("runstudent", "password1");
    static final String OTHER = ApiClient.basic("runother", "password1");

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;

    ApiClient api;
    static PlanningNetwork network;

    @BeforeEach
    void setUp() {
        api = new ApiClient(port);
        if (accounts.findByUsername("runcoord").isEmpty()) {
            accounts.save(new Account("runcoord", encoder.encode("password1"), Role.COORDINATOR));
            accounts.save(new Account("runstudent", encoder.encode("password1"), Role.REQUESTER));
            accounts.save(new Account("runother", encoder.encode("password1"), Role.REQUESTER));
            network = PlanningNetwork.create(api, COORD, STUDENT, OTHER, "R");
        }
    }

    /** Starts a run of {@code seconds}, follows its events to {@code done}, and answers the events. */
    List<Event> runToTheEnd(int seconds) {
        Answer started = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"" + PlanningNetwork.FIRST_NIGHT
                + "\",\"lastNight\":\"" + PlanningNetwork.LAST_NIGHT + "\",\"seconds\":" + seconds + "}");
        assertThat(started.status()).as(started.body()).isEqualTo(202);
        assertThat((String) started.json("$.state")).isIn("queued", "running");
        long id = started.id("$.id");
        List<Event> events = api.events("/api/planner/runs/" + id + "/events", COORD, "done", Duration.ofSeconds(120));
        assertThat(events).isNotEmpty();
        assertThat(events.get(events.size() - 1).name()).isEqualTo("done");
        Answer run = api.get("/api/planner/runs/" + id, COORD);
        assertThat((String) run.json("$.state")).as(run.body()).isEqualTo("finished");
        return events;
    }

    @Test
    void aRunStreamsProgressAndWritesADraftWhereEveryAcceptedVisitIsPlacedOrExplained() {
        List<Event> events = runToTheEnd(2);
        List<Event> progress = events.stream().filter(e -> e.name().equals("progress")).toList();
        assertThat(progress).isNotEmpty();
        for (Event e : progress) {
            double fraction = ((Number) JsonPath.read(e.data(), "$.fraction")).doubleValue();
            assertThat(fraction).isBetween(0.0, 1.0);
            assertThat((String) JsonPath.read(e.data(), "$.score")).matches("-?\\d+hard/-?\\d+medium/-?\\d+soft");
            assertThat(((Number) JsonPath.read(e.data(), "$.elapsedSeconds")).doubleValue()).isGreaterThanOrEqualTo(0);
        }
        Event done = events.get(events.size() - 1);
        assertThat((String) JsonPath.read(done.data(), "$.state")).isEqualTo("finished");
        assertThat((String) JsonPath.read(done.data(), "$.score")).startsWith("0hard/");

        Answer draft = api.get("/api/plans/draft?from=" + PlanningNetwork.FIRST_NIGHT + "&to=" + PlanningNetwork.LAST_NIGHT, COORD);
        assertThat(draft.status()).isEqualTo(200);
        assertThat((String) draft.json("$.state")).isEqualTo("draft");
        List<String> placed = draft.json("$.visits[*].id");
        List<String> unplaced = draft.json("$.unplaced[*].visitId");
        Set<String> all = new HashSet<>(placed);
        all.addAll(unplaced);
        // The first request has two repeats, the others one each.
        Set<String> expected = new HashSet<>();
        for (long id : network.requestIds) {
            expected.add(id + "-1");
        }
        expected.add(network.requestIds.get(0) + "-2");
        assertThat(all).containsAll(expected);
        assertThat(placed).doesNotHaveDuplicates().isNotEmpty();
        List<Map<String, Object>> reasons = draft.json("$.unplaced");
        assertThat(reasons).allSatisfy(u -> assertThat((String) u.get("reason")).isNotBlank());
        assertThat(unplaced).contains(network.neverRisesId + "-1");
        List<Map<String, Object>> visits = draft.json("$.visits");
        assertThat(visits).allSatisfy(v -> {
            assertThat(((Number) v.get("telescopeId")).longValue()).isEqualTo(network.telescopeId);
            assertThat(((Number) v.get("siteId")).longValue()).isEqualTo(network.siteId);
            assertThat((String) v.get("start")).isLessThan((String) v.get("end"));
            assertThat((String) v.get("night")).isIn(PlanningNetwork.FIRST_NIGHT, PlanningNetwork.LAST_NIGHT);
        });
    }
}
