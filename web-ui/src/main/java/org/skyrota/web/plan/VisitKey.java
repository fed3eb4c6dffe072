package org.skyrota.web.plan;

import org.skyrota.web.system.InvalidParametersException;

/**
 * The stable id of one visit: its request and its repeat number (from 1), written {@code "12-2"}. A visit keeps
 * this id in every revision, so that drafts, published plans and reports talk about the same visit.
 */
public record VisitKey(long requestId, int repeatNo) {

    public VisitKey {
        if (repeatNo < 1) {
            throw new IllegalArgumentException("repeatNo must be at least 1, got " + repeatNo);
        }
    }

    /** Reads {@code "12-2"}; a bare request id means its first visit. */
    public static VisitKey parse(String text) {
        try {
            int dash = text.indexOf('-');
            return dash < 0 ? new VisitKey(Long.parseLong(text), 1)
                    : new VisitKey(Long.parseLong(text.substring(0, dash)), Integer.parseInt(text.substring(dash + 1)));
        } catch (RuntimeException e) {
            throw new InvalidParametersException(java.util.List.of(new org.skyrota.web.system.FieldProblem("visitId", "'" + text + "' is not a visit id like 12-1")));
        }
    }

    @Override
    public String toString() {
        return requestId + "-" + repeatNo;
    }
}
