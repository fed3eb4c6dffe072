package org.skyrota.web.run;

/** Where a planner run is: waiting, solving, or ended one of three ways. */
public enum RunState {
    QUEUED, RUNNING, FINISHED, FAILED, CANCELLED;

    public boolean isActive() {
        return this == QUEUED || this == RUNNING;
    }

    public String apiName() {
        return name().toLowerCase();
    }
}
