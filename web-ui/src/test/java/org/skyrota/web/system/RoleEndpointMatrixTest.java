package org.skyrota.web.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.PlanningNetwork;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.beans.factory.annotation.Qualifier;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.http.server.PathContainer;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.TestPropertySource;
import org.springframework.web.servlet.mvc.method.RequestMappingInfo;
import org.springframework.web.servlet.mvc.method.RequestMappingInfoHandlerMapping;
import org.springframework.web.servlet.mvc.method.annotation.RequestMappingHandlerMapping;
import org.springframework.web.util.pattern.PathPatternParser;

/**
 * Every endpoint the server maps, and the exact status each kind of caller gets from it: anonymous, the requester
 * who owns the request, another requester, a coordinator, an admin, a telescope API token of scope {@code read}, one
 * of scope {@code reports}, a revoked token, and a person's calendar-feed token sent as {@code ?token=}. A second
 * test reads every mapping from Spring MVC's {@link RequestMappingHandlerMapping} and fails, naming them, when one is
 * missing from the table, so a new endpoint cannot ship without its access rule being written down here.
 *
 * <p>Calls that pass the access rules are chosen to change nothing: an empty or deliberately invalid body (400), an
 * unknown id (404), a stale version (409), a dry run with no draft (409). Such a status proves the caller got past
 * Spring Security to the handler, which is all the table claims; the note column says which it is. An anonymous change
 * is refused by the CSRF check (403) before the sign-in check; a Bearer token is checked before anything else, so a
 * revoked one is 401 and a live one used outside its scope is 403 on every path, the open ones included.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "skyrota.test.context=role-endpoint-matrix")
class RoleEndpointMatrixTest {

    static final String ADMIN = ApiClient.basic("rmadmin", "password1");
    static final String COORD = ApiClient.basic("rmcoord", "password1");
    static final String OWNER = ApiClient.basic("rmowner", "password1");
    static final String OTHER = ApiClient.basic("rmother", "password1");
    static final String FEEDER = ApiClient.basic("rmfeed", "password1");

    /** The callers, in the order of the status columns of {@link Row#statuses}. */
    static final List<String> CALLERS = List.of("anonymous", "owner", "other requester", "coordinator", "admin",
            "read token", "reports token", "revoked token", "feed token");

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    @Autowired @Qualifier("requestMappingHandlerMapping") RequestMappingHandlerMapping mappings;
    /** Every mapping of request-mapping kind: the controllers' above, and the actuator endpoints' of their own. */
    @Autowired List<RequestMappingInfoHandlerMapping> allMappings;

    ApiClient api;
    static PlanningNetwork network;
    static long draftId;
    static long instrumentId;
    static String readToken;
    static String reportsToken;
    static String revokedToken;
    static String feedToken;

    @BeforeEach
    void setUp() {
        api = new ApiClient(port);
        if (accounts.findByUsername("rmadmin").isPresent()) {
            return;
        }
        accounts.save(new Account("rmadmin", encoder.encode("password1"), Role.ADMIN));
        accounts.save(new Account("rmcoord", encoder.encode("password1"), Role.COORDINATOR));
        accounts.save(new Account("rmowner", encoder.encode("password1"), Role.REQUESTER));
        accounts.save(new Account("rmother", encoder.encode("password1"), Role.REQUESTER));
        accounts.save(new Account("rmfeed", encoder.encode("password1"), Role.REQUESTER));
        network = PlanningNetwork.create(api, COORD, OWNER, OTHER, "RM");
        ApiClient.Answer draft = api.post("/api/requests", OWNER, "{\"programId\":" + network.programId
                + ",\"targetName\":\"NGC 7000\",\"ra\":314.7,\"dec\":44.3,\"exposures\":[{\"filter\":\"V\",\"seconds\":30,"
                + "\"count\":2}],\"earliestNight\":\"2027-01-10\",\"latestNight\":\"2027-01-20\",\"priority\":3}");
        assertThat(draft.status()).as(draft.body()).isEqualTo(201);
        draftId = draft.id("$.id");
        instrumentId = api.get("/api/instruments?telescopeId=" + network.telescopeId, COORD).id("$.items[0].id");
        readToken = token("read").json("$.token");
        reportsToken = token("reports").json("$.token");
        ApiClient.Answer revoked = token("reports");
        revokedToken = revoked.json("$.token");
        assertThat(api.delete("/api/tokens/" + revoked.id("$.id"), ADMIN).status()).isEqualTo(204);
        ApiClient.Answer feed = api.post("/api/accounts/me/feed-token", FEEDER, null);
        assertThat(feed.status()).as(feed.body()).isEqualTo(201);
        feedToken = feed.json("$.token");
    }

    private ApiClient.Answer token(String scope) {
        ApiClient.Answer t = api.post("/api/tokens", ADMIN, "{\"name\":\"matrix " + scope + " " + System.nanoTime()
                + "\",\"telescopeId\":" + network.telescopeId + ",\"scope\":\"" + scope + "\"}");
        assertThat(t.status()).as(t.body()).isEqualTo(201);
        return t;
    }

    /**
     * One endpoint: its method and path pattern as Spring MVC maps them, the concrete call made, and the statuses for
     * the {@link #CALLERS} in order, separated by spaces; {@code note} says what an allowed status means.
     */
    record Row(String method, String pattern, String path, String body, String statuses, String note) {
        int[] expected() {
            int[] s = Arrays.stream(statuses.trim().split("\\s+")).mapToInt(Integer::parseInt).toArray();
            if (s.length != CALLERS.size()) {
                throw new IllegalArgumentException(method + " " + pattern + ": " + s.length + " statuses for " + CALLERS.size() + " callers");
            }
            return s;
        }

        String key() {
            return method + " " + pattern;
        }
    }

    // Column order:                         anon owner other coord admin read reports revoked feed
    static final String OPEN = /*             */ "200 200 200 200 200 403 403 401 200";
    static final String SIGNED_IN_READ = /*   */ "401 200 200 200 200 403 403 401 401";
    static final String REVIEWER_READ = /*    */ "401 403 403 200 200 403 403 401 401";
    static final String ADMIN_READ = /*       */ "401 403 403 403 200 403 403 401 401";

    List<Row> rows() {
        long site = network.siteId;
        long scope = network.telescopeId;
        long mine = network.studentRequestId;
        String visit = "/api/visits/" + mine + "-1";
        String draft = "/api/requests/" + draftId;
        String validRequest = "{\"version\":999,\"programId\":" + network.programId + ",\"targetName\":\"NGC 7000\",\"ra\":314.7,"
                + "\"dec\":44.3,\"exposures\":[{\"filter\":\"V\",\"seconds\":30,\"count\":2}],\"earliestNight\":\"2027-01-10\","
                + "\"latestNight\":\"2027-01-20\",\"priority\":3}";
        return List.of(
                // Open: compute, about, API description. Tokens are checked first, so a token outside its scope is 403 here too.
                new Row("GET", "/api/almanac", "/api/almanac?lat=45&lon=7&date=2027-01-10", null, OPEN, "valid query"),
                new Row("GET", "/api/visibility", "/api/visibility?ra=83.6&dec=22&lat=45&lon=7&from=2027-01-10&to=2027-01-11",
                        null, OPEN, "valid query"),
                new Row("GET", "/api/visibility", "/api/visibility?ra=83.6&dec=22&siteId=" + site + "&from=2027-01-10&to=2027-01-11",
                        null, SIGNED_IN_READ, "at a stored site: it reads the site and its telescopes, so only for those signed in"),
                new Row("GET", "/api/about", "/api/about", null, OPEN, ""),
                new Row("GET", "/v3/api-docs", "/v3/api-docs", null, OPEN, "OpenAPI 3 document"),
                new Row("GET", "/v3/api-docs.yaml", "/v3/api-docs.yaml", null, OPEN, "OpenAPI 3 document as YAML"),
                new Row("GET", "/v3/api-docs/swagger-config", "/v3/api-docs/swagger-config", null, OPEN, "browser page settings"),
                new Row("GET", "/swagger-ui.html", "/swagger-ui.html", null, "302 302 302 302 302 403 403 401 302",
                        "redirect to the browsable page"),
                // Actuator: health and info open, the list of endpoints for those signed in.
                new Row("GET", "/actuator", "/actuator", null, SIGNED_IN_READ, "links to the exposed endpoints"),
                new Row("GET", "/actuator/health", "/actuator/health", null, OPEN, ""),
                new Row("GET", "/actuator/health/**", "/actuator/health/ping", null, "404 404 404 404 404 403 403 401 404",
                        "components are not exposed: the actuator's own 404, an empty body, not a problem document"),
                new Row("GET", "/actuator/info", "/actuator/info", null, OPEN, ""),
                // The container's error forward target, mapped for every method; a client calling it directly gets 404.
                new Row("*", "/error", "/error", null, "404 404 404 404 404 404 404 404 404",
                        "called directly: nothing to describe (was 500, not a problem document)"),

                // Accounts
                new Row("GET", "/api/accounts/me", "/api/accounts/me", null, SIGNED_IN_READ, ""),
                new Row("PUT", "/api/accounts/me/password", "/api/accounts/me/password",
                        "{\"currentPassword\":\"not-the-password\",\"newPassword\":\"another-password\"}",
                        "403 400 400 400 400 403 403 401 403", "wrong current password: 400, nothing changed"),
                new Row("POST", "/api/accounts/me/feed-token", "/api/accounts/me/feed-token", null,
                        "403 201 201 201 201 403 403 401 403", "replaces the caller's own feed token (the feed column's is another account's)"),
                new Row("GET", "/api/accounts", "/api/accounts", null, ADMIN_READ, ""),
                new Row("POST", "/api/accounts", "/api/accounts", "{}", "403 403 403 403 400 403 403 401 403", "empty body: 400"),
                new Row("PUT", "/api/accounts/{username}", "/api/accounts/nobody-by-this-name", "{\"role\":\"admin\"}",
                        "403 403 403 403 404 403 403 401 403", "unknown account: 404"),

                // Telescope API tokens and observation reports
                new Row("POST", "/api/tokens", "/api/tokens", "{}", "403 403 403 403 400 403 403 401 403", "empty body: 400"),
                // The server's clock: read by everyone signed in, moved forward by an admin (this test's clock is settable).
                new Row("GET", "/api/clock", "/api/clock", null, SIGNED_IN_READ, ""),
                new Row("PUT", "/api/clock", "/api/clock", "{}", "403 403 403 403 400 403 403 401 403", "empty body: 400"),
                new Row("GET", "/api/tokens", "/api/tokens", null, ADMIN_READ, ""),
                new Row("DELETE", "/api/tokens/{id}", "/api/tokens/999999", null, "403 403 403 403 404 403 403 401 403",
                        "unknown token: 404"),
                new Row("POST", "/api/reports", "/api/reports", "{\"visitId\":\"999999-1\",\"outcome\":\"done\"}",
                        "403 403 403 403 403 403 404 401 403", "people never report; the reports token reaches the unknown visit: 404"),

                // Audit
                new Row("GET", "/api/audit", "/api/audit", null, REVIEWER_READ, ""),

                // Planner runs and their event stream
                new Row("POST", "/api/planner/runs", "/api/planner/runs", "{}", "403 403 403 400 400 403 403 401 403",
                        "empty body: 400"),
                new Row("GET", "/api/planner/runs/{id}", "/api/planner/runs/999999", null, "401 403 403 404 404 403 403 401 401",
                        "unknown run: 404"),
                new Row("GET", "/api/planner/runs/{id}/events", "/api/planner/runs/999999/events", null,
                        "401 403 403 404 404 403 403 401 401", "unknown run: 404"),
                new Row("DELETE", "/api/planner/runs/{id}", "/api/planner/runs/999999", null, "403 403 403 404 404 403 403 401 403",
                        "unknown run: 404"),

                // Plans, overrides, exports
                new Row("GET", "/api/plans/draft", "/api/plans/draft?from=2027-01-10&to=2027-01-11", null, SIGNED_IN_READ, ""),
                new Row("GET", "/api/plans/published", "/api/plans/published", null, "401 200 200 200 200 200 403 401 401", ""),
                new Row("GET", "/api/plans/compare", "/api/plans/compare", null, SIGNED_IN_READ, ""),
                new Row("POST", "/api/plans/draft/publish", "/api/plans/draft/publish?revision=999999", null,
                        "403 403 403 409 409 403 403 401 403", "no such draft revision: 409"),
                new Row("PUT", "/api/plans/draft/nights", "/api/plans/draft/nights?dryRun=true", "{\"telescopeId\":" + scope
                        + ",\"night\":\"2027-01-10\",\"state\":\"closed\"}", "403 403 403 409 409 403 403 401 403", "no draft yet: 409"),
                new Row("POST", "/api/visits/{id}/pin", visit + "/pin?dryRun=true", null, "403 403 403 409 409 403 403 401 403",
                        "no draft yet: 409"),
                new Row("POST", "/api/visits/{id}/unpin", visit + "/unpin?dryRun=true", null, "403 403 403 409 409 403 403 401 403",
                        "no draft yet: 409"),
                new Row("POST", "/api/visits/{id}/unplace", visit + "/unplace?dryRun=true", null, "403 403 403 409 409 403 403 401 403",
                        "no draft yet: 409"),
                new Row("POST", "/api/visits/{id}/move", visit + "/move?dryRun=true", "{}", "403 403 403 400 400 403 403 401 403",
                        "no place given: 400"),
                new Row("GET", "/api/visits/{id}/candidates", visit + "/candidates", null, "401 403 403 409 409 403 403 401 401",
                        "no draft yet: 409"),
                new Row("GET", "/api/plans/published.csv", "/api/plans/published.csv", null, "401 200 200 200 200 200 403 401 401",
                        "text/csv"),
                new Row("GET", "/api/plans/published.ics", "/api/plans/published.ics", null, "401 200 200 200 200 200 403 401 401",
                        "text/calendar"),
                new Row("GET", "/api/calendar/mine.ics", "/api/calendar/mine.ics", null, "401 200 200 200 200 403 403 401 200",
                        "the caller's own visits; the feed token opens this and nothing else"),
                new Row("GET", "/api/programs/usage", "/api/programs/usage", null, SIGNED_IN_READ, ""),
                new Row("GET", "/api/programs/{id}/usage", "/api/programs/" + network.programId + "/usage", null,
                        SIGNED_IN_READ, "one program's grant ledger"),
                new Row("GET", "/api/requests/{id}/plan-status", "/api/requests/" + mine + "/plan-status", null,
                        "401 200 404 200 200 403 403 401 401", "another's request does not exist for a requester: 404"),
                new Row("GET", "/api/requests/{id}/observability", "/api/requests/" + mine + "/observability?from=2027-01-10&to=2027-01-11",
                        null, "401 200 404 200 200 403 403 401 401", "another's request: 404"),
                new Row("GET", "/api/sites/{id}/almanac", "/api/sites/" + site + "/almanac?date=2027-01-10", null, SIGNED_IN_READ, ""),

                // Plugins
                new Row("GET", "/api/plugins", "/api/plugins", null, SIGNED_IN_READ, ""),

                // Sites, telescopes, instruments, programs: everyone signed in reads, reviewers change
                new Row("GET", "/api/sites", "/api/sites", null, SIGNED_IN_READ, ""),
                new Row("GET", "/api/sites/{id}", "/api/sites/" + site, null, SIGNED_IN_READ, ""),
                new Row("POST", "/api/sites", "/api/sites", "{}", "403 403 403 400 400 403 403 401 403", "empty body: 400"),
                new Row("PUT", "/api/sites/{id}", "/api/sites/" + site, "{}", "403 403 403 400 400 403 403 401 403", "empty body: 400"),
                new Row("DELETE", "/api/sites/{id}", "/api/sites/999999", null, "403 403 403 404 404 403 403 401 403", "unknown id: 404"),
                new Row("GET", "/api/telescopes", "/api/telescopes", null, SIGNED_IN_READ, ""),
                new Row("GET", "/api/telescopes/{id}", "/api/telescopes/" + scope, null, SIGNED_IN_READ, ""),
                new Row("POST", "/api/telescopes", "/api/telescopes", "{}", "403 403 403 400 400 403 403 401 403", "empty body: 400"),
                new Row("PUT", "/api/telescopes/{id}", "/api/telescopes/" + scope, "{}", "403 403 403 400 400 403 403 401 403",
                        "empty body: 400"),
                new Row("DELETE", "/api/telescopes/{id}", "/api/telescopes/999999", null, "403 403 403 404 404 403 403 401 403",
                        "unknown id: 404"),
                new Row("GET", "/api/instruments", "/api/instruments", null, SIGNED_IN_READ, ""),
                new Row("GET", "/api/instruments/{id}", "/api/instruments/" + instrumentId, null, SIGNED_IN_READ, ""),
                new Row("POST", "/api/instruments", "/api/instruments", "{}", "403 403 403 400 400 403 403 401 403", "empty body: 400"),
                new Row("PUT", "/api/instruments/{id}", "/api/instruments/" + instrumentId, "{}", "403 403 403 400 400 403 403 401 403",
                        "empty body: 400"),
                new Row("DELETE", "/api/instruments/{id}", "/api/instruments/999999", null, "403 403 403 404 404 403 403 401 403",
                        "unknown id: 404"),
                new Row("GET", "/api/programs", "/api/programs", null, SIGNED_IN_READ, ""),
                new Row("GET", "/api/programs/{id}", "/api/programs/" + network.programId, null, SIGNED_IN_READ, ""),
                new Row("POST", "/api/programs", "/api/programs", "{}", "403 403 403 400 400 403 403 401 403", "empty body: 400"),
                new Row("PUT", "/api/programs/{id}", "/api/programs/" + network.programId, "{}", "403 403 403 400 400 403 403 401 403",
                        "empty body: 400"),
                new Row("DELETE", "/api/programs/{id}", "/api/programs/999999", null, "403 403 403 404 404 403 403 401 403",
                        "unknown id: 404"),

                // Observing requests: a requester's own only; reviewers all; only reviewers accept and reject
                new Row("GET", "/api/requests", "/api/requests", null, SIGNED_IN_READ, "a requester's listing holds only their own"),
                new Row("GET", "/api/requests/{id}", draft, null, "401 200 404 200 200 403 403 401 401", "another's request: 404"),
                new Row("POST", "/api/requests", "/api/requests", "{}", "403 400 400 400 400 403 403 401 403", "empty body: 400"),
                new Row("POST", "/api/requests/import", "/api/requests/import", "{}", "403 415 415 415 415 403 403 401 403",
                        "a JSON body is no importer's file type: 415"),
                new Row("POST", "/api/alerts", "/api/alerts", "{}", "403 403 403 400 400 403 403 401 403",
                        "not a VOEvent packet: 400; reviewers only"),
                new Row("PUT", "/api/requests/{id}", draft, validRequest, "403 409 404 409 409 403 403 401 403",
                        "valid body, stale version: 409; another's request: 404"),
                new Row("DELETE", "/api/requests/{id}", draft + "?version=999", null, "403 409 404 409 409 403 403 401 403",
                        "stale version: 409"),
                new Row("POST", "/api/requests/{id}/submit", draft + "/submit?version=999", null, "403 409 404 409 409 403 403 401 403",
                        "stale version: 409"),
                new Row("POST", "/api/requests/{id}/accept", draft + "/accept?version=999", null, "403 403 403 409 409 403 403 401 403",
                        "stale version: 409"),
                new Row("POST", "/api/requests/{id}/reject", draft + "/reject?version=999", "{\"reason\":\"matrix\"}",
                        "403 403 403 409 409 403 403 401 403", "stale version: 409"),
                new Row("POST", "/api/requests/{id}/withdraw", draft + "/withdraw?version=999", null, "403 409 404 409 409 403 403 401 403",
                        "stale version: 409"),
                new Row("POST", "/api/requests/{id}/reopen", draft + "/reopen?version=999", null, "403 409 404 409 409 403 403 401 403",
                        "stale version: 409"));
    }

    @Test
    void everyCallerGetsExactlyTheStatusTheTableGives() {
        List<String> wrong = new ArrayList<>();
        PathPatternParser parser = new PathPatternParser();
        for (Row r : rows()) {
            String path = r.path().replaceAll("\\?.*", "");
            // The call must reach the endpoint the row names, or the row proves nothing about it.
            if (!parser.parse(r.pattern()).matches(PathContainer.parsePath(path))) {
                wrong.add(r.key() + ": the call " + r.path() + " does not match the pattern");
                continue;
            }
            int[] expected = r.expected();
            for (int i = 0; i < CALLERS.size(); i++) {
                ApiClient.Answer a = call(r, i);
                String who = r.method() + " " + r.path() + " as " + CALLERS.get(i);
                if (a.status() != expected[i]) {
                    wrong.add(who + ": " + a.status() + " (expected " + expected[i] + ") " + abbreviate(a.body()));
                } else if (expected[i] >= 400 && !a.contentType().startsWith("application/problem+json") && !actuatorsOwn(r, a)) {
                    wrong.add(who + ": not a problem document but " + a.contentType());
                }
            }
        }
        assertThat(wrong).as("calls answering otherwise than the table says").isEmpty();
    }

    /** The actuator answers its own 404 with an empty body; everything else of ours is a problem document. */
    private static boolean actuatorsOwn(Row r, ApiClient.Answer a) {
        return r.pattern().startsWith("/actuator/") && a.status() == 404 && a.body().isEmpty();
    }

    private ApiClient.Answer call(Row r, int caller) {
        // A mapping for every method is called with GET.
        String method = r.method().equals("*") ? "GET" : r.method();
        return switch (CALLERS.get(caller)) {
            case "anonymous" -> api.send(method, r.path(), null, r.body());
            case "owner" -> api.send(method, r.path(), OWNER, r.body());
            case "other requester" -> api.send(method, r.path(), OTHER, r.body());
            case "coordinator" -> api.send(method, r.path(), COORD, r.body());
            case "admin" -> api.send(method, r.path(), ADMIN, r.body());
            case "read token" -> api.send(method, r.path(), ApiClient.bearer(readToken), r.body());
            case "reports token" -> api.send(method, r.path(), ApiClient.bearer(reportsToken), r.body());
            case "revoked token" -> api.send(method, r.path(), ApiClient.bearer(revokedToken), r.body());
            case "feed token" -> api.send(method, r.path() + (r.path().contains("?") ? "&" : "?") + "token=" + feedToken,
                    null, r.body());
            default -> throw new IllegalStateException(CALLERS.get(caller));
        };
    }

    @Test
    void theTableListsEveryMappedEndpoint() {
        assertThat(allMappings).as("the controllers' mapping is among those read").contains(mappings);
        Set<String> mapped = new TreeSet<>();
        for (RequestMappingInfo info : allMappings.stream().flatMap(m -> m.getHandlerMethods().keySet().stream()).toList()) {
            Set<String> patterns = info.getPathPatternsCondition() != null ? info.getPathPatternsCondition().getPatternValues()
                    : info.getPatternValues();
            Set<String> methods = new TreeSet<>();
            info.getMethodsCondition().getMethods().forEach(m -> methods.add(m.name()));
            if (methods.isEmpty()) {
                methods.add("*");
            }
            for (String p : patterns) {
                for (String m : methods) {
                    mapped.add(m + " " + p);
                }
            }
        }
        Set<String> listed = new TreeSet<>();
        rows().forEach(r -> listed.add(r.key()));
        Set<String> missing = new TreeSet<>(mapped);
        missing.removeAll(listed);
        assertThat(missing).as("mapped endpoints missing from the access table").isEmpty();
        Set<String> stale = new TreeSet<>(listed);
        stale.removeAll(mapped);
        assertThat(stale).as("table rows for endpoints no longer mapped").isEmpty();
    }

    private static String abbreviate(String s) {
        return s.length() > 200 ? s.substring(0, 200) + "…" : s;
    }
}
