package org.skyrota.web.input;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;

/**
 * The limits that keep one client from tying up the server, each refused with a problem document that names what
 * was too much: body size (1 MiB), page size (1..500), a planner run's horizon (62 nights) and time (1..600 s), and
 * the visibility endpoint's span (366 nights).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class LimitsTest {

    static final String COORD = ApiClient.basic("limitcoord", "password1");

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    ApiClient api;

    @BeforeEach
    void setUp() {
        api = new ApiClient(port);
        if (accounts.findByUsername("limitcoord").isEmpty()) {
            accounts.save(new Account("limitcoord", encoder.encode("password1"), Role.COORDINATOR));
        }
    }

    static void problem(Answer a, int status) {
        assertThat(a.status()).as(a.body()).isEqualTo(status);
        assertThat(a.contentType()).startsWith("application/problem+json");
        assertThat(((Number) a.json("$.status")).intValue()).isEqualTo(status);
    }

    @Test
    void aBodyOverOneMebibyteIs413BeforeItIsRead() {
        String huge = "{\"name\":\"" + "x".repeat(1024 * 1024 + 10) + "\"}";
        // Other test classes may share this application context and its sites: compare counts, not zero.
        long sitesBefore = api.get("/api/sites?size=500", COORD).id("$.totalItems");
        Answer a = api.post("/api/sites", COORD, huge);
        problem(a, 413);
        assertThat((String) a.json("$.detail")).contains("1048576 bytes");
        assertThat(api.get("/api/sites?size=500", COORD).id("$.totalItems")).isEqualTo(sitesBefore);
    }

    @Test
    void pageSizeOutsideOneTo500IsRefusedNamingTheParameter() {
        for (String bad : new String[] {"size=501", "size=0", "size=-5", "size=1e3", "size=abc", "page=-1", "page=x"}) {
            Answer a = api.get("/api/requests?" + bad, COORD);
            problem(a, 400);
            assertThat((String) a.json("$.parameter")).as(bad).isEqualTo(bad.substring(0, bad.indexOf('=')));
        }
        assertThat(api.get("/api/requests?size=500&page=0", COORD).status()).isEqualTo(200);
        assertThat(api.get("/api/sites?size=1", COORD).status()).isEqualTo(200);
    }

    @Test
    void aPlannerRunsHorizonAndTimeAreBounded() {
        Answer longHorizon = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-03-04\"}");
        problem(longHorizon, 400);
        assertThat((String) longHorizon.json("$.parameter")).isEqualTo("lastNight");
        assertThat((String) longHorizon.json("$.detail")).contains("62 nights");
        for (String seconds : new String[] {"0", "601", "-1"}) {
            Answer a = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-02\",\"seconds\":" + seconds + "}");
            problem(a, 400);
            assertThat((String) a.json("$.parameter")).isEqualTo("seconds");
        }
        Answer backwards = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"2027-01-05\",\"lastNight\":\"2027-01-02\"}");
        problem(backwards, 400);
        assertThat((String) backwards.json("$.parameter")).isEqualTo("lastNight");
    }

    @Test
    void theVisibilitySpanIsAtMost366Nights() {
        Answer a = api.get("/api/visibility?ra=10&dec=20&lat=45&lon=7&from=2027-01-01&to=2028-01-03", null);
        problem(a, 400);
        assertThat((String) a.json("$.parameter")).isEqualTo("to");
    }
}
