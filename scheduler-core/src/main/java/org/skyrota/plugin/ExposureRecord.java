package org.skyrota.plugin;

/**
 * One line of an exposure plan.
 *
 * @param filter  the filter name as the instrument knows it ({@code "V"}, {@code "Ha"}); not blank
 * @param seconds length of one exposure in seconds, positive
 * @param count   number of exposures, at least 1
 */
public record ExposureRecord(String filter, double seconds, int count) {

    public ExposureRecord {
        if (filter == null || filter.isBlank()) {
            throw new IllegalArgumentException("exposure filter must not be blank");
        }
        if (!(seconds > 0) || Double.isInfinite(seconds)) {
            throw new IllegalArgumentException("exposure seconds must be a positive number: " + seconds);
        }
        if (count < 1) {
            throw new IllegalArgumentException("exposure count must be at least 1: " + count);
        }
    }
}
