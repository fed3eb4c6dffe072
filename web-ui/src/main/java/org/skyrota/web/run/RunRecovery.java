package org.skyrota.web.run;

import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;

/** At start, a run that was queued or running when the server stopped can never finish: it is marked failed. */
@Component
@Order(0)
class RunRecovery implements ApplicationRunner {

    private static final Logger log = LoggerFactory.getLogger(RunRecovery.class);

    private final RunService runs;

    RunRecovery(RunService runs) {
        this.runs = runs;
    }

    @Override
    public void run(ApplicationArguments args) {
        int failed = runs.failInterrupted();
        if (failed > 0) {
            log.warn("{} planner run(s) interrupted by the last stop were marked failed", failed);
        }
    }
}
