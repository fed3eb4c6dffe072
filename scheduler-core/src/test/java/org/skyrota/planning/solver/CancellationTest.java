package org.skyrota.planning.solver;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;

import org.junit.jupiter.api.Test;

/**
 * The cancellation handle on its own: each stop action runs exactly once, whether it was registered before or after
 * the cancel, and never once it was removed. (The solver end to end: PlannerFacadeTest in the constraints module,
 * which holds the score rules a run needs.)
 */
class CancellationTest {

    @Test
    void aStopRegisteredBeforeTheCancelRunsOnceEvenWhenCancelIsCalledTwice() {
        Cancellation c = new Cancellation();
        AtomicInteger stops = new AtomicInteger();
        c.onCancel(stops::incrementAndGet);
        assertThat(stops).hasValue(0);

        c.cancel();
        c.cancel();

        assertThat(stops).hasValue(1);
        assertThat(c.isCancelled()).isTrue();
    }

    @Test
    void aStopRegisteredAfterTheCancelRunsAtOnce() {
        Cancellation c = new Cancellation();
        c.cancel();
        AtomicInteger stops = new AtomicInteger();

        c.onCancel(stops::incrementAndGet).run();

        assertThat(stops).hasValue(1);
    }

    @Test
    void aRemovedStopNeverRuns() {
        Cancellation c = new Cancellation();
        AtomicInteger stops = new AtomicInteger();
        Runnable remove = c.onCancel(stops::incrementAndGet);

        remove.run();
        c.cancel();

        assertThat(stops).hasValue(0);
    }

    @Test
    void racingRegistrationsAndOneCancelStopEveryRunExactlyOnce() throws Exception {
        // Registration and cancel from different threads in every order: no stop is lost or doubled.
        for (int round = 0; round < 200; round++) {
            Cancellation c = new Cancellation();
            AtomicInteger stops = new AtomicInteger();
            CountDownLatch go = new CountDownLatch(1);
            ExecutorService pool = Executors.newFixedThreadPool(4);
            for (int i = 0; i < 3; i++) {
                pool.submit(() -> {
                    go.await();
                    return c.onCancel(stops::incrementAndGet);
                });
            }
            pool.submit(() -> {
                go.await();
                c.cancel();
                return null;
            });
            go.countDown();
            pool.shutdown();
            assertThat(pool.awaitTermination(5, TimeUnit.SECONDS)).isTrue();
            assertThat(stops).as("round %d", round).hasValue(3);
        }
    }
}
