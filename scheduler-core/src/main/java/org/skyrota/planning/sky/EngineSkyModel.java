package org.skyrota.planning.sky;

import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

import org.skyrota.planning.model.DarknessLimit;
import org.skyrota.planning.model.ObservingLimits;
import org.skyrota.planning.model.Site;
import org.skyrota.planning.model.Target;
import org.skyrota.sky.atmosphere.Airmass;
import org.skyrota.sky.atmosphere.MoonlightSkyBrightness;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.events.SkyAtSite;
import org.skyrota.sky.site.Night;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.visibility.BatchVisibility;
import org.skyrota.sky.visibility.Darkness;
import org.skyrota.sky.visibility.FixedTarget;
import org.skyrota.sky.visibility.ObservingConstraints;
import org.skyrota.sky.visibility.VisibilityCalculator;
import org.skyrota.sky.visibility.VisibilityWindow;

/**
 * The planner's view of Skyrota's sky engine: windows from {@link BatchVisibility}, conditions from
 * {@link SkyAtSite} (apparent altitude, Kasten–Young airmass, Krisciunas–Schaefer sky brightness, Sun separation).
 * The Sun and Moon at a site are cached per minute, because thousands of targets ask about the same minutes.
 * Solar targets get daytime windows: the Sun's centre above the visit's minimum altitude, sampled each minute.
 * The site's horizon profile takes part in every window: the engine raises the minimum altitude towards the
 * azimuths the profile covers, for fixed targets and the Sun alike.
 * Moving targets (planets, the Moon, comets) get their windows from the per-instant path, topocentric.
 */
public final class EngineSkyModel implements SkyModel {
    private final Map<String, SiteLocation> locations = new ConcurrentHashMap<>();
    private final Map<String, Map<Long, double[]>> sunMoon = new ConcurrentHashMap<>();
    private final ThreadLocal<Map<String, SkyAtSite>> skies = ThreadLocal.withInitial(HashMap::new);

    @Override
    public List<SkyWindow> windows(Site site, Target target, ObservingLimits limits, LocalDate night) {
        if (target.isMoving()) {
            return movingWindows(site, target, limits, night, night);
        }
        if (target.solar()) {
            return solarWindows(site, limits, night);
        }
        List<VisibilityWindow> windows = BatchVisibility.windows(location(site), fixed(target), constraints(limits),
                night, night);
        return windows.stream().map(EngineSkyModel::window).toList();
    }

    @Override
    public List<List<List<SkyWindow>>> windows(List<Site> sites, List<Target> targets, ObservingLimits limits,
                                               LocalDate from, LocalDate to) {
        List<SiteLocation> siteLocations = sites.stream().map(this::location).toList();
        List<Target> fixedTargets = targets.stream().filter(t -> !t.isMoving()).toList();
        List<FixedTarget> fixed = fixedTargets.stream().map(EngineSkyModel::fixed).toList();
        BatchVisibility.Result result = BatchVisibility.compute(siteLocations, fixed, constraints(limits), from, to);
        List<List<List<SkyWindow>>> out = new ArrayList<>();
        for (int s = 0; s < sites.size(); s++) {
            List<List<SkyWindow>> bySite = new ArrayList<>();
            // Moving targets have no batch path: each takes the per-instant path on its own.
            int f = 0;
            for (Target target : targets) {
                bySite.add(target.isMoving() ? movingWindows(sites.get(s), target, limits, from, to)
                        : result.windows(s, f++).stream().map(EngineSkyModel::window).toList());
            }
            out.add(bySite);
        }
        return out;
    }

    @Override
    public SkyConditions conditions(Site site, Target target, Instant instant) {
        SkyAtSite sky = sky(site);
        double t = SkyAtSite.toEpochSecond(instant);
        double[] sm = sunMoon(site, sky, instant.getEpochSecond() / 60);
        if (target.solar()) {
            double altitude = sky.refract(sky.sunAltitudeDeg(t));
            return new SkyConditions(altitude, altitude > 0 ? Airmass.kastenYoung(altitude) : Double.POSITIVE_INFINITY,
                    0, 0);
        }
        double[] p = new double[5];
        if (target.isMoving()) {
            sky.target(target.moving(), t, p);
        } else {
            sky.target(fixed(target), t, p);
        }
        double altitude = p[0];
        double airmass = altitude > 0 ? Airmass.kastenYoung(altitude) : Double.POSITIVE_INFINITY;
        double moonSepDeg = Math.toDegrees(Horizontal.separationRad(p[3], p[4], sm[0], sm[1]));
        double sunSepDeg = Math.toDegrees(Horizontal.separationRad(p[3], p[4], sm[4], sm[5]));
        // A solar moving target is observed by day, like the Sun: the moonlight model does not apply.
        double brightness = target.solar() ? 0 : MoonlightSkyBrightness.skyBrightnessVMagPerArcsec2(location(site).darkSkyZenithVMag(),
                sm[3], 90 - sm[2], 90 - Math.max(0, altitude), moonSepDeg,
                location(site).extinctionMagPerAirmass());
        return new SkyConditions(altitude, airmass, brightness, sunSepDeg);
    }

    /** Moon ra, dec (rad), true altitude (deg), phase angle (deg), Sun ra, dec (rad) at a site and minute. */
    private double[] sunMoon(Site site, SkyAtSite sky, long epochMinute) {
        return sunMoon.computeIfAbsent(site.id(), k -> new ConcurrentHashMap<>()).computeIfAbsent(epochMinute, k -> {
            double t = epochMinute * 60.0;
            double[] moon = new double[4];
            sky.moon(t, moon);
            double[] sun = new double[2];
            sky.sunRaDec(t, sun);
            return new double[] {moon[0], moon[1], moon[2], sky.moonPhaseAngleDeg(t), sun[0], sun[1]};
        });
    }

    /**
     * A moving target's windows by the engine's per-instant path. A solar one (caution: certified solar filter only)
     * is observed by day like the Sun, so only its altitude limits it.
     */
    private List<SkyWindow> movingWindows(Site site, Target target, ObservingLimits limits, LocalDate from,
                                          LocalDate to) {
        ObservingConstraints c = target.solar()
                ? ObservingConstraints.of(Math.max(-1, Math.min(89, limits.minAltitudeDeg())), Darkness.ANY)
                : constraints(limits);
        return VisibilityCalculator.windows(location(site), target.moving(), c, from, to).stream()
                .map(EngineSkyModel::window).toList();
    }

    private List<SkyWindow> solarWindows(Site site, ObservingLimits limits, LocalDate date) {
        SkyAtSite sky = sky(site);
        Night night = Night.of(location(site), date);
        List<SkyWindow> out = new ArrayList<>();
        Instant start = null;
        double maxAlt = -90;
        for (Instant t = night.start(); !t.isAfter(night.end()); t = t.plusSeconds(60)) {
            double epochSecond = SkyAtSite.toEpochSecond(t);
            double altitude = sky.refract(sky.sunAltitudeDeg(epochSecond));
            boolean up = altitude >= limits.minAltitudeDeg()
                    && (site.horizon().isFlat() || altitude >= site.horizon().minAltitudeDeg(sunAzimuthDeg(sky, epochSecond)));
            if (up && start == null) {
                start = t;
                maxAlt = altitude;
            } else if (up) {
                maxAlt = Math.max(maxAlt, altitude);
            }
            if (start != null && (!up || !t.isBefore(night.end()))) {
                if (t.getEpochSecond() - start.getEpochSecond() >= 60) {
                    out.add(new SkyWindow(date, start, t, maxAlt));
                }
                start = null;
            }
        }
        return out;
    }

    /** The Sun's azimuth, degrees east of north, from its apparent place of date and the local sidereal time. */
    private static double sunAzimuthDeg(SkyAtSite sky, double epochSecond) {
        double[] sun = new double[2];
        sky.sunRaDec(epochSecond, sun);
        double hourAngleRad = sky.localSiderealTimeRad(epochSecond) - sun[0];
        return Math.toDegrees(Horizontal.azimuthRad(hourAngleRad, sun[1], Math.toRadians(sky.site().latitudeDeg())));
    }

    private SkyAtSite sky(Site site) {
        return skies.get().computeIfAbsent(site.id(), k -> new SkyAtSite(location(site)));
    }

    private SiteLocation location(Site site) {
        return locations.computeIfAbsent(site.id(), k -> {
            SiteLocation base = SiteLocation.of(site.latitudeDeg(), site.longitudeDeg(), site.elevationM(), site.zone());
            return base.withHorizon(site.horizon()).withSky(site.darkSkyZenithVMag(), base.extinctionMagPerAirmass());
        });
    }

    private static FixedTarget fixed(Target target) {
        return FixedTarget.of(target.raDeg(), target.decDeg());
    }

    static ObservingConstraints constraints(ObservingLimits limits) {
        ObservingConstraints c = ObservingConstraints.of(Math.max(-1, Math.min(89, limits.minAltitudeDeg())),
                darkness(limits.darkness()));
        if (Double.isFinite(limits.maxAirmass())) {
            c = c.withMaxAirmass(limits.maxAirmass());
        }
        if (limits.minMoonSeparationDeg() > 0) {
            c = c.withMinMoonSeparationDeg(limits.minMoonSeparationDeg());
        }
        if (limits.maxMoonIllumination() < 1) {
            c = c.withMaxMoonIllumination(limits.maxMoonIllumination());
        }
        if (limits.minSunSeparationDeg() > 0) {
            c = c.withMinSunSeparationDeg(limits.minSunSeparationDeg());
        }
        return c;
    }

    private static Darkness darkness(DarknessLimit limit) {
        return switch (limit) {
            case ANY -> Darkness.ANY;
            case CIVIL -> Darkness.CIVIL;
            case NAUTICAL -> Darkness.NAUTICAL;
            case ASTRONOMICAL -> Darkness.ASTRONOMICAL;
        };
    }

    private static SkyWindow window(VisibilityWindow w) {
        return new SkyWindow(w.night(), w.start(), w.end(), w.maxAltitudeDeg());
    }
}
