package org.skyrota.web.fault;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;

import com.jayway.jsonpath.JsonPath;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.PlanningNetwork;
import org.skyrota.web.support.ServerProcess;

/**
 * The packaged server killed with SIGKILL and started again on the same data folder (the embedded H2 database):
 * an acknowledged write is kept whole, a refused one leaves nothing, and a planner run cut short is failed while the
 * published plan stays as it was.
 */
class CrashRecoveryIT {

    static final String ADMIN_PASSWORD = "crash-admin-secret";
    static final String ADMIN = ApiClient.basic("admin", ADMIN_PASSWORD);
    static final Map<String, String> ENV = Map.of("SKYROTA_ADMIN_PASSWORD", ADMIN_PASSWORD);

    @TempDir Path dir;

    /** What one client sent, and how the server answered (status 0: no answer, the connection died). */
    record Attempt(String targetName, double raDeg, double decDeg, int exposureLines, int priority, String owner,
                   int status, String body) {}

    @Test
    void everyAcknowledgedRequestSurvivesAKillAndNothingRefusedIsHalfStored() throws Exception {
        Path data = dir.resolve("data");
        Path log = dir.resolve("server.log");
        long programId;
        List<Attempt> attempts = new ArrayList<>();
        try (ServerProcess server = ServerProcess.start(data, log, ENV)) {
            ApiClient api = new ApiClient(server.port());
            for (int s = 0; s < 4; s++) {
                account(api, "crashstudent" + s, "requester");
            }
            Answer program = api.post("/api/programs", ADMIN, "{\"code\":\"CRASH\",\"title\":\"Crash test program\","
                    + "\"principalInvestigator\":\"Dr. Test\",\"active\":true,\"grants\":[]}");
            assertThat(program.status()).as(program.body()).isEqualTo(201);
            programId = program.id("$.id");

            // 16 clients submit as fast as they can; the server is killed while they do.
            int clients = 16;
            AtomicBoolean killed = new AtomicBoolean();
            AtomicInteger acknowledged = new AtomicInteger();
            List<Attempt> sink = java.util.Collections.synchronizedList(attempts);
            ExecutorService pool = Executors.newFixedThreadPool(clients);
            for (int c = 0; c < clients; c++) {
                int client = c;
                pool.submit(() -> {
                    String owner = "crashstudent" + (client % 4);
                    String auth = ApiClient.basic(owner, "password1");
                    for (int n = 0; ; n++) {
                        String name = "NGC " + (1000 + client) + " crash " + n;
                        double ra = (client * 21.7 + n * 1.3) % 360;
                        double dec = ((client * 7 + n) % 170) - 85;
                        int lines = 1 + (n % 3);
                        int priority = 1 + (n % 5);
                        StringBuilder exposures = new StringBuilder();
                        for (int e = 0; e < lines; e++) {
                            exposures.append(e == 0 ? "" : ",").append("{\"filter\":\"F").append(e).append("\",\"seconds\":")
                                    .append(10 + e).append(",\"count\":").append(e + 1).append('}');
                        }
                        String body = "{\"programId\":" + programId + ",\"targetName\":\"" + name + "\",\"ra\":" + ra
                                + ",\"dec\":" + dec + ",\"exposures\":[" + exposures + "],\"priority\":" + priority + "}";
                        int status;
                        String answer;
                        try {
                            Answer a = api.post("/api/requests", auth, body);
                            status = a.status();
                            answer = a.body();
                        } catch (IllegalStateException connectionDied) {
                            status = 0;
                            answer = null;
                        }
                        sink.add(new Attempt(name, ra, dec, lines, priority, owner, status, answer));
                        if (status == 201) {
                            acknowledged.incrementAndGet();
                        }
                        if (status == 0 && killed.get()) {
                            return;
                        }
                    }
                });
            }
            Instant deadline = Instant.now().plusSeconds(60);
            while (acknowledged.get() < 40 && Instant.now().isBefore(deadline)) {
                Thread.sleep(20);
            }
            killed.set(true);
            server.kill();
            pool.shutdown();
            assertThat(pool.awaitTermination(2, TimeUnit.MINUTES)).isTrue();
        }
        List<Attempt> acked = attempts.stream().filter(a -> a.status() == 201).toList();
        List<Attempt> refused = attempts.stream().filter(a -> a.status() != 201 && a.status() != 0).toList();
        assertThat(acked).hasSizeGreaterThanOrEqualTo(40);
        // Nothing is refused while the server is up: every answer is a 201 or no answer at all.
        assertThat(refused).as("refused attempts").isEmpty();

        try (ServerProcess again = ServerProcess.start(data, log, ENV)) {
            ApiClient api = new ApiClient(again.port());
            Map<String, Map<String, Object>> stored = new HashMap<>();
            for (int page = 0; ; page++) {
                Answer list = api.get("/api/requests?size=500&page=" + page + "&target=crash", ADMIN);
                assertThat(list.status()).as(list.body()).isEqualTo(200);
                List<Map<String, Object>> items = list.json("$.items");
                items.forEach(i -> stored.put((String) i.get("targetName"), i));
                if (page + 1 >= ((Number) list.json("$.totalPages")).intValue()) {
                    break;
                }
            }
            Map<String, Attempt> byName = new HashMap<>();
            attempts.forEach(a -> byName.put(a.targetName(), a));
            for (Attempt a : acked) {
                Map<String, Object> row = stored.get(a.targetName());
                assertThat(row).as("acknowledged request %s after the restart", a.targetName()).isNotNull();
                // The stored request is the one the 201 described, field by field.
                Map<String, Object> answered = JsonPath.read(a.body(), "$");
                assertThat(row).isEqualTo(answered);
            }
            for (Map<String, Object> row : stored.values()) {
                Attempt sent = byName.get((String) row.get("targetName"));
                assertThat(sent).as("stored request %s was sent by a client", row.get("targetName")).isNotNull();
                assertThat(sent.status()).as("an attempt that got an error is not stored").isIn(201, 0);
                // Intact: every field and every exposure line as sent, also for the one in flight at the kill.
                assertThat(((Number) row.get("raDeg")).doubleValue()).isEqualTo(sent.raDeg());
                assertThat(((Number) row.get("decDeg")).doubleValue()).isEqualTo(sent.decDeg());
                assertThat((List<?>) row.get("exposures")).hasSize(sent.exposureLines());
                assertThat(((Number) row.get("priority")).intValue()).isEqualTo(sent.priority());
                assertThat(row.get("owner")).isEqualTo(sent.owner());
                assertThat(row.get("state")).isEqualTo("draft");
            }
            // Each stored request has exactly its one creation record in the audit log, and there is no record of a
            // request that is not stored (the change and its record commit together).
            Map<Long, Integer> creates = new HashMap<>();
            for (int page = 0; ; page++) {
                Answer audit = api.get("/api/audit?entityType=request&size=500&page=" + page, ADMIN);
                assertThat(audit.status()).as(audit.body()).isEqualTo(200);
                List<Map<String, Object>> items = audit.json("$.items");
                items.stream().filter(i -> "create".equals(i.get("action")))
                        .forEach(i -> creates.merge(((Number) i.get("entityId")).longValue(), 1, Integer::sum));
                if (page + 1 >= ((Number) audit.json("$.totalPages")).intValue()) {
                    break;
                }
            }
            Set<Long> storedIds = new HashSet<>();
            stored.values().forEach(r -> storedIds.add(((Number) r.get("id")).longValue()));
            assertThat(creates.keySet()).isEqualTo(storedIds);
            assertThat(creates.values()).allMatch(n -> n == 1);
        }
    }

    @Test
    void aRunCutShortByAKillIsFailedThePublishedPlanStaysAndANewRunWorks() throws Exception {
        Path data = dir.resolve("data");
        Path log = dir.resolve("server.log");
        String coordinator = ApiClient.basic("crashcoord", "password1");
        String published;
        long interrupted;
        try (ServerProcess server = ServerProcess.start(data, log, ENV)) {
            ApiClient api = new ApiClient(server.port());
            account(api, "crashcoord", "coordinator");
            account(api, "crashstudent", "requester");
            account(api, "crashother", "requester");
            PlanningNetwork.create(api, coordinator, ApiClient.basic("crashstudent", "password1"),
                    ApiClient.basic("crashother", "password1"), "K");
            long first = finishedRun(api, coordinator, 2);
            long revision = api.get("/api/planner/runs/" + first, coordinator).id("$.revision");
            Answer publish = api.post("/api/plans/draft/publish?revision=" + revision, coordinator, null);
            assertThat(publish.status()).as(publish.body()).isEqualTo(200);
            published = api.get("/api/plans/published", coordinator).body();
            assertThat((List<?>) JsonPath.read(published, "$.visits")).isNotEmpty();

            Answer started = startRun(api, coordinator, 120);
            interrupted = started.id("$.id");
            Instant deadline = Instant.now().plusSeconds(60);
            String state = started.json("$.state");
            while (!state.equals("running") && Instant.now().isBefore(deadline)) {
                Thread.sleep(100);
                state = api.get("/api/planner/runs/" + interrupted, coordinator).json("$.state");
            }
            assertThat(state).isEqualTo("running");
            Thread.sleep(1000); // well into the solve
            server.kill();
        }
        try (ServerProcess again = ServerProcess.start(data, log, ENV)) {
            ApiClient api = new ApiClient(again.port());
            Answer run = api.get("/api/planner/runs/" + interrupted, coordinator);
            assertThat((String) run.json("$.state")).as(run.body()).isEqualTo("failed");
            assertThat((String) run.json("$.message")).contains("server stopped");
            assertThat((Object) run.json("$.revision")).isNull();
            assertThat(withoutNow(api.get("/api/plans/published", coordinator).body())).isEqualTo(withoutNow(published));

            long next = finishedRun(api, coordinator, 2);
            assertThat(api.get("/api/planner/runs/" + next, coordinator).id("$.revision")).isPositive();
            assertThat(withoutNow(api.get("/api/plans/published", coordinator).body())).isEqualTo(withoutNow(published));
        }
    }

    static void account(ApiClient api, String name, String role) {
        Answer a = api.post("/api/accounts", ADMIN, "{\"username\":\"" + name + "\",\"password\":\"password1\",\"role\":\"" + role + "\"}");
        assertThat(a.status()).as(a.body()).isEqualTo(201);
    }

    static Answer startRun(ApiClient api, String auth, int seconds) {
        Answer started = api.post("/api/planner/runs", auth, "{\"firstNight\":\"" + PlanningNetwork.FIRST_NIGHT
                + "\",\"lastNight\":\"" + PlanningNetwork.LAST_NIGHT + "\",\"seconds\":" + seconds + "}");
        assertThat(started.status()).as(started.body()).isEqualTo(202);
        return started;
    }

    static long finishedRun(ApiClient api, String auth, int seconds) {
        long id = startRun(api, auth, seconds).id("$.id");
        api.events("/api/planner/runs/" + id + "/events", auth, "done", Duration.ofSeconds(120));
        Answer run = api.get("/api/planner/runs/" + id, auth);
        assertThat((String) run.json("$.state")).as(run.body()).isEqualTo("finished");
        return id;
    }

    /** A plan view without its "now" (the server's time when it answered), which moves on between two reads. */
    private static String withoutNow(String planView) {
        return planView.replaceAll("\"now\":\"[^\"]*\"", "");
    }
}
