package org.skyrota.web.term;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.stream.Stream;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.Test;
import org.skyrota.web.support.ApiClient;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.DynamicPropertyRegistry;
import org.springframework.test.context.DynamicPropertySource;

/**
 * Three weeks of a club network's term against the real server (H2 here; {@link PostgresTermOperationsTest} on
 * PostgreSQL), walked with the server's settable clock: see {@link TermSimulation} for the day and its invariants.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT, properties = {
        "skyrota.test.context=term-operations", "skyrota.admin-password=" + TermOperationsTest.ADMIN_PASSWORD,
        "skyrota.alerts.replan-seconds=1"})
class TermOperationsTest {

    static final String ADMIN_PASSWORD = "term-admin-password";

    static Path dataDir;

    @DynamicPropertySource
    static void dataDir(DynamicPropertyRegistry registry) throws IOException {
        dataDir = Files.createTempDirectory("skyrota-term");
        // The conditions file in its default place, <data-dir>/conditions.csv, written by the term as it goes.
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

    @Test
    void threeWeeksOfDailyOperationsKeepEveryInvariant() throws IOException {
        TermSimulation.Outcome outcome = new TermSimulation(new ApiClient(port), ADMIN_PASSWORD,
                dataDir.resolve("conditions.csv"), TermSimulation.Scale.test()).run();
        System.out.println("term: " + outcome);
        assertThat(outcome.broken()).as("broken invariants").isEmpty();
        assertThat(outcome.failedRuns()).isZero();
        assertThat(outcome.grantOverruns()).isZero();
        // The term did something: runs every day, visits published and observed.
        assertThat(outcome.runs()).isGreaterThanOrEqualTo(outcome.days());
        assertThat(outcome.placedHours()).isPositive();
        assertThat(outcome.observedHours()).isPositive();
        // History grew, and a withdrawn request's published visits reached the calendar as cancellations.
        assertThat(outcome.historyVisits()).isPositive();
        assertThat(outcome.withdrawn()).isPositive();
        assertThat(outcome.cancelledSeen()).isPositive();
    }
}
