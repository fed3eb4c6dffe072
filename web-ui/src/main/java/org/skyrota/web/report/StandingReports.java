package org.skyrota.web.report;

import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;

import org.skyrota.web.plan.VisitKey;

/**
 * What the reports say of each repeat: the latest {@code done} or {@code failed} report decides, so a failure
 * reported after a success plans the repeat again and a second success replaces the first. {@code partial} reports
 * are only recorded.
 */
public final class StandingReports {

    /** The repeats whose deciding report is {@code done}, with that report. */
    public static Map<VisitKey, ObservationReport> done(List<ObservationReport> all) {
        Map<VisitKey, ObservationReport> latest = deciding(all);
        latest.values().removeIf(r -> r.getOutcome() != Outcome.DONE);
        return latest;
    }

    /** Per repeat, the report that decides it: the latest {@code done} or {@code failed} one. */
    public static Map<VisitKey, ObservationReport> deciding(List<ObservationReport> all) {
        return all.stream()
                .filter(r -> r.getOutcome() != Outcome.PARTIAL)
                .collect(Collectors.toMap(r -> new VisitKey(r.getRequestId(), r.getRepeatNo()), r -> r,
                        (a, b) -> a.getId() > b.getId() ? a : b, java.util.HashMap::new));
    }

    private StandingReports() {
    }
}
