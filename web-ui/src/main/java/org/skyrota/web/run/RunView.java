package org.skyrota.web.run;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;

import tools.jackson.databind.json.JsonMapper;

/**
 * A planner run as the API shows it; {@code revision} is the draft revision a finished run wrote, {@code message} says
 * in plain words how it ended, and {@code summary} (finished runs only) is what it did in numbers ({@link RunSummary}).
 */
public record RunView(long id, String state, LocalDate firstNight, LocalDate lastNight, Instant startedAt,
                      Instant finishedAt, String bestScore, String message, int seconds, Long revision,
                      List<Long> siteIds, String requestedBy, String purpose, RunSummary summary) {

    private static final JsonMapper JSON = JsonMapper.builder().build();

    public static RunView of(PlannerRun r) {
        RunSummary summary = r.getSummaryJson() == null ? null : JSON.readValue(r.getSummaryJson(), RunSummary.class);
        List<Long> sites = r.getSiteIds() == null ? List.of()
                : java.util.Arrays.stream(r.getSiteIds().split(",")).map(Long::valueOf).toList();
        return new RunView(r.getId(), r.getState().apiName(), r.getFirstNight(), r.getLastNight(), r.getStartedAt(),
                r.getFinishedAt(), r.getBestScore(), r.getMessage(), r.getTimeLimitSeconds(), r.getRevisionId(), sites,
                r.getRequestedBy(), r.getPurpose(), summary);
    }
}
