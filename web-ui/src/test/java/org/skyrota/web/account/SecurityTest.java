package org.skyrota.web.account;

import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.not;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.put;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.header;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import com.jayway.jsonpath.JsonPath;

import jakarta.servlet.http.Cookie;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.program.Program;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.request.ObservingRequestRepository;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.mock.web.MockHttpSession;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.request.RequestPostProcessor;

/**
 * Who may do what, with real accounts from the database: HTTP Basic for scripts, a form
 * session with CSRF for browsers, roles, and a requester's view limited to their own requests.
 */
@SpringBootTest(properties = "skyrota.admin-password=first-admin-secret")
@AutoConfigureMockMvc
class SecurityTest {

    private static final String PASSWORD = "correct horse";

    @Autowired MockMvc mvc;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    @Autowired ProgramRepository programs;
    @Autowired ObservingRequestRepository requests;

    long programId;

    @BeforeEach
    void people() {
        for (var entry : java.util.Map.of("ada", Role.REQUESTER, "ben", Role.REQUESTER, "cora", Role.COORDINATOR).entrySet()) {
            accounts.save(new Account(entry.getKey(), encoder.encode(PASSWORD), entry.getValue()));
        }
        programId = programs.save(new Program("CLUB-1", "Club program", "cora")).getId();
    }

    @AfterEach
    void empty() {
        requests.deleteAll();
        programs.deleteAll();
        accounts.findAll().stream().filter(a -> !a.getUsername().equals("admin")).forEach(accounts::delete);
    }

    private static RequestPostProcessor as(String user) {
        return httpBasic(user, PASSWORD);
    }

    private String request(String owner) {
        return """
                {"programId":%d,%s"targetName":"M 42","ra":"05:35:17","dec":"-05:23:28",
                 "exposures":[{"filter":"V","seconds":30,"count":4}],"priority":3}"""
                .formatted(programId, owner == null ? "" : "\"owner\":\"" + owner + "\",");
    }

    @Test
    void computeHealthAndApiDescriptionNeedNoAccount() throws Exception {
        mvc.perform(get("/api/almanac?lat=45&lon=7&date=2027-03-01")).andExpect(status().isOk());
        mvc.perform(get("/actuator/health")).andExpect(status().isOk());
        mvc.perform(get("/v3/api-docs")).andExpect(status().isOk());
    }

    @Test
    void storedDataNeedsAnAccountAndTheRefusalIsAProblemDocument() throws Exception {
        var refused = mvc.perform(get("/api/sites"))
                .andExpect(status().isUnauthorized())
                .andExpect(header().string("WWW-Authenticate", containsString("Basic")))
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.status").value(401))
                .andReturn();
        assertThat(refused.getRequest().getSession(false)).as("no session opened for a refused API call").isNull();
        mvc.perform(get("/api/sites").with(httpBasic("ada", "wrong"))).andExpect(status().isUnauthorized());
        mvc.perform(get("/api/sites").with(as("ada"))).andExpect(status().isOk());
        // The dashboard's own calls are refused without the challenge that would open the browser's password dialog.
        mvc.perform(get("/api/sites").header("X-Requested-With", "XMLHttpRequest"))
                .andExpect(status().isUnauthorized())
                .andExpect(header().doesNotExist("WWW-Authenticate"))
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON));
    }

    @Test
    void aRequesterCannotChangeReferenceDataOrReview() throws Exception {
        mvc.perform(post("/api/sites").with(as("ada")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"name\":\"X\",\"latitudeDeg\":1,\"longitudeDeg\":1,\"elevationM\":1}"))
                .andExpect(status().isForbidden())
                .andExpect(content().contentTypeCompatibleWith(MediaType.APPLICATION_PROBLEM_JSON));
        mvc.perform(post("/api/sites").with(as("cora")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"name\":\"X\",\"latitudeDeg\":1,\"longitudeDeg\":1,\"elevationM\":1}"))
                .andExpect(status().isCreated());
        mvc.perform(get("/api/accounts").with(as("cora"))).andExpect(status().isForbidden());
    }

    @Test
    void aRequesterSeesAndChangesOnlyTheirOwnRequests() throws Exception {
        String created = mvc.perform(post("/api/requests").with(as("ada")).contentType(MediaType.APPLICATION_JSON).content(request(null)))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.owner").value("ada"))
                .andReturn().getResponse().getContentAsString();
        long id = ((Number) JsonPath.read(created, "$.id")).longValue();
        mvc.perform(post("/api/requests").with(as("ben")).contentType(MediaType.APPLICATION_JSON).content(request(null)))
                .andExpect(status().isCreated());

        // Another requester: the request does not exist for them, in a listing or by id.
        mvc.perform(get("/api/requests/" + id).with(as("ben"))).andExpect(status().isNotFound());
        mvc.perform(post("/api/requests/" + id + "/withdraw?version=0").with(as("ben"))).andExpect(status().isNotFound());
        mvc.perform(get("/api/requests?owner=ada").with(as("ben")))
                .andExpect(jsonPath("$.totalItems").value(1))
                .andExpect(jsonPath("$.items[0].owner").value("ben"));
        mvc.perform(post("/api/requests").with(as("ben")).contentType(MediaType.APPLICATION_JSON).content(request("ada")))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.parameter").value("owner"));

        // The owner submits; only a coordinator accepts; the coordinator sees everyone's.
        mvc.perform(post("/api/requests/" + id + "/submit?version=0").with(as("ada"))).andExpect(status().isOk());
        mvc.perform(post("/api/requests/" + id + "/accept?version=1").with(as("ada"))).andExpect(status().isForbidden());
        mvc.perform(post("/api/requests/" + id + "/accept?version=1").with(as("cora")))
                .andExpect(status().isOk()).andExpect(jsonPath("$.state").value("accepted"));
        mvc.perform(get("/api/requests").with(as("cora"))).andExpect(jsonPath("$.totalItems").value(2));
    }

    @Test
    void aBrowserSessionMustSendTheCsrfToken() throws Exception {
        // As a browser does it, cookies carried by hand: the XSRF-TOKEN cookie comes with any page,
        // and every change sends its value back (as a form field, or in the X-XSRF-TOKEN header).
        mvc.perform(post("/login").param("username", "ada").param("password", PASSWORD)).andExpect(status().isForbidden());
        Cookie token = mvc.perform(get("/login")).andReturn().getResponse().getCookie("XSRF-TOKEN");
        assertThat(token).isNotNull();
        var login = mvc.perform(post("/login").cookie(token).param("username", "ada").param("password", PASSWORD)
                        .param("_csrf", token.getValue()))
                .andExpect(status().is3xxRedirection())
                .andReturn();
        MockHttpSession session = (MockHttpSession) login.getRequest().getSession(false);
        assertThat(session).isNotNull();
        token = latest(token, login.getResponse().getCookie("XSRF-TOKEN"));

        // Signing in replaces the token (the old cookie is cleared); the next page brings the new one.
        var me = mvc.perform(token == null ? get("/api/accounts/me").session(session) : get("/api/accounts/me").session(session).cookie(token))
                .andExpect(jsonPath("$.username").value("ada")).andReturn();
        token = latest(token, me.getResponse().getCookie("XSRF-TOKEN"));
        assertThat(token).as("an XSRF-TOKEN cookie after sign-in").isNotNull();

        mvc.perform(post("/api/requests").session(session).cookie(token).contentType(MediaType.APPLICATION_JSON).content(request(null)))
                .andExpect(status().isForbidden())
                .andExpect(jsonPath("$.detail").value(containsString("CSRF")));
        mvc.perform(post("/api/requests").session(session).cookie(token).header("X-XSRF-TOKEN", "not-the-token")
                        .contentType(MediaType.APPLICATION_JSON).content(request(null)))
                .andExpect(status().isForbidden());
        mvc.perform(post("/api/requests").session(session).cookie(token).header("X-XSRF-TOKEN", token.getValue())
                        .contentType(MediaType.APPLICATION_JSON).content(request(null)))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.owner").value("ada"));
    }

    /** The cookie a browser would hold after a response that may have replaced it. */
    private static Cookie latest(Cookie held, Cookie sent) {
        return sent == null ? held : sent.getMaxAge() == 0 ? null : sent;
    }

    @Test
    void passwordsAreStoredAsBcryptAndNeverShown() throws Exception {
        assertThat(accounts.findByUsername("ada").orElseThrow().getPasswordHash()).startsWith("$2").doesNotContain(PASSWORD);
        mvc.perform(post("/api/accounts").with(httpBasic("admin", "first-admin-secret")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"username\":\"dora\",\"password\":\"long enough\",\"role\":\"requester\"}"))
                .andExpect(status().isCreated());
        mvc.perform(post("/api/accounts").with(httpBasic("admin", "first-admin-secret")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"username\":\"eve\",\"password\":\"short\",\"role\":\"requester\"}"))
                .andExpect(status().isBadRequest()).andExpect(jsonPath("$.parameter").value("password"));
        mvc.perform(get("/api/accounts").with(httpBasic("admin", "first-admin-secret")))
                .andExpect(status().isOk())
                .andExpect(content().string(containsString("\"dora\"")))
                .andExpect(content().string(not(containsString("$2"))))
                .andExpect(content().string(not(containsString("password"))));
        mvc.perform(get("/api/sites").with(httpBasic("dora", "long enough"))).andExpect(status().isOk());
    }

    @Test
    void peopleChangeTheirOwnPasswordAndAdminsChangeAccounts() throws Exception {
        mvc.perform(put("/api/accounts/me/password").with(as("ada")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"currentPassword\":\"wrong\",\"newPassword\":\"a new passphrase\"}"))
                .andExpect(status().isBadRequest()).andExpect(jsonPath("$.parameter").value("currentPassword"));
        mvc.perform(put("/api/accounts/me/password").with(as("ada")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"currentPassword\":\"" + PASSWORD + "\",\"newPassword\":\"a new passphrase\"}"))
                .andExpect(status().isNoContent());
        mvc.perform(get("/api/sites").with(as("ada"))).andExpect(status().isUnauthorized());
        mvc.perform(get("/api/sites").with(httpBasic("ada", "a new passphrase"))).andExpect(status().isOk());

        mvc.perform(put("/api/accounts/ben").with(as("cora")).contentType(MediaType.APPLICATION_JSON).content("{\"enabled\":false}"))
                .andExpect(status().isForbidden());
        mvc.perform(put("/api/accounts/ben").with(httpBasic("admin", "first-admin-secret")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"enabled\":false}"))
                .andExpect(status().isOk()).andExpect(jsonPath("$.enabled").value(false));
        mvc.perform(get("/api/sites").with(as("ben"))).andExpect(status().isUnauthorized());
        mvc.perform(put("/api/accounts/cora").with(httpBasic("admin", "first-admin-secret")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"role\":\"requester\"}"))
                .andExpect(status().isOk()).andExpect(jsonPath("$.role").value("requester"));
        mvc.perform(post("/api/sites").with(as("cora")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"name\":\"Y\",\"latitudeDeg\":1,\"longitudeDeg\":1,\"elevationM\":1}"))
                .andExpect(status().isForbidden());
        // The last enabled admin cannot lock everyone out.
        mvc.perform(put("/api/accounts/admin").with(httpBasic("admin", "first-admin-secret")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"role\":\"coordinator\"}"))
                .andExpect(status().isConflict());
    }

    @Test
    void theFirstAdminHasTheConfiguredPassword() throws Exception {
        Account admin = accounts.findByUsername("admin").orElseThrow();
        assertThat(admin.getRole()).isEqualTo(Role.ADMIN);
        assertThat(encoder.matches("first-admin-secret", admin.getPasswordHash())).isTrue();
        mvc.perform(get("/api/accounts/me").with(httpBasic("admin", "first-admin-secret"))).andExpect(jsonPath("$.role").value("admin"));
    }
}
