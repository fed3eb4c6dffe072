package org.skyrota.sky.bodies;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import java.time.ZoneOffset;
import java.util.Random;
import net.e175.klaus.solarpositioning.SPA;
import net.e175.klaus.solarpositioning.SolarPosition;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.atmosphere.Refraction;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.coords.Topocentric;
import org.skyrota.sky.time.SiderealTime;
import org.skyrota.sky.time.TimeScales;

/**
 * The topocentric Sun against the NREL SPA as implemented by {@code net.e175.klaus:solarpositioning} 2.0.3
 * (reference library, test scope), at 2,000 reproducible pseudo-random sites and instants between 1950 and 2050.
 *
 * <p>Tolerance: the SPA report (Reda and Andreas, NREL/TP-560-34302) gives its uncertainty as ±0.0003°.
 * Both sides evaluate the same truncated VSOP87 and the same ΔT (passed explicitly); the differences left
 * are IAU 2006 sidereal time and obliquity versus SPA's older expressions and our rigorous parallax,
 * all far below that. Azimuth differences are scaled by cos(altitude), the true angle on the sky.
 */
class SunVersusSpaCrossCheckTest {

    private static final double TOLERANCE_DEG = 0.0003;
    private static final int CASES = 2000;

    @Test
    void topocentricZenithAndAzimuthAgreeWithSpa() {
        Random random = new Random(20261201L);
        Percentiles zenithGeometric = new Percentiles("sun-vs-spa zenith (no refraction)");
        Percentiles azimuth = new Percentiles("sun-vs-spa azimuth*cos(alt)");
        Percentiles zenithRefracted = new Percentiles("sun-vs-spa zenith (refracted, Sun above -0.83°)");
        double[] sun = new double[4];
        double[] topo = new double[2];
        long start = Instant.parse("1950-01-01T00:00:00Z").getEpochSecond();
        long span = Instant.parse("2050-01-01T00:00:00Z").getEpochSecond() - start;
        for (int i = 0; i < CASES; i++) {
            Instant t = Instant.ofEpochSecond(start + (long) (random.nextDouble() * span));
            double latDeg = -89 + 178 * random.nextDouble();
            double lonDeg = -180 + 360 * random.nextDouble();
            double elevationM = 4000 * random.nextDouble();
            double pressure = 600 + 450 * random.nextDouble();
            double temperature = -30 + 70 * random.nextDouble();
            double deltaT = TimeScales.deltaTSeconds(t);

            double jdUt1 = TimeScales.jdUtc(t);
            double jdTt = jdUt1 + deltaT / 86400;
            double lat = Math.toRadians(latDeg);
            double lst = SiderealTime.gastRad(jdUt1, jdTt) + Math.toRadians(lonDeg);
            Sun.apparent(jdTt, sun);
            Topocentric.correct(sun[0], sun[1], sun[2], lst, lat, elevationM, topo);
            double h = lst - topo[0];
            double altDeg = Math.toDegrees(Horizontal.altitudeRad(h, topo[1], lat));
            double azDeg = Math.toDegrees(Horizontal.azimuthRad(h, topo[1], lat));

            SolarPosition geometric = SPA.calculateSolarPosition(t.atZone(ZoneOffset.UTC), latDeg, lonDeg,
                    elevationM, deltaT, 0, temperature);
            zenithGeometric.add((90 - altDeg) - geometric.zenithAngle());
            azimuth.add(Math.IEEEremainder(azDeg - geometric.azimuth(), 360) * Math.cos(Math.toRadians(altDeg)));

            // SPA refracts only when the Sun is above -(0.26667° + 0.5667°); compare where both refract.
            if (altDeg > -0.83) {
                SolarPosition refracted = SPA.calculateSolarPosition(t.atZone(ZoneOffset.UTC), latDeg, lonDeg,
                        elevationM, deltaT, pressure, temperature);
                double apparent = Refraction.apparentFromTrueDeg(altDeg, pressure, temperature);
                zenithRefracted.add((90 - apparent) - refracted.zenithAngle());
            }
        }
        System.out.println(zenithGeometric.summary("°"));
        System.out.println(azimuth.summary("°"));
        System.out.println(zenithRefracted.summary("°"));
        assertThat(zenithGeometric.count()).isEqualTo(CASES);
        assertThat(zenithRefracted.count()).isGreaterThan(CASES / 3);
        assertThat(zenithGeometric.max()).isLessThan(TOLERANCE_DEG);
        assertThat(azimuth.max()).isLessThan(TOLERANCE_DEG);
        assertThat(zenithRefracted.max()).isLessThan(TOLERANCE_DEG);
    }
}
