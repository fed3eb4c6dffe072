package org.skyrota.web.fault;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.time.Duration;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
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
}
