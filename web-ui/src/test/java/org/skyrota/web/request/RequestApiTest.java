package org.skyrota.web.request;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.hamcrest.Matchers.contains;
import static org.hamcrest.Matchers.containsString;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.delete;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.put;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.util.List;

import com.jayway.jsonpath.JsonPath;

import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.equipment.InstrumentRepository;
import org.skyrota.web.equipment.TelescopeRepository;
import org.skyrota.web.program.ProgramRepository;
import org.skyrota.web.site.SiteRepository;
import org.springframework.beans.factory.annotation.Autowired;
import org.skyrota.web.support.CsrfOnEveryRequest;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.context.annotation.Import;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.security.test.context.support.WithMockUser;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.http.MediaType;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.ResultActions;

/**
 * Equipment, programs and observing requests end to end on the embedded database: the chain
 * site → telescope → instrument → program with a grant → request, coordinates in both notations,
 * every field check naming its field, the state changes, stale edits and listings.
 */
@SpringBootTest
@AutoConfigureMockMvc
@Import(CsrfOnEveryRequest.class)
@WithMockUser(username = "coordinator", roles = "COORDINATOR")
class RequestApiTest {

    @Autowired MockMvc mvc;
    @Autowired ObservingRequestRepository requests;
    @Autowired ProgramRepository programs;
    @Autowired InstrumentRepository instruments;
    @Autowired TelescopeRepository telescopes;
    @Autowired SiteRepository sites;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;

    long programId;
    long telescopeId;

    @BeforeEach
    void equipmentAndProgram() throws Exception {
        // The owners the requests name: a request's owner must have an account.
        for (String owner : List.of("student", "student2")) {
            if (!accounts.existsByUsername(owner)) {
                accounts.save(new Account(owner, encoder.encode("password1"), Role.REQUESTER));
            }
        }
        long siteId = id(create("/api/sites", """
                {"name":"Plateau Station","latitudeDeg":-23.5,"longitudeDeg":-67.8,"elevationM":2400,"timeZone":"America/Santiago"}"""));
        telescopeId = id(create("/api/telescopes", """
                {"siteId":%d,"name":"T40","apertureMm":400,"minAltitudeDeg":15,"slewRateDegPerS":4,"settleSeconds":10}""".formatted(siteId)));
        String instrument = mvc.perform(post("/api/instruments").contentType(MediaType.APPLICATION_JSON).content("""
                        {"telescopeId":%d,"name":"CCD-1","readoutSeconds":8,"filterChangeSeconds":5,"filters":["B","V","R","Ha"]}""".formatted(telescopeId)))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.filters").value(contains("B", "V", "R", "Ha")))
                .andReturn().getResponse().getContentAsString();
        assertThat(JsonPath.<Integer>read(instrument, "$.telescopeId")).isEqualTo((int) telescopeId);
        programId = id(create("/api/programs", """
                {"code":"VAR-27","title":"Variable stars for the first-year course","principalInvestigator":"coordinator",
                 "grants":[{"telescopeId":%d,"hours":40,"firstNight":"2027-01-01","lastNight":"2027-06-30"}]}""".formatted(telescopeId)));
    }

    @AfterEach
    void empty() {
        requests.deleteAll();
        programs.deleteAll();
        instruments.deleteAll();
        telescopes.deleteAll();
        sites.deleteAll();
    }

    private String request(String ra, String dec, int priority) {
        return """
                {"programId":%d,"owner":"student","targetName":"NGC 1976","ra":%s,"dec":%s,
                 "exposures":[{"filter":"V","seconds":60,"count":10},{"filter":"R","seconds":45,"count":5}],
                 "maxMoonIllumination":0.6,"maxAirmass":1.8,"earliestNight":"2027-01-10","latestNight":"2027-02-10","repeats":2,
                 "repeatIntervalHours":48,"repeatToleranceHours":6,"priority":%d}"""
                .formatted(programId, ra, dec, priority);
    }

    @Test
    void sexagesimalAndDecimalCoordinatesAreStoredAsDegreesWithDefaults() throws Exception {
        // 05:35:17.3 h = 83.82208°; −05°23′28″ = −5.39111° (arithmetic: 15°/h, 60′/°, 60″/′).
        String created = mvc.perform(post("/api/requests").contentType(MediaType.APPLICATION_JSON).content(request("\"05:35:17.3\"", "\"-05:23:28\"", 2)))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.state").value("draft"))
                .andExpect(jsonPath("$.darkness").value("astronomical"))
                .andExpect(jsonPath("$.minAltitudeDeg").value(30.0))
                .andExpect(jsonPath("$.exposures[1].filter").value("R"))
                .andReturn().getResponse().getContentAsString();
        assertThat(JsonPath.<Double>read(created, "$.raDeg")).isCloseTo(83.822083, within(1e-6));
        assertThat(JsonPath.<Double>read(created, "$.decDeg")).isCloseTo(-5.391111, within(1e-6));

        String letters = create("/api/requests", request("\"5h35m17.3s\"", "\"-5d23m28s\"", 2));
        assertThat(JsonPath.<Double>read(letters, "$.raDeg")).isCloseTo(83.822083, within(1e-6));
        String decimal = create("/api/requests", request("83.8221", "-5.3911", 2));
        assertThat(JsonPath.<Double>read(decimal, "$.raDeg")).isEqualTo(83.8221);
        assertThat(JsonPath.<Double>read(decimal, "$.decDeg")).isEqualTo(-5.3911);
    }

    @ParameterizedTest(name = "{0} is refused")
    @CsvSource(delimiter = '|', textBlock = """
            ra                   | "25:00:00"                | "-05:23:28"
            ra                   | "05:61:00"                | "-05:23:28"
            ra                   | "361"                     | "-05:23:28"
            ra                   | "five"                    | "-05:23:28"
            dec                  | "05:35:17"                | "-91:00:00"
            dec                  | "05:35:17"                | "+45:75:00"
            dec                  | "05:35:17"                | "-90.5"
            """)
    void badCoordinatesAreNamed(String field, String ra, String dec) throws Exception {
        refused(mvc.perform(post("/api/requests").contentType(MediaType.APPLICATION_JSON).content(request(ra, dec, 3))), field);
    }

    @Test
    void everyOtherFieldCheckNamesItsField() throws Exception {
        String ok = request("\"05:35:17\"", "\"-05:23:28\"", 3);
        refused(send(ok.replace("\"priority\":3", "\"priority\":6")), "priority");
        refused(send(ok.replace("\"priority\":3", "\"priority\":0")), "priority");
        refused(send(ok.replace("\"seconds\":60", "\"seconds\":0")), "exposures[0].seconds");
        refused(send(ok.replace("\"count\":5", "\"count\":0")), "exposures[1].count");
        refused(send(ok.replace("\"filter\":\"V\"", "\"filter\":\"\"")), "exposures[0].filter");
        refused(send(ok.replace("\"maxMoonIllumination\":0.6", "\"maxMoonIllumination\":1.5")), "maxMoonIllumination");
        refused(send(ok.replace("\"repeats\":2", "\"repeats\":0")), "repeats");
        // Nights out of order: both fields are named.
        send(ok.replace("2027-02-10", "2027-01-01")).andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.errors[*].field").value(contains("earliestNight", "latestNight")));
        refused(send(ok.replace("\"programId\":" + programId, "\"programId\":999999")), "programId");
        // Values of the wrong JSON type are named too.
        refused(send(ok.replace("\"priority\":3", "\"priority\":\"high\"")), "priority");
        refused(send(ok.replace("\"seconds\":45", "\"seconds\":\"long\"")), "exposures[1].seconds");
        refused(send(ok.replace("\"earliestNight\":\"2027-01-10\"", "\"earliestNight\":\"10 Jan\"")), "earliestNight");
        refused(send(ok.replace("\"maxMoonIllumination\":0.6", "\"darkness\":\"bright\"")), "darkness");
    }

    @Test
    void repeatSpacingIsStoredAndEveryRuleNamesItsField() throws Exception {
        String ok = request("\"05:35:17\"", "\"-05:23:28\"", 3);
        String spaced = create("/api/requests", ok);
        assertThat(JsonPath.<Double>read(spaced, "$.repeatIntervalHours")).isEqualTo(48.0);
        assertThat(JsonPath.<Double>read(spaced, "$.repeatToleranceHours")).isEqualTo(6.0);
        // No tolerance given: none.
        String strict = create("/api/requests", ok.replace(",\"repeatToleranceHours\":6", ""));
        assertThat(JsonPath.<Double>read(strict, "$.repeatToleranceHours")).isEqualTo(0.0);
        // One visit needs no spacing.
        String single = create("/api/requests", ok.replace("\"repeats\":2,", "\"repeats\":1,")
                .replace("\"repeatIntervalHours\":48,\"repeatToleranceHours\":6,", ""));
        assertThat(JsonPath.<Object>read(single, "$.repeatIntervalHours")).isNull();
        assertThat(JsonPath.<Object>read(single, "$.repeatToleranceHours")).isNull();

        // More than one repeat needs an interval.
        refused(send(ok.replace("\"repeatIntervalHours\":48,\"repeatToleranceHours\":6,", "")), "repeatIntervalHours");
        // Each field's own range: the interval more than 0 and at most 366 days, the tolerance not negative.
        refused(send(ok.replace("\"repeatIntervalHours\":48", "\"repeatIntervalHours\":0")), "repeatIntervalHours");
        refused(send(ok.replace("\"repeatIntervalHours\":48", "\"repeatIntervalHours\":-24")), "repeatIntervalHours");
        refused(send(ok.replace("\"repeatIntervalHours\":48", "\"repeatIntervalHours\":8785")), "repeatIntervalHours");
        refused(send(ok.replace("\"repeatIntervalHours\":48", "\"repeatIntervalHours\":\"daily\"")), "repeatIntervalHours");
        refused(send(ok.replace("\"repeatToleranceHours\":6", "\"repeatToleranceHours\":-1")), "repeatToleranceHours");
        // A tolerance as large as the interval would allow two visits at the same moment: both fields are named.
        send(ok.replace("\"repeatToleranceHours\":6", "\"repeatToleranceHours\":48"))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.parameter").value("repeatToleranceHours"))
                .andExpect(jsonPath("$.errors[*].field").value(contains("repeatToleranceHours", "repeatIntervalHours")));
        // A tolerance loosens an interval, so it cannot come alone.
        refused(send(ok.replace("\"repeats\":2,", "\"repeats\":1,").replace("\"repeatIntervalHours\":48,", "")), "repeatToleranceHours");
        mvc.perform(get("/api/requests")).andExpect(jsonPath("$.totalItems").value(3));
    }

    @Test
    void lifecycleFollowsTheAllowedTransitionsOnly() throws Exception {
        long id = id(create("/api/requests", request("83.82", "-5.39", 1)));
        action(id, "accept", 0).andExpect(status().isConflict()).andExpect(jsonPath("$.detail").value(containsString("draft")));
        action(id, "submit", 0).andExpect(status().isOk()).andExpect(jsonPath("$.state").value("submitted")).andExpect(jsonPath("$.version").value(1));
        // Editing is for drafts only.
        mvc.perform(put("/api/requests/" + id).contentType(MediaType.APPLICATION_JSON)
                        .content(request("83.82", "-5.39", 1).replace("{\"programId\"", "{\"version\":1,\"programId\"")))
                .andExpect(status().isConflict());
        action(id, "reject", 1).andExpect(status().isBadRequest()).andExpect(jsonPath("$.parameter").value("reason"));
        mvc.perform(post("/api/requests/" + id + "/reject?version=1").contentType(MediaType.APPLICATION_JSON).content("{\"reason\":\"Too low from every site in this semester\"}"))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.state").value("rejected"))
                .andExpect(jsonPath("$.rejectionReason").value("Too low from every site in this semester"));
        action(id, "reopen", 2).andExpect(status().isOk()).andExpect(jsonPath("$.state").value("draft")).andExpect(jsonPath("$.rejectionReason").isEmpty());
        action(id, "submit", 3).andExpect(status().isOk());
        action(id, "accept", 4).andExpect(status().isOk()).andExpect(jsonPath("$.state").value("accepted"));
        mvc.perform(delete("/api/requests/" + id)).andExpect(status().isConflict());
        action(id, "withdraw", 5).andExpect(status().isOk()).andExpect(jsonPath("$.state").value("withdrawn"));
        action(id, "submit", 6).andExpect(status().isConflict());
        mvc.perform(delete("/api/requests/" + id + "?version=6")).andExpect(status().isNoContent());
    }

    @Test
    void staleActionOrEditGets409WithTheCurrentVersion() throws Exception {
        long id = id(create("/api/requests", request("83.82", "-5.39", 1)));
        String edit = request("83.9", "-5.39", 2).replace("{\"programId\"", "{\"version\":0,\"programId\"");
        mvc.perform(put("/api/requests/" + id).contentType(MediaType.APPLICATION_JSON).content(edit))
                .andExpect(status().isOk()).andExpect(jsonPath("$.priority").value(2)).andExpect(jsonPath("$.version").value(1));
        mvc.perform(put("/api/requests/" + id).contentType(MediaType.APPLICATION_JSON).content(edit.replace("\"priority\":2", "\"priority\":4")))
                .andExpect(status().isConflict()).andExpect(jsonPath("$.currentVersion").value(1));
        action(id, "submit", 0).andExpect(status().isConflict()).andExpect(jsonPath("$.currentVersion").value(1));
        mvc.perform(post("/api/requests/" + id + "/submit")).andExpect(status().isBadRequest()).andExpect(jsonPath("$.parameter").value("version"));
        mvc.perform(get("/api/requests/" + id)).andExpect(jsonPath("$.priority").value(2)).andExpect(jsonPath("$.state").value("draft"));
    }

    @Test
    void listingFiltersByStateOwnerTargetAndPriorityAndSortsByPriority() throws Exception {
        for (int p = 1; p <= 5; p++) {
            long id = id(create("/api/requests", request("83.82", "-5.39", p)));
            if (p % 2 == 1) {
                action(id, "submit", 0).andExpect(status().isOk());
            }
        }
        create("/api/requests", request("10.68", "41.27", 3).replace("\"owner\":\"student\"", "\"owner\":\"student2\"").replace("NGC 1976", "M 31"));
        // Descending priority is the planner's order: 5, the highest, first.
        mvc.perform(get("/api/requests?state=submitted&sort=priority,desc"))
                .andExpect(jsonPath("$.totalItems").value(3))
                .andExpect(jsonPath("$.items[*].priority").value(contains(5, 3, 1)));
        mvc.perform(get("/api/requests?owner=student2")).andExpect(jsonPath("$.items[*].targetName").value(contains("M 31")));
        mvc.perform(get("/api/requests?target=ngc&size=2&page=1&sort=priority"))
                .andExpect(jsonPath("$.totalItems").value(5))
                .andExpect(jsonPath("$.page").value(1))
                .andExpect(jsonPath("$.items[*].priority").value(contains(3, 4)));
        mvc.perform(get("/api/requests?programId=" + programId)).andExpect(jsonPath("$.totalItems").value(6));
        mvc.perform(get("/api/requests?state=lost")).andExpect(status().isBadRequest()).andExpect(jsonPath("$.parameter").value("state"));
        mvc.perform(get("/api/requests?priority=3&sort=targetName"))
                .andExpect(jsonPath("$.totalItems").value(2))
                .andExpect(jsonPath("$.items[*].targetName").value(contains("M 31", "NGC 1976")));
        mvc.perform(get("/api/requests?priority=6")).andExpect(status().isBadRequest()).andExpect(jsonPath("$.parameter").value("priority"));
        mvc.perform(get("/api/requests?priority=high")).andExpect(status().isBadRequest()).andExpect(jsonPath("$.parameter").value("priority"));
    }

    /**
     * The listing reads rows with SQL of its own, the single read goes through the entity mapping: both must show
     * every field alike, nulls, exposure order, target parameters and timestamps included.
     */
    @Test
    void aListedRequestReadsExactlyAsTheRequestAlone() throws Exception {
        long full = id(create("/api/requests", request("83.82", "-5.39", 4)));
        long bare = id(create("/api/requests", """
                {"programId":%d,"owner":"student","targetName":"M 42 'bare'","ra":83.8,"dec":-5.4,
                 "exposures":[{"filter":"Ha","seconds":300,"count":3},{"filter":"B","seconds":30,"count":1},{"filter":"V","seconds":20,"count":2}],
                 "priority":1}""".formatted(programId)));
        long planet = id(create("/api/requests", """
                {"programId":%d,"owner":"student2","targetName":"Jupiter","targetKind":"planet","targetParameters":{"body":"jupiter"},
                 "exposures":[{"filter":"R","seconds":1.5,"count":40}],"minAltitudeDeg":25,"darkness":"nautical",
                 "minMoonSeparationDeg":20,"priority":5}""".formatted(programId)));
        action(full, "submit", 0).andExpect(status().isOk());
        mvc.perform(post("/api/requests/" + full + "/reject?version=1").contentType(MediaType.APPLICATION_JSON)
                .content("{\"reason\":\"Below 30° from every site\"}")).andExpect(status().isOk());

        String listing = mvc.perform(get("/api/requests?size=10&sort=priority,desc")).andExpect(status().isOk())
                .andExpect(jsonPath("$.totalItems").value(3))
                .andExpect(jsonPath("$.items[*].id").value(contains((int) planet, (int) full, (int) bare)))
                .andReturn().getResponse().getContentAsString();
        for (long id : new long[] {full, bare, planet}) {
            Object listed = JsonPath.read(listing, "$.items[?(@.id == " + id + ")]");
            String alone = mvc.perform(get("/api/requests/" + id)).andExpect(status().isOk()).andReturn().getResponse().getContentAsString();
            assertThat(listed).as("request %d listed vs read alone", id).isEqualTo(JsonPath.read("[" + alone + "]", "$"));
        }
        assertThat(JsonPath.<String>read(listing, "$.items[1].rejectionReason")).isEqualTo("Below 30° from every site");
        assertThat(JsonPath.<Double>read(listing, "$.items[1].maxAirmass")).isEqualTo(1.8);
        assertThat(JsonPath.<Object>read(listing, "$.items[2].maxAirmass")).isNull();
        assertThat(JsonPath.<List<String>>read(listing, "$.items[2].exposures[*].filter")).containsExactly("Ha", "B", "V");
        assertThat(JsonPath.<String>read(listing, "$.items[0].targetParameters.body")).isEqualTo("jupiter");
        // Pages split a sort key's ties by id, so that paging through never repeats or skips a request.
        String first = mvc.perform(get("/api/requests?size=2&page=0&sort=owner")).andReturn().getResponse().getContentAsString();
        String second = mvc.perform(get("/api/requests?size=2&page=1&sort=owner")).andReturn().getResponse().getContentAsString();
        assertThat(JsonPath.<List<Integer>>read(first, "$.items[*].id")).containsExactly((int) full, (int) bare);
        assertThat(JsonPath.<List<Integer>>read(second, "$.items[*].id")).containsExactly((int) planet);
        assertThat(JsonPath.<Integer>read(second, "$.totalPages")).isEqualTo(2);
        refused(mvc.perform(get("/api/requests?sort=colour")), "sort");
    }

    @Test
    void programGrantMustNameAStoredTelescope() throws Exception {
        refused(mvc.perform(post("/api/programs").contentType(MediaType.APPLICATION_JSON).content("""
                {"code":"X-1","title":"t","principalInvestigator":"coordinator",
                 "grants":[{"telescopeId":987654,"hours":5,"firstNight":"2027-01-01","lastNight":"2027-01-31"}]}""")), "grants[0].telescopeId");
        refused(mvc.perform(post("/api/programs").contentType(MediaType.APPLICATION_JSON).content("""
                {"code":"X 1","title":"t","principalInvestigator":"coordinator"}""")), "code");
        refused(mvc.perform(post("/api/telescopes").contentType(MediaType.APPLICATION_JSON).content("""
                {"siteId":987654,"name":"T1","apertureMm":400,"minAltitudeDeg":15,"slewRateDegPerS":4,"settleSeconds":10}""")), "siteId");
        refused(mvc.perform(post("/api/telescopes").contentType(MediaType.APPLICATION_JSON).content("""
                {"siteId":1,"name":"T1","apertureMm":-4,"minAltitudeDeg":15,"slewRateDegPerS":4,"settleSeconds":10}""")), "apertureMm");
        mvc.perform(get("/api/telescopes/987654")).andExpect(status().isNotFound());
        // A site with a telescope on it, or a telescope a grant names, cannot be deleted.
        long siteId = ((Number) JsonPath.read(mvc.perform(get("/api/telescopes/" + telescopeId)).andReturn().getResponse().getContentAsString(), "$.siteId")).longValue();
        mvc.perform(delete("/api/sites/" + siteId)).andExpect(status().isConflict())
                .andExpect(content().contentType(MediaType.APPLICATION_PROBLEM_JSON));
        mvc.perform(delete("/api/telescopes/" + telescopeId)).andExpect(status().isConflict());
        mvc.perform(get("/api/programs?active=true")).andExpect(jsonPath("$.items[0].grants[0].hours").value(40.0));
    }

    /** Seen before: "maxAirmass":1.2 and "minAltitude":60 were dropped without a word, and the request stored. */
    @Test
    void anUnknownMemberIsRefusedNamingItAndNothingIsStored() throws Exception {
        String ok = request("\"05:35:17\"", "\"-05:23:28\"", 3);
        refused(send(ok.replace("\"priority\":3", "\"priority\":3,\"minAltitude\":60")), "minAltitude");
        refused(send(ok.replace("\"maxAirmass\":1.8", "\"maxAirmas\":1.2")), "maxAirmas");
        refused(send(ok.replace("\"count\":5", "\"count\":5,\"exposure\":300")), "exposures[1].exposure");
        send(ok.replace("\"priority\":3", "\"priority\":3,\"minAltitude\":60"))
                .andExpect(jsonPath("$.errors[0].message").value(containsString("is not a member of this body")))
                .andExpect(jsonPath("$.errors[0].message").value(containsString("minAltitudeDeg")));
        assertThat(requests.count()).isZero();
    }

    /** Seen before: priority 2.5 was stored as 2. Numbers, text and booleans are what the form declares. */
    @ParameterizedTest(name = "{0}: {1} -> {2} is refused")
    @CsvSource(delimiter = '|', textBlock = """
            priority             | "priority":3                  | "priority":2.5
            priority             | "priority":3                  | "priority":3.0
            priority             | "priority":3                  | "priority":"3"
            repeats              | "repeats":2                   | "repeats":true
            exposures[0].count   | "count":10                    | "count":1e1
            exposures[0].seconds | "seconds":60                  | "seconds":"60"
            programId            | "programId":                  | "programId":"1",
            targetName           | "targetName":"NGC 1976"       | "targetName":1976
            maxMoonIllumination  | "maxMoonIllumination":0.6     | "maxMoonIllumination":"0.6"
            darkness             | "maxMoonIllumination":0.6     | "darkness":0
            ra                   | "ra":"05:35:17"               | "ra":true
            dec                  | "dec":"-05:23:28"             | "dec":["-05:23:28"]
            priority             | "priority":3                  | "priority":3,"priority":5
            """)
    void aValueOfAnotherJsonTypeIsRefusedNamingItsField(String field, String from, String to) throws Exception {
        String ok = request("\"05:35:17\"", "\"-05:23:28\"", 3);
        String body = from.equals("\"programId\":") ? ok.replace("\"programId\":" + programId + ",", to) : ok.replace(from, to);
        assertThat(body).isNotEqualTo(ok);
        refused(send(body), field);
        assertThat(requests.count()).isZero();
    }

    /**
     * Seen before: years 0000, -1000 and +10000 were taken, and years before 1 came back from storage as other years.
     * The ends of the range are stored and read back exactly (also on PostgreSQL).
     */
    @Test
    void nightsOutside1900To2200AreRefusedAndTheEndsAreStoredExactly() throws Exception {
        String ok = request("\"05:35:17\"", "\"-05:23:28\"", 3);
        for (String night : List.of("0000-01-01", "-1000-01-01", "+10000-01-01", "1899-12-31", "2201-01-01", "2027-02-30", "20270110")) {
            refused(send(ok.replace("2027-01-10", night)), "earliestNight");
        }
        refused(send(ok.replace("\"2027-01-10\"", "20270110")), "earliestNight");
        assertThat(requests.count()).isZero();
        long id = id(create("/api/requests", ok.replace("2027-01-10", "1900-01-01").replace("2027-02-10", "2200-12-31")));
        mvc.perform(get("/api/requests/" + id))
                .andExpect(jsonPath("$.earliestNight").value("1900-01-01"))
                .andExpect(jsonPath("$.latestNight").value("2200-12-31"));
        mvc.perform(get("/api/requests?size=5"))
                .andExpect(jsonPath("$.items[0].earliestNight").value("1900-01-01"))
                .andExpect(jsonPath("$.items[0].latestNight").value("2200-12-31"));
    }

    /** Seen before: a coordinator could create a request for an owner who has no account. */
    @Test
    void anOwnerWithoutAnAccountIsRefusedNamingIt() throws Exception {
        String ok = request("\"05:35:17\"", "\"-05:23:28\"", 3);
        refused(send(ok.replace("\"owner\":\"student\"", "\"owner\":\"nobody-here\"")), "owner");
        assertThat(requests.count()).isZero();
        // The caller needs no named owner; their own name is theirs.
        mvc.perform(post("/api/requests").contentType(MediaType.APPLICATION_JSON).content(ok.replace("\"owner\":\"student\",", "")))
                .andExpect(status().isCreated()).andExpect(jsonPath("$.owner").value("coordinator"));
    }

    @Test
    void maxAirmassIsStoredWithinItsRangeAndRefusedOutsideIt() throws Exception {
        String ok = request("\"05:35:17\"", "\"-05:23:28\"", 3);
        mvc.perform(post("/api/requests").contentType(MediaType.APPLICATION_JSON).content(ok))
                .andExpect(status().isCreated()).andExpect(jsonPath("$.maxAirmass").value(1.8));
        String without = create("/api/requests", ok.replace("\"maxAirmass\":1.8,", ""));
        assertThat(JsonPath.<Object>read(without, "$.maxAirmass")).isNull();
        for (String bad : List.of("0.99", "10.01", "-1", "\"1.2\"")) {
            refused(send(ok.replace("\"maxAirmass\":1.8", "\"maxAirmass\":" + bad)), "maxAirmass");
        }
        for (String edge : List.of("1", "10")) {
            mvc.perform(post("/api/requests").contentType(MediaType.APPLICATION_JSON)
                            .content(ok.replace("\"maxAirmass\":1.8", "\"maxAirmass\":" + edge)))
                    .andExpect(status().isCreated()).andExpect(jsonPath("$.maxAirmass").value(Double.parseDouble(edge)));
        }
    }

    /**
     * What a GET answers can be sent back unchanged with PUT (and POST): its read-only members are ignored and its
     * raDeg/decDeg stand for ra/dec. A moving target's view (ra and dec read 0) too.
     */
    @Test
    void aRequestReadBackIsTakenBackUnchangedByPutAndPost() throws Exception {
        long id = id(create("/api/requests", request("\"05:35:17.3\"", "\"-05:23:28\"", 4)));
        long planet = id(create("/api/requests", """
                {"programId":%d,"owner":"student2","targetName":"Jupiter","targetKind":"planet","targetParameters":{"body":"jupiter"},
                 "exposures":[{"filter":"R","seconds":1.5,"count":40}],"priority":5}""".formatted(programId)));
        for (long each : new long[] {id, planet}) {
            String read = mvc.perform(get("/api/requests/" + each)).andReturn().getResponse().getContentAsString();
            String edited = mvc.perform(put("/api/requests/" + each).contentType(MediaType.APPLICATION_JSON).content(read))
                    .andExpect(status().isOk())
                    .andReturn().getResponse().getContentAsString();
            for (String member : List.of("programId", "owner", "targetName", "raDeg", "decDeg", "exposures", "minAltitudeDeg",
                    "darkness", "minMoonSeparationDeg", "maxMoonIllumination", "maxAirmass", "earliestNight", "latestNight",
                    "repeats", "repeatIntervalHours", "repeatToleranceHours", "priority", "state", "targetKind",
                    "targetParameters", "createdAt")) {
                assertThat((Object) JsonPath.read(edited, "$." + member)).as(each + " " + member)
                        .isEqualTo(JsonPath.read(read, "$." + member));
            }
            mvc.perform(post("/api/requests").contentType(MediaType.APPLICATION_JSON).content(read))
                    .andExpect(status().isCreated())
                    .andExpect(jsonPath("$.version").value(0))
                    .andExpect(jsonPath("$.targetName").value(JsonPath.<String>read(read, "$.targetName")));
        }
        // Sent beside ra, raDeg must agree with it.
        String read = mvc.perform(get("/api/requests/" + id)).andReturn().getResponse().getContentAsString();
        String both = read.replace("\"raDeg\":", "\"ra\":\"06:00:00\",\"raDeg\":");
        mvc.perform(put("/api/requests/" + id).contentType(MediaType.APPLICATION_JSON).content(both))
                .andExpect(status().isBadRequest()).andExpect(jsonPath("$.parameter").value("raDeg"));
    }

    private ResultActions send(String body) throws Exception {
        return mvc.perform(post("/api/requests").contentType(MediaType.APPLICATION_JSON).content(body));
    }

    private ResultActions action(long id, String name, long version) throws Exception {
        return mvc.perform(post("/api/requests/" + id + "/" + name + "?version=" + version));
    }

    private static void refused(ResultActions result, String field) throws Exception {
        result.andExpect(status().isBadRequest())
                .andExpect(content().contentType(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.parameter").value(field))
                .andExpect(jsonPath("$.errors[0].field").value(field));
    }

    private String create(String path, String body) throws Exception {
        return mvc.perform(post(path).contentType(MediaType.APPLICATION_JSON).content(body))
                .andExpect(status().isCreated())
                .andReturn().getResponse().getContentAsString();
    }

    private long id(String json) {
        return ((Number) JsonPath.read(json, "$.id")).longValue();
    }
}
