package org.skyrota.planning.solver;

import java.util.ArrayList;
import java.util.List;

/**
 * A handle that ends a planner run early and cleanly: give it to the run with
 * {@link SolveOptions#withCancellation(Cancellation)}, call {@link #cancel()} from any thread, and the run stops at
 * the solver's next step and returns the best plan found so far (the start plan if the search had not begun).
 * Interrupting the run's thread instead tears the solver down mid-step. Thread-safe; once cancelled it stays
 * cancelled, so give each run a fresh one.
 */
public final class Cancellation {
    private final List<Runnable> listeners = new ArrayList<>();
    private boolean cancelled;

    /** Asks the run to stop; returns once the solver has stopped (at most one step), or at once if none runs. */
    public void cancel() {
        List<Runnable> toRun;
        synchronized (this) {
            if (cancelled) {
                return;
            }
            cancelled = true;
            toRun = List.copyOf(listeners);
            listeners.clear();
        }
        // Outside the lock: stopping the solver waits for its thread, which may be registering or removing a listener.
        toRun.forEach(Runnable::run);
    }

    public synchronized boolean isCancelled() {
        return cancelled;
    }

    /**
     * Runs {@code stop} once on {@link #cancel()}, or at once if already cancelled; the returned action removes it
     * again when the run ends by itself.
     */
    Runnable onCancel(Runnable stop) {
        synchronized (this) {
            if (!cancelled) {
                listeners.add(stop);
                return () -> {
                    synchronized (this) {
                        listeners.remove(stop);
                    }
                };
            }
        }
        stop.run();
        return () -> { };
    }
}
