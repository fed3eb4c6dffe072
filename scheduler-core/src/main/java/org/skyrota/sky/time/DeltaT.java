package org.skyrota.sky.time;

/**
 * ΔT = TT − UT1 from the polynomial expressions of Espenak and Meeus ("Five Millennium
 * Canon of Solar Eclipses: −1999 to +3000", NASA/TP-2006-214141, section "Polynomial
 * expressions for Delta T"). Valid from −1999 to +3000; outside that span the long-term
 * parabola −20 + 32 u² with u = (y − 1820)/100 is used, which is the same expression the
 * authors give for the remote past and future.
 *
 * <p>The polynomials do not include the small correction for a different lunar secular
 * acceleration; Skyrota's Moon theory (Meeus ch. 47) is close enough to the ephemeris the
 * expressions were fitted to for planning purposes.
 */
public final class DeltaT {

    private DeltaT() {
    }

    /**
     * ΔT in seconds for a decimal year (2000.0 is the start of 2000, 2000.5 its middle).
     *
     * @param decimalYear the year, positive or negative (astronomical numbering: 0 = 1 BC)
     * @return TT − UT1 in seconds
     */
    public static double espenakMeeusSeconds(double decimalYear) {
        double y = decimalYear;
        if (y < -500) {
            double u = (y - 1820) / 100;
            return -20 + 32 * u * u;
        }
        if (y < 500) {
            double u = y / 100;
            return 10583.6 + u * (-1014.41 + u * (33.78311 + u * (-5.952053
                    + u * (-0.1798452 + u * (0.022174192 + u * 0.0090316521)))));
        }
        if (y < 1600) {
            double u = (y - 1000) / 100;
            return 1574.2 + u * (-556.01 + u * (71.23472 + u * (0.319781
                    + u * (-0.8503463 + u * (-0.005050998 + u * 0.0083572073)))));
        }
        if (y < 1700) {
            double t = y - 1600;
            return 120 + t * (-0.9808 + t * (-0.01532 + t / 7129));
        }
        if (y < 1800) {
            double t = y - 1700;
            return 8.83 + t * (0.1603 + t * (-0.0059285 + t * (0.00013336 - t / 1174000)));
        }
        if (y < 1860) {
            double t = y - 1800;
            return 13.72 + t * (-0.332447 + t * (0.0068612 + t * (0.0041116 + t * (-0.00037436
                    + t * (0.0000121272 + t * (-0.0000001699 + t * 0.000000000875))))));
        }
        if (y < 1900) {
            double t = y - 1860;
            return 7.62 + t * (0.5737 + t * (-0.251754 + t * (0.01680668
                    + t * (-0.0004473624 + t / 233174))));
        }
        if (y < 1920) {
            double t = y - 1900;
            return -2.79 + t * (1.494119 + t * (-0.0598939 + t * (0.0061966 - t * 0.000197)));
        }
        if (y < 1941) {
            double t = y - 1920;
            return 21.20 + t * (0.84493 + t * (-0.076100 + t * 0.0020936));
        }
        if (y < 1961) {
            double t = y - 1950;
            return 29.07 + t * (0.407 + t * (-1.0 / 233 + t / 2547));
        }
        if (y < 1986) {
            double t = y - 1975;
            return 45.45 + t * (1.067 + t * (-1.0 / 260 - t / 718));
        }
        if (y < 2005) {
            double t = y - 2000;
            return 63.86 + t * (0.3345 + t * (-0.060374 + t * (0.0017275
                    + t * (0.000651814 + t * 0.00002373599))));
        }
        if (y < 2050) {
            double t = y - 2000;
            return 62.92 + t * (0.32217 + t * 0.005589);
        }
        if (y < 2150) {
            double u = (y - 1820) / 100;
            return -20 + 32 * u * u - 0.5628 * (2150 - y);
        }
        double u = (y - 1820) / 100;
        return -20 + 32 * u * u;
    }
}
