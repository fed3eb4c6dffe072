package org.skyrota.sky.visibility;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.sky.bodies.Moon;
import org.skyrota.sky.bodies.Sun;
import org.skyrota.sky.coords.ApparentPlace;
import org.skyrota.sky.events.SkyAtSite;
import org.skyrota.sky.events.SkyEvents;
import org.skyrota.sky.site.HorizonPoint;
import org.skyrota.sky.site.HorizonProfile;
import org.skyrota.sky.site.Night;
import org.skyrota.sky.site.SiteLocation;

/**
 * Windows of moving targets (the per-instant path with a place asked for at each instant and the
 * site's parallax applied) against the sky engine's own rising and setting of the Moon and the
 * Sun ({@link SkyEvents}, Meeus, Astronomical Algorithms, 2nd ed., ch. 15 definitions), and
 * against the fixed-target path for a star given as a moving target. The planets are checked
 * against a published worked example in the solar-system plugin's tests, which may depend on
 * this module (this module may not depend on the plugin).
 */
class MovingTargetWindowsTest {

    /** An invented site at 45° N. */
    private static final SiteLocation SITE = SiteLocation.of(45.0, 7.5, 600, ZoneId.of("Europe/Rome"));

    /** The engine's Moon, geocentric: what a target-kind plugin hands over. */
    /** Scratch per thread, as the plugin rules ask of a MovingTarget. */
    private static final ThreadLocal<double[]> SCRATCH = ThreadLocal.withInitial(() -> new double[5]);

    private static final MovingTarget MOON = new MovingTarget() {

        @Override
        public String label() {
            return "Moon";
        }

        @Override
        public void apparentGeocentric(double jdTt, double[] out) {
            double[] s = SCRATCH.get();
            Moon.apparent(jdTt, s);
            System.arraycopy(s, 0, out, 0, 3);
        }
    };

    /** The same Moon with its distance withheld, so that no parallax can be applied. */
    private static final MovingTarget MOON_WITHOUT_PARALLAX = new MovingTarget() {
        @Override
        public String label() {
            return "Moon at infinity";
        }

        @Override
        public void apparentGeocentric(double jdTt, double[] out) {
            MOON.apparentGeocentric(jdTt, out);
            out[2] = Double.POSITIVE_INFINITY;
        }
    };

    private static final MovingTarget SUN = new MovingTarget() {

        @Override
        public String label() {
            return "Sun";
        }

        @Override
        public void apparentGeocentric(double jdTt, double[] out) {
            double[] s = SCRATCH.get();
            Sun.apparent(jdTt, s);
            System.arraycopy(s, 0, out, 0, 3);
        }

        @Override
        public boolean isSolar() {
            return true;
        }
    };

    private static double seconds(Instant a, Instant b) {
        return Math.abs(Duration.between(a, b).toMillis()) / 1000.0;
    }

    /**
     * Moonrise and moonset are the upper limb at the horizon with 34′ of refraction; a window
     * whose limit is the apparent altitude that the centre has at that moment must open and close
     * at those instants. The brief allows a minute or two; the two computations share the Moon's
     * theory, so they agree far closer. Without the parallax (up to about a degree) the same
     * window is off by minutes, which shows the correction is applied.
     */
    @Test
    void theMoonsWindowsOpenAtMoonriseAndCloseAtMoonset() {
        SkyAtSite sky = new SkyAtSite(SITE);
        double[] moon = new double[4];
        int risesChecked = 0;
        int setsChecked = 0;
        double worst = 0;
        double smallestParallaxShift = Double.POSITIVE_INFINITY;
        for (LocalDate d = LocalDate.of(2027, 3, 1); d.isBefore(LocalDate.of(2027, 3, 15)); d = d.plusDays(1)) {
            Night night = Night.of(SITE, d);
            Optional<Instant> rise = SkyEvents.moonrise(SITE, night.start().plusSeconds(600),
                    night.end().minusSeconds(600));
            Optional<Instant> set = SkyEvents.moonset(SITE, night.start().plusSeconds(600),
                    night.end().minusSeconds(600));
            if (rise.isPresent()) {
                ObservingConstraints c = limbLimit(sky, moon, rise.get());
                Instant opens = nearest(VisibilityCalculator.windows(SITE, MOON, c, d, d), rise.get(), true);
                worst = Math.max(worst, seconds(opens, rise.get()));
                Instant unshifted = nearest(VisibilityCalculator.windows(SITE, MOON_WITHOUT_PARALLAX, c, d, d),
                        rise.get(), true);
                smallestParallaxShift = Math.min(smallestParallaxShift, seconds(unshifted, rise.get()));
                risesChecked++;
            }
            if (set.isPresent()) {
                ObservingConstraints c = limbLimit(sky, moon, set.get());
                Instant closes = nearest(VisibilityCalculator.windows(SITE, MOON, c, d, d), set.get(), false);
                worst = Math.max(worst, seconds(closes, set.get()));
                setsChecked++;
            }
        }
        System.out.printf("moving Moon vs moonrise/moonset: %d rises, %d sets, worst %.2f s; without parallax at least %.0f s off%n",
                risesChecked, setsChecked, worst, smallestParallaxShift);
        assertThat(risesChecked).isGreaterThanOrEqualTo(8);
        assertThat(setsChecked).isGreaterThanOrEqualTo(8);
        assertThat(worst).as("worst difference from the engine's moonrise/moonset, s").isLessThan(5);
        // The horizontal parallax, 54′ to 61′, lowers the Moon near the horizon by about that
        // much: some four minutes of rising at 45° N.
        assertThat(smallestParallaxShift).as("shift without parallax, s").isGreaterThan(120);
    }

    /** The apparent altitude of the Moon's centre when its upper limb is on the horizon, at instant t. */
    private static ObservingConstraints limbLimit(SkyAtSite sky, double[] moon, Instant t) {
        sky.moon(SkyAtSite.toEpochSecond(t), moon);
        double centreTrue = -SkyAtSite.HORIZON_REFRACTION_DEG - moon[3];
        return ObservingConstraints.of(sky.refract(centreTrue), Darkness.ANY);
    }

    /** The window start (or end) nearest to t; fails if there is none within ten minutes. */
    private static Instant nearest(List<VisibilityWindow> windows, Instant t, boolean start) {
        Instant best = null;
        for (VisibilityWindow w : windows) {
            Instant edge = start ? w.start() : w.end();
            if (best == null || seconds(edge, t) < seconds(best, t)) {
                best = edge;
            }
        }
        assertThat(best).as("a window edge near %s among %s", t, windows).isNotNull();
        assertThat(seconds(best, t)).as("edge %s near %s", best, t).isLessThan(600);
        return best;
    }

    /**
     * The Sun as a moving target (the engine's own Sun): above the sunrise altitude (−0°50′,
     * Meeus ch. 15) from the start of the night (local noon) until sunset and again from sunrise
     * until the night's end. The solar parallax, 8.8″, moves the instants by about a second.
     */
    @Test
    void theSunAsAMovingTargetSetsAndRisesWithTheEnginesSun() {
        SkyAtSite sky = new SkyAtSite(SITE);
        for (LocalDate d : List.of(LocalDate.of(2027, 6, 21), LocalDate.of(2027, 12, 21))) {
            Night night = Night.of(SITE, d);
            ObservingConstraints c = ObservingConstraints.of(sky.refract(SkyAtSite.SUNRISE_ALTITUDE_DEG),
                    Darkness.ANY);
            List<VisibilityWindow> w = VisibilityCalculator.windows(SITE, SUN, c, d, d);
            Instant sunset = SkyEvents.sunset(SITE, night.start(), night.end()).orElseThrow();
            Instant sunrise = SkyEvents.sunrise(SITE, night.start(), night.end()).orElseThrow();
            assertThat(w).as("windows on %s", d).hasSize(2);
            assertThat(w.get(0).start()).isEqualTo(night.start());
            assertThat(seconds(w.get(0).end(), sunset)).as("sunset %s", d).isLessThan(5);
            assertThat(seconds(w.get(1).start(), sunrise)).as("sunrise %s", d).isLessThan(5);
            assertThat(w.get(1).end()).isEqualTo(night.end());
        }
    }

    /**
     * A star handed over as a moving target (its apparent place of date, no distance) must get
     * the fixed path's windows under every kind of constraint at once, horizon profile included:
     * the two share one definition.
     */
    @Test
    void aStarAsAMovingTargetGetsTheFixedTargetsWindows() {
        SiteLocation site = SITE.withHorizon(HorizonProfile.of(List.of(HorizonPoint.of(0, 5),
                HorizonPoint.of(90, 15), HorizonPoint.of(180, 3), HorizonPoint.of(270, 10))));
        ObservingConstraints c = ObservingConstraints.of(15, Darkness.NAUTICAL).withMaxAirmass(2.5)
                .withMinMoonSeparationDeg(25).withMaxMoonIllumination(0.99).withMaxSkyBrightness(18.0)
                .withMinSunSeparationDeg(40);
        LocalDate from = LocalDate.of(2027, 4, 18);
        LocalDate to = from.plusDays(2);
        Random r = new Random(11);
        int windows = 0;
        for (int i = 0; i < 8; i++) {
            FixedTarget fixed = FixedTarget.of(360 * r.nextDouble(), Math.toDegrees(Math.asin(1.6 * r.nextDouble() - 0.6)));
            MovingTarget star = new MovingTarget() {
                @Override
                public String label() {
                    return "star";
                }

                @Override
                public void apparentGeocentric(double jdTt, double[] out) {
                    ApparentPlace.ofDate(fixed.raRad(), fixed.decRad(), 0, 0, jdTt, out);
                    out[2] = 0;
                }
            };
            List<VisibilityWindow> a = VisibilityCalculator.windows(site, fixed, c, from, to);
            List<VisibilityWindow> b = VisibilityCalculator.windows(site, star, c, from, to);
            assertThat(b).as("windows of %s", fixed).hasSameSizeAs(a);
            for (int k = 0; k < a.size(); k++) {
                assertThat(seconds(a.get(k).start(), b.get(k).start())).isLessThan(1);
                assertThat(seconds(a.get(k).end(), b.get(k).end())).isLessThan(1);
                assertThat(b.get(k).maxAltitudeDeg()).isCloseTo(a.get(k).maxAltitudeDeg(),
                        org.assertj.core.data.Offset.offset(1e-6));
            }
            windows += a.size();
        }
        assertThat(windows).as("windows compared").isGreaterThan(3);
    }

    /**
     * The Moon, with a minimum altitude of 30° and nothing else, over a lunation: its windows'
     * highest altitudes stay within the range its declination (±28.6° at most, common practice)
     * allows at 45° N, 90 − 45 + δ, less up to a degree of parallax.
     */
    @Test
    void theMoonsHighestAltitudesAreBoundedByItsDeclination() {
        ObservingConstraints c = ObservingConstraints.of(30, Darkness.ANY);
        List<VisibilityWindow> w = VisibilityCalculator.windows(SITE, MOON, c, LocalDate.of(2027, 1, 1),
                LocalDate.of(2027, 1, 28));
        assertThat(w).hasSizeGreaterThan(15);
        List<Double> highs = new ArrayList<>();
        for (VisibilityWindow v : w) {
            highs.add(v.maxAltitudeDeg());
            assertThat(v.maxAltitudeDeg()).isBetween(30.0, 45 + 28.7);
        }
        assertThat(highs.stream().mapToDouble(Double::doubleValue).max().orElseThrow()).isGreaterThan(60);
    }
}
