package org.skyrota.web.run;

import java.time.LocalDate;
import java.util.List;
import java.util.Map;

import com.fasterxml.jackson.annotation.JsonIgnoreProperties;

/**
 * What a run is asked to do.
 *
 * @param seconds time limit, 1..600 (default 30)
 * @param weights rule name to {@code {hard, medium, soft}}, replacing the rule's default weight for this run
 *     <p>The read-only members of a run's own view are ignored, so that a run read back can be sent again to run
 *     the same nights anew.
 */
@JsonIgnoreProperties({"id", "state", "startedAt", "finishedAt", "bestScore", "message", "revision", "requestedBy",
        "purpose", "summary"})
public record RunForm(LocalDate firstNight, LocalDate lastNight, List<Long> siteIds, Integer seconds,
                      Map<String, Weight> weights) {

    public record Weight(Long hard, Long medium, Long soft) {}
}
