package org.skyrota.web.input;

import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.contains;
import static org.hamcrest.Matchers.containsString;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.get;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.put;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.content;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.jsonPath;
import static org.springframework.test.web.servlet.result.MockMvcResultMatchers.status;

import java.util.List;

import com.jayway.jsonpath.JsonPath;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.CsrfOnEveryRequest;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.webmvc.test.autoconfigure.AutoConfigureMockMvc;
import org.springframework.context.annotation.Import;
import org.springframework.http.MediaType;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.security.test.context.support.WithMockUser;
import org.springframework.test.context.TestPropertySource;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.ResultActions;

/**
 * Strict input across the resources that RequestApiTest and SiteApiTest do not hold: what a GET answers is taken back
 * unchanged by PUT (and by POST where nothing unique stands in the way), an unknown member is refused naming it, and
 * every night or instant, in a body or a query parameter, lies within 1900-01-01..2200-12-31 and in order, or is
 * refused naming the field.
 */
@SpringBootTest
@AutoConfigureMockMvc
@Import(CsrfOnEveryRequest.class)
@WithMockUser(username = "strictadmin", roles = "ADMIN")
// A context of its own: runs plan every stored site.
@TestPropertySource(properties = "skyrota.test.context=strict-input")
class StrictInputTest {

    @Autowired MockMvc mvc;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;

    static long siteId;
    static long telescopeId;
    static long instrumentId;
    static long programId;

    @BeforeEach
    void network() throws Exception {
        if (siteId != 0 && mvc.perform(get("/api/sites/" + siteId)).andReturn().getResponse().getStatus() == 200) {
            return;
        }
        siteId = id(created("/api/sites", """
                {"name":"Strict hill","latitudeDeg":45,"longitudeDeg":7,"elevationM":500,"timeZone":"Europe/Rome"}"""));
        telescopeId = id(created("/api/telescopes", """
                {"siteId":%d,"name":"S40","apertureMm":400,"minAltitudeDeg":15,"slewRateDegPerS":4,"settleSeconds":10,
                 "mountKind":"EQUATORIAL","needsMeridianFlip":true,"eastHourAngleLimitDeg":-90,"westHourAngleLimitDeg":90}"""
                .formatted(siteId)));
        instrumentId = id(created("/api/instruments", """
                {"telescopeId":%d,"name":"SCCD","readoutSeconds":8,"filterChangeSeconds":5,"filters":["B","V"]}"""
                .formatted(telescopeId)));
        programId = id(created("/api/programs", """
                {"code":"STRICT","title":"Strict","principalInvestigator":"Dr. Test",
                 "grants":[{"telescopeId":%d,"hours":12.5,"firstNight":"2027-01-01","lastNight":"2027-01-31"}]}"""
                .formatted(telescopeId)));
    }

    /** Telescopes, instruments and programs read back are taken back unchanged; their ids are read-only. */
    @Test
    void equipmentAndProgramsReadBackAreTakenBackUnchanged() throws Exception {
        for (String[] resource : new String[][] {
                {"/api/telescopes/" + telescopeId, "siteId,name,apertureMm,minAltitudeDeg,slewRateDegPerS,settleSeconds,active,"
                        + "mountKind,needsMeridianFlip,eastHourAngleLimitDeg,westHourAngleLimitDeg", "S40"},
                {"/api/instruments/" + instrumentId, "telescopeId,name,readoutSeconds,filterChangeSeconds,certifiedSolarFilter,"
                        + "filters", "SCCD"},
                {"/api/programs/" + programId, "code,title,principalInvestigator,active,grants", "STRICT"}}) {
            String read = mvc.perform(get(resource[0])).andExpect(status().isOk()).andReturn().getResponse().getContentAsString();
            String edited = mvc.perform(put(resource[0]).contentType(MediaType.APPLICATION_JSON).content(read))
                    .andExpect(status().isOk())
                    .andReturn().getResponse().getContentAsString();
            for (String member : resource[1].split(",")) {
                assertThat((Object) JsonPath.read(edited, "$." + member)).as(resource[0] + " " + member)
                        .isEqualTo(JsonPath.read(read, "$." + member));
            }
            // POST takes the same representation: only the name, unique, must differ.
            String collection = resource[0].substring(0, resource[0].lastIndexOf('/'));
            mvc.perform(post(collection).contentType(MediaType.APPLICATION_JSON).content(read.replace(resource[2], resource[2] + "B")))
                    .andExpect(status().isCreated());
        }
    }

    @Test
    void anAccountReadBackIsTakenBackUnchangedButNeverRenamed() throws Exception {
        if (!accounts.existsByUsername("strictstudent")) {
            accounts.save(new Account("strictstudent", encoder.encode("password1"), Role.REQUESTER));
        }
        String list = mvc.perform(get("/api/accounts")).andReturn().getResponse().getContentAsString();
        List<Object> views = JsonPath.read(list, "$[?(@.username == 'strictstudent')]");
        String view = JsonPath.parse(views.get(0)).jsonString();
        mvc.perform(put("/api/accounts/strictstudent").contentType(MediaType.APPLICATION_JSON).content(view))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.username").value("strictstudent"))
                .andExpect(jsonPath("$.role").value("requester"))
                .andExpect(jsonPath("$.enabled").value(true));
        refused(mvc.perform(put("/api/accounts/strictstudent").contentType(MediaType.APPLICATION_JSON)
                .content(view.replace("strictstudent", "someoneelse"))), "username");
        assertThat(accounts.existsByUsername("someoneelse")).isFalse();
        refused(mvc.perform(put("/api/accounts/strictstudent").contentType(MediaType.APPLICATION_JSON)
                .content("{\"enabled\":\"false\"}")), "enabled");
    }

    /** Seen before: a run asked with "secnds":600 ran for the default 30 s. A run read back can be sent again. */
    @Test
    void aRunRefusesAnUnknownMemberAndTakesItsOwnViewBack() throws Exception {
        refused(send("/api/planner/runs", "{\"firstNight\":\"2027-03-01\",\"lastNight\":\"2027-03-02\",\"secnds\":600}"), "secnds");
        refused(send("/api/planner/runs", "{\"firstNight\":\"2027-03-01\",\"lastNight\":\"2027-03-02\",\"seconds\":1.5}"), "seconds");
        String run = send("/api/planner/runs", "{\"firstNight\":\"2027-03-01\",\"lastNight\":\"2027-03-02\",\"seconds\":1}")
                .andExpect(status().isAccepted()).andReturn().getResponse().getContentAsString();
        String ended = awaitEnd(id(run));
        assertThat(JsonPath.<String>read(ended, "$.state")).isEqualTo("finished");
        String again = send("/api/planner/runs", ended).andExpect(status().isAccepted())
                .andExpect(jsonPath("$.firstNight").value("2027-03-01"))
                .andExpect(jsonPath("$.lastNight").value("2027-03-02"))
                .andExpect(jsonPath("$.seconds").value(1))
                .andReturn().getResponse().getContentAsString();
        assertThat(id(again)).isNotEqualTo(id(run));
        awaitEnd(id(again));
    }

    @Test
    void nightsOfRunsGrantsAndNightMarksLieIn1900To2200AndInOrder() throws Exception {
        for (String night : List.of("0000-01-01", "-1000-01-01", "+10000-01-01", "1899-12-31", "2201-01-01")) {
            refused(send("/api/planner/runs", "{\"firstNight\":\"" + night + "\",\"lastNight\":\"2027-03-02\",\"seconds\":1}"),
                    "firstNight");
            refused(mvc.perform(put("/api/plans/draft/nights").contentType(MediaType.APPLICATION_JSON)
                    .content("{\"telescopeId\":" + telescopeId + ",\"night\":\"" + night + "\",\"state\":\"closed\"}")), "night");
            refused(send("/api/programs", """
                    {"code":"G-%s","title":"t","principalInvestigator":"p",
                     "grants":[{"telescopeId":%d,"hours":5,"firstNight":"2027-01-01","lastNight":"%s"}]}"""
                    .formatted(night.replace("+", "").replace("-", ""), telescopeId, night)), "grants[0].lastNight");
        }
        // Out of order: both fields are named.
        send("/api/planner/runs", "{\"firstNight\":\"2027-03-02\",\"lastNight\":\"2027-03-01\",\"seconds\":1}")
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.errors[*].field").value(org.hamcrest.Matchers.hasItems("firstNight", "lastNight")));
        send("/api/programs", """
                {"code":"G-ORDER","title":"t","principalInvestigator":"p",
                 "grants":[{"telescopeId":%d,"hours":5,"firstNight":"2027-02-01","lastNight":"2027-01-01"}]}""".formatted(telescopeId))
                .andExpect(status().isBadRequest())
                .andExpect(jsonPath("$.errors[*].field").value(
                        org.hamcrest.Matchers.containsInAnyOrder("grants[0].firstNight", "grants[0].lastNight")));
        // The ends of the range are taken.
        send("/api/programs", """
                {"code":"G-ENDS","title":"t","principalInvestigator":"p",
                 "grants":[{"telescopeId":%d,"hours":5,"firstNight":"1900-01-01","lastNight":"2200-12-31"}]}""".formatted(telescopeId))
                .andExpect(status().isCreated())
                .andExpect(jsonPath("$.grants[0].firstNight").value("1900-01-01"))
                .andExpect(jsonPath("$.grants[0].lastNight").value("2200-12-31"));
    }

    @Test
    void instantsInBodiesAreIso8601TextWithinTheRange() throws Exception {
        for (String start : List.of("\"+10000-01-10T20:00:00Z\"", "\"0000-01-10T20:00:00Z\"", "\"1899-12-31T23:59:59Z\"",
                "\"2201-01-01T00:00:00Z\"", "\"2027-01-10T20:00:00\"", "\"2027-01-10\"", "1800000000")) {
            refused(send("/api/visits/1-1/move?dryRun=true", "{\"telescopeId\":" + telescopeId + ",\"start\":" + start + "}"), "start");
        }
        // In range, the body is read and the unknown visit is what is refused.
        send("/api/visits/1-1/move?dryRun=true", "{\"telescopeId\":" + telescopeId + ",\"start\":\"2027-01-10T21:00:00+01:00\"}")
                .andExpect(status().is(org.hamcrest.Matchers.oneOf(404, 409)));
        // The clock's own representation is taken back: its read-only member "settable" is ignored.
        String clock = mvc.perform(get("/api/clock")).andReturn().getResponse().getContentAsString();
        mvc.perform(put("/api/clock").contentType(MediaType.APPLICATION_JSON)
                        .content(clock.replaceFirst("\"now\":\"[^\"]+\"", "\"now\":\"2026-12-02T00:00:00Z\"")))
                .andExpect(status().isOk())
                .andExpect(jsonPath("$.now").value(containsString("2026-12-02T00:00")));
        refused(mvc.perform(put("/api/clock").contentType(MediaType.APPLICATION_JSON).content("{\"now\":\"9999-12-31T00:00:00Z\"}")),
                "now");
    }

    @Test
    void datesInQueryParametersLieInTheRangeAndInOrder() throws Exception {
        for (String path : List.of("/api/plans/draft", "/api/plans/published", "/api/plans/compare")) {
            refused(mvc.perform(get(path + "?from=0000-01-01")), "from");
            refused(mvc.perform(get(path + "?to=+10000-01-01")), "to");
            refused(mvc.perform(get(path + "?from=2027-01-10&to=2027-01-09")), "from");
            mvc.perform(get(path + "?from=2027-01-10&to=2027-01-09"))
                    .andExpect(jsonPath("$.errors[*].field").value(contains("from", "to")));
            mvc.perform(get(path + "?from=1900-01-01&to=2200-12-31")).andExpect(status().isOk());
        }
        refused(mvc.perform(get("/api/sites/" + siteId + "/almanac?date=1899-12-31")), "date");
        mvc.perform(get("/api/sites/" + siteId + "/almanac?date=1899-12-31"))
                .andExpect(jsonPath("$.errors[0].message").value(containsString("from 1900-01-01 to 2200-12-31")));
        refused(mvc.perform(get("/api/plans/published.csv?night=-1000-01-01")), "night");
    }

    private String awaitEnd(long runId) throws Exception {
        long until = System.nanoTime() + 120_000_000_000L;
        while (true) {
            String run = mvc.perform(get("/api/planner/runs/" + runId)).andReturn().getResponse().getContentAsString();
            String state = JsonPath.read(run, "$.state");
            if (!state.equals("queued") && !state.equals("running")) {
                return run;
            }
            assertThat(System.nanoTime()).as("run " + runId + " ends").isLessThan(until);
            Thread.sleep(100);
        }
    }

    private ResultActions send(String path, String body) throws Exception {
        return mvc.perform(post(path).contentType(MediaType.APPLICATION_JSON).content(body));
    }

    private String created(String path, String body) throws Exception {
        return send(path, body).andExpect(status().isCreated()).andReturn().getResponse().getContentAsString();
    }

    private static long id(String json) {
        return ((Number) JsonPath.read(json, "$.id")).longValue();
    }

    private static void refused(ResultActions result, String field) throws Exception {
        result.andExpect(status().isBadRequest())
                .andExpect(content().contentType(MediaType.APPLICATION_PROBLEM_JSON))
                .andExpect(jsonPath("$.parameter").value(field));
    }
}
