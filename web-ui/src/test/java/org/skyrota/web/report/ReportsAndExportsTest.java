package org.skyrota.web.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.List;
import java.util.Map;

import com.jayway.jsonpath.JsonPath;

import net.fortuna.ical4j.data.CalendarBuilder;
import net.fortuna.ical4j.model.Calendar;
import net.fortuna.ical4j.model.Property;
import net.fortuna.ical4j.model.component.VEvent;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.PlanningNetwork;
import org.skyrota.web.system.ServerClock;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.TestPropertySource;

/**
 * Telescope tokens and observation reports; the published plan as CSV and iCalendar (read back with Apache Commons
 * CSV and ical4j); a requester's own feed with a feed token.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
// A context of its own: runs plan every stored site, so another class's network would share this draft.
@TestPropertySource(properties = "skyrota.test.context=reports-exports")
class ReportsAndExportsTest {

    static final String ADMIN = ApiClient.basic("repadmin", "password1");
    static final String COORD = ApiClient.basic("repcoord", "password1");
    static final String STUDENT = ApiClient.basic("repstudent", "password1");
    static final String OTHER = ApiClient.basic("repother", "password1");

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    @Autowired ServerClock clock;

    ApiClient api;
    /** The id of each token made here, by its secret. */
    final Map<String, Long> tokenIds = new java.util.HashMap<>();
    static PlanningNetwork network;
    static Answer published;

    // The fields are shared by this class and its PostgreSQL variant: each class starts from nothing, so that one
    // never reads the other's plan.
    @BeforeAll
    static void forgetTheOtherDatabasesPlan() {
        network = null;
        published = null;
    }

    @BeforeEach
    void setUp() {
        api = new ApiClient(port);
        if (accounts.findByUsername("repadmin").isEmpty()) {
            accounts.save(new Account("repadmin", encoder.encode("password1"), Role.ADMIN));
            accounts.save(new Account("repcoord", encoder.encode("password1"), Role.COORDINATOR));
            accounts.save(new Account("repstudent", encoder.encode("password1"), Role.REQUESTER));
            accounts.save(new Account("repother", encoder.encode("password1"), Role.REQUESTER));
        }
        if (network == null) {
            network = PlanningNetwork.create(api, COORD, STUDENT, OTHER, "E");
        }
        if (published == null) {
            published = runAndPublish();
        }
    }

    Answer runAndPublish() {
        Answer started = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"" + PlanningNetwork.FIRST_NIGHT
                + "\",\"lastNight\":\"" + PlanningNetwork.LAST_NIGHT + "\",\"seconds\":1}");
        assertThat(started.status()).as(started.body()).isEqualTo(202);
        Answer run = api.awaitRunEnd(started.id("$.id"), COORD, Duration.ofSeconds(180));
        assertThat((String) run.json("$.state")).as(run.body()).isEqualTo("finished");
        Answer draft = api.get("/api/plans/draft", COORD);
        Answer p = api.post("/api/plans/draft/publish?revision=" + draft.id("$.revision"), COORD, null);
        assertThat(p.status()).isEqualTo(200);
        assertThat(p.<List<Object>>json("$.plan.visits")).isNotEmpty();
        return p;
    }

    String token(String scope, long telescopeId) {
        Answer t = api.post("/api/tokens", ADMIN, "{\"name\":\"dome " + scope + " " + System.nanoTime() + "\",\"telescopeId\":"
                + telescopeId + ",\"scope\":\"" + scope + "\"}");
        assertThat(t.status()).as(t.body()).isEqualTo(201);
        String token = t.json("$.token");
        assertThat(token).hasSizeGreaterThanOrEqualTo(43);
        tokenIds.put(token, t.id("$.id"));
        // Shown once: the listing never carries it.
        assertThat(api.get("/api/tokens", ADMIN).body()).doesNotContain(token);
        return token;
    }

    /** A report observed at the visit's published start; the server's clock is moved past it first. */
    String report(String visitId, String outcome) {
        List<String> starts = published.json("$.plan.visits[?(@.id == '" + visitId + "')].start");
        Instant observedAt = starts.isEmpty() ? Instant.parse("2027-01-11T01:00:00Z") : Instant.parse(starts.get(0));
        reached(observedAt);
        return "{\"visitId\":\"" + visitId + "\",\"outcome\":\"" + outcome + "\",\"reason\":\"clouds\",\"observedAt\":\""
                + observedAt + "\"}";
    }

    /** Moves the server's clock (forward only) to a minute after {@code t}: a visit is reported once it happened. */
    void reached(Instant t) {
        if (clock.instant().isBefore(t.plusSeconds(60))) {
            clock.set(t.plusSeconds(60));
        }
    }

    /**
     * Seen before: observedAt 9999-12-31 and 1900-01-01 were taken. A visit is observed neither after now (the server's
     * clock) nor before its night began: local noon of its night at its site (Europe/Rome, UTC+1 in January).
     */
    @Test
    void anObservedAtInTheFutureOrBeforeTheVisitsNightIsRefused() {
        String visit = published.<List<String>>json("$.plan.visits[*].id").get(0);
        String night = published.json("$.plan.visits[0].night");
        Instant nightStart = LocalDate.parse(night).atTime(12, 0)
                .atZone(ZoneId.of("Europe/Rome")).toInstant();
        String reports = token("reports", network.telescopeId);
        reached(Instant.parse(published.<String>json("$.plan.visits[0].start")));
        for (Instant refused : List.of(Instant.parse("9999-12-31T00:00:00Z"), Instant.parse("1900-01-01T00:00:00Z"),
                nightStart.minusSeconds(1), clock.instant().plus(Duration.ofDays(1)))) {
            Answer a = api.post("/api/reports", ApiClient.bearer(reports), "{\"visitId\":\"" + visit
                    + "\",\"outcome\":\"partial\",\"observedAt\":\"" + refused + "\"}");
            assertThat(a.status()).as(refused + " " + night + " " + a.body()).isEqualTo(400);
            assertThat((String) a.json("$.parameter")).isEqualTo("observedAt");
        }
        Answer atNightStart = api.post("/api/reports", ApiClient.bearer(reports), "{\"visitId\":\"" + visit
                + "\",\"outcome\":\"partial\",\"observedAt\":\"" + nightStart + "\"}");
        assertThat(atNightStart.status()).as(atNightStart.body()).isEqualTo(201);
        assertThat(Instant.parse(atNightStart.json("$.observedAt"))).isEqualTo(nightStart);
    }

    @Test
    void reportsNeedALiveTokenOfTheReportsScopeForTheVisitsTelescope() {
        List<String> ids = published.json("$.plan.visits[*].id");
        String reports = token("reports", network.telescopeId);
        String read = token("read", network.telescopeId);

        Answer wrongScope = api.post("/api/reports", ApiClient.bearer(read), report(ids.get(0), "done"));
        assertThat(wrongScope.status()).isEqualTo(403);
        assertThat(wrongScope.contentType()).startsWith("application/problem+json");
        Answer unknown = api.post("/api/reports", ApiClient.bearer("not-a-token"), report(ids.get(0), "done"));
        assertThat(unknown.status()).isEqualTo(401);
        assertThat(unknown.contentType()).startsWith("application/problem+json");
        // A person cannot send reports, whatever the role.
        assertThat(api.post("/api/reports", ADMIN, report(ids.get(0), "done")).status()).isEqualTo(403);
        // The read scope reads the published plan, and nothing else.
        assertThat(api.get("/api/plans/published", ApiClient.bearer(read)).status()).isEqualTo(200);
        assertThat(api.get("/api/plans/draft", ApiClient.bearer(read)).status()).isEqualTo(403);
        // A reports token answers only for visits on its own telescope.
        long otherScope = api.post("/api/telescopes", COORD, "{\"siteId\":" + network.siteId + ",\"name\":\"Spare "
                + System.nanoTime() + "\",\"apertureMm\":200,\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10,"
                + "\"active\":false}").id("$.id");
        assertThat(api.post("/api/reports", ApiClient.bearer(token("reports", otherScope)), report(ids.get(0), "done")).status())
                .isEqualTo(403);
        Answer bad = api.post("/api/reports", ApiClient.bearer(reports), report(ids.get(0), "splendid"));
        assertThat(bad.status()).isEqualTo(400);
        assertThat((String) bad.json("$.parameter")).isEqualTo("outcome");
        assertThat(api.post("/api/reports", ApiClient.bearer(reports), report("999999-1", "done")).status()).isEqualTo(404);

        Answer ok = api.post("/api/reports", ApiClient.bearer(reports), report(ids.get(0), "partial"));
        assertThat(ok.status()).as(ok.body()).isEqualTo(201);
        // Without observedAt the visit is taken to have run as published: observed at its published start.
        Answer untimed = api.post("/api/reports", ApiClient.bearer(reports),
                "{\"visitId\":\"" + ids.get(0) + "\",\"outcome\":\"partial\"}");
        assertThat(untimed.status()).as(untimed.body()).isEqualTo(201);
        assertThat(Instant.parse(untimed.json("$.observedAt")))
                .isEqualTo(Instant.parse(published.json("$.plan.visits[0].start")));
        long tokenId = api.get("/api/tokens", ADMIN).<List<Integer>>json("$[-1:].id").get(0);
        assertThat(tokenId).isPositive();

        // Other tests make reports tokens for this telescope too: revoke this one by its own id.
        long reportsTokenId = tokenIds.get(reports);
        assertThat(JsonPath.<List<Integer>>read(api.get("/api/tokens", ADMIN).body(),
                "$[?(@.scope == 'reports' && @.telescopeId == " + network.telescopeId + ")].id"))
                .contains((int) reportsTokenId);
        assertThat(api.delete("/api/tokens/" + reportsTokenId, ADMIN).status()).isEqualTo(204);
        Answer revoked = api.post("/api/reports", ApiClient.bearer(reports), report(ids.get(0), "done"));
        assertThat(revoked.status()).isEqualTo(401);
        assertThat((String) revoked.json("$.detail")).contains("revoked");
    }

    @Test
    void aDoneVisitCountsAsObservedAndAFailedOneIsPlannedAgain() {
        // The repeat-spacing test reports the first request's visits: use the others.
        List<String> ids = published.<List<String>>json("$.plan.visits[*].id").stream()
                .filter(id -> !id.startsWith(network.studentRequestId + "-")).toList();
        assertThat(ids.size()).isGreaterThanOrEqualTo(2);
        String reports = token("reports", network.telescopeId);
        // Another test of this class may have reported a visit done already: count this report's hours alone
        // (each figure is rounded to 0.01 h).
        double observedBefore = observedHours();
        Answer done = api.post("/api/reports", ApiClient.bearer(reports), report(ids.get(0), "done"));
        assertThat(done.status()).as(done.body()).isEqualTo(201);
        assertThat((Boolean) done.json("$.requeued")).isFalse();
        assertThat(((Number) done.json("$.observedHours")).doubleValue()).isPositive();
        Answer failed = api.post("/api/reports", ApiClient.bearer(reports), report(ids.get(1), "failed"));
        assertThat(failed.status()).isEqualTo(201);
        assertThat((Boolean) failed.json("$.requeued")).isTrue();

        Answer usage = api.get("/api/programs/usage", STUDENT);
        assertThat(usage.status()).isEqualTo(200);
        List<Map<String, Object>> mine = usage.json("$[?(@.programId == " + network.programId + ")]");
        assertThat(((Number) mine.get(0).get("observedHours")).doubleValue() - observedBefore)
                .isCloseTo(((Number) done.json("$.observedHours")).doubleValue(), org.assertj.core.data.Offset.offset(0.011));
        assertThat(((Number) mine.get(0).get("grantedHours")).doubleValue()).isEqualTo(40.0);
        assertThat(((Number) mine.get(0).get("plannedHours")).doubleValue()).isPositive();

        Answer started = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"" + PlanningNetwork.FIRST_NIGHT
                + "\",\"lastNight\":\"" + PlanningNetwork.LAST_NIGHT + "\",\"seconds\":1}");
        assertThat((String) api.awaitRunEnd(started.id("$.id"), COORD, Duration.ofSeconds(180)).json("$.state")).isEqualTo("finished");
        Answer draft = api.get("/api/plans/draft", COORD);
        // Both stay in history as they were published, saying how they went; the failed repeat is planned again
        // under a new visit id (placed ahead, or left out with its reason), the observed one is not.
        assertThat(draft.<List<String>>json("$.visits[?(@.id == '" + ids.get(0) + "')].status")).containsExactly("observed");
        assertThat(draft.<List<String>>json("$.visits[?(@.id == '" + ids.get(1) + "')].status")).containsExactly("failed");
        String failedRequest = ids.get(1).split("-")[0];
        List<String> again = draft.json("$.visits[?(@.requestId == " + failedRequest + " && @.status == 'planned')].id");
        again.addAll(draft.json("$.unplaced[?(@.requestId == " + failedRequest + ")].visitId"));
        assertThat(again).isNotEmpty().doesNotContain(ids.get(1));
        long requestId = Long.parseLong(ids.get(0).split("-")[0]);
        Answer status = api.get("/api/requests/" + requestId + "/plan-status", COORD);
        assertThat(status.<List<String>>json("$.visits[?(@.visitId == '" + ids.get(0) + "')].status")).containsExactly("observed");

        // The latest report decides: a failure reported after the success takes the visit's hours back and leaves
        // it to be planned again.
        Answer undone = api.post("/api/reports", ApiClient.bearer(reports), report(ids.get(0), "failed"));
        assertThat(undone.status()).isEqualTo(201);
        assertThat(api.get("/api/requests/" + requestId + "/plan-status", COORD)
                .<List<String>>json("$.visits[?(@.visitId == '" + ids.get(0) + "')].status")).doesNotContain("observed");
        assertThat(observedHours()).isCloseTo(observedBefore, org.assertj.core.data.Offset.offset(0.011));
    }

    double observedHours() {
        List<Map<String, Object>> mine = api.get("/api/programs/usage", STUDENT)
                .json("$[?(@.programId == " + network.programId + ")]");
        return ((Number) mine.get(0).get("observedHours")).doubleValue();
    }

    @Test
    void theRepeatLeftOpenIsPlannedNoCloserToTheObservedOneThanItsSpacing() {
        // The network's first request has two repeats 24 h apart with 4 h of tolerance: at least 20 h start to start.
        String first = network.studentRequestId + "-1";
        String second = network.studentRequestId + "-2";
        List<String> publishedIds = published.json("$.plan.visits[*].id");
        assertThat(publishedIds).contains(first);
        String reports = token("reports", network.telescopeId);
        // Reported as taken at 06:00 local at the end of the first night, so that the second may not start before
        // 02:00 local on the next: later than the planner would choose on its own (near the meridian, about 23:30),
        // yet with the target still high enough (above 30° until about 04:00).
        Instant observedAt = Instant.parse("2027-01-11T05:00:00Z");
        List<String> publishedStart = published.json("$.plan.visits[?(@.id == '" + second + "')].start");
        assertThat(publishedStart).as("the second repeat was published too close, so the rule has to move it")
                .hasSize(1);
        assertThat(Instant.parse(publishedStart.get(0))).isBefore(observedAt.plus(Duration.ofHours(20)));
        reached(observedAt);
        Answer done = api.post("/api/reports", ApiClient.bearer(reports), "{\"visitId\":\"" + first
                + "\",\"outcome\":\"done\",\"observedAt\":\"" + observedAt + "\"}");
        assertThat(done.status()).as(done.body()).isEqualTo(201);
        assertThat(Instant.parse(done.json("$.observedAt"))).isEqualTo(observedAt);

        Answer started = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"" + PlanningNetwork.FIRST_NIGHT
                + "\",\"lastNight\":\"" + PlanningNetwork.LAST_NIGHT + "\",\"seconds\":1}");
        assertThat((String) api.awaitRunEnd(started.id("$.id"), COORD, Duration.ofSeconds(180)).json("$.state")).isEqualTo("finished");
        Answer draft = api.get("/api/plans/draft", COORD);
        List<String> starts = draft.json("$.visits[?(@.id == '" + second + "')].start");
        // Still placeable on the second night, late enough: the rule must leave it a place, not only take one away.
        assertThat(starts).as(draft.body()).hasSize(1);
        assertThat(Instant.parse(starts.get(0))).isAfterOrEqualTo(observedAt.plus(Duration.ofHours(20)));
        // The observed repeat stays in history, once, as observed.
        assertThat(draft.<List<String>>json("$.visits[?(@.id == '" + first + "')].status")).containsExactly("observed");

        // A coordinator may still put it back where it was published: allowed, but named as a broken hard rule.
        List<Integer> publishedTelescope = published.json("$.plan.visits[?(@.id == '" + second + "')].telescopeId");
        Answer back = api.post("/api/visits/" + second + "/move?dryRun=true", COORD, "{\"telescopeId\":"
                + publishedTelescope.get(0) + ",\"start\":\"" + publishedStart.get(0) + "\"}");
        assertThat(back.status()).as(back.body()).isEqualTo(200);
        assertThat(back.<List<String>>json("$.hardBroken")).as(back.body()).contains("Too close to an observed repeat");
    }

    @Test
    void thePublishedPlanExportsAsCsvPerSiteAndNight() throws Exception {
        List<Map<String, Object>> visits = published.json("$.plan.visits");
        String night = (String) visits.get(0).get("night");
        Answer csv = api.get("/api/plans/published.csv?siteId=" + network.siteId + "&night=" + night, COORD);
        assertThat(csv.status()).isEqualTo(200);
        assertThat(csv.contentType()).startsWith("text/csv");
        List<CSVRecord> rows = CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                .parse(new StringReader(csv.body())).getRecords();
        List<Map<String, Object>> thatNight = visits.stream().filter(v -> night.equals(v.get("night"))).toList();
        assertThat(rows).hasSize(thatNight.size());
        for (int i = 0; i < rows.size(); i++) {
            CSVRecord row = rows.get(i);
            Map<String, Object> v = thatNight.get(i);
            String[] id = ((String) v.get("id")).split("-");
            assertThat(row.get("visit_id")).isEqualTo(String.valueOf(Long.parseLong(id[0]) * 1000 + Integer.parseInt(id[1])));
            assertThat(row.get("request_id")).isEqualTo(id[0]);
            assertThat(row.get("target")).isEqualTo(v.get("targetName"));
            assertThat(row.get("night")).isEqualTo(night);
            assertThat(Instant.parse(row.get("start"))).isEqualTo(Instant.parse((String) v.get("start")));
            assertThat(Instant.parse(row.get("end"))).isEqualTo(Instant.parse((String) v.get("end")));
            assertThat(row.get("exposure_plan")).isEqualTo("V 5x60s");
        }
        Answer none = api.get("/api/plans/published.csv?siteId=" + network.siteId + "&night=2030-01-01", COORD);
        assertThat(CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get()
                .parse(new StringReader(none.body())).getRecords()).isEmpty();
    }

    @Test
    void thePublishedPlanAndARequestersOwnVisitsExportAsICalendar() throws Exception {
        List<Map<String, Object>> visits = published.json("$.plan.visits");
        Answer ics = api.get("/api/plans/published.ics?siteId=" + network.siteId, STUDENT);
        assertThat(ics.status()).isEqualTo(200);
        assertThat(ics.contentType()).startsWith("text/calendar");
        List<VEvent> events = parse(ics.body());
        assertThat(events).hasSize(visits.size());
        for (int i = 0; i < events.size(); i++) {
            assertThat(Instant.from(events.get(i).getStartDate().orElseThrow().getDate()))
                    .isEqualTo(Instant.parse((String) visits.get(i).get("start")));
        }
        long mineCount = visits.stream().filter(v -> "repstudent".equals(api.get("/api/requests/" + v.get("requestId"), COORD)
                .json("$.owner"))).count();

        Answer feed = api.post("/api/accounts/me/feed-token", STUDENT, null);
        assertThat(feed.status()).isEqualTo(201);
        String token = feed.json("$.token");
        Answer mine = api.get("/api/calendar/mine.ics?token=" + token, null);
        assertThat(mine.status()).isEqualTo(200);
        List<VEvent> own = parse(mine.body());
        assertThat(own).hasSize((int) mineCount);
        assertThat(own).allSatisfy(e -> assertThat(e.<Property>getProperty("UID").orElseThrow().getValue()).isNotBlank());
        Answer signedIn = api.get("/api/calendar/mine.ics", STUDENT);
        assertThat(parse(signedIn.body())).hasSize((int) mineCount);
        assertThat(api.get("/api/calendar/mine.ics?token=wrong", null).status()).isEqualTo(401);
        assertThat(api.get("/api/calendar/mine.ics", null).status()).isEqualTo(401);
        // A new feed token replaces the old one; a feed token opens nothing else.
        api.post("/api/accounts/me/feed-token", STUDENT, null);
        assertThat(api.get("/api/calendar/mine.ics?token=" + token, null).status()).isEqualTo(401);
        assertThat(api.get("/api/plans/draft?token=" + token, null).status()).isEqualTo(401);
    }

    static List<VEvent> parse(String ics) throws Exception {
        Calendar calendar = new CalendarBuilder().build(new ByteArrayInputStream(ics.getBytes(StandardCharsets.UTF_8)));
        return calendar.getComponents("VEVENT");
    }
}
