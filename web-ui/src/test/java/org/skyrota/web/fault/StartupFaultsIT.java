package org.skyrota.web.fault;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Map;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.ServerProcess;

/** The packaged server started where it cannot work: it says why in one sentence and exits with a non-zero code. */
class StartupFaultsIT {

    @TempDir Path dir;

    @Test
    void anUnreachablePostgresIsOneClearMessageAndANonZeroExit() throws Exception {
        int closedPort = ServerProcess.freePort(); // nothing listens there once the probe socket is closed
        String url = "jdbc:postgresql://127.0.0.1:" + closedPort + "/skyrota";
        Path log = dir.resolve("server.log");
        ServerProcess server = ServerProcess.launch(log, Map.of("SKYROTA_DB_URL", url, "SKYROTA_DB_USER", "skyrota"),
                "--spring.profiles.active=postgres", "--skyrota.data-dir=" + dir.resolve("data"));
        int exit = server.awaitExit(Duration.ofMinutes(2));
        String output = server.log();
        assertThat(exit).as(output).isNotZero();
        assertThat(output).contains("Skyrota cannot reach its database at " + url + ": ");
        assertThat(output).contains("Check that the database server is running");
        // No stack trace: no "at org.…" frames and no "Caused by:" chains anywhere in the output.
        assertThat(output).doesNotContainPattern("(?m)^\\s+at [a-z]+\\.").doesNotContain("Caused by:");
    }

    /**
     * Broken plugin jars in {@code <data-dir>/plugins} (bytes that are no zip, and a jar whose service file names a
     * class it does not hold) never stop the start: each is left out, logged in one line and listed.
     */
    @Test
    void brokenPluginJarsAreLeftOutListedAndLoggedWithoutStoppingTheStart() throws Exception {
        Path plugins = dir.resolve("data").resolve("plugins");
        Files.createDirectories(plugins);
        Files.write(plugins.resolve("corrupt.jar"), "this is not a zip file".getBytes(StandardCharsets.UTF_8));
        try (OutputStream file = Files.newOutputStream(plugins.resolve("missing-class.jar"));
             JarOutputStream jar = new JarOutputStream(file)) {
            jar.putNextEntry(new JarEntry("META-INF/services/org.skyrota.plugin.PlanExporter"));
            jar.write("org.example.skyrota.NotInThisJar\n".getBytes(StandardCharsets.UTF_8));
            jar.closeEntry();
        }
        String password = "plugin-admin-secret";
        try (ServerProcess server = ServerProcess.start(dir.resolve("data"), dir.resolve("plugins.log"),
                Map.of("SKYROTA_ADMIN_PASSWORD", password))) {
            Answer listed = new ApiClient(server.port()).get("/api/plugins", ApiClient.basic("admin", password));
            assertThat(listed.status()).isEqualTo(200);
            assertThat(listed.<java.util.List<String>>json("$.problems[*].source"))
                    .anySatisfy(source -> assertThat(source).endsWith("corrupt.jar"))
                    .anySatisfy(source -> assertThat(source).endsWith("missing-class.jar"));
            assertThat(listed.<java.util.List<String>>json("$.plugins[*].id")).contains("csv", "icalendar");
            String log = server.log();
            assertThat(log).contains("Plugin left out").contains("corrupt.jar").contains("missing-class.jar");
            assertThat(log).doesNotContain("Caused by:");
        }
    }
}
