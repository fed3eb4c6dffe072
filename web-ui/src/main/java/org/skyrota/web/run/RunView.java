package org.skyrota.web.run;

import java.time.Instant;
import java.time.LocalDate;

/** A planner run as the API shows it; {@code revision} is the draft revision a finished run wrote. */
public record RunView(long id, String state, LocalDate firstNight, LocalDate lastNight, Instant startedAt,
                      Instant finishedAt, String bestScore, String message, int seconds, Long revision) {

    static RunView of(PlannerRun r) {
        return new RunView(r.getId(), r.getState().apiName(), r.getFirstNight(), r.getLastNight(), r.getStartedAt(),
                r.getFinishedAt(), r.getBestScore(), r.getMessage(), r.getTimeLimitSeconds(), r.getRevisionId());
    }
}
