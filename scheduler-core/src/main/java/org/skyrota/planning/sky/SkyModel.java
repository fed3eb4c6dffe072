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
     * The maximal intervals of the night (local noon to local noon) in which every limit holds, the site's horizon
     * profile ({@link Site#horizon()}) included. A night may hold several windows or none.
     */
    List<SkyWindow> windows(Site site, Target target, ObservingLimits limits, LocalDate night);

    /**
     * Windows of many targets that share the same limits, at every site, on every night from {@code from} to
     * {@code to}: {@code result.get(site).get(target)} lists the windows in time order. The default asks night by
     * night; a sky engine with a batch path overrides it.
     */
    default List<List<List<SkyWindow>>> windows(List<Site> sites, List<Target> targets, ObservingLimits limits,
                                                LocalDate from, LocalDate to) {
        List<List<List<SkyWindow>>> result = new java.util.ArrayList<>();
        for (Site site : sites) {
            List<List<SkyWindow>> bySite = new java.util.ArrayList<>();
            for (Target target : targets) {
                List<SkyWindow> all = new java.util.ArrayList<>();
                for (LocalDate d = from; !d.isAfter(to); d = d.plusDays(1)) {
                    all.addAll(windows(site, target, limits, d));
                }
                bySite.add(all);
            }
            result.add(bySite);
        }
        return result;
    }

    /** Conditions for the target at one instant. */
    SkyConditions conditions(Site site, Target target, Instant instant);

    /**
     * The target's local hour angle at the site (local apparent sidereal time minus apparent right ascension),
     * degrees in [-180, 180), positive west of the meridian. Asked only for telescopes whose mount cares
     * ({@link org.skyrota.planning.model.Telescope#hourAngleMatters()}).
     */
    default double hourAngleDeg(Site site, Target target, Instant instant) {
        return target.solar() ? org.skyrota.sky.coords.HourAngle.ofSunDeg(site.longitudeDeg(), instant)
                : org.skyrota.sky.coords.HourAngle.ofFixedDeg(target.raDeg(), target.decDeg(), site.longitudeDeg(),
                        instant);
    }
}
