package org.skyrota.sky.almanac;

import java.time.Instant;
import java.time.LocalDate;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import org.skyrota.sky.events.Crossing;
import org.skyrota.sky.events.CrossingFinder;
import org.skyrota.sky.events.SkyAtSite;
import org.skyrota.sky.site.Night;
import org.skyrota.sky.site.SiteLocation;

/**
 * The night almanac: sunset, the three dusks and dawns, sunrise, moonrise and moonset, each the
 * first such event inside the night, and the Moon's illuminated fraction at the night's middle.
 * The Sun's altitude is sampled once per night and searched for every threshold. Results are
 * cached per site and date (a few thousand nights), so a planner asking again costs nothing.
 */
public final class Almanac {

    private static final int CACHE_SIZE = 4096;
    private static final CrossingFinder FINDER = CrossingFinder.forAltitudes();
    private static final Map<Key, NightAlmanac> CACHE = new LinkedHashMap<>(256, 0.75f, true) {
        @Override
        protected boolean removeEldestEntry(Map.Entry<Key, NightAlmanac> eldest) {
            return size() > CACHE_SIZE;
        }
    };

    private record Key(SiteLocation site, LocalDate date) {
    }

    private Almanac() {
    }

    /** The almanac of the night that begins at local noon of {@code date}. */
    public static NightAlmanac forNight(SiteLocation site, LocalDate date) {
        Objects.requireNonNull(site, "site");
        Objects.requireNonNull(date, "date");
        Key key = new Key(site, date);
        synchronized (CACHE) {
            NightAlmanac hit = CACHE.get(key);
            if (hit != null) {
                return hit;
            }
        }
        NightAlmanac computed = compute(site, date);
        synchronized (CACHE) {
            CACHE.put(key, computed);
        }
        return computed;
    }

    private static NightAlmanac compute(SiteLocation site, LocalDate date) {
        Night night = Night.of(site, date);
        SkyAtSite sky = new SkyAtSite(site);
        double from = SkyAtSite.toEpochSecond(night.start());
        double to = SkyAtSite.toEpochSecond(night.end());
        int n = (int) Math.ceil((to - from) / 600.0);
        double[] t = new double[n + 1];
        double[] sunAlt = new double[n + 1];
        double[] moonLimb = new double[n + 1];
        for (int i = 0; i <= n; i++) {
            t[i] = i == n ? to : from + i * (to - from) / n;
            sunAlt[i] = sky.sunAltitudeDeg(t[i]);
            moonLimb[i] = sky.moonUpperLimbDeg(t[i]);
        }
        Optional<Instant>[] sunset = sunEvents(sky, t, sunAlt, SkyAtSite.SUNRISE_ALTITUDE_DEG);
        Optional<Instant>[] civil = sunEvents(sky, t, sunAlt, -6);
        Optional<Instant>[] nautical = sunEvents(sky, t, sunAlt, -12);
        Optional<Instant>[] astronomical = sunEvents(sky, t, sunAlt, -18);
        List<Crossing> moon = FINDER.find(sky::moonUpperLimbDeg, t, moonLimb);
        double illumination = sky.moonIlluminatedFraction(SkyAtSite.toEpochSecond(night.middle()));
        return new NightAlmanac(date, sunset[0], civil[0], nautical[0], astronomical[0], astronomical[1],
                nautical[1], civil[1], sunset[1], first(moon, true), first(moon, false),
                Math.max(0, Math.min(1, illumination)));
    }

    /** [first downward crossing, first upward crossing] of the Sun's centre at the altitude. */
    @SuppressWarnings("unchecked")
    private static Optional<Instant>[] sunEvents(SkyAtSite sky, double[] t, double[] sunAlt, double altitudeDeg) {
        double[] v = new double[sunAlt.length];
        for (int i = 0; i < v.length; i++) {
            v[i] = sunAlt[i] - altitudeDeg;
        }
        List<Crossing> c = FINDER.find(x -> sky.sunAltitudeDeg(x) - altitudeDeg, t, v);
        return new Optional[] {first(c, false), first(c, true)};
    }

    private static Optional<Instant> first(List<Crossing> crossings, boolean rising) {
        for (Crossing c : crossings) {
            if (c.rising() == rising) {
                return Optional.of(SkyAtSite.toInstant(c.epochSecond()));
            }
        }
        return Optional.empty();
    }
}
