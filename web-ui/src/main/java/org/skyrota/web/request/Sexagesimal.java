package org.skyrota.web.request;

import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads coordinates as people write them: decimal degrees ({@code 83.82}, {@code -5.39}), or
 * sexagesimal with colons, spaces or unit letters, right ascension in hours
 * ({@code 05:35:17.3}, {@code 5h35m17.3s}) and declination in degrees ({@code -05:23:28},
 * {@code -5d23m28s}, {@code -5°23'28"}).
 */
final class Sexagesimal {

    private static final Pattern DECIMAL = Pattern.compile("[+-]?(\\d+(\\.\\d*)?|\\.\\d+)");
    private static final Pattern PARTS = Pattern.compile(
            "([+-]?)\\s*(\\d{1,3})\\s*(?:[:hHdD°]|\\s)\\s*(\\d{1,2})(?:\\s*(?:[:mM'′]|\\s)\\s*(\\d{1,2}(?:\\.\\d*)?))?\\s*(?:[sS\"″])?");

    private Sexagesimal() {}

    /** Right ascension in degrees, 0 to below 360. */
    static double rightAscensionDeg(String text) {
        String t = text.trim();
        if (DECIMAL.matcher(t).matches()) {
            double deg = Double.parseDouble(t);
            require(deg >= 0 && deg <= 360, "in decimal degrees must be between 0 and 360, was " + text);
            return deg % 360;
        }
        Matcher m = PARTS.matcher(t);
        require(m.matches() && m.group(1).isEmpty(), "must be decimal degrees or hours as HH:MM:SS.s or 5h35m17s, was '" + text + "'");
        double hours = hms(m, text, 24);
        return hours * 15 % 360;
    }

    /** Declination in degrees, −90 to 90. */
    static double declinationDeg(String text) {
        String t = text.trim();
        if (DECIMAL.matcher(t).matches()) {
            double deg = Double.parseDouble(t);
            require(deg >= -90 && deg <= 90, "in decimal degrees must be between -90 and 90, was " + text);
            return deg;
        }
        Matcher m = PARTS.matcher(t);
        require(m.matches(), "must be decimal degrees or degrees as +DD:MM:SS.s or -5d23m28s, was '" + text + "'");
        double deg = hms(m, text, 90);
        require(deg <= 90, "must be between -90 and 90 degrees, was '" + text + "'");
        return "-".equals(m.group(1)) ? -deg : deg;
    }

    private static double hms(Matcher m, String text, int maxWhole) {
        int whole = Integer.parseInt(m.group(2));
        int minutes = Integer.parseInt(m.group(3));
        double seconds = m.group(4) == null ? 0 : Double.parseDouble(m.group(4));
        require(whole <= maxWhole && minutes < 60 && seconds < 60, "has a field out of range, was '" + text + "'");
        double value = whole + minutes / 60.0 + seconds / 3600.0;
        require(value <= maxWhole, "is out of range, was '" + text + "'");
        return value;
    }

    private static void require(boolean ok, String message) {
        if (!ok) {
            throw new IllegalArgumentException(message);
        }
    }
}
