package org.skyrota.web.system;

/** The request is well formed but clashes with the stored state (a state change not allowed now, a duplicate name); HTTP 409. */
public class ConflictException extends RuntimeException {

    public ConflictException(String message) {
        super(message);
    }
}
