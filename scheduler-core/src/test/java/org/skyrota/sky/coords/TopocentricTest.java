package org.skyrota.sky.coords;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import org.junit.jupiter.api.Test;

class TopocentricTest {

    private static final double ARCSEC = Math.PI / 648000.0;

    @Test
    void starAtInfinityIsUnchanged() {
        double[] out = new double[3];
        Topocentric.correct(1.0, 0.3, Double.POSITIVE_INFINITY, 2.0, 0.7, 1000, out);
        assertThat(out[0]).isEqualTo(1.0);
        assertThat(out[1]).isEqualTo(0.3);
    }

    @Test
    void parallaxInAltitudeAtTheEquatorFollowsTheTextbookFormula() {
        // At geodetic latitude 0 and sea level the observer lies on the equatorial radius a, along the
        // vertical: the altitude is lowered by p with sin p = (a/Δ) cos h' (common practice, no source).
        Random random = new Random(11);
        double[] out = new double[3];
        for (int i = 0; i < 1000; i++) {
            double lst = random.nextDouble() * 2 * Math.PI;
            double ra = random.nextDouble() * 2 * Math.PI;
            double dec = Math.asin(2 * random.nextDouble() - 1);
            double dist = 356000 + random.nextDouble() * 50000;
            Topocentric.correct(ra, dec, dist, lst, 0.0, 0.0, out);
            double geoAlt = Horizontal.altitudeRad(lst - ra, dec, 0.0);
            double topoAlt = Horizontal.altitudeRad(lst - out[0], out[1], 0.0);
            double expected = Math.asin(Topocentric.WGS84_A_KM / dist * Math.cos(topoAlt));
            assertThat((geoAlt - topoAlt) / ARCSEC).isCloseTo(expected / ARCSEC, within(1e-6));
            assertThat(out[2]).isCloseTo(Math.sqrt(dist * dist + Topocentric.WGS84_A_KM * Topocentric.WGS84_A_KM
                    - 2 * dist * Topocentric.WGS84_A_KM * Math.sin(geoAlt)), within(1e-6));
        }
    }

    @Test
    void moonOnTheHorizonDropsByItsHorizontalParallax() {
        // Common practice, no source: the Moon's horizontal parallax is about 57′ (54′ to 61′).
        double[] out = new double[3];
        double dist = 384400;
        Topocentric.correct(Math.PI / 2, 0.0, dist, 0.0, 0.0, 0.0, out);
        double topoAlt = Horizontal.altitudeRad(0.0 - out[0], out[1], 0.0);
        assertThat(Math.toDegrees(topoAlt) * 60).isCloseTo(-57.0, within(0.5));
    }
}
