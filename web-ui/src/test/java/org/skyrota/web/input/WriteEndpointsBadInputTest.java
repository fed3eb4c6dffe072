package org.skyrota.web.input;

import static org.assertj.core.api.Assertions.assertThat;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.csrf;
import static org.springframework.security.test.web.servlet.request.SecurityMockMvcRequestPostProcessors.user;
import static org.springframework.security.test.web.servlet.setup.SecurityMockMvcConfigurers.springSecurity;
import static org.springframework.test.web.servlet.request.MockMvcRequestBuilders.post;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import com.jayway.jsonpath.JsonPath;

import java.util.Random;
import java.util.TreeMap;
import java.util.function.Supplier;
import java.util.stream.IntStream;
import java.util.stream.Stream;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DynamicTest;
import org.junit.jupiter.api.TestFactory;
import org.skyrota.web.SkyrotaApplication;
import org.springframework.boot.WebApplicationType;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.context.ConfigurableApplicationContext;
import org.springframework.http.MediaType;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.mock.web.MockHttpServletResponse;
import org.springframework.test.web.servlet.MockMvc;
import org.springframework.test.web.servlet.setup.MockMvcBuilders;
import org.springframework.web.context.WebApplicationContext;

import org.skyrota.web.system.RequestLimits;

/**
 * Generated malformed input thrown at every write endpoint that takes a JSON body: one field of a valid body
 * replaced by a hostile value (NaN and infinities, out-of-range numbers and dates, huge strings and arrays, wrong
 * types, script tags and SQL metacharacters), an unknown field added, or the JSON itself broken. Whatever comes in,
 * the server never answers 5xx; every rejection is a problem document, a 400 names the field that was changed;
 * and a rejected write leaves every table exactly as it was.
 *
 * <p>The inputs come from a seeded generator of our own (400 tries, the same on every run), so that a failure
 * names its try and can be replayed. The Spring application is started once for the class and reached through
 * MockMvc with Spring Security's filters, as a coordinator or an admin.
 */
class WriteEndpointsBadInputTest {

    static ConfigurableApplicationContext context;
    static MockMvc mvc;
    static JdbcTemplate jdbc;
    static long programId;
    static long siteId;
    static long telescopeId;
    static int serial;

    /** A write endpoint: path, who may call it, a valid body ({@code %d} made unique per try) and its field paths. */
    record Endpoint(String path, String role, String body, List<String> fields) {
        String valid() {
            return body.replace("#N", Integer.toString(++serial)).replace("#P", Long.toString(programId))
                    .replace("#S", Long.toString(siteId)).replace("#T", Long.toString(telescopeId));
        }
    }

    static List<Endpoint> endpoints() {
        return List.of(
                new Endpoint("/api/requests", "COORDINATOR", "{\"programId\":#P,\"targetName\":\"NGC 7000 #N\",\"ra\":\"20:58:47\","
                        + "\"dec\":\"+44:19:48\",\"exposures\":[{\"filter\":\"V\",\"seconds\":30,\"count\":4}],\"minAltitudeDeg\":30,"
                        + "\"darkness\":\"astronomical\",\"minMoonSeparationDeg\":20,\"maxMoonIllumination\":0.5,"
                        + "\"earliestNight\":\"2027-01-10\",\"latestNight\":\"2027-01-20\",\"repeats\":2,\"repeatIntervalHours\":24,\"repeatToleranceHours\":3,\"priority\":3}",
                        List.of("programId", "owner", "targetName", "ra", "dec", "exposures", "exposures[0].filter", "exposures[0].seconds",
                                "exposures[0].count", "minAltitudeDeg", "darkness", "minMoonSeparationDeg", "maxMoonIllumination",
                                "earliestNight", "latestNight", "repeats", "repeatIntervalHours", "repeatToleranceHours", "priority")),
                new Endpoint("/api/sites", "COORDINATOR", "{\"name\":\"Hill #N\",\"latitudeDeg\":45,\"longitudeDeg\":7,\"elevationM\":500,"
                        + "\"timeZone\":\"Europe/Rome\",\"darkSkyZenithVMag\":21.5,\"horizon\":[{\"azimuthDeg\":0,\"altitudeDeg\":5}]}",
                        List.of("name", "latitudeDeg", "longitudeDeg", "elevationM", "timeZone", "darkSkyZenithVMag", "horizon",
                                "horizon[0].azimuthDeg", "horizon[0].altitudeDeg")),
                new Endpoint("/api/telescopes", "COORDINATOR", "{\"siteId\":#S,\"name\":\"T #N\",\"apertureMm\":400,\"minAltitudeDeg\":15,"
                        + "\"slewRateDegPerS\":4,\"settleSeconds\":10,\"active\":true}",
                        List.of("siteId", "name", "apertureMm", "minAltitudeDeg", "slewRateDegPerS", "settleSeconds", "active")),
                new Endpoint("/api/instruments", "COORDINATOR", "{\"telescopeId\":#T,\"name\":\"CCD #N\",\"readoutSeconds\":5,"
                        + "\"filterChangeSeconds\":10,\"certifiedSolarFilter\":false,\"filters\":[\"B\",\"V\"]}",
                        List.of("telescopeId", "name", "readoutSeconds", "filterChangeSeconds", "certifiedSolarFilter", "filters", "filters[0]")),
                new Endpoint("/api/programs", "COORDINATOR", "{\"code\":\"P#N\",\"title\":\"Test\",\"principalInvestigator\":\"Dr. Test\","
                        + "\"active\":true,\"grants\":[{\"telescopeId\":#T,\"hours\":40,\"firstNight\":\"2027-01-01\",\"lastNight\":\"2027-01-31\"}]}",
                        List.of("code", "title", "principalInvestigator", "active", "grants", "grants[0].telescopeId", "grants[0].hours",
                                "grants[0].firstNight", "grants[0].lastNight")),
                new Endpoint("/api/accounts", "ADMIN", "{\"username\":\"user#N\",\"password\":\"password1\",\"role\":\"requester\"}",
                        List.of("username", "password", "role")));
    }

    /** One hostile change to a valid body. */
    record Mutation(String kind, String field, String value, int cut) {}

    static final int TRIES = 400;
    static final long SEED = 20261201L;
    static final Map<Integer, Integer> statuses = new TreeMap<>();

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
        programId = created("/api/programs", "{\"code\":\"BASE\",\"title\":\"Base\",\"principalInvestigator\":\"Dr. Test\",\"active\":true}");
    }

    @AfterAll
    static void stop() {
        System.out.println("bad-input statuses over " + TRIES + " tries: " + statuses);
        // The generator must reach both the refusing and the accepting paths, or the test proves little.
        assertThat(statuses.keySet()).as("statuses seen").contains(400, 201);
        if (context != null) {
            context.close();
        }
    }

    static long created(String path, String body) throws Exception {
        MockHttpServletResponse r = send(path, "ADMIN", body);
        assertThat(r.getStatus()).as(r.getContentAsString()).isEqualTo(201);
        return ((Number) JsonPath.read(r.getContentAsString(), "$.id")).longValue();
    }

    static MockHttpServletResponse send(String path, String role, String body) throws Exception {
        return mvc.perform(post(path).with(user("tester").roles(role)).with(csrf())
                .contentType(MediaType.APPLICATION_JSON).content(body)).andReturn().getResponse();
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
            "\"Robert'); DELETE FROM account;--\"");

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
        MockHttpServletResponse r = send(endpoint.path(), endpoint.role(), body);
        String answer = r.getContentAsString();
        String what = endpoint.path() + " " + mutation.kind() + " " + field + " -> " + r.getStatus() + " " + abbreviate(answer);
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
        } else {
            assertThat(r.getStatus()).as(what).isEqualTo(201);
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
