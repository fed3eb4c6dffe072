package org.skyrota.sky.visibility;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.data.Offset.offset;

import java.time.Instant;
import java.time.LocalDate;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.atmosphere.Airmass;

/** Validation of the visibility value records: each factory names the bad value. */
class ValueRecordsTest {

    @Test
    void fixedTargetRejectsOutOfRangeCoordinates() {
        assertThatThrownBy(() -> FixedTarget.of(360, 0)).hasMessageContaining("raDeg");
        assertThatThrownBy(() -> FixedTarget.of(-0.1, 0)).hasMessageContaining("raDeg");
        assertThatThrownBy(() -> FixedTarget.of(10, 90.5)).hasMessageContaining("decDeg");
        assertThatThrownBy(() -> FixedTarget.of(10, 0, 1e6, 0)).hasMessageContaining("pmRaMasPerYear");
        assertThatThrownBy(() -> FixedTarget.of(10, 0, 0, Double.NaN)).hasMessageContaining("pmDecMasPerYear");
        assertThat(FixedTarget.of(180, 0).raRad()).isCloseTo(Math.PI, offset(1e-15));
    }

    @Test
    void constraintsRejectBadLimitsAndNameThem() {
        ObservingConstraints c = ObservingConstraints.of(30, Darkness.ASTRONOMICAL);
        assertThatThrownBy(() -> ObservingConstraints.of(95, Darkness.CIVIL)).hasMessageContaining("minAltitudeDeg");
        assertThatThrownBy(() -> c.withMaxAirmass(0.5)).hasMessageContaining("maxAirmass");
        assertThatThrownBy(() -> c.withMinMoonSeparationDeg(-1)).hasMessageContaining("minMoonSeparationDeg");
        assertThatThrownBy(() -> c.withMaxMoonIllumination(1.5)).hasMessageContaining("maxMoonIllumination");
        assertThatThrownBy(() -> c.withMaxSkyBrightness(40)).hasMessageContaining("maxSkyBrightness");
        assertThatThrownBy(() -> c.withMinSunSeparationDeg(200)).hasMessageContaining("minSunSeparationDeg");
        assertThatThrownBy(() -> c.withDarkness(null)).hasMessageContaining("darkness");
        Instant t = Instant.parse("2027-01-01T00:00:00Z");
        assertThatThrownBy(() -> c.withTimeWindow(t, t)).hasMessageContaining("latest must be after earliest");
    }

    @Test
    void anAirmassLimitBecomesTheAltitudeWhereTheAirmassEqualsIt() {
        // Kasten and Young 1989: airmass 1.994 at zenith angle 60° (CHECKS.md), i.e. altitude 30°.
        ObservingConstraints c = ObservingConstraints.of(10, Darkness.ANY).withMaxAirmass(1.994);
        assertThat(c.effectiveMinAltitudeDeg()).isCloseTo(30, offset(0.02));
        assertThat(Airmass.kastenYoung(c.effectiveMinAltitudeDeg())).isCloseTo(1.994, offset(1e-9));
        assertThat(ObservingConstraints.of(45, Darkness.ANY).withMaxAirmass(2).effectiveMinAltitudeDeg()).isEqualTo(45);
    }

    @Test
    void darknessParsesTheApiWordsAndRejectsOthers() {
        assertThat(Darkness.parse("astronomical")).isEqualTo(Darkness.ASTRONOMICAL);
        assertThat(Darkness.parse(" Nautical ")).isEqualTo(Darkness.NAUTICAL);
        assertThat(Darkness.CIVIL.sunAltitudeLimitDeg()).isEqualTo(-6);
        assertThatThrownBy(() -> Darkness.parse("pitch")).hasMessageContaining("pitch");
    }

    @Test
    void windowRejectsAnEndBeforeItsStart() {
        Instant t = Instant.parse("2027-01-01T00:00:00Z");
        assertThatThrownBy(() -> new VisibilityWindow(LocalDate.of(2027, 1, 1), t, t, 40)).hasMessageContaining("end");
        assertThatThrownBy(() -> new VisibilityWindow(LocalDate.of(2027, 1, 1), t, t.plusSeconds(60), 91))
                .hasMessageContaining("maxAltitudeDeg");
    }
}
