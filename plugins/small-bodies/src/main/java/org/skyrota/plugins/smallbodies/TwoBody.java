package org.skyrota.plugins.smallbodies;

/**
 * Two-body motion about the Sun on any conic, from the perihelion distance q, the eccentricity e
 * and the time from perihelion: the true anomaly and the radius vector (Meeus, Astronomical
 * Algorithms, 2nd ed., ch. 30, 33 and 34). The Sun's mass alone: the Gaussian gravitational
 * constant k = 0.01720209895, the mass of the body neglected.
 */
final class TwoBody {

    /** The Gaussian gravitational constant, radians per day for a = 1 AU. */
    static final double K = 0.01720209895;

    private TwoBody() {
    }

    /**
     * @param qAu     perihelion distance, AU, positive
     * @param e       eccentricity: below 1 an ellipse, exactly 1 a parabola, above 1 a hyperbola
     * @param dtDays  time since perihelion in days (negative before it)
     * @param out     receives out[0] = true anomaly in radians (−π, π], out[1] = radius vector in AU
     */
    static void anomalyAndRadius(double qAu, double e, double dtDays, double[] out) {
        double v;
        if (e < 1) {
            double a = qAu / (1 - e);
            double meanAnomaly = K / (a * Math.sqrt(a)) * dtDays;
            double ecc = eccentricAnomaly(Math.IEEEremainder(meanAnomaly, 2 * Math.PI), e);
            v = 2 * Math.atan2(Math.sqrt(1 + e) * Math.sin(ecc / 2), Math.sqrt(1 - e) * Math.cos(ecc / 2));
        } else if (e == 1) {
            v = 2 * Math.atan(barker(qAu, dtDays));
        } else {
            double a = qAu / (e - 1);
            double meanAnomaly = K / (a * Math.sqrt(a)) * dtDays;
            double h = hyperbolicAnomaly(meanAnomaly, e);
            v = 2 * Math.atan(Math.sqrt((e + 1) / (e - 1)) * Math.tanh(h / 2));
        }
        out[0] = v;
        // The polar equation of the conic keeps its precision for every e (no 1 − e cos E).
        out[1] = qAu * (1 + e) / (1 + e * Math.cos(v));
    }

    /**
     * Kepler's equation E − e sin E = M for 0 ≤ e &lt; 1 by Newton's method from Danby's start
     * E₀ = M + 0.85 e sign(sin M), kept inside a bracket that shrinks at each step (bisection when
     * a Newton step would leave it), so that it converges for every e and M, even for e close to 1.
     *
     * @param meanAnomaly M in [−π, π]
     */
    static double eccentricAnomaly(double meanAnomaly, double e) {
        if (meanAnomaly == 0) {
            return 0;
        }
        double lo = -Math.PI;
        double hi = Math.PI;
        double ecc = meanAnomaly + 0.85 * e * Math.signum(Math.sin(meanAnomaly));
        for (int i = 0; i < 200; i++) {
            double f = ecc - e * Math.sin(ecc) - meanAnomaly;
            if (f > 0) {
                hi = ecc;
            } else if (f < 0) {
                lo = ecc;
            } else {
                return ecc;
            }
            double next = ecc - f / (1 - e * Math.cos(ecc));
            if (!(next > lo && next < hi)) {
                next = 0.5 * (lo + hi);
            }
            if (Math.abs(next - ecc) <= 1e-15 * Math.max(1, Math.abs(ecc))) {
                return next;
            }
            ecc = next;
        }
        return ecc;
    }

    /** e sinh H − H = M for e &gt; 1, by Newton's method from H₀ = sign(M) ln(2|M|/e + 1.8). */
    static double hyperbolicAnomaly(double meanAnomaly, double e) {
        if (meanAnomaly == 0) {
            return 0;
        }
        double h = Math.signum(meanAnomaly) * Math.log(2 * Math.abs(meanAnomaly) / e + 1.8);
        for (int i = 0; i < 200; i++) {
            double step = (e * Math.sinh(h) - h - meanAnomaly) / (e * Math.cosh(h) - 1);
            h -= step;
            if (Math.abs(step) <= 1e-15 * Math.max(1, Math.abs(h))) {
                break;
            }
        }
        return h;
    }

    /**
     * Barker's equation for the parabola: s³ + 3s = W with W = 3k/√2 · t / q^{3/2} and s = tan(v/2),
     * solved in closed form (Meeus ch. 34) on |W| so that no difference of near-equal numbers
     * appears before perihelion.
     */
    static double barker(double qAu, double dtDays) {
        double w = 3 * K / Math.sqrt(2) * dtDays / (qAu * Math.sqrt(qAu));
        double aw = Math.abs(w);
        double y = Math.cbrt(aw / 2 + Math.sqrt(aw * aw / 4 + 1));
        return Math.signum(w) * (y - 1 / y);
    }
}
