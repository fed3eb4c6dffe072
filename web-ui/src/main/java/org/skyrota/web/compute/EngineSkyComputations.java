package org.skyrota.web.compute;

import java.time.LocalDate;
import java.util.List;

import org.skyrota.plugin.MovingTarget;
import org.skyrota.sky.almanac.Almanac;
import org.skyrota.sky.almanac.NightAlmanac;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.visibility.BatchVisibility;
import org.skyrota.sky.visibility.FixedTarget;
import org.skyrota.sky.visibility.ObservingConstraints;
import org.skyrota.sky.visibility.VisibilityCalculator;
import org.springframework.stereotype.Component;

/**
 * The compute port answered by the sky engine of {@code scheduler-core}: the only place where the
 * endpoints' values become the engine's records. Visibility uses the engine's batch path, which
 * the engine's own tests hold to the per-instant definition within a few seconds.
 */
@Component
class EngineSkyComputations implements SkyComputations {

    @Override
    public NightEvents almanac(Observer observer, LocalDate night) {
        NightAlmanac a = Almanac.forNight(site(observer), night);
        return new NightEvents(a.date(), a.sunset(), a.civilDusk(), a.nauticalDusk(), a.astronomicalDusk(),
                a.astronomicalDawn(), a.nauticalDawn(), a.civilDawn(), a.sunrise(), a.moonrise(), a.moonset(),
                a.moonIllumination());
    }

    @Override
    public List<Window> windows(Observer observer, Target target, Conditions conditions, LocalDate from, LocalDate to) {
        return BatchVisibility.windows(site(observer), FixedTarget.of(target.raDeg(), target.decDeg()),
                        constraints(conditions), from, to)
                .stream()
                .map(w -> new Window(w.night(), w.start(), w.end(), w.maxAltitudeDeg()))
                .toList();
    }

    /** Moving targets have no batch path: the per-instant one, with the site's parallax. */
    @Override
    public List<Window> movingWindows(Observer observer, MovingTarget target, Conditions conditions, LocalDate from,
                                LocalDate to) {
        return VisibilityCalculator.windows(site(observer), target, constraints(conditions), from, to)
                .stream()
                .map(w -> new Window(w.night(), w.start(), w.end(), w.maxAltitudeDeg()))
                .toList();
    }

    private static ObservingConstraints constraints(Conditions conditions) {
        ObservingConstraints constraints = ObservingConstraints.of(conditions.minAltitudeDeg(), darkness(conditions.darkness()));
        if (conditions.minMoonSeparationDeg() != null) {
            constraints = constraints.withMinMoonSeparationDeg(conditions.minMoonSeparationDeg());
        }
        if (conditions.maxMoonIllumination() != null) {
            constraints = constraints.withMaxMoonIllumination(conditions.maxMoonIllumination());
        }
        if (conditions.maxAirmass() != null) {
            constraints = constraints.withMaxAirmass(conditions.maxAirmass());
        }
        return constraints;
    }

    private static SiteLocation site(Observer o) {
        return SiteLocation.of(o.latitudeDeg(), o.longitudeDeg(), o.elevationM(), o.zone());
    }

    private static org.skyrota.sky.visibility.Darkness darkness(Darkness d) {
        return switch (d) {
            case CIVIL -> org.skyrota.sky.visibility.Darkness.CIVIL;
            case NAUTICAL -> org.skyrota.sky.visibility.Darkness.NAUTICAL;
            case ASTRONOMICAL -> org.skyrota.sky.visibility.Darkness.ASTRONOMICAL;
        };
    }
}
