package org.skyrota.web.run;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;

import org.junit.jupiter.api.Test;
import org.skyrota.web.SkyrotaApplication;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * A run left queued or running in the database by a stop (here: a server closed while its run was marked running)
 * is failed, with a message, when the server starts again on the same database.
 */
class RunRestartTest {

    @Test
    void aRunLeftRunningIsFailedAtTheNextStart() throws Exception {
        Path data = Files.createTempDirectory("skyrota-restart-test");
        String[] args = {"--server.port=0", "--skyrota.data-dir=" + data,
                "--spring.datasource.url=jdbc:h2:file:" + data.resolve("skyrota") + ";DB_CLOSE_ON_EXIT=FALSE",
                "--skyrota.admin-password=restart-admin"};
        long running;
        long queued;
        long finished;
        try (ConfigurableApplicationContext first = new SpringApplicationBuilder(SkyrotaApplication.class).run(args)) {
            PlannerRunRepository runs = first.getBean(PlannerRunRepository.class);
            PlannerRun a = new PlannerRun(LocalDate.parse("2027-01-10"), LocalDate.parse("2027-01-11"), null, 5, null, "someone");
            a.start(Instant.now());
            running = runs.save(a).getId();
            queued = runs.save(new PlannerRun(LocalDate.parse("2027-02-10"), LocalDate.parse("2027-02-11"), null, 5, null,
                    "someone")).getId();
            PlannerRun c = new PlannerRun(LocalDate.parse("2027-03-10"), LocalDate.parse("2027-03-11"), null, 5, null, "someone");
            c.start(Instant.now());
            c.end(RunState.FINISHED, Instant.now(), "0hard/0medium/0soft", "placed 0 of 0 visits");
            finished = runs.save(c).getId();
        }
        try (ConfigurableApplicationContext second = new SpringApplicationBuilder(SkyrotaApplication.class).run(args)) {
            PlannerRunRepository runs = second.getBean(PlannerRunRepository.class);
            PlannerRun a = runs.findById(running).orElseThrow();
            assertThat(a.getState()).isEqualTo(RunState.FAILED);
            assertThat(a.getMessage()).contains("stopped");
            assertThat(a.getFinishedAt()).isNotNull();
            assertThat(runs.findById(queued).orElseThrow().getState()).isEqualTo(RunState.FAILED);
            assertThat(runs.findById(finished).orElseThrow().getState()).isEqualTo(RunState.FINISHED);
        }
    }
}
