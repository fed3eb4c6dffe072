package org.skyrota.sky.site;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;

/**
 * The minimum usable apparent altitude as a function of azimuth (trees, buildings, dome
 * limits). Piecewise linear between the given points and wrapping around at 0/360°; a profile
 * of one point is constant; the flat profile is 0° everywhere, which adds nothing to a
 * constraint's own minimum altitude.
 */
public final class HorizonProfile {

    private static final HorizonProfile FLAT = new HorizonProfile(new double[0], new double[0]);

    private final double[] azimuthDeg;
    private final double[] altitudeDeg;
    private final double maxAltitudeDeg;

    private HorizonProfile(double[] azimuthDeg, double[] altitudeDeg) {
        this.azimuthDeg = azimuthDeg;
        this.altitudeDeg = altitudeDeg;
        this.maxAltitudeDeg = Arrays.stream(altitudeDeg).max().orElse(0);
    }

    /** The horizon at 0° altitude in every direction. */
    public static HorizonProfile flat() {
        return FLAT;
    }

    /**
     * A profile through the given points (any order, at least one, no two at the same
     * azimuth).
     *
     * @throws IllegalArgumentException naming the repeated azimuth or the empty list
     */
    public static HorizonProfile of(List<HorizonPoint> points) {
        if (points == null || points.isEmpty()) {
            throw new IllegalArgumentException("points must hold at least one HorizonPoint: " + points);
        }
        List<HorizonPoint> sorted = new ArrayList<>(points);
        for (HorizonPoint p : sorted) {
            if (p == null) {
                throw new IllegalArgumentException("points must not contain null: " + points);
            }
        }
        sorted.sort(Comparator.comparingDouble(HorizonPoint::azimuthDeg));
        double[] az = new double[sorted.size()];
        double[] alt = new double[sorted.size()];
        for (int i = 0; i < az.length; i++) {
            az[i] = sorted.get(i).azimuthDeg();
            alt[i] = sorted.get(i).altitudeDeg();
            if (i > 0 && az[i] == az[i - 1]) {
                throw new IllegalArgumentException("points: azimuthDeg " + az[i] + " given twice");
            }
        }
        return new HorizonProfile(az, alt);
    }

    /** True when the profile is 0° in every direction. */
    public boolean isFlat() {
        if (altitudeDeg.length == 0) {
            return true;
        }
        for (double a : altitudeDeg) {
            if (a != 0) {
                return false;
            }
        }
        return true;
    }

    /** The highest altitude of the profile (0 for the flat profile); bounds where it can bite. */
    public double maxAltitudeDeg() {
        return maxAltitudeDeg;
    }

    /** The points of the profile sorted by azimuth (empty for the flat profile). */
    public List<HorizonPoint> points() {
        List<HorizonPoint> out = new ArrayList<>(azimuthDeg.length);
        for (int i = 0; i < azimuthDeg.length; i++) {
            out.add(new HorizonPoint(azimuthDeg[i], altitudeDeg[i]));
        }
        return List.copyOf(out);
    }

    /**
     * The minimum altitude towards the given azimuth, interpolated linearly between the
     * neighbouring points, across north where needed.
     *
     * @param azimuthDeg azimuth east of north, any value (reduced modulo 360)
     */
    public double minAltitudeDeg(double azimuthDeg) {
        int n = this.azimuthDeg.length;
        if (n == 0) {
            return 0;
        }
        if (n == 1) {
            return altitudeDeg[0];
        }
        double az = azimuthDeg - 360.0 * Math.floor(azimuthDeg / 360.0);
        int hi = Arrays.binarySearch(this.azimuthDeg, az);
        if (hi >= 0) {
            return altitudeDeg[hi];
        }
        hi = -hi - 1;
        int lo = hi - 1;
        double azLo;
        double azHi;
        if (hi == n) {
            hi = 0;
            azLo = this.azimuthDeg[lo];
            azHi = this.azimuthDeg[0] + 360;
        } else if (lo < 0) {
            lo = n - 1;
            azLo = this.azimuthDeg[lo] - 360;
            azHi = this.azimuthDeg[hi];
        } else {
            azLo = this.azimuthDeg[lo];
            azHi = this.azimuthDeg[hi];
        }
        double f = (az - azLo) / (azHi - azLo);
        return altitudeDeg[lo] + f * (altitudeDeg[hi] - altitudeDeg[lo]);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof HorizonProfile h
                && Arrays.equals(azimuthDeg, h.azimuthDeg)
                && Arrays.equals(altitudeDeg, h.altitudeDeg);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(azimuthDeg) + Arrays.hashCode(altitudeDeg);
    }

    @Override
    public String toString() {
        return isFlat() ? "HorizonProfile[flat]" : "HorizonProfile" + points();
    }
}
