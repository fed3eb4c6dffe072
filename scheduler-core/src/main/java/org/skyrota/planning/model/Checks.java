package org.skyrota.planning.model;

/** Argument checks whose messages name the offending value. */
final class Checks {
    private Checks() {
    }

    static void notBlank(String what, String value) {
        if (value == null || value.isBlank()) {
            throw new IllegalArgumentException(what + " must not be blank, got " + (value == null ? "null" : "'" + value + "'"));
        }
    }

    static void range(String what, double value, double min, double max) {
        if (!(value >= min && value <= max)) {
            throw new IllegalArgumentException(what + " must be in [" + min + ", " + max + "], got " + value);
        }
    }

    static void positive(String what, double value) {
        if (!(value > 0)) {
            throw new IllegalArgumentException(what + " must be positive, got " + value);
        }
    }

    static void notNegative(String what, double value) {
        if (!(value >= 0)) {
            throw new IllegalArgumentException(what + " must not be negative, got " + value);
        }
    }

    static <T> T notNull(String what, T value) {
        if (value == null) {
            throw new IllegalArgumentException(what + " must not be null");
        }
        return value;
    }
}
