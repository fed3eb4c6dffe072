package org.skyrota.sky;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.management.ManagementFactory;
import org.junit.jupiter.api.Test;
import org.skyrota.sky.bodies.Moon;
import org.skyrota.sky.bodies.Sun;
import org.skyrota.sky.coords.ApparentPlace;
import org.skyrota.sky.coords.Horizontal;
import org.skyrota.sky.coords.Nutation;
import org.skyrota.sky.coords.Topocentric;
import org.skyrota.sky.time.SiderealTime;

/**
 * The per-sample primitives promise not to allocate (the batch path calls them millions of times). Measured
 * with the JVM's per-thread allocation counter: 20,000 calls of each may allocate less than 64 KiB in total
 * (a single array per call would be 320 KB or more).
 */
class AllocationFreeTest {

    private static final int CALLS = 20_000;
    private static final long SLACK_BYTES = 64 * 1024;

    @Test
    void primitivesDoNotAllocatePerCall() {
        java.lang.management.ThreadMXBean bean = ManagementFactory.getThreadMXBean();
        org.junit.jupiter.api.Assumptions.assumeTrue(bean instanceof com.sun.management.ThreadMXBean,
                "per-thread allocation counter not available on this JVM");
        com.sun.management.ThreadMXBean mx = (com.sun.management.ThreadMXBean) bean;
        org.junit.jupiter.api.Assumptions.assumeTrue(mx.isThreadAllocatedMemorySupported());
        mx.setThreadAllocatedMemoryEnabled(true);

        double[] out = new double[5];
        double[] frame = new double[ApparentPlace.FRAME_LENGTH];
        double sink = run(out, frame, 2000);
        long id = Thread.currentThread().getId();
        long before = mx.getThreadAllocatedBytes(id);
        sink += run(out, frame, CALLS);
        long allocated = mx.getThreadAllocatedBytes(id) - before;
        assertThat(sink).isFinite();
        assertThat(allocated).as("bytes allocated by %d calls", CALLS).isLessThan(SLACK_BYTES);
    }

    private static double run(double[] out, double[] frame, int calls) {
        double sink = 0;
        for (int i = 0; i < calls; i++) {
            double jd = 2460000.5 + i * 0.01;
            Sun.apparent(jd, out);
            sink += out[0];
            Moon.apparent(jd, out);
            sink += out[1];
            sink += Moon.illuminatedFraction(jd);
            ApparentPlace.ofDate(1.0, 0.5, 1e-7, 1e-7, jd, out);
            sink += out[0];
            ApparentPlace.prepare(jd, frame);
            ApparentPlace.ofDate(frame, 1.0, 0.5, 1e-7, 1e-7, out);
            sink += out[1];
            Topocentric.correct(1.0, 0.5, 384000, 2.0, 0.7, 100, out);
            sink += out[0];
            Nutation.angles(jd, out);
            sink += SiderealTime.gastRad(jd, jd) + Horizontal.altitudeRad(out[0], 0.3, 0.7);
        }
        return sink;
    }
}
