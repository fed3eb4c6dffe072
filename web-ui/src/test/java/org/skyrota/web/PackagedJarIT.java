package org.skyrota.web;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.Base64;
import java.util.List;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The jar as shipped: {@code java -jar skyrota.jar --demo} on an empty data folder starts,
 * creates its embedded database there, reports healthy, answers the compute endpoints without a
 * login and the stored data with the demo accounts.
 */
class PackagedJarIT {

    private static final Duration START_TIMEOUT = Duration.ofMinutes(3);

    @TempDir
    static Path dataDir;

    static Process server;
    static int port;
    static Path log;
    static final HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();

    @BeforeAll
    static void start() throws Exception {
        Path jar = Path.of(System.getProperty("skyrota.jar", "target/skyrota.jar"));
        assertThat(jar).exists();
        try (ServerSocket socket = new ServerSocket(0)) {
            port = socket.getLocalPort();
        }
        log = dataDir.resolve("server.log");
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        server = new ProcessBuilder(List.of(java, "-Xmx512m", "-jar", jar.toString(), "--server.port=" + port,
                "--skyrota.data-dir=" + dataDir.resolve("db"), "--demo"))
                .redirectErrorStream(true).redirectOutput(log.toFile()).start();
        Instant deadline = Instant.now().plus(START_TIMEOUT);
        while (Instant.now().isBefore(deadline)) {
            assertThat(server.isAlive()).as("server exited early; log:%n%s", readLog()).isTrue();
            try {
                if (get("/actuator/health", null).statusCode() == 200) {
                    return;
                }
            } catch (IOException notYet) {
                // not listening yet
            }
            Thread.sleep(500);
        }
        throw new AssertionError("server not healthy within " + START_TIMEOUT + "; log:\n" + readLog());
    }

    @AfterAll
    static void stop() throws InterruptedException {
        if (server != null) {
            server.destroy();
            if (!server.waitFor(30, java.util.concurrent.TimeUnit.SECONDS)) {
                server.destroyForcibly();
            }
        }
    }

    @Test
    void healthyWithItsDatabaseInTheDataFolder() throws Exception {
        assertThat(get("/actuator/health", null).body()).contains("\"status\":\"UP\"");
        assertThat(dataDir.resolve("db").resolve("skyrota.mv.db")).exists();
        assertThat(readLog()).contains("DEMO MODE").doesNotContain("ERROR");
    }

    @Test
    void computeNeedsNoLoginAndStoredDataNeedsAnAccount() throws Exception {
        HttpResponse<String> almanac = get("/api/almanac?lat=-32.38&lon=20.81&date=2027-06-01&tz=Africa/Johannesburg", null);
        assertThat(almanac.statusCode()).isEqualTo(200);
        assertThat(almanac.body()).startsWith("{\"date\":\"2027-06-01\",\"sunset\":\"2027-06-01T");

        HttpResponse<String> bad = get("/api/almanac?lat=91&lon=0&date=2027-06-01", null);
        assertThat(bad.statusCode()).isEqualTo(400);
        assertThat(bad.headers().firstValue("Content-Type")).hasValueSatisfying(v -> assertThat(v).startsWith("application/problem+json"));
        assertThat(bad.body()).contains("\"parameter\":\"lat\"");

        assertThat(get("/api/requests", null).statusCode()).isEqualTo(401);
        HttpResponse<String> own = get("/api/requests?size=500", "student:demo");
        assertThat(own.statusCode()).isEqualTo(200);
        assertThat(own.body()).contains("\"owner\":\"student\"").doesNotContain("\"owner\":\"student2\"");
        assertThat(get("/api/sites", "coordinator:demo").body()).contains("\"totalItems\":3");
    }

    /** Every bundled plugin loads from the packaged jar, with the libraries it needs packaged beside it. */
    @Test
    void everyBundledPluginLoadsFromThePackagedJar() throws Exception {
        HttpResponse<String> plugins = get("/api/plugins", "coordinator:demo");
        assertThat(plugins.statusCode()).isEqualTo(200);
        assertThat(plugins.body()).as(plugins.body()).contains("\"problems\":[]");
        for (String id : List.of("csv", "icalendar", "voevent", "conditions-file", "solar-system", "small-bodies")) {
            assertThat(plugins.body()).contains("\"id\":\"" + id + "\"");
        }
        assertThat(plugins.body()).contains("\"scoreRules\":[").contains("equatorial-mount");
        assertThat(readLog()).doesNotContain("Plugin left out");
    }

    private static HttpResponse<String> get(String path, String userColonPassword) throws IOException, InterruptedException {
        HttpRequest.Builder request = HttpRequest.newBuilder(URI.create("http://127.0.0.1:" + port + path)).timeout(Duration.ofSeconds(30));
        if (userColonPassword != null) {
            request.header("Authorization", "Basic " + Base64.getEncoder().encodeToString(userColonPassword.getBytes(StandardCharsets.UTF_8)));
        }
        return http.send(request.build(), HttpResponse.BodyHandlers.ofString());
    }

    private static String readLog() {
        try {
            return Files.readString(log);
        } catch (IOException e) {
            return "(no log: " + e.getMessage() + ")";
        }
    }
}
