package org.skyrota.web.system;

import java.util.Map;

/** The request is well formed but clashes with the stored state (a state change not allowed now, a duplicate name); HTTP 409. */
public class ConflictException extends RuntimeException {

    private final Map<String, Object> details;

    public ConflictException(String message) {
        this(message, Map.of());
    }

    /** @param details members added to the problem document, by name (for example the rules a plan breaks) */
    public ConflictException(String message, Map<String, Object> details) {
        super(message);
        this.details = Map.copyOf(details);
    }

    public Map<String, Object> details() {
        return details;
    }
}
