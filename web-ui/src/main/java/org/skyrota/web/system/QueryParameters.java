package org.skyrota.web.system;

import java.time.LocalDate;
import java.time.ZoneId;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.Function;
import java.util.regex.Pattern;

/**
 * Reads raw query-string values, collecting every problem before failing once.
 *
 * <p>Values are read by hand rather than by Spring's converters so that each message names
 * the parameter and the allowed range, and so that what {@link Double#parseDouble} would
 * accept but no person means ({@code NaN}, {@code Infinity}, {@code 0x1p3}, {@code 1d}) is refused.
 * Call {@link #throwIfInvalid()} after reading every value; the values returned for bad input
 * are placeholders that must not be used.
 */
public final class QueryParameters {

    private static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+(\\.\\d*)?|\\.\\d+)([eE][+-]?\\d{1,3})?");

    private final List<FieldProblem> problems = new ArrayList<>();

    public double requiredNumber(String name, String raw, double min, double max) {
        if (isAbsent(raw)) {
            problems.add(new FieldProblem(name, "is required"));
            return Double.NaN;
        }
        return number(name, raw, min, max);
    }

    public double optionalNumber(String name, String raw, double min, double max, double defaultValue) {
        return isAbsent(raw) ? defaultValue : number(name, raw, min, max);
    }

    /** Null when absent. */
    public Double optionalNumber(String name, String raw, double min, double max) {
        return isAbsent(raw) ? null : number(name, raw, min, max);
    }

    public LocalDate requiredDate(String name, String raw, LocalDate earliest, LocalDate latest) {
        if (isAbsent(raw)) {
            problems.add(new FieldProblem(name, "is required"));
            return null;
        }
        try {
            LocalDate date = LocalDate.parse(raw.trim(), DateTimeFormatter.ISO_LOCAL_DATE);
            if (date.isBefore(earliest) || date.isAfter(latest)) {
                problems.add(new FieldProblem(name, "must be between " + earliest + " and " + latest + ", was " + raw));
                return null;
            }
            return date;
        } catch (DateTimeParseException e) {
            problems.add(new FieldProblem(name, "must be a date as YYYY-MM-DD, was '" + raw + "'"));
            return null;
        }
    }

    /** An IANA time-zone region such as {@code Europe/Madrid} ({@link IanaZone}); null when absent. */
    public ZoneId optionalZone(String name, String raw) {
        if (isAbsent(raw)) {
            return null;
        }
        ZoneId zone = IanaZone.Validator.region(raw.trim()).orElse(null);
        if (zone == null) {
            problems.add(new FieldProblem(name, IanaZone.MESSAGE + ", was '" + SupportedDates.shortened(raw) + "'"));
        }
        return zone;
    }

    /** One of the enum's constants, named in lower case; {@code defaultValue} when absent. */
    public <E extends Enum<E>> E optionalChoice(String name, String raw, Class<E> type, E defaultValue) {
        if (isAbsent(raw)) {
            return defaultValue;
        }
        for (E constant : type.getEnumConstants()) {
            if (constant.name().equalsIgnoreCase(raw.trim())) {
                return constant;
            }
        }
        problems.add(new FieldProblem(name, "must be one of " + choices(type, c -> c.name().toLowerCase(Locale.ROOT)) + ", was '" + raw + "'"));
        return defaultValue;
    }

    /** Adds a problem found by a check across several values. */
    public void reject(String name, String message) {
        problems.add(new FieldProblem(name, message));
    }

    public boolean isValid() {
        return problems.isEmpty();
    }

    public void throwIfInvalid() {
        if (!problems.isEmpty()) {
            throw new InvalidParametersException(problems);
        }
    }

    private double number(String name, String raw, double min, double max) {
        String text = raw.trim();
        if (!DECIMAL.matcher(text).matches()) {
            problems.add(new FieldProblem(name, "must be a decimal number, was '" + raw + "'"));
            return Double.NaN;
        }
        double value = Double.parseDouble(text);
        if (!(value >= min && value <= max)) {
            problems.add(new FieldProblem(name, "must be between " + plain(min) + " and " + plain(max) + ", was " + raw));
            return Double.NaN;
        }
        return value;
    }

    private static boolean isAbsent(String raw) {
        return raw == null || raw.isBlank();
    }

    private static String plain(double v) {
        return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
    }

    private static <E extends Enum<E>> String choices(Class<E> type, Function<E, String> name) {
        List<String> names = new ArrayList<>();
        for (E constant : type.getEnumConstants()) {
            names.add(name.apply(constant));
        }
        return String.join(", ", names);
    }
}
