package org.skyrota.plugins.icalendar;

import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.time.temporal.ChronoUnit;

/**
 * The content-line rules of RFC 5545 section 3.1: lines end in CRLF and are folded so that no line
 * is longer than 75 octets, a continuation line starting with one space; a fold never splits a
 * UTF-8 character. TEXT values escape backslash, semicolon, comma and line breaks (section 3.3.11).
 */
final class ContentLines {

    static final int MAX_OCTETS = 75;
    private static final DateTimeFormatter UTC = DateTimeFormatter.ofPattern("uuuuMMdd'T'HHmmss'Z'").withZone(ZoneOffset.UTC);

    private final ByteArrayOutputStream out = new ByteArrayOutputStream();

    /** Writes {@code NAME:value}, folded; the value must already be escaped if it is TEXT. */
    ContentLines line(String name, String value) {
        String line = name + ":" + value;
        int octetsOnLine = 0;
        for (int i = 0; i < line.length(); ) {
            int cp = line.codePointAt(i);
            byte[] bytes = new String(Character.toChars(cp)).getBytes(StandardCharsets.UTF_8);
            if (octetsOnLine + bytes.length > MAX_OCTETS) {
                out.writeBytes(new byte[] {'\r', '\n', ' '});
                octetsOnLine = 1;
            }
            out.writeBytes(bytes);
            octetsOnLine += bytes.length;
            i += Character.charCount(cp);
        }
        out.writeBytes(new byte[] {'\r', '\n'});
        return this;
    }

    /** A TEXT property. */
    ContentLines text(String name, String value) {
        return line(name, escape(value));
    }

    /** A DATE-TIME property in UTC ("FORM #2"), to the second. */
    ContentLines utc(String name, Instant instant) {
        return line(name, UTC.format(instant.truncatedTo(ChronoUnit.SECONDS)));
    }

    byte[] bytes() {
        return out.toByteArray();
    }

    /** RFC 5545 section 3.3.11; a CR LF or a lone CR or LF becomes one {@code \n}; other control characters are dropped. */
    static String escape(String value) {
        if (value == null) {
            return "";
        }
        StringBuilder s = new StringBuilder(value.length() + 8);
        for (int i = 0; i < value.length(); i++) {
            char c = value.charAt(i);
            switch (c) {
                case '\\' -> s.append("\\\\");
                case ';' -> s.append("\\;");
                case ',' -> s.append("\\,");
                case '\r' -> {
                    s.append("\\n");
                    if (i + 1 < value.length() && value.charAt(i + 1) == '\n') {
                        i++;
                    }
                }
                case '\n' -> s.append("\\n");
                default -> {
                    // CONTROL characters other than HTAB are not allowed in a TEXT value
                    if (c >= 0x20 && c != 0x7F || c == '\t') {
                        s.append(c);
                    }
                }
            }
        }
        return s.toString();
    }
}
