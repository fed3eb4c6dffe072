package org.skyrota.web.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Test;
import org.skyrota.web.account.Account;
import org.skyrota.web.account.AccountRepository;
import org.skyrota.web.account.Role;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.support.ApiClient.Answer;
import org.skyrota.web.support.PlanningNetwork;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.security.crypto.password.PasswordEncoder;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;
import org.springframework.test.context.TestPropertySource;

/**
 * The conditions file in its default place, {@code <data-dir>/conditions.csv}, with the server running: the server
 * starts without it, the file is written afterwards, and the next planner run reads it. A row with a cloud fraction at
 * or above {@code skyrota.conditions.close-at-cloud-fraction} (0.9 by default, 0.7 here) closes its night although it
 * says {@code closed=no}; one below does not. Invented sites, nights and forecasts.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@TestPropertySource(properties = {"skyrota.test.context=conditions-file-server",
        "skyrota.conditions.close-at-cloud-fraction=0.7"})
class ConditionsFileServerTest {

    static final String COORD = ApiClient.basic("cfcoord", "password1");
    static final String STUDENT = ApiClient.basic("cfstudent", "password1");
    static final String OTHER = ApiClient.basic("cfother", "password1");
    static final String CLOUDY = PlanningNetwork.FIRST_NIGHT;
    static final String HALF_CLOUDY = PlanningNetwork.LAST_NIGHT;
    /** A night after the requests' own, 0.75 cloudy: closed only because the limit is set to 0.7. */
    static final String MOSTLY_CLOUDY = "2027-01-12";

    static Path dataDir;

    @DynamicPropertySource
    static void dataDir(DynamicPropertyRegistry registry) throws IOException {
        dataDir = Files.createTempDirectory("skyrota-conditions-server");
        // No conditions file is configured: the server's default place is used, empty at the start.
        System.clearProperty("skyrota.conditions.file");
        registry.add("skyrota.data-dir", dataDir::toString);
    }

    @AfterAll
    static void removeTheDataDir() throws IOException {
        try (Stream<Path> files = Files.walk(dataDir)) {
            for (Path p : files.sorted(Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }

    @LocalServerPort int port;
    @Autowired AccountRepository accounts;
    @Autowired PasswordEncoder encoder;

    @Test
    void aConditionsFileWrittenAfterTheStartClosesTheCloudyNightAtTheNextRun() throws IOException {
        ApiClient api = new ApiClient(port);
        accounts.save(new Account("cfcoord", encoder.encode("password1"), Role.COORDINATOR));
        accounts.save(new Account("cfstudent", encoder.encode("password1"), Role.REQUESTER));
        accounts.save(new Account("cfother", encoder.encode("password1"), Role.REQUESTER));
        PlanningNetwork network = PlanningNetwork.create(api, COORD, STUDENT, OTHER, "CF");
        Path conditions = dataDir.resolve("conditions.csv");
        assertThat(conditions).doesNotExist();

        Answer before = run(api);
        assertThat((String) before.json("$.message")).doesNotContain("conditions feed");
        assertThat(closedNights(api, network)).isEmpty();
        assertThat(nightsWithVisits(api, network)).contains(CLOUDY, HALF_CLOUDY);

        Files.writeString(conditions, "site,telescope,night,closed,cloud_fraction,reason\n"
                + "Test hill CF,," + CLOUDY + ",no,0.95,forecast overcast\n"
                + "Test hill CF,," + HALF_CLOUDY + ",no,0.5,forecast half cloudy\n"
                + "Test hill CF,," + MOSTLY_CLOUDY + ",no,0.75,\n", StandardCharsets.UTF_8);

        Answer after = run(api);
        assertThat((String) after.json("$.message")).contains("telescope nights closed by conditions feeds: 2");
        List<Map<String, Object>> closed = closedNights(api, network);
        assertThat(closed).extracting(n -> n.get("night")).containsExactlyInAnyOrder(CLOUDY, MOSTLY_CLOUDY);
        assertThat(closed).allSatisfy(n -> assertThat(n.get("state")).isEqualTo("closed"));
        assertThat(closed).extracting(n -> (String) n.get("reason")).containsExactlyInAnyOrder(
                "conditions feed conditions-file: forecast overcast", "conditions feed conditions-file: cloud cover 75 %");
        assertThat(nightsWithVisits(api, network)).doesNotContain(CLOUDY).contains(HALF_CLOUDY);
    }

    private static Answer run(ApiClient api) {
        Answer started = api.post("/api/planner/runs", COORD, "{\"firstNight\":\"" + PlanningNetwork.FIRST_NIGHT
                + "\",\"lastNight\":\"" + MOSTLY_CLOUDY + "\",\"seconds\":2}");
        assertThat(started.status()).as(started.body()).isEqualTo(202);
        Answer ended = api.awaitRunEnd(started.id("$.id"), COORD, Duration.ofSeconds(240));
        assertThat((String) ended.json("$.state")).as(ended.body()).isEqualTo("finished");
        return ended;
    }

    private static List<Map<String, Object>> closedNights(ApiClient api, PlanningNetwork network) {
        return api.get("/api/plans/draft", COORD).json("$.closedNights[?(@.telescopeId == " + network.telescopeId + ")]");
    }

    private static List<String> nightsWithVisits(ApiClient api, PlanningNetwork network) {
        return api.get("/api/plans/draft", COORD).json("$.visits[?(@.telescopeId == " + network.telescopeId + ")].night");
    }
}
