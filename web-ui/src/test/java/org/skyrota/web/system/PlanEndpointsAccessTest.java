package org.skyrota.web.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.PlanningNetwork;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.TestPropertySource;

/**
 * Who may call each endpoint of planner runs, plans, overrides, tokens, reports, exports and plugins: anonymous,
 * the requester who owns the request, another requester, a coordinator and an admin, each status asserted. The
 * calls are chosen so that they change nothing (bad input, unknown ids, dry runs) once past the access rules; there
 * is no draft in this context, so overrides that pass the rules answer 409. An anonymous change is refused by the
 * CSRF check (403) before the sign-in check: a call without credentials is a browser's, and a browser's change
 * must carry the token; an anonymous read is 401.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = "skyrota.test.context=access-matrix")
class PlanEndpointsAccessTest {

    static final String ADMIN = ApiClient.basic("mxadmin", "password1");
    static final String COORD = ApiClient.basic("mxcoord", "password1");
    static final String OWNER = ApiClient.basic("mxowner", "password1");
    static final String OTHER = ApiClient.basic("mxother", "password1");

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;

    ApiClient api;
    static PlanningNetwork network;

    @BeforeEach
    void setUp() {
        api = new ApiClient(port);
        if (accounts.findByUsername("mxadmin").isEmpty()) {
            accounts.save(new Account("mxadmin", encoder.encode("password1"), Role.ADMIN));
            accounts.save(new Account("mxcoord", encoder.encode("password1"), Role.COORDINATOR));
            accounts.save(new Account("mxowner", encoder.encode("password1"), Role.REQUESTER));
            accounts.save(new Account("mxother", encoder.encode("password1"), Role.REQUESTER));
            network = PlanningNetwork.create(api, COORD, OWNER, OTHER, "M");
        }
    }

    /** One call and the statuses expected for anonymous, owner, other requester, coordinator, admin. */
    record Row(String method, String path, String body, int anonymous, int owner, int other, int coordinator, int admin) {}

    @Test
    void everyRoleGetsTheStatusItShould() {
        long mine = network.studentRequestId;
        List<Row> rows = List.of(
                new Row("POST", "/api/planner/runs", "{}", 403, 403, 403, 400, 400),
                new Row("GET", "/api/planner/runs/999999", null, 401, 403, 403, 404, 404),
                new Row("GET", "/api/planner/runs/999999/events", null, 401, 403, 403, 404, 404),
                new Row("DELETE", "/api/planner/runs/999999", null, 403, 403, 403, 404, 404),
                new Row("GET", "/api/plans/draft?from=2027-01-10&to=2027-01-11", null, 401, 200, 200, 200, 200),
                new Row("GET", "/api/plans/published", null, 401, 200, 200, 200, 200),
                new Row("GET", "/api/plans/compare", null, 401, 200, 200, 200, 200),
                new Row("POST", "/api/plans/draft/publish?revision=999999", null, 403, 403, 403, 409, 409),
                new Row("PUT", "/api/plans/draft/nights?dryRun=true", "{\"telescopeId\":" + network.telescopeId
                        + ",\"night\":\"2027-01-10\",\"state\":\"closed\"}", 403, 403, 403, 409, 409),
                new Row("POST", "/api/visits/" + mine + "-1/pin?dryRun=true", null, 403, 403, 403, 409, 409),
                new Row("POST", "/api/visits/" + mine + "-1/unpin?dryRun=true", null, 403, 403, 403, 409, 409),
                new Row("POST", "/api/visits/" + mine + "-1/unplace?dryRun=true", null, 403, 403, 403, 409, 409),
                new Row("POST", "/api/visits/" + mine + "-1/move?dryRun=true", "{}", 403, 403, 403, 400, 400),
                new Row("GET", "/api/visits/" + mine + "-1/candidates", null, 401, 403, 403, 409, 409),
                new Row("GET", "/api/programs/usage", null, 401, 200, 200, 200, 200),
                new Row("GET", "/api/requests/" + mine + "/plan-status", null, 401, 200, 404, 200, 200),
                new Row("GET", "/api/requests/" + mine + "/observability?from=2027-01-10&to=2027-01-11", null, 401, 200, 404, 200, 200),
                new Row("GET", "/api/sites/" + network.siteId + "/almanac?date=2027-01-10", null, 401, 200, 200, 200, 200),
                new Row("GET", "/api/plans/published.csv", null, 401, 200, 200, 200, 200),
                new Row("GET", "/api/plans/published.ics", null, 401, 200, 200, 200, 200),
                new Row("GET", "/api/calendar/mine.ics", null, 401, 200, 200, 200, 200),
                new Row("POST", "/api/accounts/me/feed-token", null, 403, 201, 201, 201, 201),
                new Row("POST", "/api/tokens", "{}", 403, 403, 403, 403, 400),
                new Row("GET", "/api/tokens", null, 401, 403, 403, 403, 200),
                new Row("DELETE", "/api/tokens/999999", null, 403, 403, 403, 403, 404),
                new Row("POST", "/api/reports", "{\"visitId\":\"1-1\",\"outcome\":\"done\"}", 403, 403, 403, 403, 403),
                new Row("GET", "/api/plugins", null, 401, 200, 200, 200, 200));
        List<String> wrong = new ArrayList<>();
        for (Row r : rows) {
            check(wrong, r, "anonymous", null, r.anonymous());
            check(wrong, r, "owner", OWNER, r.owner());
            check(wrong, r, "other requester", OTHER, r.other());
            check(wrong, r, "coordinator", COORD, r.coordinator());
            check(wrong, r, "admin", ADMIN, r.admin());
        }
        assertThat(wrong).isEmpty();
    }

    private void check(List<String> wrong, Row r, String who, String auth, int expected) {
        ApiClient.Answer a = api.send(r.method(), r.path(), auth, r.body());
        if (a.status() != expected) {
            wrong.add(r.method() + " " + r.path() + " as " + who + ": " + a.status() + " (expected " + expected + ") " + a.body());
        } else if (expected >= 400 && !a.contentType().startsWith("application/problem+json")) {
            wrong.add(r.method() + " " + r.path() + " as " + who + ": not a problem document but " + a.contentType());
        }
    }

    @Test
    void theSiteAlmanacAndObservabilityAnswerFromTheSkyEngine() {
        ApiClient.Answer almanac = api.get("/api/sites/" + network.siteId + "/almanac?date=2027-01-10", OWNER);
        // The same site given by its coordinates to the open compute endpoint answers the same night.
        ApiClient.Answer open = api.get("/api/almanac?lat=45&lon=7&elevation=500&tz=Europe/Rome&date=2027-01-10", null);
        assertThat(almanac.body()).isEqualTo(open.body());
        ApiClient.Answer obs = api.get("/api/requests/" + network.neverRisesId + "/observability?from=2027-01-10&to=2027-01-11", OWNER);
        assertThat(obs.<List<Object>>json("$.sites[0].windows")).isEmpty();
        assertThat((Object) obs.json("$.nextObservableNight")).isNull();
        ApiClient.Answer up = api.get("/api/requests/" + network.studentRequestId + "/observability?from=2027-01-10&to=2027-01-11", OWNER);
        assertThat(up.<List<String>>json("$.sites[0].windows[*].night")).containsExactly("2027-01-10", "2027-01-11");
        assertThat((String) up.json("$.nextObservableNight.night")).isEqualTo("2027-01-10");
        // The windows are the compute endpoint's for the same target and conditions.
        ApiClient.Answer same = api.get("/api/visibility?ra=83.6&dec=22.0&lat=45&lon=7&elevation=500&tz=Europe/Rome"
                + "&from=2027-01-10&to=2027-01-11&minAltitude=30", null);
        assertThat(up.<List<String>>json("$.sites[0].windows[*].start")).isEqualTo(same.json("$.windows[*].start"));
    }
}
