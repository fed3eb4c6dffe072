package org.skyrota.web.site;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.ZoneId;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.skyrota.sky.site.SiteLocation;

/** A stored site reaches the sky engine with every value it holds, and the engine's defaults for the rest. */
class SiteMapperTest {

    @Test
    void mapsLocationZoneHorizonAndSky() {
        Site site = new Site("Ridge Station", -31.27, 149.06, 1165);
        site.setTimeZone("Australia/Sydney");
        site.setDarkSkyZenithVMag(21.9);
        site.setHorizon(List.of(new HorizonPoint(0, 5), new HorizonPoint(90, 12.5), new HorizonPoint(180, 3)));

        SiteLocation location = SiteMapper.toLocation(site);

        assertThat(location.latitudeDeg()).isEqualTo(-31.27);
        assertThat(location.longitudeDeg()).isEqualTo(149.06);
        assertThat(location.elevationM()).isEqualTo(1165);
        assertThat(location.zone()).isEqualTo(ZoneId.of("Australia/Sydney"));
        assertThat(location.darkSkyZenithVMag()).isEqualTo(21.9);
        assertThat(location.horizon().minAltitudeDeg(90)).isEqualTo(12.5);
        assertThat(location.horizon().minAltitudeDeg(45)).isEqualTo(8.75); // linear between 0° and 90°
    }

    @Test
    void siteWithoutZoneOrHorizonUsesLocalMeanSolarTimeAndAFlatHorizon() {
        SiteLocation location = SiteMapper.toLocation(new Site("Coast Station", 10, 20, 0));
        assertThat(location.zone()).isNull();
        assertThat(location.horizon().isFlat()).isTrue();
        assertThat(location.darkSkyZenithVMag()).isEqualTo(SiteLocation.DEFAULT_DARK_SKY_ZENITH_VMAG);
    }
}
