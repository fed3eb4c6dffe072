package org.skyrota.sky.coords;

import org.skyrota.sky.time.TimeScales;

/** Obliquity of the ecliptic, radians. */
public final class Obliquity {

    private static final double ARCSEC = Math.PI / 648000.0;

    private Obliquity() {
    }

    /**
     * Mean obliquity of the ecliptic of date, IAU 2006 (Capitaine et al. 2003, as SOFA
     * {@code iauObl06}): 84381.406″ − 46.836769″ T − …, T in Julian centuries of TT from J2000.
     * It is 0.042″ smaller than the IAU 1980 value that Meeus uses ({@link #meanIau1980Rad}).
     *
     * @param jdTt Julian Date in TT
     */
    public static double meanRad(double jdTt) {
        double t = TimeScales.centuriesTt(jdTt);
        return (84381.406 + t * (-46.836769 + t * (-0.0001831 + t * (0.00200340
                + t * (-0.000000576 + t * -0.0000000434))))) * ARCSEC;
    }

    /**
     * Mean obliquity by the IAU 1980 expression (Lieske et al. 1977; Meeus, Astronomical
     * Algorithms, 2nd ed., formula 22.2): 23°26′21.448″ − 46.8150″ T − 0.00059″ T² + 0.001813″ T³.
     *
     * @param jdTt Julian Date in TT
     */
    public static double meanIau1980Rad(double jdTt) {
        double t = TimeScales.centuriesTt(jdTt);
        return (84381.448 + t * (-46.8150 + t * (-0.00059 + t * 0.001813))) * ARCSEC;
    }

    /**
     * True obliquity: {@link #meanRad} plus the nutation in obliquity from {@link Nutation}.
     *
     * @param jdTt Julian Date in TT
     */
    public static double trueRad(double jdTt) {
        return meanRad(jdTt) + Nutation.obliquityRad(jdTt);
    }
}
