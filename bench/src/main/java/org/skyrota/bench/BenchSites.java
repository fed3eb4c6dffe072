package org.skyrota.bench;

import java.time.ZoneId;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.visibility.FixedTarget;

/** Invented sites and seeded random targets shared by the visibility benchmarks. */
final class BenchSites {

    private BenchSites() {
    }

    /** Three invented sites on three continents, both hemispheres, one far north. */
    static List<SiteLocation> threeSites() {
        return List.of(
                SiteLocation.of(67.4, 21.6, 420, ZoneId.of("Europe/Stockholm")),
                SiteLocation.of(-30.6, -70.9, 2300, ZoneId.of("America/Santiago")),
                SiteLocation.of(33.9, 133.2, 650, ZoneId.of("Asia/Tokyo")));
    }

    /** Targets spread uniformly over the sky, with small proper motions. */
    static List<FixedTarget> randomTargets(int n, long seed) {
        Random r = new Random(seed);
        List<FixedTarget> out = new ArrayList<>(n);
        for (int i = 0; i < n; i++) {
            double ra = 360 * r.nextDouble();
            double dec = Math.toDegrees(Math.asin(2 * r.nextDouble() - 1));
            out.add(FixedTarget.of(ra, dec, 50 * r.nextGaussian(), 50 * r.nextGaussian()));
        }
        return out;
    }
}
