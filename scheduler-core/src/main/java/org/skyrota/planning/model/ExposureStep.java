package org.skyrota.planning.model;

/**
 * One line of an exposure plan: {@code count} exposures of {@code seconds} each through {@code filter}.
 */
public record ExposureStep(String filter, double seconds, int count) {
    public ExposureStep {
        Checks.notBlank("exposure filter", filter);
        Checks.positive("exposure seconds in filter " + filter, seconds);
        Checks.positive("exposure count in filter " + filter, count);
    }
}
