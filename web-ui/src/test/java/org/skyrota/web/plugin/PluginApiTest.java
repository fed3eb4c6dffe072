package org.skyrota.web.plugin;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * The server lists the bundled plugins found on its class path and, without failing its start, reports a corrupt jar
 * put in the data folder's plugins folder.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
class PluginApiTest {

    static final Path DATA = dataDirWithABrokenPlugin();

    @LocalServerPort int port;

    static Path dataDirWithABrokenPlugin() {
        try {
            Path dir = Files.createTempDirectory("skyrota-plugins-test");
            Files.createDirectories(dir.resolve("plugins"));
            Files.writeString(dir.resolve("plugins/broken.jar"), "this is not a zip file", StandardCharsets.UTF_8);
            return dir;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @DynamicPropertySource
    static void dataDir(DynamicPropertyRegistry registry) {
        registry.add("skyrota.data-dir", DATA::toString);
        registry.add("skyrota.admin-password", () -> "admin-password");
    }

    @Test
    void listsTheBundledPluginsAndTheBrokenJar() {
        ApiClient api = new ApiClient(port);
        assertThat(api.get("/api/plugins", null).status()).isEqualTo(401);
        Answer a = api.get("/api/plugins", ApiClient.basic("admin", "admin-password"));
        assertThat(a.status()).as(a.body()).isEqualTo(200);
        List<Map<String, Object>> plugins = a.json("$.plugins");
        assertThat(plugins).extracting(p -> p.get("id")).contains("csv", "icalendar");
        Map<String, Object> csv = plugins.stream().filter(p -> p.get("id").equals("csv")).findFirst().orElseThrow();
        assertThat((List<String>) csv.get("kinds")).contains("plan-exporter", "request-importer");
        assertThat(csv.get("apiVersion")).isEqualTo(1);
        assertThat((String) csv.get("description")).isNotBlank();
        // The bundled equatorial-mount plugin adds two score rules, listed with their default weights.
        List<Map<String, Object>> rules = a.json("$.scoreRules");
        assertThat(rules).anySatisfy(r -> {
            assertThat(r.get("rule")).isEqualTo("Outside hour-angle limits");
            assertThat(r.get("plugin")).isEqualTo("equatorial-mount.hour-angle-limits");
            assertThat(r.get("defaultWeight")).isEqualTo(Map.of("hard", 1, "medium", 0, "soft", 0));
        });
        assertThat(rules).anySatisfy(r -> {
            assertThat(r.get("rule")).isEqualTo("Meridian flip during visit");
            assertThat(r.get("defaultWeight")).isEqualTo(Map.of("hard", 0, "medium", 0, "soft", 10));
            assertThat((String) r.get("description")).isNotBlank();
        });
        assertThat(plugins).anySatisfy(p -> {
            assertThat(p.get("id")).isEqualTo("equatorial-mount.meridian-flip");
            assertThat((List<String>) p.get("kinds")).containsExactly("score-rule");
        });
        List<Map<String, Object>> problems = a.json("$.problems");
        assertThat(problems).anySatisfy(p -> {
            assertThat((String) p.get("source")).endsWith("broken.jar");
            assertThat((String) p.get("problem")).isNotBlank();
        });
    }
}
