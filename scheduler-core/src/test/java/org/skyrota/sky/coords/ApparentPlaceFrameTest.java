package org.skyrota.sky.coords;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.time.TimeScales;

class ApparentPlaceFrameTest {

    @Test
    void preparedFrameGivesTheSamePlaceAsTheDirectPath() {
        Random random = new Random(99);
        double[] frame = new double[ApparentPlace.FRAME_LENGTH];
        double[] direct = new double[2];
        double[] batch = new double[2];
        for (int i = 0; i < 2000; i++) {
            double jd = TimeScales.J2000_JD + (random.nextDouble() - 0.5) * 73050;
            double ra = random.nextDouble() * 2 * Math.PI;
            double dec = Math.asin(2 * random.nextDouble() - 1);
            double pmRa = (random.nextDouble() - 0.5) * 1e-5;
            double pmDec = (random.nextDouble() - 0.5) * 1e-5;
            ApparentPlace.prepare(jd, frame);
            ApparentPlace.ofDate(frame, ra, dec, pmRa, pmDec, batch);
            ApparentPlace.ofDate(ra, dec, pmRa, pmDec, jd, direct);
            // 1e-11 rad = 2 µas: the two paths only differ in rounding.
            assertThat(Horizontal.separationRad(direct[0], direct[1], batch[0], batch[1])).isLessThan(1e-11);
            assertThat(batch[0]).isBetween(0.0, 2 * Math.PI);
        }
    }
}
