package org.skyrota.planning.domain;

import java.util.List;

/** The names of the score rules; each is also the name of its weight. */
public final class RuleNames {
    public static final String TELESCOPE_OVERLAP = "Telescope overlap";
    public static final String OUTSIDE_WINDOW = "Outside visibility window";
    public static final String INSTRUMENT_MISSING = "Instrument or filter missing";
    public static final String REPEATS_TOO_CLOSE = "Repeats too close";
    public static final String TOO_CLOSE_TO_OBSERVED = "Too close to an observed repeat";
    public static final String CLOSED_NIGHT = "Closed night";
    public static final String SUN_AVOIDANCE = "Sun avoidance";
    public static final String PROGRAM_OVER_GRANT = "Program over grant";
    public static final String UNPLACED_VISIT = "Unplaced visit";
    public static final String AIRMASS_QUALITY = "Airmass above best";
    public static final String SKY_BRIGHTNESS = "Sky brighter than dark sky";
    public static final String IDLE_TIME = "Idle time between visits";
    public static final String OVERHEAD_TIME = "Overhead time";
    public static final String PROGRAM_FAIRNESS = "Program fairness";
    public static final String URGENCY = "Urgency";
    public static final String STABILITY = "Moved from published plan";

    public static final List<String> ALL = List.of(TELESCOPE_OVERLAP, OUTSIDE_WINDOW, INSTRUMENT_MISSING,
            REPEATS_TOO_CLOSE, TOO_CLOSE_TO_OBSERVED, CLOSED_NIGHT, SUN_AVOIDANCE, PROGRAM_OVER_GRANT, UNPLACED_VISIT, AIRMASS_QUALITY,
            SKY_BRIGHTNESS, IDLE_TIME, OVERHEAD_TIME, PROGRAM_FAIRNESS, URGENCY, STABILITY);

    private RuleNames() {
    }
}
