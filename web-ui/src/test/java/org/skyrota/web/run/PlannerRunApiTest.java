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
import org.springframework.test.context.TestPropertySource;

/**
 * Planner runs over HTTP: start, follow the event stream to its end, read the run and then the draft it wrote;
 * one run at a time per horizon; cancelling; pins kept across a re-run; publish and compare.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
// A context of its own: runs plan every stored site, so another class's network would share this draft.
@TestPropertySource(properties = "skyrota.test.context=planner-runs")
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

    Answer draft() {
        Answer d = api.get("/api/plans/draft", COORD);
        assertThat(d.status()).isEqualTo(200);
        return d;
    }

    @Test
    void oneRunAtATimePerHorizonAndARunCanBeCancelled() {
        Answer first = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"2027-01-10\",\"lastNight\":\"2027-01-11\",\"seconds\":20}");
        assertThat(first.status()).isEqualTo(202);
        Answer overlapping = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"2027-01-11\",\"lastNight\":\"2027-01-12\",\"seconds\":1}");
        assertThat(overlapping.status()).isEqualTo(409);
        assertThat(overlapping.contentType()).startsWith("application/problem+json");
        Answer cancelled = api.delete("/api/planner/runs/" + first.id("$.id"), COORD);
        assertThat(cancelled.status()).as(cancelled.body()).isEqualTo(200);
        assertThat((String) cancelled.json("$.state")).isEqualTo("cancelled");
        assertThat((String) cancelled.json("$.message")).isEqualTo("cancelled by runcoord");
        List<Event> events = api.events("/api/planner/runs/" + first.id("$.id") + "/events", COORD, "done", Duration.ofSeconds(30));
        assertThat((String) JsonPath.read(events.get(events.size() - 1).data(), "$.state")).isEqualTo("cancelled");
        // Ended runs cannot be cancelled again; bad input is a 400 naming the field.
        assertThat(api.delete("/api/planner/runs/" + first.id("$.id"), COORD).status()).isEqualTo(409);
        Answer bad = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"2027-01-10\",\"lastNight\":\"2027-01-11\",\"seconds\":601}");
        assertThat(bad.status()).isEqualTo(400);
        assertThat((String) bad.json("$.parameter")).isEqualTo("seconds");
        Answer badRule = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"2027-01-10\",\"lastNight\":\"2027-01-11\",\"weights\":{\"No such rule\":{\"soft\":1}}}");
        assertThat(badRule.status()).isEqualTo(400);
        assertThat(api.get("/api/planner/runs/999999", COORD).status()).isEqualTo(404);
    }

    @Test
    void aRunWithWeightsIsAccepted() {
        Answer started = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"2027-01-10\",\"lastNight\":\"2027-01-11\",\"seconds\":1,"
                + "\"siteIds\":[" + network.siteId + "],\"weights\":{\"Idle time between visits\":{\"soft\":5},"
                // a score-rule plugin's rule is weighted by name like a built-in one (the bundled equatorial-mount plugin)
                + "\"Meridian flip during visit\":{\"soft\":3}}}");
        assertThat(started.status()).as(started.body()).isEqualTo(202);
        List<Event> events = api.events("/api/planner/runs/" + started.id("$.id") + "/events", COORD, "done", Duration.ofSeconds(60));
        assertThat((String) JsonPath.read(events.get(events.size() - 1).data(), "$.state")).isEqualTo("finished");
    }

    @Test
    void aPinnedVisitStaysWhereItWasPinnedAcrossARerun() {
        runToTheEnd(1);
        Answer d = draft();
        Map<String, Object> visit = d.<List<Map<String, Object>>>json("$.visits").get(0);
        String id = (String) visit.get("id");
        String newStart = java.time.Instant.parse((String) visit.get("start")).plus(Duration.ofMinutes(20)).toString();
        Answer moved = api.post("/api/visits/" + id + "/move", COORD, "{\"telescopeId\":" + network.telescopeId
                + ",\"start\":\"" + newStart + "\"}");
        assertThat(moved.status()).as(moved.body()).isEqualTo(200);
        assertThat((Boolean) moved.json("$.dryRun")).isFalse();

        runToTheEnd(1);
        List<Map<String, Object>> after = draft().json("$.visits[?(@.id == '" + id + "')]");
        assertThat(after).hasSize(1);
        assertThat(after.get(0).get("start")).isEqualTo(newStart);
        assertThat(after.get(0).get("pinned")).isEqualTo(true);

        Answer unpinned = api.post("/api/visits/" + id + "/unpin", COORD, null);
        assertThat(unpinned.status()).isEqualTo(200);
        assertThat(draft().<List<Boolean>>json("$.visits[?(@.id == '" + id + "')].pinned")).containsExactly(false);
    }

    @Test
    void overridesReportTheirEffectFirstAndAStaleRevisionIsRefused() {
        runToTheEnd(1);
        Answer d = draft();
        long version = d.id("$.version");
        List<Map<String, Object>> visits = d.json("$.visits");
        assertThat(visits.size()).isGreaterThanOrEqualTo(2);
        String id = (String) visits.get(0).get("id");

        Answer dry = api.post("/api/visits/" + id + "/unplace?dryRun=true&version=" + version, COORD, null);
        assertThat(dry.status()).as(dry.body()).isEqualTo(200);
        assertThat((Boolean) dry.json("$.dryRun")).isTrue();
        // Leaving a placed visit out costs its priority-weighted minutes at the medium level (the README, "Planner score rules and their default weights").
        assertThat(medium(dry.json("$.scoreAfter"))).isLessThan(medium(dry.json("$.scoreBefore")));
        assertThat(draft().id("$.version")).isEqualTo(version);
        assertThat(draft().<List<String>>json("$.visits[*].id")).contains(id);

        // Putting a second visit on top of the first breaks "Telescope overlap" (hard).
        String other = (String) visits.get(1).get("id");
        Answer overlap = api.post("/api/visits/" + other + "/move?dryRun=true", COORD, "{\"telescopeId\":" + network.telescopeId
                + ",\"start\":\"" + visits.get(0).get("start") + "\"}");
        assertThat(overlap.status()).as(overlap.body()).isEqualTo(200);
        assertThat(overlap.<List<String>>json("$.hardBroken")).contains("Telescope overlap");
        assertThat(hard(overlap.json("$.scoreAfter"))).isLessThan(0);

        Answer real = api.post("/api/visits/" + id + "/unplace?version=" + version, COORD, null);
        assertThat(real.status()).isEqualTo(200);
        assertThat((String) real.json("$.scoreAfter")).isEqualTo(dry.json("$.scoreAfter"));
        assertThat(real.id("$.version")).isGreaterThan(version);
        assertThat(draft().<List<String>>json("$.unplaced[*].visitId")).contains(id);

        Answer stale = api.post("/api/visits/" + other + "/pin?version=" + version, COORD, null);
        assertThat(stale.status()).isEqualTo(409);
        assertThat(stale.id("$.currentVersion")).isEqualTo(real.id("$.version"));
    }

    @Test
    void closingANightTakesItsVisitsOutAndARerunLeavesItEmpty() {
        runToTheEnd(1);
        String night = PlanningNetwork.FIRST_NIGHT;
        Answer closed = api.put("/api/plans/draft/nights", COORD, "{\"telescopeId\":" + network.telescopeId
                + ",\"night\":\"" + night + "\",\"state\":\"closed\",\"reason\":\"dome maintenance\"}");
        assertThat(closed.status()).as(closed.body()).isEqualTo(200);
        Answer d = draft();
        assertThat(d.<List<String>>json("$.visits[*].night")).doesNotContain(night);
        assertThat(d.<List<String>>json("$.closedNights[?(@.night == '" + night + "')].state")).containsExactly("closed");
        runToTheEnd(1);
        assertThat(draft().<List<String>>json("$.visits[*].night")).isNotEmpty().doesNotContain(night);
        Answer opened = api.put("/api/plans/draft/nights", COORD, "{\"telescopeId\":" + network.telescopeId
                + ",\"night\":\"" + night + "\",\"state\":\"open\"}");
        assertThat(opened.status()).isEqualTo(200);
        assertThat(draft().<List<Object>>json("$.closedNights")).isEmpty();
    }

    @Test
    void publishingCopiesTheDraftAndCompareShowsLaterChanges() {
        runToTheEnd(1);
        Answer d = draft();
        Answer published = api.post("/api/plans/draft/publish?revision=" + d.id("$.revision"), COORD, null);
        assertThat(published.status()).as(published.body()).isEqualTo(200);
        assertThat((String) published.json("$.plan.state")).isEqualTo("published");
        assertThat(published.<List<String>>json("$.plan.visits[*].id")).containsExactlyInAnyOrderElementsOf(d.json("$.visits[*].id"));
        Answer again = api.get("/api/plans/published", STUDENT);
        assertThat(again.status()).isEqualTo(200);
        assertThat(again.id("$.revision")).isEqualTo(published.id("$.revision"));
        // The published view is kept between reads and narrowed for each reader: a requester sees only their own
        // name, a coordinator every owner's; nights and site narrow the visits.
        assertThat(api.get("/api/plans/published", COORD).<List<String>>json("$.visits[*].owner"))
                .contains("runstudent", "runother");
        assertThat(again.<List<String>>json("$.visits[*].owner")).contains("runstudent").doesNotContain("runother");
        assertThat(api.get("/api/plans/published", OTHER).<List<String>>json("$.visits[*].owner"))
                .contains("runother").doesNotContain("runstudent");
        assertThat(api.get("/api/plans/published?siteId=999999", COORD).<List<Object>>json("$.visits")).isEmpty();
        assertThat(api.get("/api/plans/published?siteId=" + network.siteId, COORD).<List<Object>>json("$.visits"))
                .hasSameSizeAs(again.<List<Object>>json("$.visits"));
        String lastNight = PlanningNetwork.LAST_NIGHT;
        assertThat(api.get("/api/plans/published?from=" + lastNight + "&to=" + lastNight, COORD)
                .<List<String>>json("$.visits[*].night")).containsOnly(lastNight);

        Answer same = api.get("/api/plans/compare", COORD);
        assertThat(same.<List<Object>>json("$.placed")).isEmpty();
        assertThat(same.<List<Object>>json("$.moved")).isEmpty();
        assertThat(same.<List<Object>>json("$.dropped")).isEmpty();

        List<Map<String, Object>> visits = d.json("$.visits");
        String dropped = (String) visits.get(0).get("id");
        assertThat(api.post("/api/visits/" + dropped + "/unplace", COORD, null).status()).isEqualTo(200);
        String moved = (String) visits.get(visits.size() - 1).get("id");
        String later = java.time.Instant.parse((String) visits.get(visits.size() - 1).get("start")).plus(Duration.ofMinutes(10)).toString();
        assertThat(api.post("/api/visits/" + moved + "/move", COORD, "{\"telescopeId\":" + network.telescopeId
                + ",\"start\":\"" + later + "\"}").status()).isEqualTo(200);
        Answer diff = api.get("/api/plans/compare", COORD);
        assertThat(diff.<List<String>>json("$.dropped[*].id")).containsExactly(dropped);
        assertThat(diff.<List<String>>json("$.moved[*].id")).containsExactly(moved);
        assertThat(diff.<List<String>>json("$.moved[*].start")).containsExactly(later);

        // A run never touches the published plan; a stale revision cannot be published.
        runToTheEnd(1);
        assertThat(api.get("/api/plans/published", COORD).<List<String>>json("$.visits[*].id"))
                .containsExactlyInAnyOrderElementsOf(published.json("$.plan.visits[*].id"));
        assertThat(api.post("/api/plans/draft/publish?revision=" + d.id("$.revision"), COORD, null).status()).isEqualTo(409);
        Answer audit = api.get("/api/audit?entityType=plan", COORD);
        assertThat(audit.<List<String>>json("$.items[*].action")).contains("publish", "override");
    }

    @Test
    void candidatesAreScoredAsTheMoveThereWouldBe() {
        runToTheEnd(1);
        Map<String, Object> visit = draft().<List<Map<String, Object>>>json("$.visits").get(0);
        String id = (String) visit.get("id");
        Answer list = api.get("/api/visits/" + id + "/candidates", COORD);
        assertThat(list.status()).as(list.body()).isEqualTo(200);
        List<Map<String, Object>> candidates = list.json("$");
        assertThat(candidates).isNotEmpty().hasSizeLessThanOrEqualTo(12);
        assertThat(candidates).allSatisfy(c -> {
            assertThat((String) c.get("start")).isLessThan((String) c.get("end"));
            assertThat((String) c.get("scoreChange")).matches("-?\\d+hard/-?\\d+medium/-?\\d+soft");
        });
        Map<String, Object> c = candidates.get(0);
        Answer dry = api.post("/api/visits/" + id + "/move?dryRun=true", COORD, "{\"telescopeId\":" + c.get("telescopeId")
                + ",\"start\":\"" + c.get("start") + "\"}");
        assertThat(dry.status()).isEqualTo(200);
        String[] before = ((String) dry.json("$.scoreBefore")).split("/");
        String[] after = ((String) dry.json("$.scoreAfter")).split("/");
        String[] change = ((String) c.get("scoreChange")).split("/");
        for (int level = 0; level < 3; level++) {
            assertThat(number(after[level]) - number(before[level])).as("level " + level).isEqualTo(number(change[level]));
        }
        assertThat(api.get("/api/visits/999999-1/candidates", COORD).status()).isEqualTo(404);
    }

    static long number(String part) {
        return Long.parseLong(part.replaceAll("[a-z]", ""));
    }

    static long medium(String score) {
        return Long.parseLong(score.split("/")[1].replace("medium", ""));
    }

    static long hard(String score) {
        return Long.parseLong(score.split("/")[0].replace("hard", ""));
    }
}
