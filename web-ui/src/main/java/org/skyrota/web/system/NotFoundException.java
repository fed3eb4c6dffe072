package org.skyrota.web.system;

/** A stored thing that does not exist (or that the caller may not see); answered as HTTP 404. */
public class NotFoundException extends RuntimeException {

    public NotFoundException(String kind, Object id) {
        super("No " + kind + " with id " + id);
    }
}
