package org.skyrota.plugins.voevent;

import java.util.List;
import java.util.Objects;
import org.skyrota.plugin.ExposureRecord;

/**
 * How an alert becomes a request.
 *
 * @param program          the target-of-opportunity program the request goes to; not blank
 * @param exposures        the exposure plan of the request; not empty
 * @param validityNights   how many nights from the event's night the request stays open, at least 1
 * @param defaultPriority  the priority (1 to 5) when the packet states no importance
 * @param allowTestPackets whether {@code role="test"} packets are accepted
 */
public record AlertSettings(String program, List<ExposureRecord> exposures, int validityNights, int defaultPriority,
        boolean allowTestPackets) {

    public static final String DEFAULT_PROGRAM = "Target of opportunity";

    public AlertSettings {
        if (program == null || program.isBlank()) {
            throw new IllegalArgumentException("program must not be blank");
        }
        exposures = List.copyOf(Objects.requireNonNull(exposures, "exposures"));
        if (exposures.isEmpty()) {
            throw new IllegalArgumentException("exposures must not be empty");
        }
        if (validityNights < 1) {
            throw new IllegalArgumentException("validityNights must be at least 1: " + validityNights);
        }
        if (defaultPriority < 1 || defaultPriority > 5) {
            throw new IllegalArgumentException("defaultPriority must be from 1 to 5: " + defaultPriority);
        }
    }

    /** Program "Target of opportunity", five 60 s exposures in R, open three nights, priority 3, no test packets. */
    public static AlertSettings defaults() {
        return new AlertSettings(DEFAULT_PROGRAM, List.of(new ExposureRecord("R", 60, 5)), 3, 3, false);
    }

    public AlertSettings withProgram(String newProgram) {
        return new AlertSettings(newProgram, exposures, validityNights, defaultPriority, allowTestPackets);
    }

    public AlertSettings withTestPackets(boolean allow) {
        return new AlertSettings(program, exposures, validityNights, defaultPriority, allow);
    }
}
