package org.skyrota.sky.coords;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reading and writing right ascension and declination as people type them.
 *
 * <p>Right ascension: a bare number is decimal degrees ({@code "187.25"}); anything with
 * separators is hours, minutes and seconds: {@code "12:29:00.0"}, {@code "12 29 00"},
 * {@code "12h29m00s"}, {@code "12:29.5"} (minutes with a fraction). Declination: a bare number is
 * decimal degrees ({@code "-0.5"}); else degrees, minutes and seconds: {@code "+12:23:28"},
 * {@code "-00 30 00"}, {@code "12d23m28s"}, {@code "12°23′28″"}. The sign belongs to the whole
 * angle, so {@code "-00:30:00"} is &minus;0.5&deg;, not +0.5&deg;.
 */
public final class Sexagesimal {

    private static final Pattern NUMBER = Pattern.compile("[+-]?(\\d+(\\.\\d*)?|\\.\\d+)([eE][+-]?\\d+)?");
    /** Up to three unsigned fields, the last of which may have a fraction, split by colons, blanks or unit letters. */
    private static final Pattern FIELDS = Pattern.compile(
            "([+-])?\\s*(\\d+(?:\\.\\d*)?)\\s*(?:[:\\shd°]\\s*(\\d+(?:\\.\\d*)?)\\s*(?:[:\\sm'′]\\s*(\\d+(?:\\.\\d*)?)\\s*[s\"″]?)?\\s*[m'′]?)?\\s*[hd°]?",
            Pattern.CASE_INSENSITIVE);

    private Sexagesimal() {
    }

    /**
     * Parses a right ascension.
     *
     * @return degrees in [0, 360)
     * @throws IllegalArgumentException naming the text and what is wrong with it
     */
    public static double parseRaDeg(String text) {
        String t = trimmed(text, "right ascension");
        if (NUMBER.matcher(t).matches()) {
            double deg = Double.parseDouble(t);
            if (!(deg >= 0 && deg < 360)) {
                throw new IllegalArgumentException("right ascension in degrees must be at least 0 and below 360: \"" + text + "\"");
            }
            return deg;
        }
        if (t.matches("(?i).*[d°].*")) {
            throw new IllegalArgumentException("right ascension with separators is read as hours, minutes and seconds,"
                    + " not degrees: \"" + text + "\"");
        }
        double[] f = fields(t, text, "right ascension", "hh:mm:ss.s");
        if (f[3] < 0) {
            throw new IllegalArgumentException("right ascension cannot be negative: \"" + text + "\"");
        }
        double hours = f[0] + f[1] / 60 + f[2] / 3600;
        if (f[0] >= 24 || hours >= 24) {
            throw new IllegalArgumentException("right ascension hours must be below 24: \"" + text + "\"");
        }
        return hours * 15;
    }

    /**
     * Parses a declination.
     *
     * @return degrees in [&minus;90, +90]
     * @throws IllegalArgumentException naming the text and what is wrong with it
     */
    public static double parseDecDeg(String text) {
        String t = trimmed(text, "declination");
        double deg;
        if (NUMBER.matcher(t).matches()) {
            deg = Double.parseDouble(t);
        } else {
            if (t.matches("(?i).*h.*")) {
                throw new IllegalArgumentException("declination is in degrees, not hours: \"" + text + "\"");
            }
            double[] f = fields(t, text, "declination", "±dd:mm:ss");
            double magnitude = Math.abs(f[0]) + f[1] / 60 + f[2] / 3600;
            deg = f[3] < 0 ? -magnitude : magnitude;
        }
        if (!(deg >= -90 && deg <= 90)) {
            throw new IllegalArgumentException("declination must be between -90 and +90 degrees: \"" + text + "\"");
        }
        return deg;
    }

    /** Right ascension as {@code "hh:mm:ss.s"} with the given number of decimals of a second (0 to 6). */
    public static String formatRa(double raDeg, int secondDecimals) {
        if (!Double.isFinite(raDeg)) {
            throw new IllegalArgumentException("right ascension must be finite: " + raDeg);
        }
        double hours = ((raDeg % 360) + 360) % 360 / 15;
        return hms(hours, secondDecimals, true);
    }

    /** Declination as {@code "+dd:mm:ss"} (always signed) with the given number of decimals of an arcsecond (0 to 6). */
    public static String formatDec(double decDeg, int secondDecimals) {
        if (!(decDeg >= -90 && decDeg <= 90)) {
            throw new IllegalArgumentException("declination must be between -90 and +90 degrees: " + decDeg);
        }
        String body = hms(Math.abs(decDeg), secondDecimals, false);
        boolean negative = decDeg < 0 && !body.matches("[0:.]+");
        return (negative ? "-" : "+") + body;
    }

    private static String hms(double value, int decimals, boolean wrapAt24) {
        if (decimals < 0 || decimals > 6) {
            throw new IllegalArgumentException("decimals must be 0 to 6: " + decimals);
        }
        double scale = Math.pow(10, decimals);
        // Round once, in units of the last printed digit, so that 59.96 s never prints as 60.0.
        long units = Math.round(value * 3600 * scale);
        if (wrapAt24) {
            units %= 24L * 3600 * (long) scale;
        }
        long unitsPerSecond = (long) scale;
        long totalSeconds = units / unitsPerSecond;
        long fraction = units % unitsPerSecond;
        long whole = totalSeconds / 3600;
        long minutes = totalSeconds / 60 % 60;
        long seconds = totalSeconds % 60;
        String text = String.format(Locale.ROOT, "%02d:%02d:%02d", whole, minutes, seconds);
        if (decimals > 0) {
            text += String.format(Locale.ROOT, ".%0" + decimals + "d", fraction);
        }
        return text;
    }

    private static String trimmed(String text, String what) {
        if (text == null || text.isBlank()) {
            throw new IllegalArgumentException(what + " must not be blank");
        }
        return text.strip();
    }

    /** {hours or degrees (unsigned), minutes, seconds, sign}. */
    private static double[] fields(String t, String original, String what, String shape) {
        Matcher m = FIELDS.matcher(t);
        if (!m.matches()) {
            throw new IllegalArgumentException(what + " must be decimal degrees or " + shape + ": \"" + original + "\"");
        }
        double a = Double.parseDouble(m.group(2));
        double b = m.group(3) == null ? 0 : Double.parseDouble(m.group(3));
        double c = m.group(4) == null ? 0 : Double.parseDouble(m.group(4));
        if ((m.group(3) != null && m.group(2).contains(".")) || (m.group(4) != null && m.group(3).contains("."))) {
            throw new IllegalArgumentException(what + ": only the last field may have a fraction: \"" + original + "\"");
        }
        if (b >= 60) {
            throw new IllegalArgumentException(what + " minutes must be below 60: \"" + original + "\"");
        }
        if (c >= 60) {
            throw new IllegalArgumentException(what + " seconds must be below 60: \"" + original + "\"");
        }
        double sign = "-".equals(m.group(1)) ? -1 : 1;
        return new double[] {a, b, c, sign};
    }
}
