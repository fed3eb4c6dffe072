package org.skyrota.plugins.solarsystem;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.skyrota.plugin.MovingTarget;
import org.skyrota.plugin.PluginException;
import org.skyrota.sky.events.SkyAtSite;
import org.skyrota.sky.site.Night;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.visibility.Darkness;
import org.skyrota.sky.visibility.ObservingConstraints;
import org.skyrota.sky.visibility.VisibilityCalculator;
import org.skyrota.sky.visibility.VisibilityWindow;

/**
 * The plugin's planets through the sky engine's moving-target windows, against a published
 * worked example of rising, transit and setting.
 */
class PlanetWindowsTest {

    private final SolarSystemKind kind = new SolarSystemKind();

    private MovingTarget body(String name) throws PluginException {
        return kind.resolve(Map.of("body", name));
    }

    private static double seconds(Instant a, Instant b) {
        return Math.abs(Duration.between(a, b).toMillis()) / 1000.0;
    }

    /**
     * Meeus, Astronomical Algorithms, 2nd ed., Ex. 15.a: Venus at Boston (42°20′ N, 71°05′ W) on
     * 1988 March 20 (UT), h0 = −0°34′ for a planet. The example's results, quoted from memory as
     * fractions of the UT day: setting m2 = 0.12130 (2h54m40s), rising m1 = 0.51766 (12h25m26s),
     * transit m0 = 0.81965 (19h40m18s); its tabulated declinations at 0h TD on March 19, 20 and 21
     * are 18.04761°, 18.44092° and 18.82742°. At the transit the declination interpolates to
     * 18.758°, so the highest altitude of the window holding it is 90° − 42.333° + 18.758° =
     * 66.425°, plus 0.4′ of refraction. The site's nights run from local mean noon (16:44 UT), so
     * the setting falls in the night of March 19 and the rising at its end. Tolerance 30 s for the
     * times (the elements' error for Venus, under 1′, is a few seconds of time here; the example's
     * interpolation is good to a few seconds) and 0.05° for the altitude.
     */
    @Test
    void venusRisesTransitsAndSetsAtBostonAsInMeeus15a() throws PluginException {
        SiteLocation boston = SiteLocation.of(42 + 20 / 60.0, -(71 + 5 / 60.0), 0);
        SkyAtSite sky = new SkyAtSite(boston);
        ObservingConstraints c = ObservingConstraints.of(sky.refract(-34 / 60.0), Darkness.ANY);
        List<VisibilityWindow> windows = VisibilityCalculator.windows(boston, body("venus"), c,
                LocalDate.of(1988, 3, 19), LocalDate.of(1988, 3, 20));

        Instant day = Instant.parse("1988-03-20T00:00:00Z");
        Instant setting = day.plusMillis(Math.round(0.12130 * 86_400_000));
        Instant rising = day.plusMillis(Math.round(0.51766 * 86_400_000));
        Instant transit = day.plusMillis(Math.round(0.81965 * 86_400_000));
        VisibilityWindow evening = containing(windows, setting.minusSeconds(3600));
        VisibilityWindow morning = containing(windows, rising.plusSeconds(3600));
        VisibilityWindow highest = containing(windows, transit);
        assertThat(seconds(evening.end(), setting)).as("setting %s", evening.end()).isLessThan(30);
        assertThat(seconds(morning.start(), rising)).as("rising %s", morning.start()).isLessThan(30);
        assertThat(highest.maxAltitudeDeg()).isCloseTo(90 - (42 + 20 / 60.0) + 18.758 + 0.4 / 60, within(0.05));
    }

    private static VisibilityWindow containing(List<VisibilityWindow> windows, Instant t) {
        return windows.stream().filter(w -> !w.start().isAfter(t) && !w.end().isBefore(t)).findFirst()
                .orElseThrow(() -> new AssertionError("no window holds " + t + " among " + windows));
    }

    /**
     * The Moon through the plugin gives the same windows as the sky engine's Moon handed over
     * directly: the plugin is geocentric and the engine applies the parallax once.
     */
    @Test
    void thePluginsMoonGetsTheParallaxOnce() throws PluginException {
        SiteLocation site = SiteLocation.of(45, 10, 200);
        ObservingConstraints c = ObservingConstraints.of(0, Darkness.ANY);
        LocalDate d = LocalDate.of(2027, 2, 10);
        List<VisibilityWindow> windows = VisibilityCalculator.windows(site, body("moon"), c, d, d.plusDays(5));
        SkyAtSite sky = new SkyAtSite(site);
        double[] moon = new double[4];
        assertThat(windows).isNotEmpty();
        int edges = 0;
        for (VisibilityWindow w : windows) {
            Night night = Night.of(site, w.night());
            for (Instant edge : List.of(w.start(), w.end())) {
                if (edge.equals(night.start()) || edge.equals(night.end())) {
                    continue;
                }
                // Inside the night a window's edge is where the Moon's centre sits on the limit
                // (0°) by the engine's own topocentric Moon.
                sky.moon(SkyAtSite.toEpochSecond(edge), moon);
                assertThat(sky.refract(moon[2])).as("Moon's altitude at %s", edge).isCloseTo(0, within(0.01));
                edges++;
            }
        }
        assertThat(edges).isGreaterThanOrEqualTo(8);
    }
}
