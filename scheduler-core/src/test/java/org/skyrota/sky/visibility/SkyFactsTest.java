package org.skyrota.sky.visibility;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.data.Offset.offset;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.almanac.Almanac;
import org.skyrota.sky.almanac.NightAlmanac;
import org.skyrota.sky.events.SkyAtSite;
import org.skyrota.sky.events.SkyEvents;
import org.skyrota.sky.site.Night;
import org.skyrota.sky.site.SiteLocation;

/** Facts of the trade (common practice, no source), at invented sites. */
class SkyFactsTest {

    private static final LocalDate JUNE_SOLSTICE = LocalDate.of(2027, 6, 21);
    private static final LocalDate DECEMBER_SOLSTICE = LocalDate.of(2027, 12, 21);

    @Test
    void theCelestialPoleStandsAtTheLatitudePlusRefraction() {
        // Common practice, no source. The J2000 pole has precessed ~0.15° from the pole of date
        // by 2027 (50.3″/yr × sin ε × 27 yr), so its altitude wanders by that much in a day.
        SiteLocation site = SiteLocation.of(47.3, 8.5, 400);
        SkyAtSite sky = new SkyAtSite(site);
        double[] out = new double[5];
        double t0 = Instant.parse("2027-03-01T00:00:00Z").getEpochSecond();
        for (int h = 0; h < 24; h += 3) {
            sky.target(FixedTarget.of(0, 90), t0 + h * 3600.0, out);
            double expected = sky.refract(site.latitudeDeg());
            assertThat(out[0]).isCloseTo(expected, offset(0.2));
        }
    }

    @Test
    void aCircumpolarTargetNeitherRisesNorSetsAndIsVisibleThroughTheWholeDarkTime() {
        // Common practice, no source: dec > 90° − latitude never sets.
        SiteLocation site = SiteLocation.of(52.0, 5.0, 10, ZoneId.of("Europe/Amsterdam"));
        FixedTarget target = FixedTarget.of(150, 60);
        LocalDate date = LocalDate.of(2027, 2, 10);
        Night night = Night.of(site, date);
        assertThat(SkyEvents.targetRise(site, target, night.start(), night.end())).isEmpty();
        assertThat(SkyEvents.targetSet(site, target, night.start(), night.end())).isEmpty();
        assertThat(SkyEvents.targetTransit(site, target, night.start(), night.end())).isPresent();
        NightAlmanac a = Almanac.forNight(site, date);
        List<VisibilityWindow> w = VisibilityCalculator.windows(site, target,
                ObservingConstraints.of(0, Darkness.ASTRONOMICAL), date);
        assertThat(w).hasSize(1);
        assertThat(Duration.between(a.astronomicalDusk().orElseThrow(), w.get(0).start()).abs().getSeconds())
                .isLessThanOrEqualTo(1);
        assertThat(Duration.between(a.astronomicalDawn().orElseThrow(), w.get(0).end()).abs().getSeconds())
                .isLessThanOrEqualTo(1);
    }

    @Test
    void northOfTheArcticCircleTheSunDoesNotSetInJuneNorRiseInDecember() {
        // Common practice, no source.
        SiteLocation site = SiteLocation.of(70.0, 25.0, 0, ZoneId.of("Europe/Oslo"));
        NightAlmanac june = Almanac.forNight(site, JUNE_SOLSTICE);
        assertThat(june.sunset()).isEmpty();
        assertThat(june.sunrise()).isEmpty();
        assertThat(june.civilDusk()).isEmpty();
        assertThat(june.astronomicalDusk()).isEmpty();
        NightAlmanac december = Almanac.forNight(site, DECEMBER_SOLSTICE);
        assertThat(december.sunrise()).isEmpty();
        assertThat(december.sunset()).isEmpty();
        // The Sun still climbs to about −3.4° at noon: civil twilight, but no sunrise.
        assertThat(december.civilDawn()).isPresent();
        assertThat(december.astronomicalDusk()).isPresent();
    }

    @Test
    void aHighLatitudeSummerNightHasNoAstronomicalDarknessAndNoWindows() {
        // Common practice, no source: at 60° N near the June solstice the Sun stays above about −6.6°.
        SiteLocation site = SiteLocation.of(60.0, 10.0, 100, ZoneId.of("Europe/Oslo"));
        NightAlmanac a = Almanac.forNight(site, JUNE_SOLSTICE);
        assertThat(a.sunset()).isPresent();
        assertThat(a.astronomicalDusk()).isEmpty();
        assertThat(a.nauticalDusk()).isEmpty();
        FixedTarget overhead = FixedTarget.of(270, 60);
        ObservingConstraints dark = ObservingConstraints.of(20, Darkness.ASTRONOMICAL);
        assertThat(VisibilityCalculator.windows(site, overhead, dark, JUNE_SOLSTICE)).isEmpty();
        assertThat(BatchVisibility.windows(site, overhead, dark, JUNE_SOLSTICE, JUNE_SOLSTICE)).isEmpty();
        ObservingConstraints civil = dark.withDarkness(Darkness.CIVIL);
        assertThat(VisibilityCalculator.windows(site, overhead, civil, JUNE_SOLSTICE)).hasSize(1);
    }

    @Test
    void atTheEquatorADecZeroTargetIsUpHalfASiderealDayPlusRefractionAndRisesStraightUp() {
        // Common practice, no source: rise to set = 12 sidereal hours plus twice the hour angle
        // of 34′ at 15°/h; the target rises due east, its altitude climbing at 15° per sidereal hour.
        SiteLocation site = SiteLocation.of(0, 30, 0);
        FixedTarget target = FixedTarget.of(100, 0);
        Instant from = Instant.parse("2027-04-01T00:00:00Z");
        Instant rise = SkyEvents.targetRise(site, target, from, from.plus(Duration.ofDays(1))).orElseThrow();
        Instant set = SkyEvents.targetSet(site, target, rise, rise.plus(Duration.ofDays(1))).orElseThrow();
        double siderealToSolar = 1 / 1.00273790935;
        double expectedS = (12 * 3600 + 2 * (34.0 / 60 / 15) * 3600) * siderealToSolar;
        assertThat(Duration.between(rise, set).toMillis() / 1000.0).isCloseTo(expectedS, offset(30.0));
        SkyAtSite sky = new SkyAtSite(site);
        double[] out = new double[5];
        double t = SkyAtSite.toEpochSecond(rise);
        sky.target(target, t, out);
        // Precession and nutation move the J2000 equator point off dec 0 by up to ~0.15° by 2027.
        assertThat(out[1]).isCloseTo(90, offset(0.3));
        double rate = (sky.targetTrueAltitudeDeg(target, t + 60) - sky.targetTrueAltitudeDeg(target, t - 60)) / 120;
        assertThat(rate * 3600).isCloseTo(15.041, offset(0.05));
    }

    @Test
    void theDateLineIsOneMeridianWithTwoDates() {
        // Common practice, no source: longitudes +180 and −180 are one place; in local mean solar
        // time the night of date D at +180 is the night of D − 1 at −180.
        LocalDate d = LocalDate.of(2027, 9, 15);
        NightAlmanac east = Almanac.forNight(SiteLocation.of(-17.0, 180.0, 0), d);
        NightAlmanac west = Almanac.forNight(SiteLocation.of(-17.0, -180.0, 0), d.minusDays(1));
        assertThat(east.sunset()).isPresent();
        assertThat(Duration.between(east.sunset().get(), west.sunset().get()).abs().toMillis()).isLessThan(100);
        assertThat(Duration.between(east.moonrise().orElseThrow(), west.moonrise().orElseThrow()).abs().toMillis())
                .isLessThan(100);
        assertThat(east.moonIllumination()).isCloseTo(west.moonIllumination(), offset(1e-9));
    }

    @Test
    void aNightAcrossTheDaylightSavingChangeKeepsItsEventsInOrder() {
        // EU summer time ended on 2027-10-31 at 01:00 UTC (common practice, no source): a 25-hour night.
        SiteLocation site = SiteLocation.of(50.1, 8.7, 100, ZoneId.of("Europe/Berlin"));
        LocalDate d = LocalDate.of(2027, 10, 30);
        Night night = Night.of(site, d);
        assertThat(night.duration()).isEqualTo(Duration.ofHours(25));
        NightAlmanac a = Almanac.forNight(site, d);
        List<Optional<Instant>> order = List.of(a.sunset(), a.civilDusk(), a.nauticalDusk(), a.astronomicalDusk(),
                a.astronomicalDawn(), a.nauticalDawn(), a.civilDawn(), a.sunrise());
        Instant prev = night.start();
        for (Optional<Instant> e : order) {
            assertThat(e).isPresent();
            assertThat(e.get()).isAfter(prev);
            prev = e.get();
        }
        assertThat(prev).isBefore(night.end());
        List<VisibilityWindow> w = VisibilityCalculator.windows(site, FixedTarget.of(30, 40),
                ObservingConstraints.of(30, Darkness.ASTRONOMICAL), d);
        assertThat(w).isNotEmpty();
        w.forEach(x -> assertThat(night.contains(x.start()) && !x.end().isAfter(night.end())).isTrue());
    }
}
