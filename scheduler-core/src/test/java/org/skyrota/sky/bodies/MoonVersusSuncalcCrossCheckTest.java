package org.skyrota.sky.bodies;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.shredzone.commons.suncalc.MoonIllumination;
import org.shredzone.commons.suncalc.MoonPosition;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.coords.Topocentric;
import org.skyrota.sky.time.SiderealTime;
import org.skyrota.sky.time.TimeScales;

/**
 * The Moon against {@code org.shredzone.commons:commons-suncalc} 3.11 (reference library, test scope), at
 * 2,000 reproducible pseudo-random sites and instants between 2000 and 2040.
 *
 * <p>What suncalc computes: its Moon is the short series of Montenbruck and Pfleger ("Astronomy on the
 * Personal Computer", 14 terms in longitude) rotated with the mean obliquity and the mean sidereal time;
 * its README states that results have "an accuracy of about a minute" and are "probably not sufficient for
 * astronomical purposes". Its {@code MoonPosition} applies no diurnal parallax: its true altitude is the
 * geocentric one (shown below: it agrees with our geocentric altitude, not with our topocentric one, which
 * is lower by up to the Moon's horizontal parallax of about 1°). Its topocentric option (a location given
 * to {@code MoonIllumination}) lowers the altitude by the horizontal parallax minus the dip of the horizon
 * whatever the altitude (read from the 3.11 jar's {@code ExtendedMath.parallax}), which is not a rigorous
 * reference either. So the comparison is geocentric with geocentric, and our topocentric correction is
 * checked separately (TopocentricTest, and the NREL SPA example and cross-check for the Sun).
 *
 * <p>Tolerances from that accuracy: the short series errs by a few arcminutes (its largest neglected terms
 * are of order 100″); nutation, which it leaves out, adds up to 17″. 0.1° (6′) for the altitude and for
 * the azimuth times cos(altitude). The illuminated fraction inherits the elongation error: 0.005.
 */
class MoonVersusSuncalcCrossCheckTest {

    private static final double POSITION_TOLERANCE_DEG = 0.1;
    private static final double FRACTION_TOLERANCE = 0.005;
    private static final int CASES = 2000;

    @Test
    void geocentricAltitudeAzimuthAndIlluminationAgreeWithSuncalc() {
        Random random = new Random(4711L);
        Percentiles altitude = new Percentiles("moon-vs-suncalc geocentric altitude");
        Percentiles azimuth = new Percentiles("moon-vs-suncalc azimuth*cos(alt)");
        Percentiles fraction = new Percentiles("moon-vs-suncalc illuminated fraction");
        Percentiles topocentricShift = new Percentiles("moon topocentric minus geocentric altitude");
        double[] moon = new double[5];
        double[] topo = new double[2];
        long start = Instant.parse("2000-01-01T00:00:00Z").getEpochSecond();
        long span = Instant.parse("2040-01-01T00:00:00Z").getEpochSecond() - start;
        for (int i = 0; i < CASES; i++) {
            Instant t = Instant.ofEpochSecond(start + (long) (random.nextDouble() * span));
            double latDeg = -89 + 178 * random.nextDouble();
            double lonDeg = -180 + 360 * random.nextDouble();
            double elevationM = 3000 * random.nextDouble();
            double lat = Math.toRadians(latDeg);
            double jdTt = TimeScales.jdTt(t);
            double lst = SiderealTime.gastRad(TimeScales.jdUt1(t), jdTt) + Math.toRadians(lonDeg);
            Moon.apparent(jdTt, moon);
            double h = lst - moon[0];
            double altDeg = Math.toDegrees(Horizontal.altitudeRad(h, moon[1], lat));
            double azDeg = Math.toDegrees(Horizontal.azimuthRad(h, moon[1], lat));

            MoonPosition reference = MoonPosition.compute().on(t).at(latDeg, lonDeg).elevation(elevationM).execute();
            altitude.add(altDeg - reference.getTrueAltitude());
            azimuth.add(Math.IEEEremainder(azDeg - reference.getAzimuth(), 360) * Math.cos(Math.toRadians(altDeg)));

            Topocentric.correct(moon[0], moon[1], moon[2], lst, lat, elevationM, topo);
            double topoAltDeg = Math.toDegrees(Horizontal.altitudeRad(lst - topo[0], topo[1], lat));
            topocentricShift.add(topoAltDeg - reference.getTrueAltitude());

            MoonIllumination illumination = MoonIllumination.compute().on(t).execute();
            fraction.add(Moon.illuminatedFraction(jdTt) - illumination.getFraction());
        }
        System.out.println(altitude.summary("°"));
        System.out.println(azimuth.summary("°"));
        System.out.println(fraction.summary(""));
        System.out.println(topocentricShift.summary("°"));
        assertThat(altitude.max()).isLessThan(POSITION_TOLERANCE_DEG);
        assertThat(azimuth.max()).isLessThan(POSITION_TOLERANCE_DEG);
        assertThat(fraction.max()).isLessThan(FRACTION_TOLERANCE);
        // suncalc's altitude is geocentric: our topocentric altitude departs from it by the parallax.
        assertThat(topocentricShift.max()).isGreaterThan(0.85).isLessThan(1.2);
    }
}
