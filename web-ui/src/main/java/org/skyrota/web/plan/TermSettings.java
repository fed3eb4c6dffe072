package org.skyrota.web.plan;

import java.time.Duration;

import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * How the term moves on: how soon after now a run may place a visit ({@code skyrota.planner.lead-time}, 15 minutes:
 * time to publish and for the telescope to take the plan up), and how long after a published visit's end its
 * telescope may still report on it before it counts as missed ({@code skyrota.reports.missed-after}, 12 hours: the
 * morning after).
 */
@Component
public class TermSettings {

    private final Duration leadTime;
    private final Duration missedAfter;

    TermSettings(@Value("${skyrota.planner.lead-time:PT15M}") Duration leadTime,
                 @Value("${skyrota.reports.missed-after:PT12H}") Duration missedAfter) {
        if (leadTime.isNegative() || missedAfter.isNegative()) {
            throw new IllegalArgumentException("skyrota.planner.lead-time and skyrota.reports.missed-after must not be"
                    + " negative, got " + leadTime + " and " + missedAfter);
        }
        this.leadTime = leadTime;
        this.missedAfter = missedAfter;
    }

    public static TermSettings of(Duration leadTime, Duration missedAfter) {
        return new TermSettings(leadTime, missedAfter);
    }

    public Duration leadTime() {
        return leadTime;
    }

    public Duration missedAfter() {
        return missedAfter;
    }
}
