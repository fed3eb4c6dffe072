package org.skyrota.sky.atmosphere;

/**
 * The model of the brightness of the moonlit night sky by Krisciunas and Schaefer (1991,
 * PASP 103, 1033), in the V band. Angles in degrees (the paper's units); brightness in
 * nanolamberts (nL) or V magnitudes per square arcsecond.
 */
public final class MoonlightSkyBrightness {

    private MoonlightSkyBrightness() {
    }

    /**
     * Sky brightness added by moonlight at the target, as the paper models it:
     * B = f(ρ) · I* · 10^(−0.4 k X(Z_moon)) · (1 − 10^(−0.4 k X(Z))), with the Moon's illuminance
     * I* = 10^(−0.4 (3.84 + 0.026 |α| + 4e-9 α⁴)), the scattering function
     * f(ρ) = 10^5.36 (1.06 + cos² ρ) + 10^(6.15 − ρ/40) (for ρ ≥ 10°; 6.2e7 ρ^−2 closer in) and the air
     * mass X(Z) = (1 − 0.96 sin² Z)^−1/2.
     *
     * @param phaseAngleDeg the Moon's phase angle α, degrees (0 full Moon, 180 new)
     * @param moonZenithDistanceDeg zenith distance of the Moon, degrees
     * @param targetZenithDistanceDeg zenith distance of the sky position, degrees
     * @param moonSeparationDeg angle ρ between the Moon and the sky position, degrees
     * @param extinctionMagPerAirmass extinction coefficient k in V, magnitudes per air mass
     * @return brightness in nanolamberts; 0 when the Moon is below the horizon (zenith
     *     distance above 90°)
     */
    public static double moonlightNanolamberts(double phaseAngleDeg, double moonZenithDistanceDeg,
            double targetZenithDistanceDeg, double moonSeparationDeg, double extinctionMagPerAirmass) {
        if (moonZenithDistanceDeg > 90.0) {
            return 0.0;
        }
        double alpha = Math.abs(phaseAngleDeg);
        double illuminance = Math.pow(10, -0.4 * (3.84 + 0.026 * alpha + 4e-9 * Math.pow(alpha, 4)));
        double rho = Math.abs(moonSeparationDeg);
        double scattering;
        if (rho >= 10.0) {
            double c = Math.cos(Math.toRadians(rho));
            scattering = Math.pow(10, 5.36) * (1.06 + c * c) + Math.pow(10, 6.15 - rho / 40.0);
        } else {
            // The paper's form for small separations; ρ is held at 0.25° so the value stays
            // finite (the Moon's own disk).
            double r = Math.max(rho, 0.25);
            scattering = 6.2e7 / (r * r);
        }
        double k = extinctionMagPerAirmass;
        double xMoon = airmassKs(moonZenithDistanceDeg);
        double xTarget = airmassKs(Math.min(targetZenithDistanceDeg, 90.0));
        return scattering * illuminance * Math.pow(10, -0.4 * k * xMoon) * (1 - Math.pow(10, -0.4 * k * xTarget));
    }

    /**
     * Nanolamberts to V magnitudes per square arcsecond: V = (20.7233 − ln(B/34.08))/0.92104
     * (the paper's conversion B = 34.08 exp(20.7233 − 0.92104 V), inverted).
     */
    public static double nanolambertsToVMagPerArcsec2(double nanolamberts) {
        return (20.7233 - Math.log(nanolamberts / 34.08)) / 0.92104;
    }

    /** V magnitudes per square arcsecond to nanolamberts: B = 34.08 exp(20.7233 − 0.92104 V). */
    public static double vMagPerArcsec2ToNanolamberts(double vMag) {
        return 34.08 * Math.exp(20.7233 - 0.92104 * vMag);
    }

    /**
     * Total V sky brightness at the target: the dark sky at the zenith brightened towards
     * the horizon as B_zen · 10^(−0.4 k (X − 1)) · X (the paper's dark-sky term), plus moonlight
     * ({@link #moonlightNanolamberts}, zero with the Moon below the horizon).
     *
     * @param darkZenithVMag dark-sky brightness at the zenith, V mag/arcsec² (about 21.5 at a
     *     dark site)
     * @return V magnitudes per square arcsecond (smaller is brighter)
     */
    public static double skyBrightnessVMagPerArcsec2(double darkZenithVMag, double phaseAngleDeg,
            double moonZenithDistanceDeg, double targetZenithDistanceDeg, double moonSeparationDeg,
            double extinctionMagPerAirmass) {
        double x = airmassKs(Math.min(targetZenithDistanceDeg, 90.0));
        double dark = vMagPerArcsec2ToNanolamberts(darkZenithVMag)
                * Math.pow(10, -0.4 * extinctionMagPerAirmass * (x - 1)) * x;
        double moon = moonlightNanolamberts(phaseAngleDeg, moonZenithDistanceDeg, targetZenithDistanceDeg,
                moonSeparationDeg, extinctionMagPerAirmass);
        return nanolambertsToVMagPerArcsec2(dark + moon);
    }

    /** The paper's air mass X(Z) = (1 − 0.96 sin² Z)^−1/2, Z in degrees (valid to Z = 90°). */
    public static double airmassKs(double zenithDistanceDeg) {
        double s = Math.sin(Math.toRadians(zenithDistanceDeg));
        return 1.0 / Math.sqrt(1 - 0.96 * s * s);
    }
}
