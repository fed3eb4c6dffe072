package org.skyrota.plugin;

/** A plugin could not do what was asked, for a reason a user can act on (bad parameters, a malformed file). */
public class PluginException extends Exception {

    private final String field;

    /**
     * @param field   the input field, parameter or line the problem is in, or null when none applies
     * @param message what is wrong, in plain words
     */
    public PluginException(String field, String message) {
        super(message);
        this.field = field;
    }

    public PluginException(String field, String message, Throwable cause) {
        super(message, cause);
        this.field = field;
    }

    /** The field, parameter or line at fault, or null. */
    public String field() {
        return field;
    }
}
