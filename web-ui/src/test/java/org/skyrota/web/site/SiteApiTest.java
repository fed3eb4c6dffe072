package org.skyrota.web.site;

import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.delete;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.put;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.header;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import com.jayway.jsonpath.JsonPath;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.springframework.beans.factory.annotation.Autowired;
import org.skyrota.web.support.CsrfOnEveryRequest;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.context.annotation.Import;
import org.springframework.security.test.context.support.WithMockUser;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;

/** The site resource end to end on the embedded database: create, read, list, edit, delete, and every refusal. */
@SpringBootTest
@AutoConfigureMockMvc
@Import(CsrfOnEveryRequest.class)
@WithMockUser(username = "coordinator", roles = "COORDINATOR")
class SiteApiTest {

    private static final String RIDGE = """
            {"name":"Ridge Station","latitudeDeg":-31.27,"longitudeDeg":149.06,"elevationM":1165,
             "timeZone":"Australia/Sydney","darkSkyZenithVMag":21.6,
             "horizon":[{"azimuthDeg":0,"altitudeDeg":5},{"azimuthDeg":180,"altitudeDeg":12}]}""";

    @Autowired
    MockMvc mvc;

    @Autowired
    SiteRepository sites;

    @AfterEach
    void empty() {
        sites.deleteAll();
    }

    @Test
    void createdSiteIsReadBackWithItsLocation() throws Exception {
        String location = mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(RIDGE))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.version").value(0))
                .andReturn().getResponse().getHeader("Location");
        assertThat(location).contains("/api/sites/");

        mvc.perform(get(location))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.name").value("Ridge Station"))
                .andExpect(jsonPath("$.latitudeDeg").value(-31.27))
                .andExpect(jsonPath("$.timeZone").value("Australia/Sydney"))
                .andExpect(jsonPath("$.horizon[1].altitudeDeg").value(12.0));
    }

    @ParameterizedTest(name = "{0}={1} is refused")
    @CsvSource(delimiter = '|', textBlock = """
            latitudeDeg       | 91
            latitudeDeg       | null
            latitudeDeg       | "NaN"
            longitudeDeg      | "Infinity"
            longitudeDeg      | -180.5
            elevationM        | 9100
            timeZone          | "Atlantis/Central"
            timeZone          | "GMT+5"
            timeZone          | "UTC+02:00"
            timeZone          | "+05:00"
            timeZone          | "Z"
            timeZone          | "australia/sydney"
            timeZone          | ""
            timeZone          | 10
            name              | "  "
            name              | 5
            darkSkyZenithVMag | 30
            darkSkyZenithVMag | "21.6"
            elevationM        | true
            """)
    void invalidFieldIsNamed(String field, String json) throws Exception {
        String body = RIDGE.replaceFirst("\"" + field + "\":[^,]+,", "\"" + field + "\":" + json + ",");
        mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(body))
                .andExpect(status().isBadRequest())
                .andExpect(content().contentType(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.parameter").value(field))
                .andExpect(jsonPath("$.errors[0].field").value(field));
    }

    @ParameterizedTest(name = "{0} is an IANA region")
    @CsvSource({"Europe/Madrid", "Etc/GMT-5", "UTC", "America/Argentina/San_Juan"})
    void ianaRegionNamesAreTaken(String zone) throws Exception {
        mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON)
                        .content(RIDGE.replace("Australia/Sydney", zone).replace("Ridge Station", "Ridge " + zone)))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.timeZone").value(zone));
    }

    /** Seen before: a site's "GMT+5" was stored; it is no region and reads the wrong way round (Etc/GMT-5 is UTC+5). */
    @Test
    void aTimeZoneThatIsAnOffsetIsRefusedNamingIt() throws Exception {
        mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(RIDGE.replace("Australia/Sydney", "GMT+5")))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.parameter").value("timeZone"))
                .andExpect(jsonPath("$.errors[0].message").value(containsString("IANA time-zone region")));
        assertThat(sites.count()).isZero();
    }

    @Test
    void anUnknownMemberIsRefusedNamingItAndNothingIsStored() throws Exception {
        for (String[] c : new String[][] {
                {RIDGE.replace("\"elevationM\"", "\"elevation\""), "elevation"},
                {RIDGE.replace("\"altitudeDeg\":12", "\"altitude\":12"), "horizon[1].altitude"},
                {RIDGE.replace("{\"name\"", "{\"nam\":\"x\",\"name\""), "nam"},
                {RIDGE.replace("{\"name\"", "{\"latitudeDeg\":10,\"name\""), "latitudeDeg"}}) {
            mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(c[0]))
                    .andExpect(status().isBadRequest())
                    .andExpect(content().contentType(MediaType.APPLICATION_PROBLEM_JSON))
                    .andExpect(jsonPath("$.parameter").value(c[1]));
        }
        assertThat(sites.count()).isZero();
    }

    /** What a GET answers can be sent back unchanged: its id and time stamps are read-only and ignored. */
    @Test
    void aSiteReadBackIsTakenBackUnchangedByPutAndPost() throws Exception {
        String created = mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(RIDGE))
                .andExpect(status().isCreated()).andReturn().getResponse().getContentAsString();
        long id = ((Number) JsonPath.read(created, "$.id")).longValue();
        String read = mvc.perform(get("/api/sites/" + id)).andReturn().getResponse().getContentAsString();
        String edited = mvc.perform(put("/api/sites/" + id).contentType(MediaType.APPLICATION_JSON).content(read))
                .andExpect(status().isOk())
                .andReturn().getResponse().getContentAsString();
        for (String member : new String[] {"$.name", "$.latitudeDeg", "$.longitudeDeg", "$.elevationM", "$.timeZone",
                "$.darkSkyZenithVMag", "$.horizon", "$.createdAt"}) {
            assertThat((Object) JsonPath.read(edited, member)).as(member).isEqualTo(JsonPath.read(read, member));
        }
        mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(read.replace("Ridge Station", "Ridge Two")))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.id").value(org.hamcrest.Matchers.not((int) id)))
                .andExpect(jsonPath("$.timeZone").value("Australia/Sydney"));
    }

    @Test
    void invalidHorizonPointIsNamedWithItsIndex() throws Exception {
        String body = RIDGE.replace("{\"azimuthDeg\":180,\"altitudeDeg\":12}", "{\"azimuthDeg\":400,\"altitudeDeg\":12}");
        mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(body))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.parameter").value("horizon[1].azimuthDeg"));
    }

    @Test
    void duplicateNameIsAConflict() throws Exception {
        mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(RIDGE)).andExpect(status().isCreated());
        mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(RIDGE))
                .andExpect(status().isConflict())
                .andExpect(jsonPath("$.detail").value(containsString("Ridge Station")));
    }

    @Test
    void editAgainstTheCurrentVersionSucceedsAndAStaleOneGets409WithTheCurrentVersion() throws Exception {
        String created = mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(RIDGE))
                .andReturn().getResponse().getContentAsString();
        int id = JsonPath.read(created, "$.id");
        String edit = RIDGE.replace("{\"name\"", "{\"version\":0,\"name\"").replace("1165", "1170");

        mvc.perform(put("/api/sites/" + id).contentType(MediaType.APPLICATION_JSON).content(edit))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.version").value(1))
                .andExpect(jsonPath("$.elevationM").value(1170.0));

        // The same edit again is made against version 0, which is gone: refused, not applied.
        mvc.perform(put("/api/sites/" + id).contentType(MediaType.APPLICATION_JSON).content(edit.replace("1170", "1180")))
                .andExpect(status().isConflict())
                .andExpect(content().contentType(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.type").value("urn:skyrota:problem:stale-version"))
                .andExpect(jsonPath("$.currentVersion").value(1));
        mvc.perform(get("/api/sites/" + id)).andExpect(jsonPath("$.elevationM").value(1170.0));

        mvc.perform(put("/api/sites/" + id).contentType(MediaType.APPLICATION_JSON).content(RIDGE))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.parameter").value("version"));
    }

    @Test
    void listPagesSortsAndFilters() throws Exception {
        for (String name : new String[] {"Echo Hill", "Alpha Ridge", "Delta Hill", "Bravo Flat"}) {
            mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(RIDGE.replace("Ridge Station", name)))
                    .andExpect(status().isCreated());
        }
        mvc.perform(get("/api/sites?size=3"))
                .andExpect(jsonPath("$.totalItems").value(4))
                .andExpect(jsonPath("$.totalPages").value(2))
                .andExpect(jsonPath("$.items[0].name").value("Alpha Ridge"))
                .andExpect(jsonPath("$.items.length()").value(3));
        mvc.perform(get("/api/sites?name=hill&sort=name,desc"))
                .andExpect(jsonPath("$.items[*].name").value(org.hamcrest.Matchers.contains("Echo Hill", "Delta Hill")));
        mvc.perform(get("/api/sites?sort=colour"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.parameter").value("sort"));
    }

    @Test
    void unknownSiteIs404AndDeleteChecksTheVersion() throws Exception {
        mvc.perform(get("/api/sites/987654"))
                .andExpect(status().isNotFound())
                .andExpect(content().contentType(MediaType.APPLICATION_PROBLEM_JSON));
        String created = mvc.perform(post("/api/sites").contentType(MediaType.APPLICATION_JSON).content(RIDGE))
                .andReturn().getResponse().getContentAsString();
        int id = JsonPath.read(created, "$.id");
        mvc.perform(delete("/api/sites/" + id + "?version=3")).andExpect(status().isConflict());
        mvc.perform(delete("/api/sites/" + id + "?version=0")).andExpect(status().isNoContent());
        mvc.perform(get("/api/sites/" + id)).andExpect(status().isNotFound());
        mvc.perform(get("/api/sites/abc"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.parameter").value("id"));
    }
}
