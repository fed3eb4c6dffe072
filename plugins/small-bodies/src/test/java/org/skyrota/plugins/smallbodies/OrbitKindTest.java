package org.skyrota.plugins.smallbodies;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.lang.management.ManagementFactory;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.skyrota.plugin.PluginException;
import org.skyrota.plugin.PluginRegistry;
import org.skyrota.sky.bodies.Sun;

/** Comet Encke, Meeus, Astronomical Algorithms, 2nd ed. (1998), Ex. 33.b, and the parameter checks. */
class OrbitKindTest {

    private static final double ARCSEC = Math.PI / 648000;
    /** 1990 October 6.0 TD. */
    private static final double JDE = 2448170.5;

    /** The elements of the example: a, e, i, Ω, ω for the equinox J2000, T = 1990 Oct 28.54502 TD. */
    private static Map<String, String> encke() {
        Map<String, String> p = new HashMap<>();
        p.put("name", "2P/Encke");
        p.put("a", "2.2091404");
        p.put("e", "0.8502196");
        p.put("i", "11.94524");
        p.put("node", "334.75006");
        p.put("arg_perihelion", "186.23352");
        p.put("perihelion_time", "1990-10-28.54502");
        return p;
    }

    private final OrbitKind kind = new OrbitKind();

    /**
     * Meeus Ex. 33.b prints the astrometric place referred to J2000 (light time included, no
     * aberration or nutation): α = 10h34m14.2s, δ = +19°09′31″, and the elongation ψ = 40.51°.
     * The book computes the Sun with VSOP87 as the sky engine does (about 1″); the values are
     * printed to 0.1 s (1.4″ on the sky at this declination) and 1″. Tolerance 3″.
     */
    @Test
    void enckeMeeus33b() throws PluginException {
        OrbitTarget target = kind.resolveOrbit(encke());
        double[] out = new double[3];
        target.astrometricJ2000(JDE, out);

        double expectedRa = Math.toRadians((10 + 34 / 60.0 + 14.2 / 3600) * 15);
        double expectedDec = Math.toRadians(19 + 9 / 60.0 + 31 / 3600.0);
        assertThat(Math.IEEEremainder(out[0] - expectedRa, 2 * Math.PI) * Math.cos(out[1]) / ARCSEC).isCloseTo(0, within(3.0));
        assertThat((out[1] - expectedDec) / ARCSEC).isCloseTo(0, within(3.0));

        // elongation from the Sun: the angle at the Earth between the comet and the Sun
        double[] earth = new double[5];
        EarthPosition.heliocentricEquatorialJ2000(JDE, earth);
        double cx = Math.cos(out[1]) * Math.cos(out[0]);
        double cy = Math.cos(out[1]) * Math.sin(out[0]);
        double cz = Math.sin(out[1]);
        double r = Math.sqrt(earth[0] * earth[0] + earth[1] * earth[1] + earth[2] * earth[2]);
        double cosPsi = -(cx * earth[0] + cy * earth[1] + cz * earth[2]) / r;
        assertThat(Math.toDegrees(Math.acos(cosPsi))).isCloseTo(40.51, within(0.005));
    }

    /**
     * The same comet at the apparent place of date: the sky engine's precession, nutation and
     * aberration move it by about 5′ at this date (7 years of precession); the apparent place must
     * differ from the astrometric one by that, and the distance must be unchanged.
     */
    @Test
    void theApparentPlaceAddsPrecessionNutationAndAberration() throws PluginException {
        OrbitTarget target = kind.resolveOrbit(encke());
        double[] astrometric = new double[3];
        double[] apparent = new double[3];
        target.astrometricJ2000(JDE, astrometric);
        target.apparentGeocentric(JDE, apparent);

        double sep = Math.acos(Math.sin(astrometric[1]) * Math.sin(apparent[1])
                + Math.cos(astrometric[1]) * Math.cos(apparent[1]) * Math.cos(astrometric[0] - apparent[0]));
        // general precession 50.3″ a year (common practice) over 9.24 years, give or take aberration (20″) and nutation (17″)
        assertThat(sep / ARCSEC).isBetween(9.24 * 50.3 * 0.3, 9.24 * 50.3 * 1.2);
        assertThat(apparent[2]).isEqualTo(astrometric[2]);
        assertThat(apparent[2] / Sun.AU_KM).isBetween(0.5, 1.5);
    }

    @Test
    void aMeanAnomalyAtEpochTimesTheSameOrbit() throws PluginException {
        // Encke's mean anomaly on 1990 Oct 6.0 from its perihelion time: M = n (t - T), n = k / a^1.5
        double a = 2.2091404;
        double n = TwoBody.K / Math.pow(a, 1.5);
        double meanAnomalyDeg = Math.toDegrees(n * (JDE - 2448193.04502));
        Map<String, String> p = encke();
        p.remove("perihelion_time");
        p.put("epoch", Double.toString(JDE));
        p.put("mean_anomaly", Double.toString(meanAnomalyDeg));
        OrbitTarget byEpoch = kind.resolveOrbit(p);

        assertThat(byEpoch.perihelionJdTt()).isCloseTo(2448193.04502, within(1e-7));
        assertThat(OrbitKind.julianDateTt("1990-10-28T13:04:49.728", "t")).isCloseTo(2448193.04502, within(1e-8));
        assertThat(OrbitKind.julianDateTt("2448193.04502", "t")).isEqualTo(2448193.04502);
    }

    @Test
    void positionsAllocateNothing() throws PluginException {
        com.sun.management.ThreadMXBean threads = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        OrbitTarget target = kind.resolveOrbit(encke());
        double[] out = new double[3];
        for (int i = 0; i < 20000; i++) {
            target.apparentGeocentric(2448000 + i * 0.01, out);
        }
        long before = threads.getCurrentThreadAllocatedBytes();
        for (int i = 0; i < 20000; i++) {
            target.apparentGeocentric(2448100 + i * 0.01, out);
        }
        assertThat(threads.getCurrentThreadAllocatedBytes() - before).isLessThan(16_000L);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "e at least 1 with a|e=1.2|e|must be an ellipse",
        "negative e|e=-0.1|e|cannot be negative",
        "NaN e|e=NaN|e|finite",
        "missing e|e=|e|e is missing",
        "q and a|q=1.0|a|not both",
        "no size|a=|q|needs q",
        "negative a|a=-2|a|positive",
        "inclination|i=181|i|0 to 180",
        "not a number|node=north|node|must be a number",
        "no time|perihelion_time=|perihelion_time|needs perihelion_time",
        "bad time|perihelion_time=1990-13-28.5|perihelion_time|Julian Date",
        "unknown parameter|colour=green|colour|unknown parameter",
        "both timings|mean_anomaly=10|epoch|not both",
    })
    void parameterErrorsNameTheParameter(String label, String change, String field, String message) {
        Map<String, String> p = encke();
        String[] kv = change.split("=", 2);
        if (kv[1].isEmpty()) {
            p.remove(kv[0]);
        } else {
            p.put(kv[0], kv[1]);
        }
        assertThatThrownBy(() -> kind.resolve(p)).as(label).isInstanceOf(PluginException.class)
                .hasMessageContaining(message)
                .extracting(e -> ((PluginException) e).field()).isEqualTo(field);
    }

    @Test
    void parabolicAndHyperbolicOrbitsResolveWithQ() throws PluginException {
        Map<String, String> p = encke();
        p.remove("a");
        p.put("q", "0.9");
        p.put("e", "1");
        double[] out = new double[3];
        kind.resolve(p).apparentGeocentric(JDE, out);
        assertThat(out[1]).isBetween(-Math.PI / 2, Math.PI / 2);
        p.put("e", "1.3");
        kind.resolve(p).apparentGeocentric(JDE, out);
        assertThat(out[2]).isPositive();
    }

    @Test
    void foundThroughItsServicesFile() {
        PluginRegistry registry = PluginRegistry.load(getClass().getClassLoader());
        assertThat(registry.problems()).isEmpty();
        assertThat(registry.targetKind("orbit")).get().isInstanceOf(OrbitKind.class);
    }
}
