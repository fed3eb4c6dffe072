package org.skyrota.planning.solver;

import java.time.Duration;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;
import java.util.concurrent.locks.LockSupport;
import java.util.function.Consumer;
import java.util.logging.Level;
import java.util.logging.Logger;

/**
 * Passes progress from the solver's thread to the caller's consumer on a thread of its own. Only the newest progress
 * waits: one the consumer has not taken yet is replaced, so a slow reader (an event stream to a far browser) sees
 * fewer updates but never slows the search, and a reader that blocks for good cannot stop the run from ending.
 */
final class ProgressRelay implements AutoCloseable {

    private static final Logger log = Logger.getLogger(ProgressRelay.class.getName());

    /** How long {@link #close()} waits for the consumer to take the last progress. */
    static final Duration DRAIN_LIMIT = Duration.ofSeconds(10);

    private final Consumer<Progress> consumer;
    private final AtomicReference<Progress> pending = new AtomicReference<>();
    private final Thread thread;
    private volatile boolean closing;

    ProgressRelay(Consumer<Progress> consumer) {
        this.consumer = consumer;
        this.thread = new Thread(this::run, "planner-progress");
        thread.setDaemon(true);
        thread.start();
    }

    /** Called on the solver's thread: never blocks. */
    void offer(Progress progress) {
        if (pending.getAndSet(progress) == null) {
            LockSupport.unpark(thread);
        }
    }

    private void run() {
        while (true) {
            Progress next = pending.getAndSet(null);
            if (next != null) {
                try {
                    consumer.accept(next);
                } catch (RuntimeException e) {
                    // A failing reader must not end the run; it only misses this update.
                    log.log(Level.WARNING, "A progress consumer failed", e);
                }
            } else if (closing) {
                return;
            } else {
                LockSupport.parkNanos(this, TimeUnit.MILLISECONDS.toNanos(200));
            }
        }
    }

    /** Delivers what is still pending, waiting at most {@link #DRAIN_LIMIT} for a consumer that does not return. */
    @Override
    public void close() {
        closing = true;
        LockSupport.unpark(thread);
        try {
            thread.join(DRAIN_LIMIT.toMillis());
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        if (thread.isAlive()) {
            log.warning("The progress consumer did not return within " + DRAIN_LIMIT.toSeconds()
                    + " s; the run ends without waiting for it");
        }
    }
}
