package org.skyrota.bench;

import java.time.LocalDate;
import java.util.List;
import org.skyrota.sky.site.SiteLocation;
import org.skyrota.sky.visibility.BatchVisibility;
import org.skyrota.sky.visibility.Darkness;
import org.skyrota.sky.visibility.FixedTarget;
import org.skyrota.sky.visibility.ObservingConstraints;

/**
 * Visibility windows for 10,000 seeded random targets × 3 invented sites × 365 nights
 * (minimum altitude 30°, astronomical darkness, 30° from the Moon) by the batch path.
 * Prints {@code BENCH visibility targets=… sites=… nights=… seconds=… targetNightsPerSecond=… windows=…}.
 */
public final class VisibilityBench {

    private VisibilityBench() {
    }

    public static void main(String[] args) {
        int targets = args.length > 0 ? Integer.parseInt(args[0]) : 10_000;
        int nights = args.length > 1 ? Integer.parseInt(args[1]) : 365;
        List<SiteLocation> sites = BenchSites.threeSites();
        List<FixedTarget> list = BenchSites.randomTargets(targets, 42);
        ObservingConstraints c = ObservingConstraints.of(30, Darkness.ASTRONOMICAL).withMinMoonSeparationDeg(30);
        LocalDate from = LocalDate.of(2027, 1, 1);
        LocalDate to = from.plusDays(nights - 1L);

        // Warm up the JIT on a different slice of dates and targets.
        List<FixedTarget> warm = BenchSites.randomTargets(2000, 7);
        for (int i = 0; i < 3; i++) {
            BatchVisibility.compute(sites, warm, c, LocalDate.of(2026, 1, 1), LocalDate.of(2026, 2, 28));
        }

        var os = (com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory
                .getOperatingSystemMXBean();
        long cpu0 = os.getProcessCpuTime();
        long t0 = System.nanoTime();
        BatchVisibility.Result r = BatchVisibility.compute(sites, list, c, from, to);
        double seconds = (System.nanoTime() - t0) / 1e9;
        double cpuSeconds = (os.getProcessCpuTime() - cpu0) / 1e9;
        long targetNights = (long) targets * sites.size() * nights;
        System.out.printf("BENCH visibility targets=%d sites=%d nights=%d seconds=%.3f targetNightsPerSecond=%.0f"
                + " windows=%d cores=%d cpuSeconds=%.3f loadAverage=%.1f%n", targets, sites.size(), nights, seconds,
                targetNights / seconds, r.windowCount(), Runtime.getRuntime().availableProcessors(), cpuSeconds,
                os.getSystemLoadAverage());
    }
}
