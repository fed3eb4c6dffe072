package org.skyrota.web.term;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import net.fortuna.ical4j.data.CalendarBuilder;
import net.fortuna.ical4j.model.Property;
import net.fortuna.ical4j.model.component.VEvent;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.junit.jupiter.api.TestMethodOrder;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.request.DarknessLimit;
import org.skyrota.web.request.Exposure;
import org.skyrota.web.request.ObservingRequest;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.request.RequestState;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.system.ServerClock;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.TestPropertySource;

/**
 * The term's rules one at a time, each a failure seen on the server before: re-planning some nights after a publish,
 * grants that pay only where they hold, one broken request among good ones, a publish that breaks a hard rule, runs
 * over nights already past, a failed visit planned again, a withdrawn request leaving the calendars, requests that
 * complete and expire, and a run restricted to one site. The steps share one network and walk forward in time.
 *
 * <p>An invented network: a hill at 45° N with two telescopes (the program's grant pays for one of them only) and a
 * desert site at 32° N whose grant is for the whole site. Targets are real objects by catalogue number, with
 * approximate coordinates recalled from memory, all up on January evenings in the north.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "skyrota.test.context=term-rules")
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class TermRulesTest {

    static final String ADMIN = ApiClient.basic("tradmin", "password1");
    static final String COORD = ApiClient.basic("trcoord", "password1");
    static final String STUDENT = ApiClient.basic("trstudent", "password1");

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    @Autowired ServerClock clock;
    @Autowired ObservingRequestRepository requestRepository;
    @Autowired ProgramRepository programRepository;

    ApiClient api;
    long hill;
    long desert;
    long granted;
    long ungranted;
    long desertScope;
    long program;
    final List<Long> requests = new ArrayList<>();

    @BeforeAll
    void network() {
        api = new ApiClient(port);
        accounts.save(new Account("tradmin", encoder.encode("password1"), Role.ADMIN));
        accounts.save(new Account("trcoord", encoder.encode("password1"), Role.COORDINATOR));
        accounts.save(new Account("trstudent", encoder.encode("password1"), Role.REQUESTER));
        clock.set(Instant.parse("2027-01-08T12:00:00Z"));
        hill = created(api.post("/api/sites", COORD, "{\"name\":\"Rules hill\",\"latitudeDeg\":45,\"longitudeDeg\":7,"
                + "\"elevationM\":500,\"timeZone\":\"Europe/Rome\",\"darkSkyZenithVMag\":21.5}"));
        desert = created(api.post("/api/sites", COORD, "{\"name\":\"Rules desert\",\"latitudeDeg\":32,\"longitudeDeg\":-111,"
                + "\"elevationM\":1500,\"timeZone\":\"America/Phoenix\",\"darkSkyZenithVMag\":21.7}"));
        granted = telescope(hill, "G1");
        ungranted = telescope(hill, "U1");
        desertScope = telescope(desert, "D1");
        program = created(api.post("/api/programs", COORD, "{\"code\":\"RULES\",\"title\":\"Rules program\","
                + "\"principalInvestigator\":\"Dr. Rules\",\"active\":true,\"grants\":[{\"telescopeId\":" + granted
                + ",\"hours\":20,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-02-28\"},{\"siteId\":" + desert
                + ",\"hours\":20,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-02-28\"}]}"));
        Object[][] targets = {{"NGC 1952", 83.6, 22.0}, {"M 45", 56.9, 24.1}, {"NGC 2168", 92.2, 24.3},
                {"NGC 1912", 82.2, 35.8}, {"NGC 2632", 130.1, 19.7}, {"NGC 2392", 112.3, 20.9}};
        for (int i = 0; i < targets.length; i++) {
            requests.add(accepted((String) targets[i][0], (double) targets[i][1], (double) targets[i][2],
                    "2027-01-10", i < 4 ? "2027-01-25" : "2027-01-12", i == 0 ? 2 : 1));
        }
    }

    @Test
    @Order(1)
    void aRunOverSomeNightsAfterAPublishKeepsThePublishedVisitsElsewhere() {
        run("2027-01-10", "2027-01-12", null);
        Answer published = publish();
        List<String> ids = published.json("$.plan.visits[*].id");
        assertThat(ids).isNotEmpty();
        // Before: every run whose nights did not cover every published visit failed ("placement outside the
        // planning horizon").
        run("2027-01-12", "2027-01-12", null);
        run("2027-01-15", "2027-01-25", null);
        Answer draft = api.get("/api/plans/draft", COORD);
        for (Map<String, Object> v : published.<List<Map<String, Object>>>json("$.plan.visits")) {
            if (LocalDate.parse((String) v.get("night")).isBefore(LocalDate.parse("2027-01-12"))) {
                List<String> start = draft.json("$.visits[?(@.id == '" + v.get("id") + "')].start");
                assertThat(start).as("visit %s outside the later runs' nights", v.get("id")).containsExactly((String) v.get("start"));
            }
        }
    }

    @Test
    @Order(2)
    void aGrantPaysOnlyForItsTelescopeOrSiteAndTheLedgerSaysWhatIsLeft() {
        Answer draft = api.get("/api/plans/draft", COORD);
        assertThat(draft.<List<Integer>>json("$.visits[*].telescopeId")).isNotEmpty().doesNotContain((int) ungranted);
        Answer usage = api.get("/api/programs/" + program + "/usage", STUDENT);
        assertThat(usage.status()).as(usage.body()).isEqualTo(200);
        List<Map<String, Object>> grants = usage.json("$.grants");
        assertThat(grants).hasSize(2);
        for (Map<String, Object> g : grants) {
            double remaining = ((Number) g.get("remainingHours")).doubleValue();
            double sum = ((Number) g.get("grantedHours")).doubleValue() - ((Number) g.get("observedHours")).doubleValue()
                    - ((Number) g.get("publishedHours")).doubleValue() - ((Number) g.get("draftHours")).doubleValue();
            assertThat(remaining).isCloseTo(sum, org.assertj.core.data.Offset.offset(0.02));
            assertThat((Boolean) g.get("over")).isFalse();
        }
        double published = grants.stream().mapToDouble(g -> ((Number) g.get("publishedHours")).doubleValue()).sum();
        assertThat(published).isPositive();
        assertThat(usage.<List<String>>json("$.over")).isEmpty();
    }

    @Test
    @Order(3)
    void oneRequestThatCannotBePlannedIsLeftOutWithItsReasonAndTheRunGoesOn() {
        // Stored around the checks, as old data or a bad import path once stored it: its last night before its first.
        ObservingRequest broken = new ObservingRequest(programRepository.findById(program).orElseThrow(), "trstudent");
        broken.setTarget("NGC 2264", 100.2, 9.9);
        broken.setConditions(30, DarknessLimit.ASTRONOMICAL, null, null);
        broken.setSchedule(LocalDate.parse("2027-01-20"), LocalDate.parse("2027-01-11"), 1, 3);
        broken.setExposures(List.of(new Exposure("V", 60, 3)));
        broken.moveTo(RequestState.SUBMITTED, null);
        broken.moveTo(RequestState.ACCEPTED, null);
        long id = requestRepository.save(broken).getId();
        run("2027-01-10", "2027-01-25", null);
        Answer draft = api.get("/api/plans/draft", COORD);
        List<String> reasons = draft.json("$.unplaced[?(@.requestId == " + id + ")].reason");
        assertThat(reasons).hasSize(1);
        assertThat(reasons.get(0)).startsWith("cannot be planned: ").contains("latestNight");
        String visit = draft.<List<String>>json("$.visits[?(@.status == 'planned')].id").get(0);
        assertThat(api.get("/api/visits/" + visit + "/candidates", COORD).status()).isEqualTo(200);
        assertThat(api.post("/api/visits/" + visit + "/pin?dryRun=true", COORD, null).status()).isEqualTo(200);
        Answer withdrawn = api.post("/api/requests/" + id + "/withdraw?version=" + api.get("/api/requests/" + id, COORD)
                .id("$.version"), COORD, null);
        assertThat(withdrawn.status()).as(withdrawn.body()).isEqualTo(200);
    }

    @Test
    @Order(4)
    void aDraftThatBreaksAHardRuleIsPublishedOnlyWhenForcedWithAReason() {
        run("2027-01-10", "2027-01-25", null);
        Answer draft = api.get("/api/plans/draft", COORD);
        List<Map<String, Object>> visits = draft.json("$.visits[?(@.status == 'planned' && @.telescopeId == " + granted + ")]");
        assertThat(visits.size()).isGreaterThanOrEqualTo(2);
        Map<String, Object> a = visits.get(0);
        Map<String, Object> b = visits.get(1);
        // a on top of b: the two overlap on one telescope.
        Answer moved = api.post("/api/visits/" + a.get("id") + "/move", COORD, "{\"telescopeId\":" + granted
                + ",\"start\":\"" + b.get("start") + "\"}");
        assertThat(moved.status()).as(moved.body()).isEqualTo(200);
        assertThat(moved.<List<String>>json("$.hardBroken")).contains("Telescope overlap");
        long revision = api.get("/api/plans/draft", COORD).id("$.revision");
        Answer refused = api.post("/api/plans/draft/publish?revision=" + revision, COORD, null);
        assertThat(refused.status()).as(refused.body()).isEqualTo(409);
        assertThat(refused.<List<String>>json("$.broken[*].rule")).contains("Telescope overlap");
        assertThat(refused.<List<String>>json("$.broken[?(@.rule == 'Telescope overlap')].visits[*]"))
                .contains((String) a.get("id"), (String) b.get("id"));
        Answer noReason = api.post("/api/plans/draft/publish?revision=" + revision + "&force=true", COORD, null);
        assertThat(noReason.status()).isEqualTo(400);
        assertThat(noReason.<List<String>>json("$.errors[*].field")).containsExactly("reason");
        Answer forced = api.post("/api/plans/draft/publish?revision=" + revision + "&force=true&reason=two%20cameras",
                COORD, null);
        assertThat(forced.status()).as(forced.body()).isEqualTo(200);
        assertThat((String) forced.json("$.forced")).isEqualTo("two cameras");
        Answer audit = api.get("/api/audit?entityType=plan&size=1", COORD);
        assertThat(audit.body()).contains("two cameras").contains("Telescope overlap");
        // The same draft once more: nothing new is published.
        Answer again = api.post("/api/plans/draft/publish?revision=" + revision, COORD, null);
        assertThat(again.status()).as(again.body()).isEqualTo(200);
        assertThat((Boolean) again.json("$.changed")).isFalse();
        assertThat(again.id("$.revision")).isEqualTo(forced.id("$.revision"));
        // Mend it for the steps after.
        assertThat(api.post("/api/visits/" + a.get("id") + "/unplace", COORD, null).status()).isEqualTo(200);
        run("2027-01-10", "2027-01-25", null);
        publish();
    }

    @Test
    @Order(5)
    void aRunOverNightsAlreadyPastPlacesNothingBeforeNowAndLeavesHistoryAsPublished() {
        Answer published = api.get("/api/plans/published", COORD);
        List<Map<String, Object>> firstNight = published.json("$.visits[?(@.night == '2027-01-10')]");
        assertThat(firstNight).isNotEmpty();
        Instant afterFirst = firstNight.stream().map(v -> Instant.parse((String) v.get("end"))).max(Instant::compareTo)
                .orElseThrow().plus(Duration.ofMinutes(1));
        clock.set(afterFirst);
        run("2027-01-09", "2027-01-13", null);
        Answer draft = api.get("/api/plans/draft", COORD);
        Instant now = Instant.parse(draft.json("$.now"));
        for (Map<String, Object> v : draft.<List<Map<String, Object>>>json("$.visits")) {
            Instant start = Instant.parse((String) v.get("start"));
            if (start.isBefore(now)) {
                List<String> was = published.json("$.visits[?(@.id == '" + v.get("id") + "')].start");
                assertThat(was).as("visit %s before now is history", v.get("id")).containsExactly((String) v.get("start"));
                assertThat((String) v.get("status")).isNotEqualTo("planned");
            } else {
                assertThat(start).isAfterOrEqualTo(now.plus(Duration.ofMinutes(15)));
            }
        }
        // A move into the past is refused naming start; history cannot be moved at all.
        String past = (String) firstNight.get(0).get("id");
        assertThat(api.post("/api/visits/" + past + "/unplace", COORD, null).status()).isEqualTo(409);
        String ahead = draft.<List<String>>json("$.visits[?(@.status == 'planned')].id").get(0);
        Answer intoThePast = api.post("/api/visits/" + ahead + "/move?dryRun=true", COORD, "{\"telescopeId\":" + granted
                + ",\"start\":\"" + firstNight.get(0).get("start") + "\"}");
        assertThat(intoThePast.status()).isEqualTo(400);
        assertThat(intoThePast.<List<String>>json("$.errors[*].field")).containsExactly("start");
    }

    @Test
    @Order(6)
    void aFailedVisitStaysInHistoryAndItsRepeatIsPlannedAgainAhead() {
        Answer published = api.get("/api/plans/published", COORD);
        Map<String, Object> done = published.<List<Map<String, Object>>>json("$.visits[?(@.status == 'awaiting report')]").get(0);
        long scope = ((Number) done.get("telescopeId")).longValue();
        String token = api.post("/api/tokens", ADMIN, "{\"name\":\"rules dome\",\"telescopeId\":" + scope
                + ",\"scope\":\"reports\"}").json("$.token");
        Answer failed = api.post("/api/reports", ApiClient.bearer(token), "{\"visitId\":\"" + done.get("id")
                + "\",\"outcome\":\"failed\",\"reason\":\"clouds\"}");
        assertThat(failed.status()).as(failed.body()).isEqualTo(201);
        // A report on a visit still ahead is refused: a report is about what happened.
        List<Map<String, Object>> aheadOnScope = published.json("$.visits[?(@.status == 'planned' && @.telescopeId == "
                + scope + ")]");
        if (!aheadOnScope.isEmpty()) {
            assertThat(api.post("/api/reports", ApiClient.bearer(token), "{\"visitId\":\"" + aheadOnScope.get(0).get("id")
                    + "\",\"outcome\":\"done\"}").status()).isEqualTo(409);
        }
        run("2027-01-10", "2027-01-25", null);
        Answer draft = api.get("/api/plans/draft", COORD);
        assertThat(draft.<List<String>>json("$.visits[?(@.id == '" + done.get("id") + "')].status")).containsExactly("failed");
        long request = ((Number) done.get("requestId")).longValue();
        List<String> again = draft.json("$.visits[?(@.requestId == " + request + " && @.status == 'planned')].id");
        again.addAll(draft.json("$.unplaced[?(@.requestId == " + request + ")].visitId"));
        assertThat(again).isNotEmpty().doesNotContain((String) done.get("id"));
        List<String> starts = draft.json("$.visits[?(@.requestId == " + request + " && @.status == 'planned')].start");
        Instant now = Instant.parse(draft.json("$.now"));
        assertThat(starts).allSatisfy(s -> assertThat(Instant.parse(s)).isAfter(now));
    }

    @Test
    @Order(7)
    void aWithdrawnRequestLeavesThePublishedPlanAndItsCalendarEventIsCancelled() throws Exception {
        publish();
        Answer published = api.get("/api/plans/published", COORD);
        Map<String, Object> visit = published.<List<Map<String, Object>>>json("$.visits[?(@.status == 'planned')]").get(0);
        long request = ((Number) visit.get("requestId")).longValue();
        String[] key = ((String) visit.get("id")).split("-");
        String uid = "visit-" + (Long.parseLong(key[0]) * 1000 + Long.parseLong(key[1])) + "@skyrota";
        VEvent before = event(uid);
        assertThat(before.<Property>getProperty("STATUS").orElseThrow().getValue()).isEqualTo("CONFIRMED");
        int sequence = Integer.parseInt(before.<Property>getProperty("SEQUENCE").orElseThrow().getValue());
        Answer withdrawn = api.post("/api/requests/" + request + "/withdraw?version="
                + api.get("/api/requests/" + request, COORD).id("$.version"), COORD, null);
        assertThat(withdrawn.status()).as(withdrawn.body()).isEqualTo(200);
        assertThat(api.get("/api/plans/published", COORD).<List<Object>>json("$.visits[?(@.requestId == " + request
                + " && @.status == 'planned')]")).isEmpty();
        assertThat(api.get("/api/plans/draft", COORD).<List<Object>>json("$.visits[?(@.requestId == " + request
                + " && @.status == 'planned')]")).isEmpty();
        VEvent cancelled = event(uid);
        assertThat(cancelled.<Property>getProperty("STATUS").orElseThrow().getValue()).isEqualTo("CANCELLED");
        assertThat(Integer.parseInt(cancelled.<Property>getProperty("SEQUENCE").orElseThrow().getValue())).isGreaterThan(sequence);
        // Published again, the cancellation stays in the calendar, and unchanged visits keep their sequence.
        Answer p = publish();
        assertThat((Integer) p.json("$.cancelled")).isPositive();
        assertThat(event(uid).<Property>getProperty("STATUS").orElseThrow().getValue()).isEqualTo("CANCELLED");
    }

    @Test
    @Order(8)
    void requestsCompleteWhenEveryRepeatIsObservedAndExpireWhenTheirNightsAreOver() {
        long shortOne = requests.get(4);
        assertThat((String) api.get("/api/requests/" + shortOne, COORD).json("$.state")).isIn("accepted", "withdrawn");
        moveClock("2027-01-14T12:00:00Z");
        for (long id : requests.subList(4, 6)) {
            String state = api.get("/api/requests/" + id, COORD).json("$.state");
            assertThat(state).as("request %d, nights to 2027-01-12", id).isIn("expired", "completed", "withdrawn");
        }
        // One of the long requests observed in full: completed at the next pass.
        Answer published = api.get("/api/plans/published", COORD);
        // Reported late (they count as missed until a report comes), but reported all the same.
        List<Map<String, Object>> over = published.json("$.visits[?(@.status == 'awaiting report' || @.status == 'missed')]");
        assertThat(over).isNotEmpty();
        Map<Long, String> tokens = new java.util.HashMap<>();
        for (Map<String, Object> v : over) {
            long scope = ((Number) v.get("telescopeId")).longValue();
            String token = tokens.computeIfAbsent(scope, s -> api.post("/api/tokens", ADMIN, "{\"name\":\"rules " + s
                    + "\",\"telescopeId\":" + s + ",\"scope\":\"reports\"}").json("$.token"));
            assertThat(api.post("/api/reports", ApiClient.bearer(token), "{\"visitId\":\"" + v.get("id")
                    + "\",\"outcome\":\"done\"}").status()).isEqualTo(201);
        }
        moveClock("2027-01-14T12:05:00Z");
        long completed = requests.stream().filter(id -> "completed".equals(api.get("/api/requests/" + id, COORD)
                .json("$.state"))).count();
        assertThat(completed).isPositive();
    }

    @Test
    @Order(9)
    void aRunRestrictedToOneSiteLeavesTheOtherSitesVisitsAndReasonsAlone() {
        run("2027-01-14", "2027-01-25", null);
        Answer before = api.get("/api/plans/draft", COORD);
        run("2027-01-14", "2027-01-25", desert);
        Answer after = api.get("/api/plans/draft", COORD);
        List<Map<String, Object>> hillVisits = before.json("$.visits[?(@.siteId == " + hill + " && @.status == 'planned')]");
        for (Map<String, Object> v : hillVisits) {
            assertThat(after.<List<String>>json("$.visits[?(@.id == '" + v.get("id") + "')].start"))
                    .containsExactly((String) v.get("start"));
        }
        for (String reason : after.<List<String>>json("$.unplaced[*].reason")) {
            assertThat(reason).doesNotStartWith("no telescope has an instrument");
        }
    }

    // ---- helpers ----

    /** Moves the server's clock as an admin does: what the new time has ended is settled before the answer. */
    void moveClock(String to) {
        Answer set = api.put("/api/clock", ADMIN, "{\"now\":\"" + to + "\"}");
        assertThat(set.status()).as(set.body()).isEqualTo(200);
    }

    VEvent event(String uid) throws Exception {
        String ics = api.get("/api/plans/published.ics", COORD).body();
        List<VEvent> events = new CalendarBuilder().build(new ByteArrayInputStream(ics.getBytes(StandardCharsets.UTF_8)))
                .getComponents("VEVENT");
        return events.stream().filter(e -> e.<Property>getProperty("UID").orElseThrow().getValue().equals(uid))
                .findFirst().orElseThrow(() -> new AssertionError("no event " + uid + " in\n" + ics));
    }

    void run(String first, String last, Long site) {
        Answer started = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"" + first + "\",\"lastNight\":\"" + last
                + "\",\"seconds\":1" + (site == null ? "" : ",\"siteIds\":[" + site + "]") + "}");
        assertThat(started.status()).as(started.body()).isEqualTo(202);
        Answer run = api.awaitRunEnd(started.id("$.id"), COORD, Duration.ofSeconds(180));
        assertThat((String) run.json("$.state")).as(run.body()).isEqualTo("finished");
        assertThat((String) run.json("$.summary.sentence")).startsWith("Placed ");
    }

    Answer publish() {
        long revision = api.get("/api/plans/draft", COORD).id("$.revision");
        Answer p = api.post("/api/plans/draft/publish?revision=" + revision, COORD, null);
        assertThat(p.status()).as(p.body()).isEqualTo(200);
        return p;
    }

    long telescope(long site, String name) {
        long id = created(api.post("/api/telescopes", COORD, "{\"siteId\":" + site + ",\"name\":\"" + name
                + "\",\"apertureMm\":400,\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10,\"active\":true}"));
        created(api.post("/api/instruments", COORD, "{\"telescopeId\":" + id + ",\"name\":\"CCD " + name
                + "\",\"readoutSeconds\":5,\"filterChangeSeconds\":10,\"certifiedSolarFilter\":false,\"filters\":[\"V\"]}"));
        return id;
    }

    long accepted(String target, double ra, double dec, String first, String last, int repeats) {
        long id = created(api.post("/api/requests", COORD, "{\"programId\":" + program + ",\"owner\":\"trstudent\","
                + "\"targetName\":\"" + target + "\",\"ra\":" + ra + ",\"dec\":" + dec
                + ",\"exposures\":[{\"filter\":\"V\",\"seconds\":60,\"count\":5}],\"minAltitudeDeg\":30,"
                + "\"earliestNight\":\"" + first + "\",\"latestNight\":\"" + last + "\",\"repeats\":" + repeats
                + (repeats > 1 ? ",\"repeatIntervalHours\":24,\"repeatToleranceHours\":4" : "") + ",\"priority\":3}"));
        Answer s = api.post("/api/requests/" + id + "/submit?version=0", COORD, null);
        Answer a = api.post("/api/requests/" + id + "/accept?version=" + s.id("$.version"), COORD, null);
        assertThat(a.status()).as(a.body()).isEqualTo(200);
        return id;
    }

    static long created(Answer a) {
        assertThat(a.status()).as(a.body()).isEqualTo(201);
        return a.id("$.id");
    }
}
