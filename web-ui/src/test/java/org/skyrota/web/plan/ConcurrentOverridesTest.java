package org.skyrota.web.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

import com.jayway.jsonpath.JsonPath;

import org.junit.jupiter.api.Test;
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

/**
 * Fifty coordinators move the same visit at the same moment, each to a start of their own, all against the version
 * they read: exactly one move is applied; every other one is a 409 that carries the current version; the audit log
 * holds exactly the one winning override and the draft shows the winner's start.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class ConcurrentOverridesTest {

    static final int CLIENTS = 50;

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;

    @Test
    void fiftyParallelOverridesOfOneVisitHaveExactlyOneWinner() throws Exception {
        accounts.save(new Account("racecoord", encoder.encode("password1"), Role.COORDINATOR));
        accounts.save(new Account("racestudent", encoder.encode("password1"), Role.REQUESTER));
        accounts.save(new Account("raceother", encoder.encode("password1"), Role.REQUESTER));
        String coord = ApiClient.basic("racecoord", "password1");
        ApiClient api = new ApiClient(port);
        PlanningNetwork network = PlanningNetwork.create(api, coord, ApiClient.basic("racestudent", "password1"),
                ApiClient.basic("raceother", "password1"), "C");
        Answer run = api.post("/api/planner/runs", coord, "{\"firstNight\":\"" + PlanningNetwork.FIRST_NIGHT
                + "\",\"lastNight\":\"" + PlanningNetwork.LAST_NIGHT + "\",\"seconds\":2}");
        assertThat(run.status()).as(run.body()).isEqualTo(202);
        assertThat((String) api.awaitRunEnd(run.id("$.id"), coord, Duration.ofSeconds(180)).json("$.state")).isEqualTo("finished");

        Answer draft = api.get("/api/plans/draft", coord);
        long revision = draft.id("$.revision");
        long version = draft.id("$.version");
        Map<String, Object> visit = draft.<List<Map<String, Object>>>json("$.visits").get(0);
        String visitId = (String) visit.get("id");
        Instant start = Instant.parse((String) visit.get("start"));
        int auditBefore = overrides(api, coord, revision).size();

        ExecutorService pool = Executors.newFixedThreadPool(CLIENTS);
        CountDownLatch go = new CountDownLatch(1);
        List<Future<Answer>> answers = new ArrayList<>();
        for (int k = 0; k < CLIENTS; k++) {
            String body = "{\"telescopeId\":" + network.telescopeId + ",\"start\":\"" + start.plusSeconds(60L * (k + 1)) + "\"}";
            answers.add(pool.submit(() -> {
                go.await();
                return api.post("/api/visits/" + visitId + "/move?version=" + version, coord, body);
            }));
        }
        go.countDown();
        List<Integer> winners = new ArrayList<>();
        for (int k = 0; k < CLIENTS; k++) {
            Answer a = answers.get(k).get();
            if (a.status() == 200) {
                winners.add(k);
            } else {
                assertThat(a.status()).as(a.body()).isEqualTo(409);
                assertThat(a.contentType()).startsWith("application/problem+json");
                assertThat(((Number) a.json("$.currentVersion")).longValue()).as(a.body()).isEqualTo(version + 1);
            }
        }
        pool.shutdown();
        assertThat(winners).hasSize(1);

        Answer after = api.get("/api/plans/draft", coord);
        assertThat(after.id("$.version")).isEqualTo(version + 1);
        Map<String, Object> moved = after.<List<Map<String, Object>>>json("$.visits").stream()
                .filter(v -> visitId.equals(v.get("id"))).findFirst().orElseThrow();
        assertThat(Instant.parse((String) moved.get("start"))).isEqualTo(start.plusSeconds(60L * (winners.get(0) + 1)));
        List<Map<String, Object>> records = overrides(api, coord, revision);
        assertThat(records).hasSize(auditBefore + 1);
        assertThat((String) JsonPath.read(records.get(0).get("after"), "$.change")).isEqualTo("move " + visitId);
    }

    /** The override records of the plan revision, newest first. */
    static List<Map<String, Object>> overrides(ApiClient api, String auth, long revision) {
        Answer audit = api.get("/api/audit?entityType=plan&entityId=" + revision + "&size=500", auth);
        assertThat(audit.status()).as(audit.body()).isEqualTo(200);
        return audit.<List<Map<String, Object>>>json("$.items").stream().filter(i -> "override".equals(i.get("action"))).toList();
    }
}
