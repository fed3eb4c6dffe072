package org.skyrota.plugins.csv;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.skyrota.plugin.ExposureRecord;

/** The exposure plan as one CSV cell: {@code "V:60x3;R:60x3"} (filter, seconds, count), count 1 when left out. */
public final class FilterPlan {

    private static final Pattern STEP = Pattern.compile("\\s*([^:;]+?)\\s*:\\s*([0-9]+(?:\\.[0-9]*)?)\\s*(?:[xX×]\\s*([0-9]+))?\\s*");

    private FilterPlan() {
    }

    /** @throws IllegalArgumentException saying which step is wrong */
    public static List<ExposureRecord> parse(String text) {
        if (text == null || text.isBlank()) {
            throw new IllegalArgumentException("the filter plan is empty; write it as filter:seconds x count, for example V:60x3;R:60x3");
        }
        List<ExposureRecord> steps = new ArrayList<>();
        String[] parts = text.split(";", -1);
        for (int i = 0; i < parts.length; i++) {
            if (parts[i].isBlank() && i == parts.length - 1 && i > 0) {
                continue; // a trailing semicolon
            }
            Matcher m = STEP.matcher(parts[i]);
            if (!m.matches()) {
                throw new IllegalArgumentException("step " + (i + 1) + " \"" + parts[i].strip()
                        + "\" is not filter:seconds x count (for example V:60x3)");
            }
            double seconds = Double.parseDouble(m.group(2));
            int count;
            try {
                count = m.group(3) == null ? 1 : Integer.parseInt(m.group(3));
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException("step " + (i + 1) + ": the count is too large: " + m.group(3));
            }
            try {
                steps.add(new ExposureRecord(m.group(1), seconds, count));
            } catch (IllegalArgumentException e) {
                throw new IllegalArgumentException("step " + (i + 1) + ": " + e.getMessage());
            }
        }
        return steps;
    }

    public static String format(List<ExposureRecord> exposures) {
        StringBuilder text = new StringBuilder();
        for (ExposureRecord e : exposures) {
            if (e.filter().contains(":") || e.filter().contains(";")) {
                throw new IllegalArgumentException("a filter name in a CSV filter plan cannot hold ':' or ';': " + e.filter());
            }
            if (text.length() > 0) {
                text.append(';');
            }
            String seconds = e.seconds() == Math.rint(e.seconds()) && Math.abs(e.seconds()) < 1e15
                    ? Long.toString((long) e.seconds()) : BigDecimal.valueOf(e.seconds()).toPlainString();
            text.append(e.filter()).append(':').append(seconds).append('x').append(e.count());
        }
        return text.toString();
    }
}
