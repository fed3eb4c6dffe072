package org.skyrota.web.account;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.util.HashMap;
import java.util.Map;

import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;

/**
 * Repeated failed sign-ins are slowed (429 with Retry-After before any password is checked, for that user name
 * only, cleared by a success); a browser session ends after its idle timeout (2 s here).
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT,
        properties = {"skyrota.session.idle-timeout=2s", "skyrota.sign-in.free-failures=5"})
class SignInLimitsTest {

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;
    ApiClient api;

    @BeforeEach
    void setUp() {
        api = new ApiClient(port);
        for (String name : new String[] {"guessed", "bystander", "browser"}) {
            if (accounts.findByUsername(name).isEmpty()) {
                accounts.save(new Account(name, encoder.encode("right-password"), Role.REQUESTER));
            }
        }
    }

    @Test
    void afterFiveFailuresTheNextAttemptWaitsAndEvenTheRightPasswordIsNotChecked() throws Exception {
        for (int i = 0; i < 5; i++) {
            assertThat(api.get("/api/accounts/me", ApiClient.basic("guessed", "wrong" + i)).status()).isEqualTo(401);
        }
        Answer slowed = api.get("/api/accounts/me", ApiClient.basic("guessed", "right-password"));
        assertThat(slowed.status()).as(slowed.body()).isEqualTo(429);
        assertThat(slowed.contentType()).startsWith("application/problem+json");
        assertThat(slowed.body()).doesNotContain("right-password").contains("try again in 1 s");
        // Another user name is not slowed.
        assertThat(api.get("/api/accounts/me", ApiClient.basic("bystander", "right-password")).status()).isEqualTo(200);

        Thread.sleep(1100);
        assertThat(api.get("/api/accounts/me", ApiClient.basic("guessed", "right-password")).status()).isEqualTo(200);
        // The success cleared the count: one more failure is an ordinary 401.
        assertThat(api.get("/api/accounts/me", ApiClient.basic("guessed", "wrong")).status()).isEqualTo(401);
        assertThat(api.get("/api/accounts/me", ApiClient.basic("guessed", "right-password")).status()).isEqualTo(200);
    }

    @Test
    void aBrowserSessionEndsAfterItsIdleTimeout() throws Exception {
        HttpClient http = HttpClient.newHttpClient();
        Map<String, String> cookies = new HashMap<>();
        String base = "http://127.0.0.1:" + port;
        send(http, cookies, HttpRequest.newBuilder(URI.create(base + "/api/about")).GET());
        HttpResponse<String> login = send(http, cookies, HttpRequest.newBuilder(URI.create(base + "/login"))
                .header("Content-Type", "application/x-www-form-urlencoded")
                .POST(HttpRequest.BodyPublishers.ofString("username=browser&password=right-password")));
        assertThat(login.statusCode()).isEqualTo(302);
        assertThat(login.headers().firstValue("Location").orElse("")).doesNotContain("error");
        assertThat(send(http, cookies, HttpRequest.newBuilder(URI.create(base + "/api/accounts/me")).GET()).statusCode()).isEqualTo(200);
        Thread.sleep(3500);
        assertThat(send(http, cookies, HttpRequest.newBuilder(URI.create(base + "/api/accounts/me")).GET()).statusCode()).isEqualTo(401);
    }

    static HttpResponse<String> send(HttpClient http, Map<String, String> cookies, HttpRequest.Builder b) throws Exception {
        if (!cookies.isEmpty()) {
            StringBuilder c = new StringBuilder();
            cookies.forEach((k, v) -> c.append(c.length() == 0 ? "" : "; ").append(k).append('=').append(v));
            b.header("Cookie", c.toString());
        }
        if (cookies.containsKey("XSRF-TOKEN")) {
            b.header("X-XSRF-TOKEN", cookies.get("XSRF-TOKEN"));
        }
        HttpResponse<String> r = http.send(b.build(), HttpResponse.BodyHandlers.ofString());
        for (String set : r.headers().allValues("Set-Cookie")) {
            String pair = set.split(";", 2)[0];
            int eq = pair.indexOf('=');
            if (eq > 0) {
                String value = pair.substring(eq + 1);
                if (value.isEmpty()) {
                    cookies.remove(pair.substring(0, eq));
                } else {
                    cookies.put(pair.substring(0, eq), value);
                }
            }
        }
        return r;
    }
}
