package org.skyrota.bench;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

import org.skyrota.web.SkyrotaApplication;
import org.skyrota.web.support.ApiClient;
import org.skyrota.web.term.TermSimulation;
import org.springframework.boot.SpringApplication;
import org.springframework.boot.web.server.context.WebServerApplicationContext;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * term-ops: the term of {@link TermSimulation} (21 days) at about the size of the planner-term benchmark (three sites,
 * six telescopes, some 2,500 visits asked over the term), against the server started in this JVM on an embedded H2
 * database in a fresh folder, with a settable clock. Prints
 * {@code BENCH term-ops days= failedRuns= invariantsBroken= placedHours= observedHours= grantOverruns= medianRunSeconds=}.
 * It lives beside the server's tests because it drives the server with their HTTP client and term walker; bench/run
 * builds its class path from there. Options: {@code --days=N --requests-per-day=N --seconds=N}.
 */
public final class TermOpsBench {

    public static void main(String[] args) throws Exception {
        int days = 21;
        int perDay = 60;
        int seconds = 10;
        for (String a : args) {
            if (a.startsWith("--days=")) {
                days = Integer.parseInt(a.substring(7));
            } else if (a.startsWith("--requests-per-day=")) {
                perDay = Integer.parseInt(a.substring(19));
            } else if (a.startsWith("--seconds=")) {
                seconds = Integer.parseInt(a.substring(10));
            }
        }
        Path data = Files.createTempDirectory("skyrota-term-ops");
        String password = "bench-admin-password";
        ConfigurableApplicationContext server = SpringApplication.run(SkyrotaApplication.class,
                "--server.port=0", "--skyrota.data-dir=" + data, "--skyrota.admin-password=" + password,
                "--skyrota.clock=2026-12-01T12:00:00Z", "--skyrota.clock.settable=true",
                "--skyrota.alerts.replan-seconds=" + seconds, "--logging.level.root=WARN",
                "--logging.level.org.optaplanner=WARN");
        try {
            int port = ((WebServerApplicationContext) server).getWebServer().getPort();
            // Grants grow with the requests, so that they bind about as much as in the small term of the tests.
            TermSimulation.Scale scale = new TermSimulation.Scale(days, 2, perDay, seconds, perDay / 4.0);
            TermSimulation.Outcome o = new TermSimulation(new ApiClient(port), password, data.resolve("conditions.csv"),
                    scale).run();
            o.broken().forEach(b -> System.err.println("broken: " + b));
            System.out.println(String.format(Locale.ROOT, "BENCH term-ops days=%d failedRuns=%d invariantsBroken=%d"
                            + " placedHours=%.1f observedHours=%.1f grantOverruns=%d medianRunSeconds=%.1f runs=%d"
                            + " requestsPerDay=%d telescopes=%d runLimitSeconds=%d",
                    o.days(), o.failedRuns(), o.broken().size(), o.placedHours(), o.observedHours(), o.grantOverruns(),
                    o.medianRunSeconds(), o.runs(), perDay, 6, seconds));
        } finally {
            server.close();
        }
    }

    private TermOpsBench() {}
}
