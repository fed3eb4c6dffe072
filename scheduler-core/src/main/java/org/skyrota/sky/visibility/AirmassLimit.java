package org.skyrota.sky.visibility;

import org.skyrota.sky.atmosphere.Airmass;

/** Turns an airmass limit into the apparent altitude where the airmass equals it. */
final class AirmassLimit {

    private AirmassLimit() {
    }

    /** Apparent altitude, degrees, where the Kasten–Young airmass equals {@code airmass}. */
    static double altitudeForAirmassDeg(double airmass) {
        if (airmass <= 1) {
            return 90;
        }
        double lo = -1;
        double hi = 90;
        // Airmass decreases monotonically with altitude: bisect to well under an arcsecond.
        for (int i = 0; i < 60; i++) {
            double mid = 0.5 * (lo + hi);
            if (Airmass.kastenYoung(mid) > airmass) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }
}
