package org.skyrota.sky.visibility;

import java.util.List;
import org.skyrota.sky.bodies.Moon;
import org.skyrota.sky.coords.ApparentPlace;
import org.skyrota.sky.coords.Topocentric;
import org.skyrota.sky.events.Crossing;
import org.skyrota.sky.events.CrossingFinder;
import org.skyrota.sky.events.SkyAtSite;
import org.skyrota.sky.site.Night;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.time.SiderealTime;
import org.skyrota.sky.time.TimeScales;

/**
 * What every target shares on one night at one site, computed once for the batch path:
 * the night's bounds; the sidereal time as a linear function of time; the mapping from J2000
 * directions to apparent places of date (a rotation plus the aberration vector, calibrated
 * from the positional layer); the intervals allowed by darkness, the time window and the
 * Moon's illumination; the Moon's and the Sun's directions on a 20-minute grid for linear
 * interpolation; and the intervals when the Moon is up.
 */
final class SiteNightSky {

    /** Grid step of the Sun and Moon samples, seconds. */
    static final double GRID_SECONDS = 1200;
    private static final CrossingFinder FINDER = new CrossingFinder(GRID_SECONDS, 0.05, 1.5);
    /** Spacing of the exact Moon positions, seconds. */
    static final double MOON_NODE_SECONDS = 4 * 3600;

    final int nightIndex;
    final Night night;
    final double t0;
    final double t1;
    final double tm;
    final double lstAtMidRad;
    final double omegaRadPerSecond;
    final double secondsPerRad;
    final double siderealDaySeconds;
    final double yearsSinceJ2000;
    /** J2000 to apparent of date: v = R u + beta, then normalised (row-major R). */
    final double[] rotation = new double[9];
    final double[] aberration = new double[3];

    double[] allowed;
    int allowedCount;
    double[] moonUp;
    int moonUpCount;

    final int gridCount;
    private final double latRad;
    private final double sinLat;
    private final double cosLat;
    private final double elevationM;
    private QuadraticTrack sunRa;
    private QuadraticTrack sunDec;
    private QuadraticTrack moonGx;
    private QuadraticTrack moonGy;
    private QuadraticTrack moonGz;
    double[] moonX;
    double[] moonY;
    double[] moonZ;
    double moonMeanX;
    double moonMeanY;
    double moonMeanZ;
    double moonConeRadiusDeg;
    /** Cosine of (Moon separation limit + cone radius); NaN when the Moon is not needed. */
    double cosMoonClear = Double.NaN;
    double[] moonPhaseDeg;
    double[] moonIllumination;
    double[] sunX;
    double[] sunY;
    double[] sunZ;

    SiteNightSky(SiteLocation site, ObservingConstraints c, int nightIndex, Night night) {
        this.nightIndex = nightIndex;
        this.night = night;
        this.t0 = SkyAtSite.toEpochSecond(night.start());
        this.t1 = SkyAtSite.toEpochSecond(night.end());
        this.tm = 0.5 * (t0 + t1);
        SkyAtSite sky = new SkyAtSite(site);
        double lon = Math.toRadians(site.longitudeDeg());
        double g0 = gast(t0) + lon;
        double gm = gast(tm) + lon;
        double g1 = gast(t1) + lon;
        double turns = 1.00273781191135448 * (t1 - t0) / 86400.0;
        double span = g1 - g0 + 2 * Math.PI * Math.rint(turns - (g1 - g0) / (2 * Math.PI));
        this.omegaRadPerSecond = span / (t1 - t0);
        this.secondsPerRad = 1 / omegaRadPerSecond;
        this.siderealDaySeconds = 2 * Math.PI / omegaRadPerSecond;
        this.lstAtMidRad = gm;
        double jdTtMid = TimeScales.jdTt(night.middle());
        this.yearsSinceJ2000 = (jdTtMid - TimeScales.J2000_JD) / 365.25;
        calibrate(jdTtMid);

        this.gridCount = (int) Math.ceil((t1 - t0) / GRID_SECONDS) + 1;
        this.latRad = Math.toRadians(site.latitudeDeg());
        this.sinLat = Math.sin(latRad);
        this.cosLat = Math.cos(latRad);
        this.elevationM = site.elevationM();
        boolean moonNeeded = c.minMoonSeparationDeg().isPresent() || c.maxMoonIllumination().isPresent()
                || c.maxSkyBrightness().isPresent();
        boolean phaseNeeded = c.maxMoonIllumination().isPresent() || c.maxSkyBrightness().isPresent();
        double[] t = new double[gridCount];
        for (int i = 0; i < gridCount; i++) {
            t[i] = gridTime(i);
        }

        // The Sun: exact apparent places at the start, middle and end, quadratic in between
        // (its motion among the stars is so even that this is good to far below an arcsecond).
        double[] sunRaDec = new double[2];
        double[] ra = new double[3];
        double[] dec = new double[3];
        double half = 0.5 * (t1 - t0);
        for (int k = 0; k < 3; k++) {
            sky.sunRaDec(t0 + k * half, sunRaDec);
            ra[k] = sunRaDec[0];
            dec[k] = sunRaDec[1];
        }
        ra[1] = ra[0] + Math.IEEEremainder(ra[1] - ra[0], 2 * Math.PI);
        ra[2] = ra[1] + Math.IEEEremainder(ra[2] - ra[1], 2 * Math.PI);
        sunRa = new QuadraticTrack(t0, half, ra);
        sunDec = new QuadraticTrack(t0, half, dec);

        // Darkness and the time window.
        double[] buf = new double[64];
        double[] tmp = new double[64];
        int n;
        if (c.darkness() == Darkness.ANY) {
            buf[0] = t0;
            buf[1] = t1;
            n = 1;
        } else {
            double limit = c.darkness().sunAltitudeLimitDeg();
            double[] v = new double[gridCount];
            for (int i = 0; i < gridCount; i++) {
                v[i] = sunAltitudeDeg(t[i]) - limit;
            }
            n = intervalsWhere(FINDER.find(x -> sunAltitudeDeg(x) - limit, t, v), v[0] < 0, buf);
        }
        double earliest = c.earliest().map(SkyAtSite::toEpochSecond).orElse(t0);
        double latest = c.latest().map(SkyAtSite::toEpochSecond).orElse(t1);
        tmp[0] = Math.max(t0, earliest);
        tmp[1] = Math.min(t1, latest);
        double[] out = new double[64];
        n = tmp[1] > tmp[0] ? Intervals.intersect(buf, n, tmp, 1, out) : 0;

        if (moonNeeded && n > 0) {
            // The Moon: exact geocentric places every 4 hours, quadratic in between, made
            // topocentric exactly at each use.
            int nodes = QuadraticTrack.nodesFor(t0, t1, MOON_NODE_SECONDS);
            double[] gx = new double[nodes];
            double[] gy = new double[nodes];
            double[] gz = new double[nodes];
            double[] phase = phaseNeeded ? new double[nodes] : null;
            double[] illum = c.maxMoonIllumination().isPresent() ? new double[nodes] : null;
            double[] m = new double[5];
            for (int k = 0; k < nodes; k++) {
                double tk = t0 + k * MOON_NODE_SECONDS;
                double jdTt = TimeScales.jdTt(SkyAtSite.toInstant(tk));
                Moon.apparent(jdTt, m);
                double cd = Math.cos(m[1]);
                gx[k] = m[2] * cd * Math.cos(m[0]);
                gy[k] = m[2] * cd * Math.sin(m[0]);
                gz[k] = m[2] * Math.sin(m[1]);
                if (phase != null) {
                    phase[k] = Math.toDegrees(Moon.phaseAngleRad(jdTt));
                }
                if (illum != null) {
                    illum[k] = Moon.illuminatedFraction(jdTt);
                }
            }
            moonGx = new QuadraticTrack(t0, MOON_NODE_SECONDS, gx);
            moonGy = new QuadraticTrack(t0, MOON_NODE_SECONDS, gy);
            moonGz = new QuadraticTrack(t0, MOON_NODE_SECONDS, gz);
            moonX = new double[gridCount];
            moonY = new double[gridCount];
            moonZ = new double[gridCount];
            double[] limb = new double[gridCount];
            double[] topo = new double[4];
            for (int i = 0; i < gridCount; i++) {
                limb[i] = moonTopocentric(t[i], topo);
                double cd = Math.cos(topo[1]);
                moonX[i] = cd * Math.cos(topo[0]);
                moonY[i] = cd * Math.sin(topo[0]);
                moonZ[i] = Math.sin(topo[1]);
            }
            // A cone around the Moon's mean direction that holds it all night: a target farther
            // than the limit plus this radius is clear of the Moon all night (one dot product).
            double mx = 0;
            double my = 0;
            double mz = 0;
            for (int i = 0; i < gridCount; i++) {
                mx += moonX[i];
                my += moonY[i];
                mz += moonZ[i];
            }
            double norm = Math.sqrt(mx * mx + my * my + mz * mz);
            moonMeanX = mx / norm;
            moonMeanY = my / norm;
            moonMeanZ = mz / norm;
            double minCos = 1;
            for (int i = 0; i < gridCount; i++) {
                minCos = Math.min(minCos, moonMeanX * moonX[i] + moonMeanY * moonY[i] + moonMeanZ * moonZ[i]);
            }
            // Between grid points the linear interpolation stays within the chord; 0.05° covers
            // the curvature of the path over 20 minutes with a wide margin.
            moonConeRadiusDeg = Math.toDegrees(Math.acos(Math.min(1, minCos))) + 0.05;
            if (c.minMoonSeparationDeg().isPresent()) {
                double reach = c.minMoonSeparationDeg().getAsDouble() + moonConeRadiusDeg;
                cosMoonClear = reach < 180 ? Math.cos(Math.toRadians(reach)) : -2;
            }
            moonUp = new double[64];
            double[] scratch = new double[4];
            moonUpCount = intervalsWhere(FINDER.find(x -> moonTopocentric(x, scratch), t, limb), limb[0] > 0, moonUp);
            if (phaseNeeded) {
                QuadraticTrack p = new QuadraticTrack(t0, MOON_NODE_SECONDS, phase);
                moonPhaseDeg = new double[gridCount];
                for (int i = 0; i < gridCount; i++) {
                    moonPhaseDeg[i] = p.at(t[i]);
                }
            }
            if (illum != null) {
                QuadraticTrack il = new QuadraticTrack(t0, MOON_NODE_SECONDS, illum);
                moonIllumination = new double[gridCount];
                for (int i = 0; i < gridCount; i++) {
                    moonIllumination[i] = il.at(t[i]);
                }
                double max = c.maxMoonIllumination().getAsDouble();
                // Bright-Moon intervals from the grid by linear interpolation of the fraction.
                double[] flips = new double[gridCount];
                int nf = 0;
                double prev = illumination(0) - max;
                for (int i = 1; i < gridCount; i++) {
                    double cur = illumination(i) - max;
                    if ((prev > 0) != (cur > 0)) {
                        flips[nf++] = t[i - 1] + (t[i] - t[i - 1]) * prev / (prev - cur);
                    }
                    prev = cur;
                }
                double[] bright = new double[64];
                int nb = Intervals.fromFlips(illumination(0) - max > 0, flips, nf, t0, t1, bright);
                double[] bad = new double[64];
                int nbad = Intervals.intersect(bright, nb, moonUp, moonUpCount, bad);
                double[] good = new double[64];
                int ng = Intervals.complement(bad, nbad, t0, t1, good);
                n = Intervals.intersect(out, n, good, ng, buf);
                System.arraycopy(buf, 0, out, 0, 2 * n);
            }
        }
        allowed = out;
        allowedCount = n;

        if (c.minSunSeparationDeg().isPresent()) {
            sunX = new double[gridCount];
            sunY = new double[gridCount];
            sunZ = new double[gridCount];
            for (int i = 0; i < gridCount; i++) {
                double a = sunRa.at(t[i]);
                double d = sunDec.at(t[i]);
                double cd = Math.cos(d);
                sunX[i] = cd * Math.cos(a);
                sunY[i] = cd * Math.sin(a);
                sunZ[i] = Math.sin(d);
            }
        }
    }

    /** Geocentric geometric altitude of the Sun's centre, degrees, from the quadratic track. */
    double sunAltitudeDeg(double t) {
        double d = sunDec.at(t);
        double h = lstRad(t) - sunRa.at(t);
        return Math.toDegrees(Math.asin(sinLat * Math.sin(d) + cosLat * Math.cos(d) * Math.cos(h)));
    }

    /**
     * The Moon's topocentric place (out[0] ra, out[1] dec, radians) at t; returns the height of
     * its upper limb above the horizon with 34′ refraction, degrees (positive while up).
     */
    double moonTopocentric(double t, double[] out) {
        double x = moonGx.at(t);
        double y = moonGy.at(t);
        double z = moonGz.at(t);
        double dist = Math.sqrt(x * x + y * y + z * z);
        double lst = lstRad(t);
        Topocentric.correct(Math.atan2(y, x), Math.asin(z / dist), dist, lst, latRad, elevationM, out);
        double alt = Math.toDegrees(Math.asin(sinLat * Math.sin(out[1])
                + cosLat * Math.cos(out[1]) * Math.cos(lst - out[0])));
        return alt + Math.toDegrees(Math.asin(SkyAtSite.MOON_RADIUS_KM / dist)) + SkyAtSite.HORIZON_REFRACTION_DEG;
    }

    double gridTime(int i) {
        return Math.min(t1, t0 + i * GRID_SECONDS);
    }

    private double illumination(int i) {
        return moonIllumination[i];
    }

    /** Local apparent sidereal time, radians (unreduced), at epoch second t. */
    double lstRad(double t) {
        return lstAtMidRad + omegaRadPerSecond * (t - tm);
    }

    private static double gast(double epochSecond) {
        var t = SkyAtSite.toInstant(epochSecond);
        return SiderealTime.gastRad(TimeScales.jdUt1(t), TimeScales.jdTt(t));
    }

    /**
     * Calibrates v = R u + beta from the apparent places of the six axis directions: to first
     * order in the aberration, a(+e) − a(−e) = 2 R e and Σ (a(+e) + a(−e)) = 4 beta (the
     * neglected terms are of order beta², about 10⁻⁸ rad).
     */
    private void calibrate(double jdTt) {
        double[][] axes = {{0, 0}, {Math.PI, 0}, {Math.PI / 2, 0}, {1.5 * Math.PI, 0}, {0, Math.PI / 2},
            {0, -Math.PI / 2}};
        double[][] a = new double[6][3];
        double[] out = new double[2];
        for (int k = 0; k < 6; k++) {
            ApparentPlace.ofDate(axes[k][0], axes[k][1], 0, 0, jdTt, out);
            double cd = Math.cos(out[1]);
            a[k][0] = cd * Math.cos(out[0]);
            a[k][1] = cd * Math.sin(out[0]);
            a[k][2] = Math.sin(out[1]);
        }
        for (int col = 0; col < 3; col++) {
            double[] plus = a[2 * col];
            double[] minus = a[2 * col + 1];
            for (int row = 0; row < 3; row++) {
                rotation[3 * row + col] = 0.5 * (plus[row] - minus[row]);
                aberration[row] += 0.25 * (plus[row] + minus[row]);
            }
        }
    }

    /** Intervals where the quantity holds, from its crossings and its state at the start. */
    private int intervalsWhere(List<Crossing> crossings, boolean holdsAtStart, double[] out) {
        double[] flips = new double[crossings.size()];
        for (int i = 0; i < flips.length; i++) {
            flips[i] = crossings.get(i).epochSecond();
        }
        return Intervals.fromFlips(holdsAtStart, flips, flips.length, t0, t1, out);
    }
}
