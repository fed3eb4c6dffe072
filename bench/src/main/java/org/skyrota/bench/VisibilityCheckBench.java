package org.skyrota.bench;

import java.time.Duration;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.visibility.BatchVisibility;
import org.skyrota.sky.visibility.Darkness;
import org.skyrota.sky.visibility.FixedTarget;
import org.skyrota.sky.visibility.ObservingConstraints;
import org.skyrota.sky.visibility.VisibilityCalculator;
import org.skyrota.sky.visibility.VisibilityWindow;

/**
 * The batch path against brute force (the per-instant path: exact positions every minute,
 * refined by bisection) for 200 seeded random targets × 1 invented site × 30 nights. Both run
 * on all cores. Prints {@code BENCH visibility-check … speedRatio=… maxBoundaryDifferenceSeconds=…
 * windowsBatch=… windowsBrute=… unmatched=…}; a window is matched when it overlaps exactly one
 * window of the other list.
 */
public final class VisibilityCheckBench {

    private VisibilityCheckBench() {
    }

    public static void main(String[] args) {
        int targets = args.length > 0 ? Integer.parseInt(args[0]) : 200;
        int nights = args.length > 1 ? Integer.parseInt(args[1]) : 30;
        SiteLocation site = BenchSites.threeSites().get(2);
        List<FixedTarget> list = BenchSites.randomTargets(targets, 4242);
        ObservingConstraints c = ObservingConstraints.of(30, Darkness.ASTRONOMICAL).withMinMoonSeparationDeg(30);
        LocalDate from = LocalDate.of(2027, 3, 1);
        LocalDate to = from.plusDays(nights - 1L);

        BatchVisibility.compute(List.of(site), list, c, from, to); // warm-up
        long t0 = System.nanoTime();
        BatchVisibility.Result batch = BatchVisibility.compute(List.of(site), list, c, from, to);
        double batchSeconds = (System.nanoTime() - t0) / 1e9;

        long t1 = System.nanoTime();
        List<List<VisibilityWindow>> brute = IntStream.range(0, targets).parallel()
                .mapToObj(i -> VisibilityCalculator.windows(site, list.get(i), c, from, to)).toList();
        double bruteSeconds = (System.nanoTime() - t1) / 1e9;

        double maxDiff = 0;
        int unmatched = 0;
        long nBatch = 0;
        long nBrute = 0;
        List<String> examples = new ArrayList<>();
        for (int i = 0; i < targets; i++) {
            List<VisibilityWindow> a = batch.windows(0, i);
            List<VisibilityWindow> b = brute.get(i);
            nBatch += a.size();
            nBrute += b.size();
            for (VisibilityWindow w : a) {
                List<VisibilityWindow> m = overlapping(w, b);
                if (m.size() != 1) {
                    unmatched++;
                    if (examples.size() < 5) {
                        examples.add("target " + i + " batch " + w + " brute " + m);
                    }
                    continue;
                }
                VisibilityWindow v = m.get(0);
                maxDiff = Math.max(maxDiff, seconds(Duration.between(w.start(), v.start())));
                maxDiff = Math.max(maxDiff, seconds(Duration.between(w.end(), v.end())));
            }
            for (VisibilityWindow v : b) {
                if (overlapping(v, a).size() != 1) {
                    unmatched++;
                    if (examples.size() < 5) {
                        examples.add("target " + i + " brute " + v + " batch " + overlapping(v, a));
                    }
                }
            }
        }
        examples.forEach(e -> System.err.println("unmatched: " + e));
        System.out.printf("BENCH visibility-check targets=%d sites=1 nights=%d speedRatio=%.1f"
                + " maxBoundaryDifferenceSeconds=%.2f windowsBatch=%d windowsBrute=%d unmatched=%d"
                + " batchSeconds=%.3f bruteSeconds=%.3f%n", targets, nights, bruteSeconds / batchSeconds, maxDiff,
                nBatch, nBrute, unmatched, batchSeconds, bruteSeconds);
    }

    private static double seconds(Duration d) {
        return Math.abs(d.toNanos() / 1e9);
    }

    private static List<VisibilityWindow> overlapping(VisibilityWindow w, List<VisibilityWindow> others) {
        List<VisibilityWindow> out = new ArrayList<>();
        for (VisibilityWindow o : others) {
            if (o.start().isBefore(w.end()) && w.start().isBefore(o.end())) {
                out.add(o);
            }
        }
        return out;
    }
}
