package org.skyrota.plugins.solarsystem;

/** Kepler's equation for the nearly circular orbits of the major planets. */
final class Kepler {

    private Kepler() {
    }

    /**
     * Solves E − e sin E = M by Newton's method from E₀ = M + e sin M (enough for e below 0.3, where
     * it converges in a handful of steps to machine precision).
     *
     * @param meanAnomalyRad M in radians, any turn
     * @param e              eccentricity, 0 ≤ e &lt; 0.3
     */
    static double eccentricAnomaly(double meanAnomalyRad, double e) {
        double ecc = meanAnomalyRad + e * Math.sin(meanAnomalyRad);
        for (int i = 0; i < 20; i++) {
            double step = (ecc - e * Math.sin(ecc) - meanAnomalyRad) / (1 - e * Math.cos(ecc));
            ecc -= step;
            if (Math.abs(step) < 1e-14) {
                break;
            }
        }
        return ecc;
    }
}
