package org.skyrota.web.request;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.skyrota.sky.visibility.Darkness;
import org.skyrota.sky.visibility.ObservingConstraints;
import org.skyrota.web.program.Program;

/** A stored request reaches the sky engine with its target and every condition it sets, and no others. */
class RequestMapperTest {

    @Test
    void mapsTargetAndConditions() {
        ObservingRequest r = new ObservingRequest(new Program("P", "t", "pi"), "student");
        r.setTarget("NGC 1976", 83.82, -5.39);
        r.setConditions(25, DarknessLimit.NAUTICAL, 40.0, 0.5);

        assertThat(RequestMapper.toTarget(r).raDeg()).isEqualTo(83.82);
        assertThat(RequestMapper.toTarget(r).decDeg()).isEqualTo(-5.39);
        ObservingConstraints c = RequestMapper.toConstraints(r);
        assertThat(c).isEqualTo(ObservingConstraints.of(25, Darkness.NAUTICAL).withMinMoonSeparationDeg(40).withMaxMoonIllumination(0.5));
    }

    @Test
    void absentMoonLimitsStayAbsent() {
        ObservingRequest r = new ObservingRequest(new Program("P", "t", "pi"), "student");
        r.setTarget("M 31", 10.68, 41.27);
        r.setConditions(30, DarknessLimit.ASTRONOMICAL, null, null);
        assertThat(RequestMapper.toConstraints(r)).isEqualTo(ObservingConstraints.of(30, Darkness.ASTRONOMICAL));
    }
}
