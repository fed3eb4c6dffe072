package org.skyrota.web.plan;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.skyrota.web.site.HorizonPoint;
import org.skyrota.web.site.Site;
import org.skyrota.web.site.SiteMapper;

/** A stored site's horizon reaches the planner whole, as it reaches the compute endpoints (invented site). */
class PlanningMapperHorizonTest {

    @Test
    void thePlannerGetsTheWholeProfileNotOneAltitude() {
        Site stored = new Site("Ridge Station", -31.27, 149.06, 1165);
        stored.setHorizon(List.of(new HorizonPoint(0, 5), new HorizonPoint(90, 30), new HorizonPoint(180, 3)));

        org.skyrota.planning.model.Site site = PlanningMapper.site(stored);

        // A single median altitude (5°) would open the 30° wall in the east and close the low south.
        assertThat(site.horizon().minAltitudeDeg(90)).isEqualTo(30);
        assertThat(site.horizon().minAltitudeDeg(180)).isEqualTo(3);
        assertThat(site.horizon().minAltitudeDeg(45)).isEqualTo(17.5); // linear between 0° and 90°
        assertThat(site.horizon()).isEqualTo(SiteMapper.toLocation(stored).horizon());
    }

    @Test
    void aSiteWithoutAStoredHorizonIsFlat() {
        assertThat(PlanningMapper.site(new Site("Coast Station", 10, 20, 0)).horizon().isFlat()).isTrue();
    }
}
