package org.skyrota.web.input;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.security.test.web.servlet.setup.SecurityMockMvcConfigurers.springSecurity;

import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import com.jayway.jsonpath.JsonPath;

import java.util.Random;
import java.util.Set;
import java.util.TreeMap;
import java.util.function.Supplier;
import java.util.stream.IntStream;
import java.util.stream.Stream;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestFactory;
import org.skyrota.web.SkyrotaApplication;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.springframework.boot.WebApplicationType;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.context.ConfigurableApplicationContext;
import org.springframework.http.HttpMethod;
import org.springframework.http.MediaType;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.web.servlet.request.MockHttpServletRequestBuilder;
import org.springframework.test.web.servlet.request.MockMvcRequestBuilders;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.mock.web.MockHttpServletResponse;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.setup.MockMvcBuilders;
import org.springframework.web.context.WebApplicationContext;

import org.skyrota.web.system.RequestLimits;
import org.skyrota.web.system.ServerClock;

/**
 * Generated malformed input thrown at every write endpoint that takes a JSON body (POST, PUT; the server maps no
 * PATCH, and its DELETEs take none): one field of a valid body replaced by a hostile value (NaN and infinities,
 * out-of-range numbers and dates, huge strings and arrays, wrong types, script tags and SQL metacharacters), an
 * unknown field added, or the JSON itself broken. Whatever comes in, the server never answers 5xx; every rejection
 * is a problem document, a 400 names the field that was changed; and a rejected write leaves every table exactly as
 * it was.
 *
 * <p>The inputs come from a seeded generator of our own (the same tries on every run), so that a failure names its
 * try and can be replayed. The Spring application is started once for the class and reached through MockMvc with
 * Spring Security's filters, as a coordinator, an admin, a requester changing their own password, or a telescope
 * with a {@code reports} token. A planner run and a published plan are made first, so that observation reports and
 * overrides have a visit to be about. Writes that pass are allowed to succeed (each endpoint lists the statuses it
 * may answer then: created, changed, or a conflict that comes after the body was found valid, such as a stale
 * version); their effects are undone where a later try would otherwise be refused for another reason.
 */
class WriteEndpointsBadInputTest {

    static ConfigurableApplicationContext context;
    static MockMvc mvc;
    static JdbcTemplate jdbc;
    static long programId;
    static long siteId;
    static long telescopeId;
    static int serial;

    static long instrumentId;
    static long putSiteId;
    static long putTelescopeId;
    static long putInstrumentId;
    static long putProgramId;
    static long draftRequestId;
    static String visitId;
    /** A published visit still ahead of the server's clock when the endpoints are tried: overrides change only those. */
    static String aheadVisitId;
    /** The published start of {@link #visitId}: a report's valid observedAt (not before its night, not in the future). */
    static String visitStart;
    static String reportsToken;

    /**
     * A write endpoint: method, path, who calls it, a valid body, its field paths, and the statuses a valid or
     * accepted body may get. Placeholders: #N unique per try, #P program, #S site, #T telescope, #I instrument (#P2,
     * #S2, #T2, #I2: others of each, only ever changed by the PUTs, so that one PUT's change cannot make another
     * endpoint's refusal name a different field), #R a draft request, #X a published visit that has happened, #Y one still ahead, #V the resource's
     * current version (read just before the try), #O the published start of #X.
     */
    record Endpoint(String method, String path, String role, String body, List<String> fields, Set<Integer> passes) {
        Endpoint(String path, String role, String body, List<String> fields) {
            this("POST", path, role, body, fields, Set.of(201));
        }

        String target() {
            return fill(path);
        }

        String valid() throws Exception {
            String b = fill(body.replace("#N", Integer.toString(++serial)));
            return b.contains("#V") ? b.replace("#V", Long.toString(currentVersion(target()))) : b;
        }

        static String fill(String text) {
            return text.replace("#P2", Long.toString(putProgramId)).replace("#S2", Long.toString(putSiteId))
                    .replace("#T2", Long.toString(putTelescopeId)).replace("#I2", Long.toString(putInstrumentId))
                    .replace("#P", Long.toString(programId)).replace("#S", Long.toString(siteId))
                    .replace("#T", Long.toString(telescopeId)).replace("#I", Long.toString(instrumentId))
                    .replace("#R", Long.toString(draftRequestId)).replace("#X", visitId).replace("#O", visitStart)
                    .replace("#Y", aheadVisitId);
        }

        @Override
        public String toString() {
            return method + " " + path;
        }
    }

    static final String REQUEST_BODY = "{\"programId\":#P,\"targetName\":\"NGC 7000 #N\",\"ra\":\"20:58:47\","
            + "\"dec\":\"+44:19:48\",\"exposures\":[{\"filter\":\"V\",\"seconds\":30,\"count\":4}],\"minAltitudeDeg\":30,"
            + "\"darkness\":\"astronomical\",\"minMoonSeparationDeg\":20,\"maxMoonIllumination\":0.5,\"maxAirmass\":1.5,"
            + "\"earliestNight\":\"2027-01-10\",\"latestNight\":\"2027-01-20\",\"repeats\":2,\"repeatIntervalHours\":24,"
            + "\"repeatToleranceHours\":3,\"priority\":3}";
    static final List<String> REQUEST_FIELDS = List.of("programId", "owner", "targetName", "ra", "dec", "exposures",
            "exposures[0].filter", "exposures[0].seconds", "exposures[0].count", "minAltitudeDeg", "darkness",
            "minMoonSeparationDeg", "maxMoonIllumination", "maxAirmass", "earliestNight", "latestNight", "repeats", "repeatIntervalHours",
            "repeatToleranceHours", "priority");
    static final String SITE_BODY = "{\"name\":\"Hill #N\",\"latitudeDeg\":45,\"longitudeDeg\":7,\"elevationM\":500,"
            + "\"timeZone\":\"Europe/Rome\",\"darkSkyZenithVMag\":21.5,\"horizon\":[{\"azimuthDeg\":0,\"altitudeDeg\":5}]}";
    static final List<String> SITE_FIELDS = List.of("name", "latitudeDeg", "longitudeDeg", "elevationM", "timeZone",
            "darkSkyZenithVMag", "horizon", "horizon[0].azimuthDeg", "horizon[0].altitudeDeg");
    static final String TELESCOPE_BODY = "{\"siteId\":#S,\"name\":\"T #N\",\"apertureMm\":400,\"minAltitudeDeg\":15,"
            + "\"slewRateDegPerS\":4,\"settleSeconds\":10,\"active\":true,\"mountKind\":\"EQUATORIAL\",\"needsMeridianFlip\":true,"
            + "\"eastHourAngleLimitDeg\":-90,\"westHourAngleLimitDeg\":90}";
    static final List<String> TELESCOPE_FIELDS = List.of("siteId", "name", "apertureMm", "minAltitudeDeg", "slewRateDegPerS",
            "settleSeconds", "active", "mountKind", "needsMeridianFlip", "eastHourAngleLimitDeg", "westHourAngleLimitDeg");
    static final String INSTRUMENT_BODY = "{\"telescopeId\":#T,\"name\":\"CCD #N\",\"readoutSeconds\":5,"
            + "\"filterChangeSeconds\":10,\"certifiedSolarFilter\":false,\"filters\":[\"B\",\"V\"]}";
    static final List<String> INSTRUMENT_FIELDS = List.of("telescopeId", "name", "readoutSeconds", "filterChangeSeconds",
            "certifiedSolarFilter", "filters", "filters[0]");
    static final String PROGRAM_BODY = "{\"code\":\"P#N\",\"title\":\"Test\",\"principalInvestigator\":\"Dr. Test\","
            + "\"active\":true,\"grants\":[{\"telescopeId\":#T,\"hours\":40,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}]}";
    static final List<String> PROGRAM_FIELDS = List.of("code", "title", "principalInvestigator", "active", "grants",
            "grants[0].telescopeId", "grants[0].hours", "grants[0].firstNight", "grants[0].lastNight");

    /** A PUT body: the POST body with the version read just before. */
    static String versioned(String body) {
        return "{\"version\":#V," + body.substring(1);
    }

    static List<String> versioned(List<String> fields) {
        List<String> out = new java.util.ArrayList<>(fields);
        out.add("version");
        return out;
    }

    static List<Endpoint> endpoints() {
        Set<Integer> changed = Set.of(200);
        return List.of(
                new Endpoint("/api/requests", "COORDINATOR", REQUEST_BODY, REQUEST_FIELDS),
                new Endpoint("PUT", "/api/requests/#R", "COORDINATOR", versioned(REQUEST_BODY), versioned(REQUEST_FIELDS), changed),
                new Endpoint("POST", "/api/requests/#R/reject?version=999", "COORDINATOR", "{\"reason\":\"too faint #N\"}",
                        List.of("reason"), Set.of(409)),
                new Endpoint("/api/sites", "COORDINATOR", SITE_BODY, SITE_FIELDS),
                new Endpoint("PUT", "/api/sites/#S2", "COORDINATOR", versioned(SITE_BODY), versioned(SITE_FIELDS), changed),
                new Endpoint("/api/telescopes", "COORDINATOR", TELESCOPE_BODY, TELESCOPE_FIELDS),
                new Endpoint("PUT", "/api/telescopes/#T2", "COORDINATOR", versioned(TELESCOPE_BODY), versioned(TELESCOPE_FIELDS), changed),
                new Endpoint("/api/instruments", "COORDINATOR", INSTRUMENT_BODY, INSTRUMENT_FIELDS),
                new Endpoint("PUT", "/api/instruments/#I2", "COORDINATOR", versioned(INSTRUMENT_BODY), versioned(INSTRUMENT_FIELDS), changed),
                new Endpoint("/api/programs", "COORDINATOR", PROGRAM_BODY, PROGRAM_FIELDS),
                new Endpoint("PUT", "/api/programs/#P2", "COORDINATOR", versioned(PROGRAM_BODY), versioned(PROGRAM_FIELDS), changed),
                new Endpoint("/api/accounts", "ADMIN", "{\"username\":\"user#N\",\"password\":\"password1\",\"role\":\"requester\"}",
                        List.of("username", "password", "role")),
                new Endpoint("PUT", "/api/accounts/someone", "ADMIN", "{\"role\":\"requester\",\"enabled\":true,\"password\":\"password1\"}",
                        List.of("role", "enabled", "password"), changed),
                new Endpoint("PUT", "/api/accounts/me/password", "SELF", "{\"currentPassword\":\"password1\",\"newPassword\":\"password1\"}",
                        List.of("currentPassword", "newPassword"), Set.of(204)),
                new Endpoint("/api/tokens", "ADMIN", "{\"name\":\"dome #N\",\"telescopeId\":#T,\"scope\":\"read\"}",
                        List.of("name", "telescopeId", "scope")),
                new Endpoint("POST", "/api/reports", "REPORTS", "{\"visitId\":\"#X\",\"outcome\":\"partial\",\"reason\":\"clouds #N\","
                        + "\"observedAt\":\"#O\"}", List.of("visitId", "outcome", "reason", "observedAt"), Set.of(201)),
                new Endpoint("POST", "/api/planner/runs", "COORDINATOR", "{\"firstNight\":\"2027-02-01\",\"lastNight\":\"2027-02-02\","
                        + "\"siteIds\":[#S],\"seconds\":1,\"weights\":{}}", List.of("firstNight", "lastNight", "siteIds", "siteIds[0]",
                        "seconds", "weights"), Set.of(202, 409)),
                new Endpoint("PUT", "/api/plans/draft/nights", "COORDINATOR", "{\"telescopeId\":#T,\"night\":\"2027-01-10\","
                        + "\"state\":\"locked\",\"reason\":\"dome repair #N\"}", List.of("telescopeId", "siteId", "night", "state", "reason"),
                        changed),
                new Endpoint("POST", "/api/visits/#Y/move?dryRun=true", "COORDINATOR", "{\"telescopeId\":#T,\"start\":\"2027-01-20T20:00:00Z\"}",
                        List.of("telescopeId", "start"), changed),
                new Endpoint("POST", "/api/visits/#Y/pin?dryRun=true", "COORDINATOR", "{\"telescopeId\":#T,\"start\":\"2027-01-20T20:00:00Z\"}",
                        List.of("telescopeId", "start"), changed));
    }

    /** One hostile change to a valid body. */
    record Mutation(String kind, String field, String value, int cut) {}

    static final int TRIES = 600;
    static final long SEED = 20261201L;
    static final Map<Integer, Integer> statuses = new TreeMap<>();
    static final Map<String, Integer> passed = new TreeMap<>();

    @BeforeAll
    static void start() throws Exception {
        context = new SpringApplicationBuilder(SkyrotaApplication.class).web(WebApplicationType.SERVLET)
                .properties("server.port=0", "spring.main.banner-mode=off", "logging.level.root=WARN").run();
        mvc = MockMvcBuilders.webAppContextSetup((WebApplicationContext) context)
                .addFilters(context.getBean(RequestLimits.class)).apply(springSecurity()).build();
        jdbc = context.getBean(JdbcTemplate.class);
        siteId = created("/api/sites", "{\"name\":\"Base hill\",\"latitudeDeg\":45,\"longitudeDeg\":7,\"elevationM\":500}");
        telescopeId = created("/api/telescopes", "{\"siteId\":" + siteId + ",\"name\":\"Base T\",\"apertureMm\":400,"
                + "\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10,\"active\":true}");
        instrumentId = created("/api/instruments", "{\"telescopeId\":" + telescopeId + ",\"name\":\"Base CCD\",\"readoutSeconds\":5,"
                + "\"filterChangeSeconds\":10,\"certifiedSolarFilter\":false,\"filters\":[\"B\",\"V\"]}");
        programId = created("/api/programs", "{\"code\":\"BASE\",\"title\":\"Base\",\"principalInvestigator\":\"Dr. Test\",\"active\":true,"
                + "\"grants\":[{\"telescopeId\":" + telescopeId + ",\"hours\":40,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}]}");
        putSiteId = created("/api/sites", "{\"name\":\"Edited hill\",\"latitudeDeg\":40,\"longitudeDeg\":8,\"elevationM\":300}");
        putTelescopeId = created("/api/telescopes", "{\"siteId\":" + putSiteId + ",\"name\":\"Edited T\",\"apertureMm\":300,"
                + "\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10,\"active\":true}");
        putInstrumentId = created("/api/instruments", "{\"telescopeId\":" + putTelescopeId + ",\"name\":\"Edited CCD\",\"readoutSeconds\":5,"
                + "\"filterChangeSeconds\":10,\"certifiedSolarFilter\":false,\"filters\":[\"V\"]}");
        putProgramId = created("/api/programs", "{\"code\":\"EDITED\",\"title\":\"Edited\",\"principalInvestigator\":\"Dr. Test\",\"active\":true}");
        draftRequestId = created("/api/requests", "{\"programId\":" + programId + ",\"targetName\":\"NGC 7000\",\"ra\":314.7,"
                + "\"dec\":44.3,\"exposures\":[{\"filter\":\"V\",\"seconds\":30,\"count\":2}],\"earliestNight\":\"2027-01-10\","
                + "\"latestNight\":\"2027-01-20\",\"priority\":3}");
        AccountRepository accounts = context.getBean(AccountRepository.class);
        PasswordEncoder encoder = context.getBean(PasswordEncoder.class);
        accounts.save(new Account("someone", encoder.encode("password1"), Role.REQUESTER));
        accounts.save(new Account(SELF, encoder.encode("password1"), Role.REQUESTER));
        long visitTelescope = publishedVisit();
        // A report is about a visit that has happened: the server's clock is moved past the published nights.
        context.getBean(ServerClock.class).set(Instant.parse("2027-01-12T12:00:00Z"));
        MockHttpServletResponse token = send("POST", "/api/tokens", "ADMIN", "{\"name\":\"dome\",\"telescopeId\":" + visitTelescope
                + ",\"scope\":\"reports\"}");
        assertThat(token.getStatus()).as(token.getContentAsString()).isEqualTo(201);
        reportsToken = JsonPath.read(token.getContentAsString(), "$.token");
        // Every valid body must pass as it is, or the tries at that endpoint would only ever see refusals.
        for (Endpoint e : endpoints()) {
            MockHttpServletResponse r = send(e.method(), e.target(), e.role(), e.valid());
            assertThat(e.passes()).as(e + " with its valid body: " + r.getStatus() + " " + r.getContentAsString()).contains(r.getStatus());
            afterPass(e, r);
        }
    }

    static final String SELF = "pwuser";

    /**
     * An accepted request (a target up on January evenings at 45° N; approximate coordinates from memory) planned by a
     * one-second run, and the draft published: one of its placed visits becomes {@link #visitId}; answers its telescope.
     */
    static long publishedVisit() throws Exception {
        long id = created("/api/requests", "{\"programId\":" + programId + ",\"targetName\":\"NGC 1952\",\"ra\":83.6,\"dec\":22.0,"
                + "\"exposures\":[{\"filter\":\"V\",\"seconds\":60,\"count\":5}],\"earliestNight\":\"2027-01-10\","
                + "\"latestNight\":\"2027-01-11\",\"priority\":2}");
        assertThat(send("POST", "/api/requests/" + id + "/submit?version=0", "COORDINATOR", "").getStatus()).isEqualTo(200);
        assertThat(send("POST", "/api/requests/" + id + "/accept?version=1", "COORDINATOR", "").getStatus()).isEqualTo(200);
        // A second one on later nights, still ahead when the clock has moved past the first one's visit.
        long later = created("/api/requests", "{\"programId\":" + programId + ",\"targetName\":\"NGC 2168\",\"ra\":92.2,"
                + "\"dec\":24.3,\"exposures\":[{\"filter\":\"V\",\"seconds\":60,\"count\":5}],\"earliestNight\":\"2027-01-20\","
                + "\"latestNight\":\"2027-01-21\",\"priority\":2}");
        assertThat(send("POST", "/api/requests/" + later + "/submit?version=0", "COORDINATOR", "").getStatus()).isEqualTo(200);
        assertThat(send("POST", "/api/requests/" + later + "/accept?version=1", "COORDINATOR", "").getStatus()).isEqualTo(200);
        MockHttpServletResponse run = send("POST", "/api/planner/runs", "COORDINATOR",
                "{\"firstNight\":\"2027-01-10\",\"lastNight\":\"2027-01-21\",\"seconds\":1}");
        assertThat(run.getStatus()).as(run.getContentAsString()).isEqualTo(202);
        long runId = ((Number) JsonPath.read(run.getContentAsString(), "$.id")).longValue();
        assertThat(awaitEnd(runId)).isEqualTo("finished");
        String draft = get("/api/plans/draft").getContentAsString();
        long revision = ((Number) JsonPath.read(draft, "$.revision")).longValue();
        MockHttpServletResponse published = send("POST", "/api/plans/draft/publish?revision=" + revision, "COORDINATOR", "");
        assertThat(published.getStatus()).as(published.getContentAsString()).isEqualTo(200);
        List<String> visits = JsonPath.read(published.getContentAsString(), "$.plan.visits[*].id");
        assertThat(visits).isNotEmpty();
        visitId = visits.get(0);
        List<String> ahead = JsonPath.read(published.getContentAsString(), "$.plan.visits[?(@.requestId == " + later + ")].id");
        assertThat(ahead).as("the later request's visit").isNotEmpty();
        aheadVisitId = ahead.get(0);
        visitStart = JsonPath.read(published.getContentAsString(), "$.plan.visits[0].start");
        return ((Number) JsonPath.read(published.getContentAsString(), "$.plan.visits[0].telescopeId")).longValue();
    }

    /** Waits for a planner run to end and answers its state. */
    static String awaitEnd(long runId) throws Exception {
        long deadline = System.nanoTime() + 120_000_000_000L;
        while (System.nanoTime() < deadline) {
            String state = JsonPath.read(get("/api/planner/runs/" + runId).getContentAsString(), "$.state");
            if (!state.equals("queued") && !state.equals("running")) {
                return state;
            }
            Thread.sleep(100);
        }
        throw new AssertionError("planner run " + runId + " did not end");
    }

    /** Undoes what an accepted try did where a later try would otherwise be refused for another reason than its own. */
    static void afterPass(Endpoint endpoint, MockHttpServletResponse r) throws Exception {
        if (endpoint.path().equals("/api/accounts/me/password")) {
            AccountRepository accounts = context.getBean(AccountRepository.class);
            Account self = accounts.findByUsername(SELF).orElseThrow();
            self.setPasswordHash(context.getBean(PasswordEncoder.class).encode("password1"));
            accounts.save(self);
        } else if (endpoint.path().equals("/api/planner/runs") && r.getStatus() == 202) {
            // A run writes in the background; the next try may compare row counts only once it is over.
            long runId = ((Number) JsonPath.read(r.getContentAsString(), "$.id")).longValue();
            send("DELETE", "/api/planner/runs/" + runId, "COORDINATOR", null);
            awaitEnd(runId);
            Map<String, Long> counts = rowCounts();
            for (Map<String, Long> again = null; !counts.equals(again); counts = again == null ? counts : again) {
                Thread.sleep(300);
                again = rowCounts();
                if (again.equals(counts)) {
                    break;
                }
            }
        }
    }

    @AfterAll
    static void stop() {
        System.out.println("bad-input statuses over " + TRIES + " tries: " + statuses + "; passed per endpoint: " + passed);
        // The generator must reach both the refusing and the accepting paths, or the test proves little.
        assertThat(statuses.keySet()).as("statuses seen").contains(400, 201);
        if (context != null) {
            context.close();
        }
    }

    static long created(String path, String body) throws Exception {
        MockHttpServletResponse r = send("POST", path, "ADMIN", body);
        assertThat(r.getStatus()).as(r.getContentAsString()).isEqualTo(201);
        return ((Number) JsonPath.read(r.getContentAsString(), "$.id")).longValue();
    }

    static MockHttpServletResponse get(String path) throws Exception {
        return mvc.perform(MockMvcRequestBuilders.get(path).with(user("tester").roles("ADMIN"))).andReturn().getResponse();
    }

    static long currentVersion(String path) throws Exception {
        MockHttpServletResponse r = get(path);
        assertThat(r.getStatus()).as(path + " " + r.getContentAsString()).isEqualTo(200);
        return ((Number) JsonPath.read(r.getContentAsString(), "$.version")).longValue();
    }

    static MockHttpServletResponse send(String method, String path, String role, String body) throws Exception {
        MockHttpServletRequestBuilder b = MockMvcRequestBuilders.request(HttpMethod.valueOf(method), path);
        switch (role) {
            case "REPORTS" -> b.header("Authorization", "Bearer " + reportsToken);
            case "SELF" -> b.with(user(SELF).roles("REQUESTER")).with(csrf());
            default -> b.with(user("tester").roles(role)).with(csrf());
        }
        if (body != null) {
            b.contentType(MediaType.APPLICATION_JSON).content(body);
        }
        return mvc.perform(b).andReturn().getResponse();
    }

    /** One hostile JSON value, drawn from the kinds listed in the class description. */
    static String hostile(Random random) {
        List<Supplier<String>> kinds = List.of(
                () -> FIXED_HOSTILE.get(random.nextInt(FIXED_HOSTILE.size())),
                () -> {
                    double[] special = {Double.MAX_VALUE, -Double.MIN_VALUE, Double.NaN, Double.POSITIVE_INFINITY};
                    double d = random.nextInt(4) == 0 ? special[random.nextInt(special.length)]
                            : (random.nextDouble() - 0.5) * Math.pow(10, random.nextInt(12));
                    return Double.isFinite(d) ? Double.toString(d) : "\"" + d + "\"";
                },
                () -> "\"" + "x".repeat(1 + random.nextInt(200_000)) + "\"",
                () -> "[" + "1,".repeat(1 + random.nextInt(30_000)) + "1]",
                () -> "[" + "{\"filter\":\"V\",\"seconds\":1,\"count\":1},".repeat(1 + random.nextInt(3_000)) + "{}]",
                () -> {
                    int n = 400 + random.nextInt(4_600);
                    return "[".repeat(n) + "]".repeat(n);
                },
                () -> jsonString(randomText(random, random.nextInt(301))));
        // The fixed list of known troublemakers is drawn as often as all the generated kinds together.
        int pick = random.nextInt(2 * (kinds.size() - 1));
        return kinds.get(pick < kinds.size() - 1 ? 0 : 1 + pick - (kinds.size() - 1)).get();
    }

    static final List<String> FIXED_HOSTILE = List.of("NaN", "Infinity", "-Infinity", "\"NaN\"", "\"Infinity\"", "1e309",
            "-1e309", "4.9e-325", "123456789012345678901234567890", "-1", "0", "361", "-91", "1000", "1e6", "0.5", "true",
            "null", "{}", "[]", "[null]", "[{}]", "\"\"", "\" \"", "\"\\u0000\"", "\"99999-01-01\"", "\"+999999999-12-31\"",
            "\"-999999999-01-01\"", "\"2027-13-45\"", "\"2027-02-30\"", "\"0000-00-00\"", "\"1800-01-01\"", "\"2200-12-31\"",
            "\"27-01-10\"", "\"<script>alert(1)</script>\"", "\"<img src=x onerror=alert(1)>\"",
            "\"'; drop table site; --\"", "\"\\\" or 1=1 --\"", "\"%s%n%x\"", "\"../../etc/passwd\"",
            "\"Robert'); DELETE FROM account;--\"",
            // 40 characters, 80 bytes in UTF-8: within a length limit counted in characters, past one counted in bytes.
            "\"" + "\u00e9".repeat(40) + "\"", "\"" + "\ud83d\ude00".repeat(20) + "\"");

    /** Any UTF-16 code units, control characters and lone surrogates included. */
    static String randomText(Random random, int length) {
        StringBuilder b = new StringBuilder(length);
        for (int i = 0; i < length; i++) {
            b.append((char) (random.nextInt(4) == 0 ? random.nextInt(0x80) : random.nextInt(0x10000)));
        }
        return b.toString();
    }

    /** A hostile change of one of three kinds, in the proportions 7 (replace a field), 1 (add one), 2 (break the JSON). */
    static Mutation mutation(Random random) {
        int kind = random.nextInt(10);
        if (kind < 7) {
            return new Mutation("replace", null, hostile(random), random.nextInt(101));
        }
        if (kind < 8) {
            return new Mutation("unknown", null, hostile(random), 0);
        }
        return new Mutation("broken", null, null, random.nextInt(10_001));
    }

    /** Seen while adding planner runs to the tries: a run over an unknown site was queued (and planned nothing there). */
    @Test
    void aRunOverASiteThatIsNotStoredIsRefusedNamingIt() throws Exception {
        for (String sites : List.of("[999999]", "[null]", "[#S,999999]")) {
            Map<String, Long> before = rowCounts();
            MockHttpServletResponse r = send("POST", "/api/planner/runs", "COORDINATOR", Endpoint.fill("{\"firstNight\":\"2027-02-01\","
                    + "\"lastNight\":\"2027-02-02\",\"siteIds\":" + sites + ",\"seconds\":1}"));
            assertThat(r.getStatus()).as(sites + " " + r.getContentAsString()).isEqualTo(400);
            assertThat(r.getContentType()).startsWith("application/problem+json");
            String expected = sites.startsWith("[#S") ? "siteIds[1]" : "siteIds[0]";
            assertThat((String) JsonPath.read(r.getContentAsString(), "$.parameter")).isEqualTo(expected);
            assertThat(rowCounts()).isEqualTo(before);
        }
    }

    /**
     * Seen while writing these tries: bcrypt (Spring Security's encoder) refuses to hash more than 72 bytes, so a
     * password of 40 accented letters (80 bytes in UTF-8, RFC 3629: two bytes each) passed the length check and ended
     * in a 500.
     */
    @Test
    void aPasswordOfMoreThan72BytesIsRefusedNamingIt() throws Exception {
        String accented = "\u00e9".repeat(40);
        List<String[]> calls = List.of(
                new String[] {"POST", "/api/accounts", "ADMIN", "{\"username\":\"wide\",\"password\":\"" + accented + "\",\"role\":\"requester\"}", "password"},
                new String[] {"PUT", "/api/accounts/someone", "ADMIN", "{\"password\":\"" + accented + "\"}", "password"},
                new String[] {"PUT", "/api/accounts/me/password", "SELF", "{\"currentPassword\":\"password1\",\"newPassword\":\"" + accented + "\"}",
                        "newPassword"});
        for (String[] c : calls) {
            Map<String, Long> before = rowCounts();
            MockHttpServletResponse r = send(c[0], c[1], c[2], c[3]);
            assertThat(r.getStatus()).as(c[1] + " " + r.getContentAsString()).isEqualTo(400);
            assertThat((String) JsonPath.read(r.getContentAsString(), "$.parameter")).isEqualTo(c[4]);
            assertThat(rowCounts()).isEqualTo(before);
        }
    }

    @TestFactory
    Stream<DynamicTest> hostileBodies() {
        Random random = new Random(SEED);
        List<Endpoint> all = endpoints();
        return IntStream.range(0, TRIES).mapToObj(i -> {
            Endpoint endpoint = all.get(random.nextInt(all.size()));
            Mutation mutation = mutation(random);
            return DynamicTest.dynamicTest("try " + i + ": " + endpoint.path() + " " + mutation.kind(),
                    () -> hostileBodiesAreRefusedCleanlyAndLeaveNothingBehind(endpoint, mutation));
        });
    }

    static void hostileBodiesAreRefusedCleanlyAndLeaveNothingBehind(Endpoint endpoint, Mutation mutation) throws Exception {
        String valid = endpoint.valid();
        String field = endpoint.fields().get(mutation.cut() % endpoint.fields().size());
        String body = switch (mutation.kind()) {
            case "replace" -> replace(valid, field, mutation.value());
            case "unknown" -> valid.substring(0, valid.length() - 1) + ",\"surplus\":" + mutation.value() + "}";
            default -> breakJson(valid, mutation.cut());
        };
        Map<String, Long> before = rowCounts();
        MockHttpServletResponse r = send(endpoint.method(), endpoint.target(), endpoint.role(), body);
        String answer = r.getContentAsString();
        String what = endpoint + " " + mutation.kind() + " " + field + " -> " + r.getStatus() + " " + abbreviate(answer);
        statuses.merge(r.getStatus(), 1, Integer::sum);
        assertThat(r.getStatus()).as(what).isLessThan(500);
        if (r.getStatus() >= 400) {
            assertThat(r.getContentType()).as(what).startsWith("application/problem+json");
            assertThat(((Number) JsonPath.read(answer, "$.status")).intValue()).as(what).isEqualTo(r.getStatus());
            assertThat(rowCounts()).as("no row of a refused write is stored: " + what).isEqualTo(before);
            if (r.getStatus() == 400 && mutation.kind().equals("replace")) {
                List<String> named = JsonPath.read(answer, "$.errors[*].field");
                String top = field.replaceAll("[.\\[].*", "");
                assertThat(named).as(what).anySatisfy(n -> assertThat(n).startsWith(top));
            }
        }
        if (mutation.kind().equals("unknown")) {
            // A member the body does not have is never dropped without a word: it is refused, named. Only a value
            // nested deeper than the JSON parser reads (its limit, 500 levels) ends the body before the member's name
            // counts: that body is refused as unreadable JSON, naming nothing.
            assertThat(r.getStatus()).as(what).isEqualTo(400);
            if (!mutation.value().startsWith("[".repeat(400))) {
                assertThat(JsonPath.<List<String>>read(answer, "$.errors[*].field"))
                        .as(what + " value " + abbreviate(mutation.value())).containsExactly("surplus");
            }
        } else if (r.getStatus() < 400) {
            assertThat(endpoint.passes()).as(what).contains(r.getStatus());
            passed.merge(endpoint.toString(), 1, Integer::sum);
            afterPass(endpoint, r);
        }
    }

    /** Rows in every table of the schema, so that any half-stored write shows. */
    static Map<String, Long> rowCounts() {
        Map<String, Long> out = new LinkedHashMap<>();
        for (String table : jdbc.queryForList("select table_name from information_schema.tables where table_schema = 'PUBLIC' "
                + "order by table_name", String.class)) {
            out.put(table, jdbc.queryForObject("select count(*) from \"" + table + "\"", Long.class));
        }
        return out;
    }

    /** The body with the value at {@code path} (a key, or key[0].key, or key[0]) replaced by raw JSON {@code value}. */
    static String replace(String json, String path, String value) {
        String marker = "\u0001MARK\u0001";
        String top = path.replaceAll("[.\\[].*", "");
        String withMarker;
        try {
            withMarker = JsonPath.parse(json).set("$." + path, marker).jsonString();
        } catch (com.jayway.jsonpath.PathNotFoundException e) {
            withMarker = json;
        }
        if (!withMarker.contains(marker)) {
            // the field is optional and absent from the valid body: add it
            withMarker = JsonPath.parse(json).put("$", top, marker).jsonString();
        }
        return withMarker.replace("\"" + marker + "\"", value);
    }

    static String breakJson(String json, int at) {
        int cut = at % (json.length() + 3);
        return switch (at % 5) {
            case 0 -> json.substring(0, Math.min(cut, json.length() - 1));
            case 1 -> json.substring(0, Math.min(cut, json.length())) + "\u0000}" + json.substring(Math.min(cut, json.length()));
            case 2 -> json.replace(":", "=");
            case 3 -> "[" + json + "]";
            default -> json.replaceFirst("\"", "'");
        };
    }

    static String jsonString(String s) {
        StringBuilder b = new StringBuilder("\"");
        for (char c : s.toCharArray()) {
            if (c == '"' || c == '\\') {
                b.append('\\').append(c);
            } else if (c < 0x20 || Character.isSurrogate(c)) {
                b.append(String.format("\\u%04x", (int) c));
            } else {
                b.append(c);
            }
        }
        return b.append('"').toString();
    }

    static String abbreviate(String s) {
        return s.length() > 300 ? s.substring(0, 300) + "…" : s;
    }
}
