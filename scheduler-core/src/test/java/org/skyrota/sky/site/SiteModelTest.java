package org.skyrota.sky.site;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Site, horizon profile and night bounds; the sites are invented. */
class SiteModelTest {

    @Test
    void siteFactoryNamesTheBadField() {
        assertThatThrownBy(() -> SiteLocation.of(91, 0, 0)).hasMessageContaining("latitudeDeg");
        assertThatThrownBy(() -> SiteLocation.of(0, 181, 0)).hasMessageContaining("longitudeDeg");
        assertThatThrownBy(() -> SiteLocation.of(0, 0, 10_000)).hasMessageContaining("elevationM");
        assertThatThrownBy(() -> SiteLocation.of(0, 0, 0).withSky(30, 0.2)).hasMessageContaining("darkSkyZenithVMag");
        assertThatThrownBy(() -> SiteLocation.of(0, 0, 0).withSky(21, -1)).hasMessageContaining("extinction");
        assertThatThrownBy(() -> SiteLocation.of(0, 0, 0).withWeather(2000, 10)).hasMessageContaining("pressureHpa");
        assertThatThrownBy(() -> SiteLocation.of(0, 0, 0).withHorizon(null)).hasMessageContaining("horizon");
        assertThatThrownBy(() -> SiteLocation.of(Double.NaN, 0, 0)).hasMessageContaining("latitudeDeg");
    }

    @Test
    void siteDefaultsToTheStandardAtmosphereForItsElevation() {
        SiteLocation sea = SiteLocation.of(10, 20, 0);
        SiteLocation high = SiteLocation.of(10, 20, 2500);
        assertThat(sea.pressureHpa()).isCloseTo(1013.25, offset(15.0));
        assertThat(high.pressureHpa()).isLessThan(sea.pressureHpa() * 0.8);
        assertThat(sea.darkSkyZenithVMag()).isEqualTo(21.5);
        assertThat(sea.horizon().isFlat()).isTrue();
    }

    @Test
    void horizonInterpolatesLinearlyAndWrapsAtNorth() {
        HorizonProfile p = HorizonProfile.of(List.of(HorizonPoint.of(350, 20), HorizonPoint.of(10, 10),
                HorizonPoint.of(180, 0)));
        assertThat(p.minAltitudeDeg(0)).isCloseTo(15, offset(1e-12));
        assertThat(p.minAltitudeDeg(360)).isCloseTo(15, offset(1e-12));
        assertThat(p.minAltitudeDeg(-10)).isCloseTo(20, offset(1e-12));
        assertThat(p.minAltitudeDeg(95)).isCloseTo(5, offset(1e-12));
        assertThat(p.minAltitudeDeg(265)).isCloseTo(10, offset(1e-12));
        assertThat(p.minAltitudeDeg(10)).isEqualTo(10);
        assertThat(p.maxAltitudeDeg()).isEqualTo(20);
        assertThat(HorizonProfile.flat().minAltitudeDeg(123)).isZero();
        assertThat(HorizonProfile.of(List.of(HorizonPoint.of(0, 7))).minAltitudeDeg(200)).isEqualTo(7);
    }

    @Test
    void horizonRejectsBadPoints() {
        assertThatThrownBy(() -> HorizonPoint.of(360, 0)).hasMessageContaining("azimuthDeg");
        assertThatThrownBy(() -> HorizonPoint.of(10, 95)).hasMessageContaining("altitudeDeg");
        assertThatThrownBy(() -> HorizonProfile.of(List.of())).hasMessageContaining("points");
        assertThatThrownBy(() -> HorizonProfile.of(List.of(HorizonPoint.of(5, 1), HorizonPoint.of(5, 2))))
                .hasMessageContaining("5.0 given twice");
    }

    @Test
    void nightRunsFromLocalNoonToLocalNoonAndLastsTwentyThreeOrTwentyFiveHoursAcrossDst() {
        SiteLocation site = SiteLocation.of(48, 11, 500, ZoneId.of("Europe/Berlin"));
        Night ordinary = Night.of(site, LocalDate.of(2027, 6, 1));
        assertThat(ordinary.start()).isEqualTo(Instant.parse("2027-06-01T10:00:00Z"));
        assertThat(ordinary.duration()).isEqualTo(Duration.ofHours(24));
        // EU summer time 2027 begins Sunday 28 March and ends Sunday 31 October (common practice, no source).
        assertThat(Night.of(site, LocalDate.of(2027, 3, 27)).duration()).isEqualTo(Duration.ofHours(23));
        assertThat(Night.of(site, LocalDate.of(2027, 10, 30)).duration()).isEqualTo(Duration.ofHours(25));
    }

    @Test
    void nightWithoutZoneUsesLocalMeanSolarTime() {
        Night east = Night.of(SiteLocation.of(0, 180, 0), LocalDate.of(2027, 1, 1));
        Night west = Night.of(SiteLocation.of(0, -180, 0), LocalDate.of(2027, 1, 1));
        assertThat(east.start()).isEqualTo(Instant.parse("2027-01-01T00:00:00Z"));
        assertThat(west.start()).isEqualTo(Instant.parse("2027-01-02T00:00:00Z"));
        assertThat(Night.of(SiteLocation.of(0, 15, 0), LocalDate.of(2027, 1, 1)).start())
                .isEqualTo(Instant.parse("2027-01-01T11:00:00Z"));
    }
}
