package org.skyrota.sky.visibility;

import java.time.LocalDate;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import java.util.stream.IntStream;
import org.skyrota.sky.atmosphere.MoonlightSkyBrightness;
import org.skyrota.sky.atmosphere.Refraction;
import org.skyrota.sky.events.SkyAtSite;
import org.skyrota.sky.site.Night;
import org.skyrota.sky.site.SiteLocation;

/**
 * Visibility windows for many targets × sites × nights at little cost per target-night.
 *
 * <p>Per site-night, once: bounds, sidereal time as a linear function of time, the J2000 to
 * apparent-of-date mapping, the intervals allowed by darkness, time window and Moon
 * illumination, and the Moon and Sun on a 20-minute grid ({@link SiteNightSky}). Per target and
 * night: the apparent place from that mapping; the altitude interval in closed form from the
 * hour angle (cos H = (sin h − sin φ sin δ)/(cos φ cos δ), h the geometric altitude that
 * refracts to the limit); intersection with the allowed intervals on primitive arrays; then,
 * only where they can bite, the horizon profile (sampled each minute and refined), the Moon and
 * Sun separations (bisection with a bound on how fast the separation can change, so a Moon far
 * from the target costs one evaluation), and the sky brightness (sampled each two minutes and
 * refined). Targets run in parallel over the common fork-join pool.
 *
 * <p>Agrees with {@link VisibilityCalculator} to within a few seconds at window boundaries
 * (tested against it); windows shorter than {@link VisibilityWindow#MIN_DURATION} are dropped by
 * both.
 */
public final class BatchVisibility {

    /**
     * Bound on the rate of the Moon's topocentric motion among the stars: at most 0.64°/h along
     * its orbit plus at most 0.27°/h from the turning parallax (common practice, no source);
     * rounded up.
     */
    static final double MOON_RATE_DEG_PER_SECOND = 1.0 / 3600;
    /** Bound on the Sun's motion among the stars, 0.042°/h (common practice, no source), rounded up. */
    static final double SUN_RATE_DEG_PER_SECOND = 0.05 / 3600;
    private static final double RESOLUTION_SECONDS = 0.25;
    /** Cell lengths of the separation check once the body is within reach, seconds. */
    private static final double[] CELL_SECONDS = {3600, 600};
    private static final double HORIZON_STEP_SECONDS = 60;
    private static final double BRIGHTNESS_STEP_SECONDS = 120;
    private static final int CHUNK = 32;
    private static final double TWO_PI = 2 * Math.PI;
    private static final double INV_TWO_PI = 1 / TWO_PI;

    private BatchVisibility() {
    }

    /** Windows of one target at one site, by the batch path. */
    public static List<VisibilityWindow> windows(SiteLocation site, FixedTarget target,
            ObservingConstraints constraints, LocalDate from, LocalDate to) {
        return compute(List.of(site), List.of(target), constraints, from, to).windows(0, 0);
    }

    /** Windows of every target at every site on every night from {@code from} to {@code to} inclusive. */
    public static Result compute(List<SiteLocation> sites, List<FixedTarget> targets,
            ObservingConstraints constraints, LocalDate from, LocalDate to) {
        Objects.requireNonNull(sites, "sites");
        Objects.requireNonNull(targets, "targets");
        Objects.requireNonNull(constraints, "constraints");
        Objects.requireNonNull(from, "from");
        Objects.requireNonNull(to, "to");
        if (to.isBefore(from)) {
            throw new IllegalArgumentException("to must not be before from: from " + from + ", to " + to);
        }
        int nights = (int) ChronoUnit.DAYS.between(from, to) + 1;
        int nSites = sites.size();
        SiteNightSky[][] sky = new SiteNightSky[nSites][nights];
        IntStream.range(0, nSites * nights).parallel().forEach(k -> {
            int s = k / nights;
            int d = k % nights;
            SiteLocation site = sites.get(s);
            sky[s][d] = new SiteNightSky(site, constraints, d, Night.of(site, from.plusDays(d)));
        });
        SiteConstants[] siteConstants = new SiteConstants[nSites];
        for (int s = 0; s < nSites; s++) {
            siteConstants[s] = new SiteConstants(sites.get(s), constraints);
        }
        TargetArrays t = new TargetArrays(targets);
        int nTargets = targets.size();
        float[][] data = new float[nSites * nTargets][];
        int[] counts = new int[nSites * nTargets];
        int chunks = (nTargets + CHUNK - 1) / CHUNK;
        IntStream.range(0, chunks).parallel().forEach(chunk -> {
            Worker w = new Worker(constraints);
            int end = Math.min(nTargets, (chunk + 1) * CHUNK);
            for (int s = 0; s < nSites; s++) {
                SiteConstants sc = siteConstants[s];
                for (int i = chunk * CHUNK; i < end; i++) {
                    w.beginSink();
                    for (int d = 0; d < nights; d++) {
                        w.targetNight(sc, sky[s][d], t, i);
                    }
                    data[s * nTargets + i] = w.sinkCopy();
                    counts[s * nTargets + i] = w.sinkCount();
                }
            }
        });
        double[][] nightStarts = new double[nSites][nights];
        LocalDate[] dates = new LocalDate[nights];
        for (int d = 0; d < nights; d++) {
            dates[d] = from.plusDays(d);
            for (int s = 0; s < nSites; s++) {
                nightStarts[s][d] = sky[s][d].t0;
            }
        }
        return new Result(nSites, nTargets, dates, nightStarts, data, counts);
    }

    /** The windows of a batch, stored compactly; read them per site and target. */
    public static final class Result {
        private final int sites;
        private final int targets;
        private final LocalDate[] dates;
        private final double[][] nightStarts;
        private final float[][] data;
        private final int[] counts;

        private Result(int sites, int targets, LocalDate[] dates, double[][] nightStarts, float[][] data,
                int[] counts) {
            this.sites = sites;
            this.targets = targets;
            this.dates = dates;
            this.nightStarts = nightStarts;
            this.data = data;
            this.counts = counts;
        }

        public int siteCount() {
            return sites;
        }

        public int targetCount() {
            return targets;
        }

        public int nightCount() {
            return dates.length;
        }

        /** Total number of windows over all sites, targets and nights. */
        public long windowCount() {
            long sum = 0;
            for (int c : counts) {
                sum += c;
            }
            return sum;
        }

        public int windowCount(int siteIndex, int targetIndex) {
            return counts[index(siteIndex, targetIndex)];
        }

        /** The windows of one target at one site, in time order. */
        public List<VisibilityWindow> windows(int siteIndex, int targetIndex) {
            int k = index(siteIndex, targetIndex);
            float[] w = data[k];
            List<VisibilityWindow> out = new ArrayList<>(counts[k]);
            for (int j = 0; j < counts[k]; j++) {
                int night = (int) w[4 * j];
                double base = nightStarts[siteIndex][night];
                out.add(new VisibilityWindow(dates[night], SkyAtSite.toInstant(base + w[4 * j + 1]),
                        SkyAtSite.toInstant(base + w[4 * j + 2]), w[4 * j + 3]));
            }
            return out;
        }

        private int index(int siteIndex, int targetIndex) {
            Objects.checkIndex(siteIndex, sites);
            Objects.checkIndex(targetIndex, targets);
            return siteIndex * targets + targetIndex;
        }
    }

    /** Site quantities that do not change from night to night. */
    private static final class SiteConstants {
        final SiteLocation site;
        final double sinLat;
        final double cosLat;
        final double minApparentDeg;
        final double sinMinTrue;
        final boolean horizonBites;
        final double sinProfileMaxTrue;

        SiteConstants(SiteLocation site, ObservingConstraints c) {
            this.site = site;
            double lat = Math.toRadians(site.latitudeDeg());
            this.sinLat = Math.sin(lat);
            this.cosLat = Math.cos(lat);
            this.minApparentDeg = c.effectiveMinAltitudeDeg();
            this.sinMinTrue = Math.sin(Math.toRadians(trueAltitudeFor(site, minApparentDeg)));
            double profileMax = site.horizon().maxAltitudeDeg();
            this.horizonBites = !site.horizon().isFlat() && profileMax > minApparentDeg;
            this.sinProfileMaxTrue = horizonBites ? Math.sin(Math.toRadians(trueAltitudeFor(site, profileMax))) : 0;
        }

        /**
         * The geometric altitude whose refracted altitude is {@code apparentDeg}, by inverting
         * the same refraction the per-instant path applies (so both paths share one threshold).
         */
        static double trueAltitudeFor(SiteLocation site, double apparentDeg) {
            double lo = apparentDeg - 2;
            double hi = apparentDeg + 0.01;
            for (int i = 0; i < 60; i++) {
                double mid = 0.5 * (lo + hi);
                if (Refraction.apparentFromTrueDeg(mid, site.pressureHpa(), site.temperatureC()) < apparentDeg) {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
            return 0.5 * (lo + hi);
        }
    }

    /** Targets as J2000 unit vectors and proper-motion vectors (radians per Julian year). */
    private static final class TargetArrays {
        final double[] ux;
        final double[] uy;
        final double[] uz;
        final double[] px;
        final double[] py;
        final double[] pz;

        TargetArrays(List<FixedTarget> targets) {
            int n = targets.size();
            ux = new double[n];
            uy = new double[n];
            uz = new double[n];
            px = new double[n];
            py = new double[n];
            pz = new double[n];
            for (int i = 0; i < n; i++) {
                FixedTarget t = Objects.requireNonNull(targets.get(i), "targets[" + i + "]");
                double ra = t.raRad();
                double dec = t.decRad();
                double sa = Math.sin(ra);
                double ca = Math.cos(ra);
                double sd = Math.sin(dec);
                double cd = Math.cos(dec);
                ux[i] = cd * ca;
                uy[i] = cd * sa;
                uz[i] = sd;
                double mua = t.pmRaCosDecRadPerYear();
                double mud = t.pmDecRadPerYear();
                px[i] = -sa * mua - sd * ca * mud;
                py[i] = ca * mua - sd * sa * mud;
                pz[i] = cd * mud;
            }
        }
    }

    /** One thread's scratch space and the per-target-night steps. Not thread-safe. */
    private static final class Worker {
        private final ObservingConstraints c;
        private final boolean moonSep;
        private final double minMoonSepDeg;
        private final boolean sunSep;
        private final double minSunSepDeg;
        private final boolean brightness;
        private final double maxBrightness;
        private double[] a = new double[128];
        private double[] b = new double[128];
        private double[] x = new double[128];
        private double[] bad = new double[128];
        private float[] sink = new float[4 * 64];
        private int sinkCount;

        // State of the current target-night, read by the separation and predicate functions.
        private SiteNightSky sn;
        private SiteConstants sc;
        private double vx;
        private double vy;
        private double vz;
        private double sinDec;
        private double cosDec;
        private double alpha;
        private int prevTarget = -1;
        private int prevNight = -2;
        private double prevX;
        private double prevY;
        private double prevAlpha;
        private int alphaKey = -1;
        private int arcTarget = -2;
        private int arcNight = -2;
        private double arcSinH = Double.NaN;
        private double prevCosH;
        private double prevArc;

        Worker(ObservingConstraints c) {
            this.c = c;
            this.moonSep = c.minMoonSeparationDeg().isPresent();
            this.minMoonSepDeg = c.minMoonSeparationDeg().orElse(0);
            this.sunSep = c.minSunSeparationDeg().isPresent();
            this.minSunSepDeg = c.minSunSeparationDeg().orElse(0);
            this.brightness = c.maxSkyBrightness().isPresent();
            this.maxBrightness = c.maxSkyBrightness().orElse(0);
        }

        void beginSink() {
            sinkCount = 0;
        }

        float[] sinkCopy() {
            return Arrays.copyOf(sink, 4 * sinkCount);
        }

        int sinkCount() {
            return sinkCount;
        }

        void targetNight(SiteConstants sc, SiteNightSky sn, TargetArrays t, int i) {
            if (sn.allowedCount == 0) {
                return;
            }
            this.sc = sc;
            this.sn = sn;
            double yrs = sn.yearsSinceJ2000;
            double qx = t.ux[i] + t.px[i] * yrs;
            double qy = t.uy[i] + t.py[i] * yrs;
            double qz = t.uz[i] + t.pz[i] * yrs;
            double[] r = sn.rotation;
            double[] ab = sn.aberration;
            double wx = r[0] * qx + r[1] * qy + r[2] * qz + ab[0];
            double wy = r[3] * qx + r[4] * qy + r[5] * qz + ab[1];
            double wz = r[6] * qx + r[7] * qy + r[8] * qz + ab[2];
            double inv = 1 / Math.sqrt(wx * wx + wy * wy + wz * wz);
            vx = wx * inv;
            vy = wy * inv;
            vz = wz * inv;
            sinDec = vz;
            double rxy2 = vx * vx + vy * vy;
            cosDec = Math.sqrt(rxy2);
            // The apparent place moves by well under a milliradian from one night to the next, so
            // the right ascension follows from last night's by the small-angle difference (error
            // below 1e-10 rad); atan2 only for a new target or after a gap.
            if (prevTarget == i && prevNight == sn.nightIndex - 1 && rxy2 > 1e-6) {
                double cross = prevX * vy - prevY * vx;
                double dot = prevX * vx + prevY * vy;
                double d = cross / dot;
                alpha = prevAlpha + d - d * d * d / 3;
            } else {
                alpha = Math.atan2(vy, vx);
            }
            prevTarget = i;
            alphaKey = i;
            prevNight = sn.nightIndex;
            prevX = vx;
            prevY = vy;
            prevAlpha = alpha;

            int n = altitudeIntervals(sc.sinMinTrue, a);
            if (n == 0) {
                return;
            }
            n = Intervals.intersect(a, n, sn.allowed, sn.allowedCount, b);
            if (n == 0) {
                return;
            }
            double[] cur = b;
            if (sc.horizonBites) {
                n = applyHorizon(cur, n);
                cur = b;
            }
            if (n > 0 && moonSep && sn.moonUpCount > 0
                    && vx * sn.moonMeanX + vy * sn.moonMeanY + vz * sn.moonMeanZ > sn.cosMoonClear) {
                int nx = Intervals.intersect(cur, n, sn.moonUp, sn.moonUpCount, x);
                int nbad = 0;
                for (int k = 0; k < nx; k++) {
                    nbad = badWhere(true, x[2 * k], x[2 * k + 1], nbad);
                }
                if (nbad > 0) {
                    n = subtract(cur, n, nbad);
                    cur = b;
                }
            }
            if (n > 0 && sunSep) {
                int nbad = 0;
                for (int k = 0; k < n; k++) {
                    nbad = badWhere(false, cur[2 * k], cur[2 * k + 1], nbad);
                }
                if (nbad > 0) {
                    n = subtract(cur, n, nbad);
                    cur = b;
                }
            }
            if (n > 0 && brightness) {
                int m = 0;
                for (int k = 0; k < n; k++) {
                    m = sampleWhere(PREDICATE_BRIGHTNESS, cur[2 * k], cur[2 * k + 1], BRIGHTNESS_STEP_SECONDS, x, m);
                }
                System.arraycopy(x, 0, b, 0, 2 * m);
                n = m;
                cur = b;
            }
            for (int k = 0; k < n; k++) {
                double s = cur[2 * k];
                double e = cur[2 * k + 1];
                if (e - s >= VisibilityWindow.MIN_DURATION.getSeconds()) {
                    emit(s, e);
                }
            }
        }

        /** Intervals of the night where the geometric altitude is at least asin(sinH). */
        private int altitudeIntervals(double sinH, double[] out) {
            double cp = sc.cosLat * cosDec;
            if (cp < 1e-12) {
                if (sc.sinLat * sinDec >= sinH) {
                    out[0] = sn.t0;
                    out[1] = sn.t1;
                    return 1;
                }
                return 0;
            }
            double cosH = (sinH - sc.sinLat * sinDec) / cp;
            if (cosH <= -1) {
                out[0] = sn.t0;
                out[1] = sn.t1;
                return 1;
            }
            if (cosH >= 1) {
                return 0;
            }
            double inv = sn.secondsPerRad;
            double half = halfArc(sinH, cosH) * inv;
            double sid = sn.siderealDaySeconds;
            double hm = sn.lstAtMidRad - alpha;
            hm -= TWO_PI * Math.rint(hm * INV_TWO_PI);
            // The transit nearest the middle, then back to the earliest whose arc reaches the night.
            double tk = sn.tm - hm * inv;
            if (tk - sid + half > sn.t0) {
                tk -= sid * (Math.ceil((tk + half - sn.t0) / sid) - 1);
            }
            int n = 0;
            for (; tk - half < sn.t1; tk += sid) {
                double s = Math.max(sn.t0, tk - half);
                double e = Math.min(sn.t1, tk + half);
                if (e > s) {
                    n = Intervals.append(out, n, s, e);
                }
            }
            return n;
        }

        /**
         * acos(cosH). From one night to the next cosH changes by ~1e-6, so the arc follows from
         * last night's by a second-order Taylor step (third-order error below 2e-9 rad under the
         * guards), which costs no acos; acos itself otherwise.
         */
        private double halfArc(double sinH, double cosH) {
            double s2 = 1 - prevCosH * prevCosH;
            double dc = cosH - prevCosH;
            double arc;
            if (arcTarget == alphaKey && arcNight == sn.nightIndex - 1 && arcSinH == sinH && s2 > 0.04
                    && Math.abs(dc) < 1e-4) {
                double s = Math.sqrt(s2);
                arc = prevArc - dc / s - prevCosH * dc * dc / (2 * s * s2);
            } else {
                arc = Math.acos(cosH);
            }
            arcTarget = alphaKey;
            arcNight = sn.nightIndex;
            arcSinH = sinH;
            prevCosH = cosH;
            prevArc = arc;
            return arc;
        }

        /** Geometric altitude (degrees) of the current target at time t. */
        private double trueAltitudeDeg(double t) {
            double h = sn.lstRad(t) - alpha;
            return Math.toDegrees(Math.asin(sc.sinLat * sinDec + sc.cosLat * cosDec * Math.cos(h)));
        }

        private double apparentAltitudeDeg(double t) {
            return Refraction.apparentFromTrueDeg(trueAltitudeDeg(t), sc.site.pressureHpa(), sc.site.temperatureC());
        }

        private double azimuthDeg(double t) {
            double h = sn.lstRad(t) - alpha;
            double az = Math.atan2(-cosDec * Math.sin(h), sinDec * sc.cosLat - cosDec * sc.sinLat * Math.cos(h));
            double deg = Math.toDegrees(az);
            return deg < 0 ? deg + 360 : deg;
        }

        private int applyHorizon(double[] cur, int n) {
            // Where the altitude clears the profile's highest point the profile cannot bite;
            // only the rest is sampled.
            int ni = altitudeIntervals(sc.sinProfileMaxTrue, a);
            ni = Intervals.intersect(a, ni, cur, n, x);
            int nu = Intervals.complement(x, ni, sn.t0, sn.t1, a);
            nu = Intervals.intersect(a, nu, cur, n, bad);
            int m = 0;
            double[] ok = new double[Math.max(128, 4 * nu + 8)];
            for (int k = 0; k < nu; k++) {
                m = sampleWhere(PREDICATE_HORIZON, bad[2 * k], bad[2 * k + 1], HORIZON_STEP_SECONDS, ok, m);
            }
            ensure(ni + m);
            return Intervals.union(x, ni, ok, m, b);
        }

        private void ensure(int intervals) {
            if (2 * intervals > b.length) {
                b = Arrays.copyOf(b, 4 * intervals);
                a = Arrays.copyOf(a, 4 * intervals);
                x = Arrays.copyOf(x, 4 * intervals);
                bad = Arrays.copyOf(bad, 4 * intervals);
            }
        }

        /** cur minus the bad list, written to b. */
        private int subtract(double[] cur, int n, int nbad) {
            ensure(n + nbad + 1);
            int ng = Intervals.complement(bad, nbad, sn.t0, sn.t1, a);
            double[] tmp = new double[2 * (n + ng) + 2];
            int m = Intervals.intersect(cur, n, a, ng, tmp);
            System.arraycopy(tmp, 0, b, 0, 2 * m);
            return m;
        }

        /** Separation (degrees) between the target and the Moon (moon) or the Sun at time t. */
        private double separationDeg(boolean moon, double t) {
            return Math.toDegrees(Math.acos(cosSeparation(moon, t)));
        }

        /** Cosine of the separation between the target and the Moon (moon) or the Sun at time t. */
        private double cosSeparation(boolean moon, double t) {
            double[] gx = moon ? sn.moonX : sn.sunX;
            double[] gy = moon ? sn.moonY : sn.sunY;
            double[] gz = moon ? sn.moonZ : sn.sunZ;
            int last = sn.gridCount - 1;
            int i = (int) ((t - sn.t0) / SiteNightSky.GRID_SECONDS);
            if (i >= last) {
                i = last - 1;
            }
            if (i < 0) {
                i = 0;
            }
            double ti = sn.gridTime(i);
            double f = (t - ti) / (sn.gridTime(i + 1) - ti);
            double mx = gx[i] + f * (gx[i + 1] - gx[i]);
            double my = gy[i] + f * (gy[i + 1] - gy[i]);
            double mz = gz[i] + f * (gz[i + 1] - gz[i]);
            double dot = (vx * mx + vy * my + vz * mz) / Math.sqrt(mx * mx + my * my + mz * mz);
            return Math.max(-1, Math.min(1, dot));
        }

        /**
         * Appends to {@code bad} the parts of [s, e] where the separation is below its limit,
         * bisecting with the bound on its rate: a half that provably keeps (or breaks) the limit
         * throughout is settled without looking inside.
         */
        private int badWhere(boolean moon, double s, double e, int nbad) {
            double rate = moon ? MOON_RATE_DEG_PER_SECOND : SUN_RATE_DEG_PER_SECOND;
            double limit = moon ? minMoonSepDeg : minSunSepDeg;
            double half = 0.5 * (e - s);
            // Separations are compared as cosines (sep ≥ x ⇔ cos sep ≤ cos x on [0°, 180°]).
            // Most often the body is far from the target: one evaluation settles the interval.
            if (limit + rate * half < 180 && cosSeparation(moon, s + half) <= Math.cos(Math.toRadians(limit + rate * half))) {
                return nbad;
            }
            // Otherwise hour-long cells, then ten-minute cells, each settled from its two ends
            // when it can be, and halved down to the resolution where it cannot.
            return cellPass(moon, s, e, 0, rate, limit, nbad);
        }

        private int cellPass(boolean moon, double s, double e, int level, double rate, double limit, int nbad) {
            if (level == CELL_SECONDS.length) {
                return bisectBad(moon, s, e, rate, limit, Math.cos(Math.toRadians(limit)), nbad);
            }
            int cells = Math.max(1, (int) Math.ceil((e - s) / CELL_SECONDS[level]));
            double cell = (e - s) / cells;
            double slack = rate * cell;
            double cosGood = limit + slack < 180 ? Math.cos(Math.toRadians(limit + slack)) : -2;
            double cosBad = limit - slack > 0 ? Math.cos(Math.toRadians(limit - slack)) : 2;
            double left = s;
            double cLeft = cosSeparation(moon, s);
            for (int k = 1; k <= cells; k++) {
                double right = k == cells ? e : s + k * cell;
                double cRight = cosSeparation(moon, right);
                if (cLeft <= cosGood || cRight <= cosGood) {
                    // One end is so far that the limit cannot be reached within the cell.
                    left = right;
                    cLeft = cRight;
                    continue;
                }
                if (cLeft > cosBad || cRight > cosBad) {
                    nbad = appendBad(nbad, left, right);
                } else {
                    nbad = cellPass(moon, left, right, level + 1, rate, limit, nbad);
                }
                left = right;
                cLeft = cRight;
            }
            return nbad;
        }

        private int appendBad(int nbad, double s, double e) {
            if (2 * nbad + 2 > bad.length) {
                bad = Arrays.copyOf(bad, 2 * bad.length);
            }
            return Intervals.append(bad, nbad, s, e);
        }

        /** Recursive halving with the rate bound, down to RESOLUTION_SECONDS. */
        private int bisectBad(boolean moon, double s, double e, double rate, double limit, double cosLimit, int nbad) {
            double half = 0.5 * (e - s);
            double mid = s + half;
            double cosSep = cosSeparation(moon, mid);
            double slack = rate * half;
            if (limit + slack < 180 && cosSep <= Math.cos(Math.toRadians(limit + slack))) {
                return nbad;
            }
            if (limit - slack > 0 && cosSep > Math.cos(Math.toRadians(limit - slack))) {
                return appendBad(nbad, s, e);
            }
            if (half <= RESOLUTION_SECONDS) {
                return cosSep > cosLimit ? appendBad(nbad, s, e) : nbad;
            }
            nbad = bisectBad(moon, s, mid, rate, limit, cosLimit, nbad);
            return bisectBad(moon, mid, e, rate, limit, cosLimit, nbad);
        }

        private static final int PREDICATE_HORIZON = 0;
        private static final int PREDICATE_BRIGHTNESS = 1;

        private boolean test(int predicate, double t) {
            if (predicate == PREDICATE_HORIZON) {
                return apparentAltitudeDeg(t) >= sc.site.horizon().minAltitudeDeg(azimuthDeg(t));
            }
            return skyBrightness(t) >= maxBrightness;
        }

        private double skyBrightness(double t) {
            double targetAlt = apparentAltitudeDeg(t);
            int last = sn.gridCount - 1;
            int i = Math.max(0, Math.min(last - 1, (int) ((t - sn.t0) / SiteNightSky.GRID_SECONDS)));
            double ti = sn.gridTime(i);
            double f = (t - ti) / (sn.gridTime(i + 1) - ti);
            double mx = sn.moonX[i] + f * (sn.moonX[i + 1] - sn.moonX[i]);
            double my = sn.moonY[i] + f * (sn.moonY[i + 1] - sn.moonY[i]);
            double mz = sn.moonZ[i] + f * (sn.moonZ[i + 1] - sn.moonZ[i]);
            double norm = Math.sqrt(mx * mx + my * my + mz * mz);
            double moonDec = Math.asin(mz / norm);
            double moonRa = Math.atan2(my, mx);
            double moonAlt = Math.toDegrees(Math.asin(sc.sinLat * Math.sin(moonDec)
                    + sc.cosLat * Math.cos(moonDec) * Math.cos(sn.lstRad(t) - moonRa)));
            double phase = sn.moonPhaseDeg[i] + f * (sn.moonPhaseDeg[i + 1] - sn.moonPhaseDeg[i]);
            double sep = separationDeg(true, t);
            return MoonlightSkyBrightness.skyBrightnessVMagPerArcsec2(sc.site.darkSkyZenithVMag(), phase,
                    90 - moonAlt, 90 - targetAlt, sep, sc.site.extinctionMagPerAirmass());
        }

        /** Appends the parts of [s, e] where the predicate holds: sampled, then bisected. */
        private int sampleWhere(int predicate, double s, double e, double step, double[] out, int m) {
            int steps = Math.max(1, (int) Math.ceil((e - s) / step));
            double prevT = s;
            boolean prev = test(predicate, s);
            double open = s;
            for (int k = 1; k <= steps; k++) {
                double t = k == steps ? e : s + k * step;
                boolean now = test(predicate, t);
                if (now != prev) {
                    double lo = prevT;
                    double hi = t;
                    while (hi - lo > RESOLUTION_SECONDS) {
                        double mid = 0.5 * (lo + hi);
                        if (test(predicate, mid) == prev) {
                            lo = mid;
                        } else {
                            hi = mid;
                        }
                    }
                    double edge = 0.5 * (lo + hi);
                    if (prev) {
                        m = appendGrow(out, m, open, edge);
                    } else {
                        open = edge;
                    }
                    prev = now;
                }
                prevT = t;
            }
            if (prev) {
                m = appendGrow(out, m, open, e);
            }
            return m;
        }

        private int appendGrow(double[] out, int m, double s, double e) {
            if (2 * m + 2 > out.length) {
                throw new IllegalStateException("too many intervals in one night: " + m);
            }
            return Intervals.append(out, m, s, e);
        }

        private void emit(double s, double e) {
            double h = sn.lstRad(s) - alpha;
            h -= 2 * Math.PI * Math.floor((h + Math.PI) / (2 * Math.PI));
            double he = h + sn.omegaRadPerSecond * (e - s);
            double cosH = (h <= 0 && he >= 0) || he >= 2 * Math.PI ? 1 : Math.max(Math.cos(h), Math.cos(he));
            double sinAlt = sc.sinLat * sinDec + sc.cosLat * cosDec * cosH;
            double alt = Math.toDegrees(Math.asin(Math.max(-1, Math.min(1, sinAlt))));
            double app = Math.min(90, Refraction.apparentFromTrueDeg(alt, sc.site.pressureHpa(), sc.site.temperatureC()));
            if (4 * sinkCount + 4 > sink.length) {
                sink = Arrays.copyOf(sink, 2 * sink.length);
            }
            int j = 4 * sinkCount;
            sink[j] = sn.nightIndex;
            sink[j + 1] = (float) (s - sn.t0);
            sink[j + 2] = (float) (e - sn.t0);
            sink[j + 3] = (float) app;
            sinkCount++;
        }
    }
}
