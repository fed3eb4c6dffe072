package org.skyrota.plugins.solarsystem;

import java.util.Locale;

/**
 * The major planets and the Earth–Moon barycentre with their Keplerian elements and rates from
 * E. M. Standish, "Keplerian Elements for Approximate Positions of the Major Planets" (JPL Solar
 * System Dynamics), Table 1, valid 1800 AD to 2050 AD: semi-major axis a (AU), eccentricity e,
 * inclination I, mean longitude L, longitude of perihelion ϖ and longitude of the ascending node Ω
 * (degrees), each with its rate per Julian century of TT from J2000.0, referred to the mean
 * ecliptic and equinox of J2000.
 *
 * <p>The document's approximate errors for 1800–2050 are kept with each body (right ascension and
 * declination in arcseconds, heliocentric distance in thousands of km).
 */
enum Planet {
    MERCURY(0.38709927, 0.00000037, 0.20563593, 0.00001906, 7.00497902, -0.00594749,
            252.25032350, 149472.67411175, 77.45779628, 0.16047689, 48.33076593, -0.12534081, 15, 1, 1),
    VENUS(0.72333566, 0.00000390, 0.00677672, -0.00004107, 3.39467605, -0.00078890,
            181.97909950, 58517.81538729, 131.60246718, 0.00268329, 76.67984255, -0.27769418, 20, 1, 4),
    EARTH_MOON_BARYCENTRE(1.00000261, 0.00000562, 0.01671123, -0.00004392, -0.00001531, -0.01294668,
            100.46457166, 35999.37244981, 102.93768193, 0.32327364, 0.0, 0.0, 20, 8, 6),
    MARS(1.52371034, 0.00001847, 0.09339410, 0.00007882, 1.84969142, -0.00813131,
            -4.55343205, 19140.30268499, -23.94362959, 0.44441088, 49.55953891, -0.29257343, 40, 2, 25),
    JUPITER(5.20288700, -0.00011607, 0.04838624, -0.00013253, 1.30439695, -0.00183714,
            34.39644051, 3034.74612775, 14.72847983, 0.21252668, 100.47390909, 0.20469106, 400, 10, 600),
    SATURN(9.53667594, -0.00125060, 0.05386179, -0.00050991, 2.48599187, 0.00193609,
            49.95424423, 1222.49362201, 92.59887831, -0.41897216, 113.66242448, -0.28867794, 600, 25, 1500),
    URANUS(19.18916464, -0.00196176, 0.04725744, -0.00004397, 0.77263783, -0.00242939,
            313.23810451, 428.48202785, 170.95427630, 0.40805281, 74.01692503, 0.04240589, 50, 2, 1000),
    NEPTUNE(30.06992276, 0.00026291, 0.00859048, 0.00005105, 1.77004347, 0.00035372,
            -55.12002969, 218.45945325, 44.96476227, -0.32241464, 131.78422574, -0.00508664, 10, 1, 200);

    final double a0;
    final double aRate;
    final double e0;
    final double eRate;
    final double i0Rad;
    final double iRateRad;
    final double l0Rad;
    final double lRateRad;
    final double peri0Rad;
    final double periRateRad;
    final double node0Rad;
    final double nodeRateRad;
    /** The document's approximate error in right ascension, 1800–2050, arcseconds. */
    final double raErrorArcsec;
    /** The document's approximate error in declination, 1800–2050, arcseconds. */
    final double decErrorArcsec;
    /** The document's approximate error in heliocentric distance, 1800–2050, thousands of km. */
    final double distanceErrorThousandKm;

    Planet(double a0, double aRate, double e0, double eRate, double iDeg, double iRate, double lDeg, double lRate,
            double periDeg, double periRate, double nodeDeg, double nodeRate,
            double raErrorArcsec, double decErrorArcsec, double distanceErrorThousandKm) {
        this.a0 = a0;
        this.aRate = aRate;
        this.e0 = e0;
        this.eRate = eRate;
        this.i0Rad = Math.toRadians(iDeg);
        this.iRateRad = Math.toRadians(iRate);
        this.l0Rad = Math.toRadians(lDeg);
        this.lRateRad = Math.toRadians(lRate);
        this.peri0Rad = Math.toRadians(periDeg);
        this.periRateRad = Math.toRadians(periRate);
        this.node0Rad = Math.toRadians(nodeDeg);
        this.nodeRateRad = Math.toRadians(nodeRate);
        this.raErrorArcsec = raErrorArcsec;
        this.decErrorArcsec = decErrorArcsec;
        this.distanceErrorThousandKm = distanceErrorThousandKm;
    }

    /** "Venus", "Earth–Moon barycentre". */
    String label() {
        if (this == EARTH_MOON_BARYCENTRE) {
            return "Earth–Moon barycentre";
        }
        String n = name().toLowerCase(Locale.ROOT);
        return Character.toUpperCase(n.charAt(0)) + n.substring(1);
    }

    /**
     * Heliocentric position, mean ecliptic and equinox of J2000, by the document's recipe: the
     * elements at T, M = L − ϖ, ω = ϖ − Ω, Kepler's equation, then the rotation to the ecliptic.
     *
     * @param out receives x, y, z in AU in out[0..2]
     */
    void heliocentricEclipticJ2000(double jdTt, double[] out) {
        double t = (jdTt - 2451545.0) / 36525.0;
        double a = a0 + aRate * t;
        double e = e0 + eRate * t;
        double inc = i0Rad + iRateRad * t;
        double meanLongitude = l0Rad + lRateRad * t;
        double peri = peri0Rad + periRateRad * t;
        double node = node0Rad + nodeRateRad * t;
        double argPeri = peri - node;
        double meanAnomaly = Math.IEEEremainder(meanLongitude - peri, 2 * Math.PI);
        double eccentricAnomaly = Kepler.eccentricAnomaly(meanAnomaly, e);
        double xp = a * (Math.cos(eccentricAnomaly) - e);
        double yp = a * Math.sqrt(1 - e * e) * Math.sin(eccentricAnomaly);
        double cw = Math.cos(argPeri);
        double sw = Math.sin(argPeri);
        double cn = Math.cos(node);
        double sn = Math.sin(node);
        double ci = Math.cos(inc);
        double si = Math.sin(inc);
        out[0] = (cw * cn - sw * sn * ci) * xp + (-sw * cn - cw * sn * ci) * yp;
        out[1] = (cw * sn + sw * cn * ci) * xp + (-sw * sn + cw * cn * ci) * yp;
        out[2] = (sw * si) * xp + (cw * si) * yp;
    }
}
