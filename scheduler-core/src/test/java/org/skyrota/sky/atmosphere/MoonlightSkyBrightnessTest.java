package org.skyrota.sky.atmosphere;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class MoonlightSkyBrightnessTest {

    @Test
    void documentedOutputOfAPublicImplementation() {
        // Krisciunas and Schaefer 1991 (PASP 103, 1033) print no worked example. Check value: the documented
        // output of a public implementation of their model (as listed in /work/shared/CHECKS.md): zenith
        // distance 20°, Moon zenith distance 70°, separation 50°, phase angle 45°, k = 0.15 mag/airmass
        // -> 19.855 V mag/arcsec² from moonlight alone. Verified by hand against the paper's equations:
        // I* = 10^(-0.4(3.84 + 0.026·45 + 4e-9·45⁴)), f(50°) = 10^5.36(1.06 + cos² 50°) + 10^(6.15 - 50/40),
        // X(Z) = (1 - 0.96 sin² Z)^-1/2 -> 389.7 nL.
        double nl = MoonlightSkyBrightness.moonlightNanolamberts(45, 70, 20, 50, 0.15);
        assertThat(nl).isCloseTo(389.7, within(0.2));
        assertThat(MoonlightSkyBrightness.nanolambertsToVMagPerArcsec2(nl)).isCloseTo(19.855, within(0.0006));
    }

    @Test
    void conversionRoundTrips() {
        for (double v = 16; v <= 23; v += 0.5) {
            assertThat(MoonlightSkyBrightness.nanolambertsToVMagPerArcsec2(
                    MoonlightSkyBrightness.vMagPerArcsec2ToNanolamberts(v))).isCloseTo(v, within(1e-12));
        }
    }

    @Test
    void moonBelowTheHorizonAddsNothing() {
        assertThat(MoonlightSkyBrightness.moonlightNanolamberts(10, 95, 20, 50, 0.15)).isZero();
        assertThat(MoonlightSkyBrightness.skyBrightnessVMagPerArcsec2(21.5, 10, 95, 0, 50, 0.15)).isCloseTo(21.5, within(1e-9));
    }

    @Test
    void darkSkyBrightensTowardsTheHorizon() {
        // The paper's dark-sky term B_zen·10^(-0.4k(X-1))·X: brighter (smaller magnitude) at larger zenith distance.
        double zenith = MoonlightSkyBrightness.skyBrightnessVMagPerArcsec2(21.5, 180, 120, 0, 90, 0.15);
        double low = MoonlightSkyBrightness.skyBrightnessVMagPerArcsec2(21.5, 180, 120, 70, 90, 0.15);
        assertThat(zenith).isCloseTo(21.5, within(1e-9));
        assertThat(low).isLessThan(zenith - 0.5);
    }

    @Test
    void fullerMoonAndSmallerSeparationMeanBrighterSky() {
        double full = MoonlightSkyBrightness.skyBrightnessVMagPerArcsec2(21.5, 0, 40, 30, 60, 0.15);
        double quarter = MoonlightSkyBrightness.skyBrightnessVMagPerArcsec2(21.5, 90, 40, 30, 60, 0.15);
        double near = MoonlightSkyBrightness.skyBrightnessVMagPerArcsec2(21.5, 0, 40, 30, 15, 0.15);
        assertThat(full).isLessThan(quarter);
        assertThat(near).isLessThan(full);
        // Common practice, no source: near full Moon the sky is around 18 V mag/arcsec² or brighter.
        assertThat(full).isBetween(16.5, 19.0);
        assertThat(MoonlightSkyBrightness.moonlightNanolamberts(0, 40, 30, 0, 0.15)).isFinite();
    }
}
