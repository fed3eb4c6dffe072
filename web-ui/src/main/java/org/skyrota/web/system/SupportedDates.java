package org.skyrota.web.system;

import java.time.DateTimeException;
import java.time.Instant;
import java.time.LocalDate;
import java.time.OffsetDateTime;
import java.time.format.DateTimeFormatter;
import java.util.List;

/**
 * The nights and instants the server takes, in every JSON body and query parameter: nights from 1900-01-01 to
 * 2200-12-31, instants from 1900-01-01T00:00:00Z to before 2201-01-01T00:00:00Z.
 *
 * <p>The bounds are our choice. An observing-time planner has no use for nights outside them; inside them the sky
 * engine's UT1 rests on measured or closely modelled ΔT, and every date is a plain four-digit year of the Gregorian
 * calendar that H2 and PostgreSQL store and read back alike (a year before 1 came back from storage as another
 * year). A date is ISO-8601 text {@code YYYY-MM-DD}; an instant is ISO-8601 text with its offset
 * ({@code 2027-01-10T20:00:00Z}, {@code 2027-01-10T21:00:00+01:00}); numbers are not taken for either.
 */
public final class SupportedDates {

    public static final LocalDate FIRST = LocalDate.of(1900, 1, 1);
    public static final LocalDate LAST = LocalDate.of(2200, 12, 31);
    public static final Instant FIRST_INSTANT = Instant.parse("1900-01-01T00:00:00Z");
    /** The first instant after the range: instants must lie before it. */
    public static final Instant END_INSTANT = Instant.parse("2201-01-01T00:00:00Z");

    /** What a date must be, for messages. */
    public static final String DATE_RULE = "must be a date as YYYY-MM-DD from " + FIRST + " to " + LAST;
    /** What an instant must be, for messages. */
    public static final String INSTANT_RULE = "must be an ISO-8601 instant with its offset, such as 2027-01-10T20:00:00Z, "
            + "from " + FIRST_INSTANT + " to before " + END_INSTANT;

    private SupportedDates() {}

    public static boolean contains(LocalDate date) {
        return !date.isBefore(FIRST) && !date.isAfter(LAST);
    }

    public static boolean contains(Instant instant) {
        return !instant.isBefore(FIRST_INSTANT) && instant.isBefore(END_INSTANT);
    }

    /**
     * A night as ISO-8601 text inside the range.
     *
     * @throws IllegalArgumentException saying what a date must be and what was sent
     */
    public static LocalDate parseDate(String text) {
        try {
            LocalDate date = LocalDate.parse(text, DateTimeFormatter.ISO_LOCAL_DATE);
            if (contains(date)) {
                return date;
            }
        } catch (DateTimeException e) {
            // refused below with the same words
        }
        throw new IllegalArgumentException(DATE_RULE + ", was '" + shortened(text) + "'");
    }

    /**
     * An instant as ISO-8601 text with its offset, inside the range.
     *
     * @throws IllegalArgumentException saying what an instant must be and what was sent
     */
    public static Instant parseInstant(String text) {
        try {
            Instant instant = OffsetDateTime.parse(text, DateTimeFormatter.ISO_OFFSET_DATE_TIME).toInstant();
            if (contains(instant)) {
                return instant;
            }
        } catch (DateTimeException e) {
            // refused below with the same words
        }
        throw new IllegalArgumentException(INSTANT_RULE + ", was '" + shortened(text) + "'");
    }

    /** Adds a problem naming {@code field} when {@code date} is given and outside the range. */
    public static void check(String field, LocalDate date, List<FieldProblem> problems) {
        if (date != null && !contains(date)) {
            problems.add(new FieldProblem(field, DATE_RULE + ", was " + date));
        }
    }

    /**
     * Adds a problem naming each of the two fields when both are given and {@code last} is before {@code first}: a
     * conflict between two fields names both, so that each shows it.
     */
    public static void checkOrder(String firstField, LocalDate first, String lastField, LocalDate last,
                                  List<FieldProblem> problems) {
        if (first != null && last != null && last.isBefore(first)) {
            problems.add(new FieldProblem(firstField, "must not be after " + lastField + " (" + last + "), was " + first));
            problems.add(new FieldProblem(lastField, "must not be before " + firstField + " (" + first + "), was " + last));
        }
    }

    /** At most 40 characters of what was sent, so that a huge value does not fill the answer. */
    static String shortened(String text) {
        return text.length() <= 40 ? text : text.substring(0, 40) + "…";
    }
}
