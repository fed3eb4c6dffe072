package org.skyrota.sky.visibility;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.site.HorizonPoint;
import org.skyrota.sky.site.HorizonProfile;
import org.skyrota.sky.site.SiteLocation;

/**
 * The fast batch path against the plain per-instant path (exact positions every minute,
 * refined by bisection), for seeded random targets at invented sites, under each kind of
 * constraint. Every window must have exactly one counterpart, with both boundaries within 60 s.
 */
class BatchAgainstPerInstantTest {

    private static final double TOLERANCE_S = 60;
    private static final LocalDate FROM = LocalDate.of(2027, 5, 10);
    private static final LocalDate TO = FROM.plusDays(3);

    private static List<FixedTarget> targets(int n, long seed) {
        Random r = new Random(seed);
        List<FixedTarget> out = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            out.add(FixedTarget.of(360 * r.nextDouble(), Math.toDegrees(Math.asin(2 * r.nextDouble() - 1)),
                    100 * r.nextGaussian(), 100 * r.nextGaussian()));
        }
        return out;
    }

    /** Largest boundary difference, seconds; fails on any window without exactly one counterpart. */
    static double compare(List<VisibilityWindow> batch, List<VisibilityWindow> brute) {
        double worst = 0;
        for (VisibilityWindow w : batch) {
            List<VisibilityWindow> m = brute.stream()
                    .filter(o -> o.start().isBefore(w.end()) && w.start().isBefore(o.end())).toList();
            assertThat(m).as("counterpart of batch window %s among %s", w, brute).hasSize(1);
            worst = Math.max(worst, Math.abs(Duration.between(w.start(), m.get(0).start()).toMillis() / 1000.0));
            worst = Math.max(worst, Math.abs(Duration.between(w.end(), m.get(0).end()).toMillis() / 1000.0));
            assertThat(w.maxAltitudeDeg()).isCloseTo(m.get(0).maxAltitudeDeg(),
                    org.assertj.core.data.Offset.offset(0.05));
        }
        assertThat(batch).hasSameSizeAs(brute);
        return worst;
    }

    private static void check(SiteLocation site, ObservingConstraints c, int nTargets, long seed) {
        List<FixedTarget> list = targets(nTargets, seed);
        BatchVisibility.Result r = BatchVisibility.compute(List.of(site), list, c, FROM, TO);
        double worst = 0;
        int windows = 0;
        for (int i = 0; i < list.size(); i++) {
            List<VisibilityWindow> brute = VisibilityCalculator.windows(site, list.get(i), c, FROM, TO);
            worst = Math.max(worst, compare(r.windows(0, i), brute));
            windows += brute.size();
        }
        System.out.printf("batch vs per-instant: windows=%d max boundary difference %.2f s for %s%n", windows, worst, c);
        assertThat(windows).isPositive();
        assertThat(worst).isLessThanOrEqualTo(TOLERANCE_S);
    }

    private static final SiteLocation MID_NORTH = SiteLocation.of(40.5, -3.7, 800, ZoneId.of("Europe/Madrid"));
    private static final SiteLocation SOUTH = SiteLocation.of(-33.9, 151.2, 50, ZoneId.of("Australia/Sydney"));

    @Test
    void altitudeDarknessAndMoonSeparation() {
        check(MID_NORTH, ObservingConstraints.of(30, Darkness.ASTRONOMICAL).withMinMoonSeparationDeg(40), 12, 1);
    }

    @Test
    void airmassNauticalDarknessAndMoonIllumination() {
        // 2027-05-20 is near full Moon (from memory): the illumination limit bites while the Moon is up.
        check(SOUTH, ObservingConstraints.of(10, Darkness.NAUTICAL).withMaxAirmass(2.0).withMaxMoonIllumination(0.5),
                10, 2);
    }

    @Test
    void skyBrightnessAndSunSeparationWithCivilDarkness() {
        check(SOUTH, ObservingConstraints.of(20, Darkness.CIVIL).withMaxSkyBrightness(20.5)
                .withMinSunSeparationDeg(60), 8, 3);
    }

    @Test
    void horizonProfileAndTimeWindow() {
        SiteLocation site = MID_NORTH.withHorizon(HorizonProfile.of(List.of(HorizonPoint.of(0, 10),
                HorizonPoint.of(90, 35), HorizonPoint.of(180, 15), HorizonPoint.of(270, 45))));
        Instant earliest = Instant.parse("2027-05-10T22:00:00Z");
        Instant latest = Instant.parse("2027-05-13T01:00:00Z");
        check(site, ObservingConstraints.of(20, Darkness.SUNSET).withTimeWindow(earliest, latest), 10, 4);
    }

    @Test
    void windowsRespectTheTimeWindowAndTheNight() {
        Instant earliest = Instant.parse("2027-05-10T22:00:00Z");
        ObservingConstraints c = ObservingConstraints.of(0, Darkness.ANY).withTimeWindow(earliest, null);
        List<VisibilityWindow> w = VisibilityCalculator.windows(MID_NORTH, FixedTarget.of(10, 80), c, FROM, FROM);
        assertThat(w).hasSize(1);
        assertThat(Duration.between(earliest, w.get(0).start()).toMillis()).isBetween(0L, 1000L);
        assertThat(w.get(0).end()).isEqualTo(org.skyrota.sky.site.Night.of(MID_NORTH, FROM).end());
    }
}
