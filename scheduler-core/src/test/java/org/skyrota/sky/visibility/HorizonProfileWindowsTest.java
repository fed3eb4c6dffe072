package org.skyrota.sky.visibility;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.site.HorizonPoint;
import org.skyrota.sky.site.HorizonProfile;
import org.skyrota.sky.site.SiteLocation;

/** A horizon profile raises the minimum altitude only towards the azimuths it covers (invented site). */
class HorizonProfileWindowsTest {

    private static final SiteLocation SITE = SiteLocation.of(45.0, 0.0, 300);
    private static final LocalDate NIGHT = LocalDate.of(2027, 1, 15);
    // Dec −5°: culminates due south at about 40° (90 − 45 − 5), so it is always in the south half.
    private static final FixedTarget SOUTHERN = FixedTarget.of(120, -5);
    private static final ObservingConstraints C = ObservingConstraints.of(15, Darkness.ASTRONOMICAL);

    @Test
    void aWallInTheSouthHidesASouthernTargetForBothPaths() {
        SiteLocation walled = SITE.withHorizon(HorizonProfile.of(List.of(HorizonPoint.of(90, 45),
                HorizonPoint.of(270, 45), HorizonPoint.of(0, 0))));
        assertThat(VisibilityCalculator.windows(SITE, SOUTHERN, C, NIGHT)).hasSize(1);
        assertThat(VisibilityCalculator.windows(walled, SOUTHERN, C, NIGHT)).isEmpty();
        assertThat(BatchVisibility.windows(walled, SOUTHERN, C, NIGHT, NIGHT)).isEmpty();
    }

    @Test
    void aWallInTheNorthLeavesTheSouthernTargetAlone() {
        SiteLocation walled = SITE.withHorizon(HorizonProfile.of(List.of(HorizonPoint.of(300, 60),
                HorizonPoint.of(60, 60), HorizonPoint.of(100, 0), HorizonPoint.of(260, 0))));
        List<VisibilityWindow> flat = VisibilityCalculator.windows(SITE, SOUTHERN, C, NIGHT);
        List<VisibilityWindow> walledWindows = VisibilityCalculator.windows(walled, SOUTHERN, C, NIGHT);
        assertThat(walledWindows).hasSize(1);
        assertThat(walledWindows.get(0).start()).isEqualTo(flat.get(0).start());
        assertThat(walledWindows.get(0).end()).isEqualTo(flat.get(0).end());
        assertThat(BatchVisibility.windows(walled, SOUTHERN, C, NIGHT, NIGHT)).hasSize(1);
    }
}
