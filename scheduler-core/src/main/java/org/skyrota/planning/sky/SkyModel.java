package org.skyrota.planning.sky;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;

import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Target;

/**
 * What the planner needs from the sky engine. The planner never computes positions itself: candidate
 * generation asks this interface for the windows and samples the conditions once, before solving.
 */
public interface SkyModel {

    /**
     * The maximal intervals of the night (local noon to local noon) in which every limit holds.
     * A night may hold several windows or none.
     */
    List<SkyWindow> windows(Site site, Target target, ObservingLimits limits, LocalDate night);

    /** Conditions for the target at one instant. */
    SkyConditions conditions(Site site, Target target, Instant instant);
}
