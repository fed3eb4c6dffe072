package org.skyrota.web.system;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.httpBasic;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.delete;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.put;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import com.jayway.jsonpath.JsonPath;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.request.ObservingRequestRepository;
import org.skyrota.web.site.SiteRepository;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.web.servlet.MockMvc;

/** Every change leaves an audit record naming who, when, what, and the object before and after. */
@SpringBootTest
@AutoConfigureMockMvc
class AuditLogTest {

    @Autowired MockMvc mvc;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    @Autowired AuditEventRepository events;
    @Autowired SiteRepository sites;
    @Autowired ProgramRepository programs;
    @Autowired ObservingRequestRepository requests;

    @BeforeEach
    void people() {
        accounts.save(new Account("cora", encoder.encode("password1"), Role.COORDINATOR));
        accounts.save(new Account("ada", encoder.encode("password1"), Role.REQUESTER));
    }

    @AfterEach
    void empty() {
        requests.deleteAll();
        programs.deleteAll();
        sites.deleteAll();
        events.deleteAll();
        accounts.findAll().stream().filter(a -> !a.getUsername().equals("admin")).forEach(accounts::delete);
    }

    @Test
    void siteChangesAreRecordedWithBeforeAndAfter() throws Exception {
        String created = mvc.perform(post("/api/sites").with(httpBasic("cora", "password1")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"name\":\"Hill\",\"latitudeDeg\":45,\"longitudeDeg\":7,\"elevationM\":300}"))
                .andExpect(status().isCreated()).andReturn().getResponse().getContentAsString();
        long id = ((Number) JsonPath.read(created, "$.id")).longValue();
        mvc.perform(put("/api/sites/" + id).with(httpBasic("cora", "password1")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"version\":0,\"name\":\"Hill\",\"latitudeDeg\":45,\"longitudeDeg\":7,\"elevationM\":350}"))
                .andExpect(status().isOk());
        // A refused edit changes nothing and leaves no record.
        mvc.perform(put("/api/sites/" + id).with(httpBasic("cora", "password1")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"version\":0,\"name\":\"Hill\",\"latitudeDeg\":45,\"longitudeDeg\":7,\"elevationM\":400}"))
                .andExpect(status().isConflict());
        mvc.perform(delete("/api/sites/" + id + "?version=1").with(httpBasic("cora", "password1"))).andExpect(status().isNoContent());
        assertThat(sites.existsById(id)).as("the site is gone from storage").isFalse();

        mvc.perform(get("/api/audit?entityType=site&entityId=" + id).with(httpBasic("cora", "password1")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.totalItems").value(3))
                // newest first
                .andExpect(jsonPath("$.items[0].action").value("delete"))
                .andExpect(jsonPath("$.items[0].before.elevationM").value(350.0))
                .andExpect(jsonPath("$.items[0].after").isEmpty())
                .andExpect(jsonPath("$.items[1].action").value("update"))
                .andExpect(jsonPath("$.items[1].actor").value("cora"))
                .andExpect(jsonPath("$.items[1].before.elevationM").value(300.0))
                .andExpect(jsonPath("$.items[1].after.elevationM").value(350.0))
                .andExpect(jsonPath("$.items[1].after.version").value(1))
                .andExpect(jsonPath("$.items[2].action").value("create"))
                .andExpect(jsonPath("$.items[2].before").isEmpty())
                .andExpect(jsonPath("$.items[2].at").isNotEmpty());
    }

    @Test
    void stateChangesAreRecordedAndOnlyReviewersReadTheLog() throws Exception {
        String program = mvc.perform(post("/api/programs").with(httpBasic("cora", "password1")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"code\":\"A-1\",\"title\":\"t\",\"principalInvestigator\":\"cora\"}"))
                .andExpect(status().isCreated()).andReturn().getResponse().getContentAsString();
        String request = mvc.perform(post("/api/requests").with(httpBasic("ada", "password1")).contentType(MediaType.APPLICATION_JSON)
                        .content("{\"programId\":" + JsonPath.read(program, "$.id") + ",\"targetName\":\"M 13\",\"ra\":250.42,\"dec\":36.46,"
                                + "\"exposures\":[{\"filter\":\"V\",\"seconds\":60,\"count\":3}],\"priority\":2}"))
                .andExpect(status().isCreated()).andReturn().getResponse().getContentAsString();
        long id = ((Number) JsonPath.read(request, "$.id")).longValue();
        mvc.perform(post("/api/requests/" + id + "/submit?version=0").with(httpBasic("ada", "password1"))).andExpect(status().isOk());

        String log = mvc.perform(get("/api/audit?entityType=request&entityId=" + id).with(httpBasic("cora", "password1")))
                .andExpect(jsonPath("$.items[0].action").value("state:submitted"))
                .andExpect(jsonPath("$.items[0].actor").value("ada"))
                .andExpect(jsonPath("$.items[0].before.state").value("draft"))
                .andExpect(jsonPath("$.items[0].after.state").value("submitted"))
                .andReturn().getResponse().getContentAsString();
        // Newest first: the submission, then the creation, and nothing else for this request.
        assertThat(JsonPath.<java.util.List<String>>read(log, "$.items[*].action")).containsExactly("state:submitted", "create");
        mvc.perform(get("/api/audit").with(httpBasic("ada", "password1"))).andExpect(status().isForbidden());
    }
}
