package org.skyrota.web.term;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Random;
import java.util.Set;

import net.fortuna.ical4j.data.CalendarBuilder;
import net.fortuna.ical4j.model.Calendar;
import net.fortuna.ical4j.model.Property;
import net.fortuna.ical4j.model.component.VEvent;

import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;

/**
 * A term of operations, day after day, against a real server over HTTP, as a club network's coordinator, students and
 * telescope computers would run it. Each day: the clock moves to the day's noon (UTC); students import new requests and
 * the coordinator accepts them; the telescopes report the visits that have ended (most done, some failed, a few never
 * reported, so that they are missed); now and then the conditions file closes a night; the planner runs over the next
 * seven nights; an alert comes in (twice, with the same IVORN); a student withdraws a request; one site is re-planned;
 * the draft is published (and published again, which must change nothing). After every step it checks the term's
 * invariants:
 * <ul>
 *   <li>no planner run failed;</li>
 *   <li>no draft or published visit lies before now unless it was published before it started (history);</li>
 *   <li>published history never changes;</li>
 *   <li>every accepted request open in the run's nights is placed or has a reason for each repeat;</li>
 *   <li>no grant is exceeded (the grant ledger names no program over a grant);</li>
 *   <li>the calendar export holds exactly the published plan's visits, and the withdrawn ones as cancelled.</li>
 * </ul>
 * The network is invented (its sites, programs and people); targets are real objects by catalogue number, with
 * approximate coordinates recalled from memory.
 */
public final class TermSimulation {

    /**
     * How big a term to run.
     *
     * @param days              days to walk
     * @param telescopesPerSite telescopes at each of the three sites
     * @param requestsPerDay    new requests each day
     * @param runSeconds        time limit of the daily runs
     * @param grantHours        hours of the programs' grants, scaled from the test's small term
     */
    public record Scale(int days, int telescopesPerSite, int requestsPerDay, int runSeconds, double grantHours) {
        public static Scale test() {
            return new Scale(21, 1, 4, 1, 1.0);
        }
    }

    /** What the term did. */
    public record Outcome(int days, int runs, int failedRuns, List<String> broken, double placedHours,
                          double observedHours, int grantOverruns, List<Double> runSeconds, int checks,
                          int historyVisits, int cancelledSeen, int withdrawn) {

        public double medianRunSeconds() {
            List<Double> sorted = runSeconds.stream().sorted().toList();
            return sorted.isEmpty() ? 0 : sorted.get(sorted.size() / 2);
        }
    }

    static final LocalDate START = LocalDate.of(2027, 1, 4);
    static final String PASSWORD = "term-password-1";

    /** name, RA degrees, Dec degrees: approximate, recalled from memory. */
    private static final Object[][] TARGETS = {
            {"NGC 253", 11.9, -25.3}, {"NGC 300", 13.7, -37.7}, {"M 33", 23.5, 30.7}, {"NGC 628", 24.2, 15.8},
            {"NGC 752", 29.4, 37.8}, {"NGC 1068", 40.7, 0.0}, {"NGC 1291", 49.3, -41.1}, {"M 45", 56.9, 24.1},
            {"NGC 1499", 60.2, 36.4}, {"NGC 1535", 63.6, -12.7}, {"NGC 1851", 78.5, -40.0}, {"NGC 1912", 82.2, 35.8},
            {"NGC 1952", 83.6, 22.0}, {"NGC 2070", 84.7, -69.1}, {"NGC 2168", 92.2, 24.3}, {"NGC 2244", 98.0, 4.9},
            {"NGC 2264", 100.2, 9.9}, {"NGC 2392", 112.3, 20.9}, {"NGC 2440", 113.8, -18.2}, {"NGC 2516", 119.5, -60.9},
            {"NGC 2632", 130.1, 19.7}, {"NGC 2682", 132.8, 11.8}, {"NGC 2808", 138.0, -64.9}, {"NGC 3031", 148.9, 69.1},
            {"NGC 3132", 151.8, -40.4}, {"NGC 3242", 156.2, -18.6}, {"NGC 3372", 161.3, -59.9}, {"NGC 3532", 166.4, -58.8},
            {"NGC 3628", 170.1, 13.6}, {"NGC 4038", 180.5, -18.9}};

    private final ApiClient api;
    private final Path conditionsFile;
    private final Scale scale;
    private final Random random = new Random(2027);
    private final String admin;
    private final String coordinator;
    private final List<String> students = new ArrayList<>();
    private final Map<Long, String> reportTokenByTelescope = new HashMap<>();
    private final List<Long> siteIds = new ArrayList<>();
    private final List<String> siteNames = new ArrayList<>();
    private final List<String> programCodes = new ArrayList<>();
    private final List<Long> programIds = new ArrayList<>();
    private final Map<String, Long> seenRuns = new LinkedHashMap<>();
    private final List<String> broken = new ArrayList<>();
    private final List<Double> runSeconds = new ArrayList<>();
    private int failedRuns;
    private int runs;
    private int grantOverruns;
    private int checks;
    private final Set<String> cancelledSeen = new HashSet<>();
    /** Every published visit ever seen to have started: id to "telescope start end". */
    private final Map<String, String> historySeen = new HashMap<>();
    /** The published plan's placed visits as last read: id to "telescope start end". */
    private Map<String, String> lastPublished = Map.of();
    private final Set<Long> withdrawn = new HashSet<>();
    private LocalDate today;
    private int serial;

    /**
     * @param adminPassword  the password of the server's first account, {@code admin}
     * @param conditionsFile the conditions file the server reads before each run ({@code skyrota.conditions.file}, or
     *                       {@code <data-dir>/conditions.csv})
     */
    public TermSimulation(ApiClient api, String adminPassword, Path conditionsFile, Scale scale) {
        this.api = api;
        this.conditionsFile = conditionsFile;
        this.scale = scale;
        this.admin = ApiClient.basic("admin", adminPassword);
        this.coordinator = ApiClient.basic("term-coordinator", PASSWORD);
    }

    /** Walks the term and answers what it did; the broken invariants are in {@link Outcome#broken()}. */
    public Outcome run() throws IOException {
        setUp();
        for (int day = 0; day < scale.days(); day++) {
            today = START.plusDays(day);
            day(day);
        }
        double observed = 0;
        for (Map<String, Object> u : api.get("/api/programs/usage", coordinator).<List<Map<String, Object>>>json("$")) {
            observed += ((Number) u.get("observedHours")).doubleValue();
        }
        double placed = 0;
        for (Map<String, Object> v : api.get("/api/plans/published", coordinator).<List<Map<String, Object>>>json("$.visits")) {
            placed += Duration.between(Instant.parse((String) v.get("start")), Instant.parse((String) v.get("end")))
                    .toSeconds() / 3600.0;
        }
        return new Outcome(scale.days(), runs, failedRuns, List.copyOf(broken), placed, observed, grantOverruns,
                List.copyOf(runSeconds), checks, historySeen.size(), cancelledSeen.size(), withdrawn.size());
    }

    // ---- the network ----

    private void setUp() throws IOException {
        moveClock(START.minusDays(1).atTime(12, 0).toInstant(java.time.ZoneOffset.UTC));
        created(api.post("/api/accounts", admin, "{\"username\":\"term-coordinator\",\"password\":\"" + PASSWORD
                + "\",\"role\":\"coordinator\"}"), "$.username");
        for (int i = 1; i <= 3; i++) {
            created(api.post("/api/accounts", admin, "{\"username\":\"term-student" + i + "\",\"password\":\"" + PASSWORD
                    + "\",\"role\":\"requester\"}"), "$.username");
            students.add(ApiClient.basic("term-student" + i, PASSWORD));
        }
        // Invented sites in both hemispheres: a northern moor, a southern plateau, a desert.
        Object[][] sites = {{"Harrow Moor Observatory", 55.9, -3.2, 250, "Europe/London"},
                {"Kloofrand Station", -32.4, 20.7, 1750, "Africa/Johannesburg"},
                {"Ocotillo Flat Site", 31.9, -111.6, 1900, "America/Phoenix"}};
        List<List<Long>> telescopes = new ArrayList<>();
        for (Object[] s : sites) {
            long site = created(api.post("/api/sites", coordinator, String.format(Locale.ROOT,
                    "{\"name\":\"%s\",\"latitudeDeg\":%s,\"longitudeDeg\":%s,\"elevationM\":%s,\"timeZone\":\"%s\","
                            + "\"darkSkyZenithVMag\":21.5}", s[0], s[1], s[2], s[3], s[4])));
            siteIds.add(site);
            siteNames.add((String) s[0]);
            List<Long> here = new ArrayList<>();
            for (int t = 1; t <= scale.telescopesPerSite(); t++) {
                long scope = created(api.post("/api/telescopes", coordinator, "{\"siteId\":" + site + ",\"name\":\"T"
                        + t + "\",\"apertureMm\":400,\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10,"
                        + "\"active\":true}"));
                created(api.post("/api/instruments", coordinator, "{\"telescopeId\":" + scope + ",\"name\":\"CCD\","
                        + "\"readoutSeconds\":5,\"filterChangeSeconds\":10,\"certifiedSolarFilter\":false,"
                        + "\"filters\":[\"B\",\"V\",\"R\"]}"));
                here.add(scope);
                Answer token = api.post("/api/tokens", admin, "{\"name\":\"dome " + scope + "\",\"telescopeId\":" + scope
                        + ",\"scope\":\"reports\"}");
                reportTokenByTelescope.put(scope, ApiClient.bearer(created(token, "$.token")));
            }
            telescopes.add(here);
        }
        String first = START.minusDays(1).toString();
        String last = START.plusDays(60).toString();
        double h = scale.grantHours();
        // A grant on one telescope and one at a site; one at another site; one anywhere; alerts anywhere.
        program("TRM-LAB", "Laboratory course", String.format(Locale.ROOT,
                "{\"telescopeId\":%d,\"hours\":%.1f,\"firstNight\":\"%s\",\"lastNight\":\"%s\"},"
                        + "{\"siteId\":%d,\"hours\":%.1f,\"firstNight\":\"%s\",\"lastNight\":\"%s\"}",
                telescopes.get(0).get(0), 6 * h, first, last, siteIds.get(2), 4 * h, first, last));
        program("TRM-CLUB", "Club variable stars", String.format(Locale.ROOT,
                "{\"siteId\":%d,\"hours\":%.1f,\"firstNight\":\"%s\",\"lastNight\":\"%s\"}",
                siteIds.get(1), 8 * h, first, last));
        program("TRM-OUT", "Outreach images", String.format(Locale.ROOT,
                "{\"hours\":%.1f,\"firstNight\":\"%s\",\"lastNight\":\"%s\"}", 5 * h, first, last));
        // The alerts' program: its title is what the server's skyrota.voevent.program names by default.
        created(api.post("/api/programs", coordinator, String.format(Locale.ROOT,
                "{\"code\":\"TRM-TOO\",\"title\":\"Target of opportunity\",\"principalInvestigator\":\"term-coordinator\","
                        + "\"active\":true,\"grants\":[{\"hours\":%.1f,\"firstNight\":\"%s\",\"lastNight\":\"%s\"}]}",
                3 * h, first, last)));
    }

    private void program(String code, String title, String grants) {
        programIds.add(created(api.post("/api/programs", coordinator, "{\"code\":\"" + code + "\",\"title\":\"" + title
                + "\",\"principalInvestigator\":\"term-coordinator\",\"active\":true,\"grants\":[" + grants + "]}")));
        programCodes.add(code);
    }

    // ---- a day ----

    private void day(int day) throws IOException {
        moveClock(today.atTime(12, 0).toInstant(java.time.ZoneOffset.UTC));
        check("clock moved to " + today, false);
        newRequests();
        check("requests imported and accepted", false);
        reports();
        check("reports", false);
        if (day % 5 == 2) {
            conditions(day);
        }
        run(today, today.plusDays(6), null, "daily run");
        check("daily run", true);
        if (day % 3 == 1) {
            alert(day);
            check("alert", false);
        }
        if (day % 4 == 3) {
            withdraw();
            check("withdrawal", false);
        }
        if (day % 4 == 2) {
            run(today, today.plusDays(6), siteIds.get(day % siteIds.size()), "re-plan of one site");
            check("site re-plan", false);
        }
        publish();
        check("publish", true);
    }

    private void newRequests() {
        StringBuilder csv = new StringBuilder("title,target,ra,dec,filter_plan,min_altitude,earliest_night,latest_night,"
                + "repeats,interval_days,priority,program\n");
        String student = students.get(serial % students.size());
        for (int i = 0; i < scale.requestsPerDay(); i++) {
            Object[] t = TARGETS[random.nextInt(TARGETS.length)];
            LocalDate earliest = today.plusDays(random.nextInt(4));
            int repeats = 1 + random.nextInt(3);
            int interval = repeats > 1 ? 1 + random.nextInt(2) : 0;
            LocalDate latest = earliest.plusDays(5 + random.nextInt(8) + (repeats - 1) * interval);
            csv.append(String.format(Locale.ROOT, "Term request %d,%s,%.2f,%.2f,%s,%d,%s,%s,%d,%d,%d,%s%n", ++serial, t[0],
                    t[1], t[2], random.nextBoolean() ? "V:60x4" : "B:60x3;V:60x3", 20 + 5 * random.nextInt(3), earliest,
                    latest, repeats, interval, 1 + random.nextInt(5), programCodes.get(random.nextInt(programCodes.size()))));
        }
        Answer imported = api.send("POST", "/api/requests/import", student, csv.toString(), "text/csv");
        if (imported.status() != 201) {
            broken.add(today + " import answered " + imported.status() + ": " + imported.body());
            return;
        }
        for (Object id : imported.<List<Object>>json("$.requests[*].id")) {
            long request = ((Number) id).longValue();
            Answer submitted = api.post("/api/requests/" + request + "/submit?version=0", student, null);
            Answer accepted = api.post("/api/requests/" + request + "/accept?version=" + submitted.id("$.version"),
                    coordinator, null);
            if (accepted.status() != 200) {
                broken.add(today + " accepting request " + request + " answered " + accepted.status() + ": " + accepted.body());
            }
        }
    }

    /** The telescopes report the visits that have ended: three in four done, the rest failed; one in twelve never. */
    private void reports() {
        Answer published = api.get("/api/plans/published", coordinator);
        for (Map<String, Object> v : published.<List<Map<String, Object>>>json("$.visits")) {
            if (!"awaiting report".equals(v.get("status")) || random.nextInt(12) == 0) {
                continue;
            }
            String token = reportTokenByTelescope.get(((Number) v.get("telescopeId")).longValue());
            String outcome = random.nextInt(4) == 0 ? "failed" : "done";
            Answer report = api.post("/api/reports", token, "{\"visitId\":\"" + v.get("id") + "\",\"outcome\":\""
                    + outcome + "\"" + (outcome.equals("failed") ? ",\"reason\":\"clouds came in\"" : "") + "}");
            if (report.status() != 201) {
                broken.add(today + " report on " + v.get("id") + " answered " + report.status() + ": " + report.body());
            }
        }
    }

    /** Closes tomorrow night at one site, and forecasts a cloudy night the day after at another. */
    private void conditions(int day) throws IOException {
        String text = "site,telescope,night,closed,cloud_fraction,reason\n"
                + siteNames.get(day % 3) + ",," + today.plusDays(1) + ",yes,,dome maintenance\n"
                + siteNames.get((day + 1) % 3) + ",," + today.plusDays(2) + ",no,0.95,\n";
        Files.writeString(conditionsFile, text, StandardCharsets.UTF_8);
    }

    private void run(LocalDate first, LocalDate last, Long siteId, String what) {
        Answer started = api.post("/api/planner/runs", coordinator, "{\"firstNight\":\"" + first + "\",\"lastNight\":\""
                + last + "\",\"seconds\":" + scale.runSeconds() + (siteId == null ? "" : ",\"siteIds\":[" + siteId + "]")
                + "}");
        if (started.status() != 202) {
            broken.add(today + " " + what + " could not start: " + started.status() + " " + started.body());
            return;
        }
        awaitRun(started.id("$.id"), what);
    }

    private void awaitRun(long id, String what) {
        Answer run = api.awaitRunEnd(id, coordinator, Duration.ofSeconds(900));
        runs++;
        seenRuns.put(what + " " + today, id);
        if (!"finished".equals(run.json("$.state"))) {
            failedRuns++;
            broken.add(today + " " + what + " (run " + id + ") ended " + run.json("$.state") + ": " + run.json("$.message"));
            return;
        }
        runSeconds.add(Duration.between(Instant.parse(run.json("$.startedAt")), Instant.parse(run.json("$.finishedAt")))
                .toMillis() / 1000.0);
    }

    /** An alert about an event tonight, sent twice: the second answers the same request and starts nothing. */
    private void alert(int day) {
        String ivorn = "ivo://skyrota.test/term#day-" + day;
        String packet = """
                <?xml version="1.0" encoding="UTF-8"?>
                <voe:VOEvent xmlns:voe="http://www.ivoa.net/xml/VOEvent/v2.0" version="2.0" role="observation"
                             ivorn="%s">
                  <Who><AuthorIVORN>ivo://skyrota.test/term</AuthorIVORN><Date>%sT00:00:00</Date></Who>
                  <WhereWhen><ObsDataLocation><ObservatoryLocation id="GEOLUN"/><ObservationLocation>
                    <AstroCoordSystem id="UTC-FK5-GEO"/>
                    <AstroCoords coord_system_id="UTC-FK5-GEO">
                      <Time unit="s"><TimeInstant><ISOTime>%sT03:00:00</ISOTime></TimeInstant></Time>
                      <Position2D unit="deg"><Name1>RA</Name1><Name2>Dec</Name2>
                        <Value2><C1>%.1f</C1><C2>-5.0</C2></Value2><Error2Radius>0.01</Error2Radius></Position2D>
                    </AstroCoords>
                  </ObservationLocation></ObsDataLocation></WhereWhen>
                  <Why importance="0.9"><Inference probability="0.8"><Name>TERM-T %d</Name></Inference></Why>
                </voe:VOEvent>
                """.formatted(ivorn, today, today.plusDays(1), 60.0 + 4 * day, day);
        Answer first = api.send("POST", "/api/alerts", coordinator, packet, "application/xml");
        if (first.status() != 201) {
            broken.add(today + " alert answered " + first.status() + ": " + first.body());
            return;
        }
        if (first.<Object>json("$.run") != null) {
            awaitRun(first.id("$.run.id"), "alert run");
        } else {
            broken.add(today + " alert started no run: " + first.json("$.runProblem"));
        }
        Answer again = api.send("POST", "/api/alerts", coordinator, packet, "application/xml");
        if (again.status() != 200 || again.id("$.request.id") != first.id("$.request.id")) {
            broken.add(today + " the same alert sent again answered " + again.status() + ": " + again.body());
        }
    }

    /** A student withdraws one of their accepted requests that has a published visit ahead. */
    private void withdraw() {
        Answer published = api.get("/api/plans/published", coordinator);
        for (Map<String, Object> v : published.<List<Map<String, Object>>>json("$.visits")) {
            long request = ((Number) v.get("requestId")).longValue();
            Answer r = api.get("/api/requests/" + request, coordinator);
            String owner = r.json("$.owner");
            if (!"planned".equals(v.get("status")) || !"accepted".equals(r.json("$.state")) || !owner.startsWith("term-student")
                    || withdrawn.contains(request)) {
                continue;
            }
            Answer done = api.post("/api/requests/" + request + "/withdraw?version=" + r.id("$.version"),
                    ApiClient.basic(owner, PASSWORD), null);
            if (done.status() != 200) {
                broken.add(today + " withdrawing " + request + " answered " + done.status() + ": " + done.body());
            }
            withdrawn.add(request);
            return;
        }
    }

    private void publish() {
        Answer draft = api.get("/api/plans/draft", coordinator);
        if (draft.<Object>json("$.revision") == null) {
            return;
        }
        Answer p = api.post("/api/plans/draft/publish?revision=" + draft.id("$.revision"), coordinator, null);
        if (p.status() != 200) {
            broken.add(today + " publish answered " + p.status() + ": " + p.body());
            return;
        }
        Answer again = api.post("/api/plans/draft/publish?revision=" + draft.id("$.revision"), coordinator, null);
        if (again.status() != 200 || !Boolean.FALSE.equals(again.json("$.changed"))
                || again.id("$.revision") != p.id("$.revision")) {
            broken.add(today + " publishing the same draft again changed something: " + again.body());
        }
    }

    // ---- the invariants ----

    private void check(String step, boolean afterFullRun) {
        String at = today + " after " + step + ": ";
        checks++;
        int before = broken.size();
        Answer published = api.get("/api/plans/published", coordinator);
        Answer draft = api.get("/api/plans/draft", coordinator);
        Instant now = Instant.parse(published.json("$.now"));
        Map<String, String> placedNow = new HashMap<>();
        for (Map<String, Object> v : published.<List<Map<String, Object>>>json("$.visits")) {
            String id = (String) v.get("id");
            String place = place(v);
            placedNow.put(id, place);
            boolean started = Instant.parse((String) v.get("start")).isBefore(now);
            if (started && !historySeen.containsKey(id)) {
                // Newly history: it must have been published, there, before it started.
                if (!place.equals(lastPublished.get(id))) {
                    broken.add(at + "published visit " + id + " lies before now (" + v.get("start") + ") but was not"
                            + " published there before it started");
                }
                historySeen.put(id, place);
            }
            if (started && "planned".equals(v.get("status"))) {
                broken.add(at + "published visit " + id + " starts before now but is still 'planned'");
            }
        }
        for (Map.Entry<String, String> h : historySeen.entrySet()) {
            if (!h.getValue().equals(placedNow.get(h.getKey()))) {
                broken.add(at + "published history changed: visit " + h.getKey() + " was " + h.getValue() + ", is "
                        + placedNow.get(h.getKey()));
            }
        }
        lastPublished = placedNow;
        for (Map<String, Object> v : draft.<List<Map<String, Object>>>json("$.visits")) {
            String id = (String) v.get("id");
            if (Instant.parse((String) v.get("start")).isBefore(now) && !place(v).equals(historySeen.get(id))) {
                broken.add(at + "draft visit " + id + " starts before now (" + v.get("start") + ") and is not history");
            }
        }
        for (Map<String, Object> u : draft.<List<Map<String, Object>>>json("$.unplaced")) {
            if (u.get("reason") == null || ((String) u.get("reason")).isBlank()) {
                broken.add(at + "left-out visit " + u.get("visitId") + " has no reason");
            }
        }
        if (afterFullRun) {
            everyAcceptedRequestIsPlacedOrExplained(at, draft);
        }
        for (Map<String, Object> u : api.get("/api/programs/usage", coordinator).<List<Map<String, Object>>>json("$")) {
            List<?> over = (List<?>) u.get("over");
            if (over != null && !over.isEmpty()) {
                grantOverruns++;
                broken.add(at + "program " + u.get("code") + " is over a grant: " + over);
            }
        }
        calendarMatches(at, published);
        if (broken.size() > before) {
            System.err.println("term: " + String.join("\n  ", broken.subList(before, broken.size())));
        }
    }

    private void everyAcceptedRequestIsPlacedOrExplained(String at, Answer draft) {
        Map<Long, int[]> entries = new HashMap<>();
        for (Map<String, Object> v : draft.<List<Map<String, Object>>>json("$.visits")) {
            String status = (String) v.get("status");
            if (Set.of("planned", "observed", "awaiting report", "under way").contains(status)) {
                entries.computeIfAbsent(((Number) v.get("requestId")).longValue(), k -> new int[1])[0]++;
            }
        }
        for (Map<String, Object> u : draft.<List<Map<String, Object>>>json("$.unplaced")) {
            entries.computeIfAbsent(((Number) u.get("requestId")).longValue(), k -> new int[1])[0]++;
        }
        for (int page = 0; ; page++) {
            Answer list = api.get("/api/requests?state=accepted&size=500&page=" + page, coordinator);
            List<Map<String, Object>> items = list.json("$.items");
            for (Map<String, Object> r : items) {
                LocalDate first = LocalDate.parse((String) r.get("earliestNight"));
                LocalDate last = LocalDate.parse((String) r.get("latestNight"));
                if (last.isBefore(today) || first.isAfter(today.plusDays(6))) {
                    continue;
                }
                long id = ((Number) r.get("id")).longValue();
                int repeats = ((Number) r.get("repeats")).intValue();
                int seen = entries.getOrDefault(id, new int[1])[0];
                if (seen < repeats) {
                    broken.add(at + "accepted request " + id + " has " + seen + " of its " + repeats
                            + " repeats placed, observed or explained");
                }
            }
            if (items.size() < 500) {
                return;
            }
        }
    }

    /** The calendar export holds every visit of the published plan where the plan has it, and nothing else live. */
    private void calendarMatches(String at, Answer published) {
        Answer ics = api.get("/api/plans/published.ics", coordinator);
        if (published.<Object>json("$.revision") == null) {
            return;
        }
        Map<String, Instant> live = new HashMap<>();
        Set<String> cancelled = new HashSet<>();
        try {
            Calendar calendar = new CalendarBuilder().build(new ByteArrayInputStream(ics.body().getBytes(StandardCharsets.UTF_8)));
            for (VEvent e : calendar.<VEvent>getComponents("VEVENT")) {
                String uid = e.<Property>getProperty("UID").orElseThrow().getValue();
                String status = e.<Property>getProperty("STATUS").orElseThrow().getValue();
                if (status.equals("CANCELLED")) {
                    cancelled.add(uid);
                } else {
                    live.put(uid, Instant.from(e.getStartDate().orElseThrow().getDate()));
                }
            }
        } catch (Exception e) {
            broken.add(at + "the calendar export does not parse: " + e.getMessage());
            return;
        }
        Map<String, Instant> plan = new HashMap<>();
        for (Map<String, Object> v : published.<List<Map<String, Object>>>json("$.visits")) {
            String[] key = ((String) v.get("id")).split("-");
            plan.put("visit-" + (Long.parseLong(key[0]) * 1000 + Long.parseLong(key[1])) + "@skyrota",
                    Instant.parse((String) v.get("start")));
        }
        if (!live.equals(plan)) {
            broken.add(at + "the calendar export's events differ from the published plan: " + live.size() + " events, "
                    + plan.size() + " visits");
        }
        cancelledSeen.addAll(cancelled);
        for (String uid : cancelled) {
            if (plan.containsKey(uid)) {
                broken.add(at + "the calendar cancels " + uid + ", which the published plan holds");
            }
        }
    }

    private static String place(Map<String, Object> v) {
        return v.get("telescopeId") + " " + v.get("start") + " " + v.get("end");
    }

    private void moveClock(Instant to) {
        Answer set = api.put("/api/clock", admin, "{\"now\":\"" + to + "\"}");
        if (set.status() != 200) {
            throw new IllegalStateException("the server's clock could not be set to " + to + ": " + set.body());
        }
    }

    private long created(Answer a) {
        if (a.status() != 201) {
            throw new IllegalStateException("expected 201, got " + a.status() + ": " + a.body());
        }
        return a.id("$.id");
    }

    private static String created(Answer a, String path) {
        if (a.status() != 201) {
            throw new IllegalStateException("expected 201, got " + a.status() + ": " + a.body());
        }
        return Objects.requireNonNull(a.json(path));
    }
}
