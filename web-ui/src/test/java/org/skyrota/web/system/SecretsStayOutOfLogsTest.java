package org.skyrota.web.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.CookieManager;
import java.net.HttpCookie;
import java.net.URI;
import java.net.URLEncoder;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.SecureRandom;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.extension.ExtendWith;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.report.TokenText;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.system.CapturedOutput;
import org.springframework.boot.test.system.OutputCaptureExtension;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * Passwords and tokens never reach the log or a response that should not carry them. The server runs on a real port
 * with what an operator turns on to chase a problem: DEBUG for Spring MVC, Spring Security and Skyrota, and Tomcat's
 * access log. The test signs in with wrong and right passwords (HTTP Basic and the browser form), creates and changes
 * accounts with passwords, creates, uses and revokes API tokens, makes and uses feed tokens (in the query string, as
 * feed readers send them), trips the sign-in throttle, and then searches the console output and the access log for
 * every password, every token and every stored hash of them. The account list, the token list and the audit records
 * of account and token changes are searched the same way.
 *
 * <p>Found by this test and fixed: at DEBUG, Spring MVC logged the request and response bodies it converted, and the
 * records holding passwords and new tokens printed them in {@code toString()}; the DispatcherServlet and Spring
 * Security logged the query string with the feed token; the access log's request line carried it too.
 */
@ExtendWith(OutputCaptureExtension.class)
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT, properties = {
        "skyrota.test.context=secrets-stay-out",
        "logging.level.org.springframework.web=DEBUG",
        "logging.level.org.springframework.security=DEBUG",
        "logging.level.org.skyrota=DEBUG",
        "server.tomcat.accesslog.enabled=true",
        "server.tomcat.accesslog.buffered=false",
        "server.tomcat.accesslog.prefix=access",
        "server.tomcat.accesslog.suffix=.log"})
class SecretsStayOutOfLogsTest {

    static final SecureRandom RANDOM = new SecureRandom();
    static final Path ACCESS_LOGS;

    static {
        try {
            ACCESS_LOGS = Files.createTempDirectory("skyrota-access-log");
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Random enough never to turn up in a log by chance. */
    static String secret(String prefix) {
        byte[] b = new byte[9];
        RANDOM.nextBytes(b);
        return prefix + HexFormat.of().formatHex(b);
    }

    static final String ADMIN_PASSWORD = secret("Adm-");

    @DynamicPropertySource
    static void properties(DynamicPropertyRegistry registry) {
        registry.add("skyrota.admin-password", () -> ADMIN_PASSWORD);
        registry.add("server.tomcat.accesslog.directory", ACCESS_LOGS::toString);
    }

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;

    @Test
    void noPasswordTokenOrHashIsLoggedOrAnsweredWhereItShouldNotBe(CapturedOutput output) throws Exception {
        ApiClient api = new ApiClient(port);
        List<String> secrets = new ArrayList<>(List.of(ADMIN_PASSWORD));
        String admin = ApiClient.basic("admin", ADMIN_PASSWORD);

        // Wrong and right passwords, over HTTP Basic and the browser's sign-in form.
        String wrong = secret("Wrong-");
        secrets.add(wrong);
        assertThat(api.get("/api/accounts/me", ApiClient.basic("admin", wrong)).status()).isEqualTo(401);
        assertThat(api.get("/api/accounts/me", admin).status()).isEqualTo(200);
        assertThat(formSignIn("admin", wrong)).as("a wrong password goes back to the form").contains("error");
        assertThat(formSignIn("admin", ADMIN_PASSWORD)).doesNotContain("error");

        // An account made with a password, the password set by an admin, then changed by its owner.
        String first = secret("First-");
        String second = secret("Second-");
        String third = secret("Third-");
        secrets.addAll(List.of(first, second, third));
        assertThat(api.post("/api/accounts", admin, "{\"username\":\"obs1\",\"password\":\"" + first + "\",\"role\":\"requester\"}")
                .status()).isEqualTo(201);
        assertThat(api.put("/api/accounts/obs1", admin, "{\"password\":\"" + second + "\"}").status()).isEqualTo(200);
        String notCurrent = secret("NotCurrent-");
        secrets.add(notCurrent);
        assertThat(api.put("/api/accounts/me/password", ApiClient.basic("obs1", second),
                "{\"currentPassword\":\"" + notCurrent + "\",\"newPassword\":\"" + third + "\"}").status()).isEqualTo(400);
        assertThat(api.put("/api/accounts/me/password", ApiClient.basic("obs1", second),
                "{\"currentPassword\":\"" + second + "\",\"newPassword\":\"" + third + "\"}").status()).isEqualTo(204);
        String owner = ApiClient.basic("obs1", third);
        // A bad account body: the refusal must not echo the password either.
        String tooLong = secret("Long-") + "x".repeat(80);
        secrets.add(tooLong);
        Answer refused = api.post("/api/accounts", admin, "{\"username\":\"obs2\",\"password\":\"" + tooLong + "\",\"role\":\"requester\"}");
        assertThat(refused.status()).isEqualTo(400);
        assertThat(refused.body()).doesNotContain(tooLong);

        // API tokens: made, used in the header (and, wrongly, in a query string), revoked, used again.
        long site = api.post("/api/sites", admin, "{\"name\":\"Secret hill\",\"latitudeDeg\":45,\"longitudeDeg\":7,\"elevationM\":500}")
                .id("$.id");
        long telescope = api.post("/api/telescopes", admin, "{\"siteId\":" + site + ",\"name\":\"ST1\",\"apertureMm\":300,"
                + "\"minAltitudeDeg\":15,\"slewRateDegPerS\":4,\"settleSeconds\":10,\"active\":true}").id("$.id");
        Answer readMade = api.post("/api/tokens", admin, "{\"name\":\"dome read\",\"telescopeId\":" + telescope + ",\"scope\":\"read\"}");
        Answer reportsMade = api.post("/api/tokens", admin, "{\"name\":\"dome reports\",\"telescopeId\":" + telescope
                + ",\"scope\":\"reports\"}");
        assertThat(readMade.status()).isEqualTo(201);
        assertThat(reportsMade.status()).isEqualTo(201);
        String read = readMade.json("$.token");
        String reports = reportsMade.json("$.token");
        secrets.addAll(List.of(read, reports));
        assertThat(api.get("/api/plans/published", ApiClient.bearer(read)).status()).isEqualTo(200);
        assertThat(api.get("/api/plans/published.csv?token=" + read, ApiClient.bearer(read)).status()).isEqualTo(200);
        assertThat(api.post("/api/reports", ApiClient.bearer(reports), "{\"visitId\":\"1-1\",\"outcome\":\"done\"}").status())
                .isEqualTo(404);
        assertThat(api.delete("/api/tokens/" + reportsMade.id("$.id"), admin).status()).isEqualTo(204);
        assertThat(api.post("/api/reports", ApiClient.bearer(reports), "{\"visitId\":\"1-1\",\"outcome\":\"done\"}").status())
                .isEqualTo(401);
        String unknownToken = TokenText.newToken();
        secrets.add(unknownToken);
        assertThat(api.get("/api/plans/published", ApiClient.bearer(unknownToken)).status()).isEqualTo(401);

        // Feed tokens: made, used as ?token= (the only way a feed reader can send one), replaced, the old one refused.
        Answer feed = api.post("/api/accounts/me/feed-token", owner, null);
        assertThat(feed.status()).isEqualTo(201);
        String oldFeed = feed.json("$.token");
        assertThat(api.get("/api/calendar/mine.ics?token=" + oldFeed, null).status()).isEqualTo(200);
        String newFeed = api.post("/api/accounts/me/feed-token", owner, null).json("$.token");
        secrets.addAll(List.of(oldFeed, newFeed));
        assertThat(api.get("/api/calendar/mine.ics?token=" + oldFeed, null).status()).isEqualTo(401);
        assertThat(api.get("/api/calendar/mine.ics?token=" + URLEncoder.encode(newFeed, StandardCharsets.UTF_8), null).status())
                .isEqualTo(200);
        // A feed token on a path it does not open is ignored, but it is still in a query string.
        assertThat(api.get("/api/accounts/me?token=" + newFeed, null).status()).isEqualTo(401);

        // Failed sign-ins up to the throttle, which logs them; on a name of its own, because the throttle would
        // also hold back obs1's right password below for as long as it lasts.
        for (int i = 0; i < 6; i++) {
            api.get("/api/accounts/me", ApiClient.basic("obs-throttled", wrong));
        }
        assertThat(api.get("/api/accounts/me", ApiClient.basic("obs-throttled", wrong)).status()).isEqualTo(429);

        // The stored forms are secret too: bcrypt hashes of the passwords, SHA-256 of the tokens.
        List<String> hashes = new ArrayList<>();
        accounts.findAll().forEach(a -> hashes.add(a.getPasswordHash()));
        Stream.of(read, reports, oldFeed, newFeed, unknownToken).map(TokenText::hash).forEach(hashes::add);
        assertThat(hashes).hasSizeGreaterThanOrEqualTo(7);

        // Responses that list accounts, tokens and their audit records carry none of them.
        Answer accountList = api.get("/api/accounts", admin);
        Answer tokenList = api.get("/api/tokens", admin);
        Answer accountAudit = api.get("/api/audit?entityType=account&size=500", admin);
        Answer tokenAudit = api.get("/api/audit?entityType=api-token&size=500", admin);
        assertThat(accountAudit.<List<String>>json("$.items[*].action")).contains("create", "update+password", "password");
        assertThat(tokenAudit.<List<String>>json("$.items[*].action")).contains("create", "state:revoked");
        for (Answer a : List.of(accountList, tokenList, accountAudit, tokenAudit, api.get("/api/accounts/me", owner))) {
            assertThat(a.status()).isEqualTo(200);
            assertNoneIn("a response", a.body(), secrets, hashes);
            assertThat(a.body()).as("no member names a password, a hash or a token")
                    .doesNotContainPattern("(?i)\"[^\"]*(password|hash|secret)[^\"]*\"\\s*:").doesNotContainPattern("\"token\"\\s*:");
        }

        // The logs: the console output (DEBUG request logging on) and the access log.
        String console = output.getAll();
        assertThat(console).as("request logging is on, or this proves nothing").contains("/api/calendar/mine.ics")
                .contains("/api/accounts");
        assertNoneIn("the console log", console, secrets, hashes);
        StringBuilder access = new StringBuilder();
        try (Stream<Path> files = Files.list(ACCESS_LOGS)) {
            for (Path f : files.toList()) {
                access.append(Files.readString(f));
            }
        }
        assertThat(access).as("the access log was written").contains("/api/calendar/mine.ics").contains(" 401 ");
        assertNoneIn("the access log", access.toString(), secrets, hashes);
    }

    private static void assertNoneIn(String where, String text, List<String> secrets, List<String> hashes) {
        List<String> found = new ArrayList<>();
        for (String s : secrets) {
            if (text.contains(s) || text.contains(URLEncoder.encode(s, StandardCharsets.UTF_8))) {
                found.add("secret " + s.substring(0, Math.min(8, s.length())) + "…");
            }
        }
        for (String h : hashes) {
            if (text.contains(h)) {
                found.add("hash " + h.substring(0, 12) + "…");
            }
        }
        assertThat(found).as("secrets found in " + where).isEmpty();
    }

    /** Signs in with the browser form (CSRF token from the cookie) and answers where the server sent the browser. */
    private String formSignIn(String username, String password) throws Exception {
        CookieManager cookies = new CookieManager();
        HttpClient http = HttpClient.newBuilder().cookieHandler(cookies).followRedirects(HttpClient.Redirect.NEVER).build();
        String base = "http://127.0.0.1:" + port;
        http.send(HttpRequest.newBuilder(URI.create(base + "/login")).GET().build(), HttpResponse.BodyHandlers.discarding());
        String csrf = cookies.getCookieStore().getCookies().stream().filter(c -> c.getName().equals("XSRF-TOKEN"))
                .map(HttpCookie::getValue).findFirst().orElseThrow();
        String form = form(Map.of("username", username, "password", password, "_csrf", csrf));
        HttpResponse<String> r = http.send(HttpRequest.newBuilder(URI.create(base + "/login"))
                .header("Content-Type", "application/x-www-form-urlencoded").POST(HttpRequest.BodyPublishers.ofString(form)).build(),
                HttpResponse.BodyHandlers.ofString());
        assertThat(r.statusCode()).as("the form answers with a redirect").isEqualTo(302);
        return r.headers().firstValue("Location").orElse("");
    }

    private static String form(Map<String, String> fields) {
        StringBuilder b = new StringBuilder();
        fields.forEach((k, v) -> b.append(b.isEmpty() ? "" : "&").append(k).append('=').append(URLEncoder.encode(v, StandardCharsets.UTF_8)));
        return b.toString();
    }
}
