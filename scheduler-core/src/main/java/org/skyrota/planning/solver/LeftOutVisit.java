package org.skyrota.planning.solver;

/** A visit the plan leaves out, and why in plain words. */
public record LeftOutVisit(String visitId, String requestId, int priority, String reason) {
}
