package org.skyrota.web.request;

import java.time.LocalDate;
import java.util.List;
import java.util.Map;

import jakarta.validation.Valid;
import jakarta.validation.constraints.DecimalMax;
import jakarta.validation.constraints.DecimalMin;
import jakarta.validation.constraints.Max;
import jakarta.validation.constraints.Min;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotEmpty;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;

/**
 * An observing request as a client sends it. {@code ra} and {@code dec} are decimal degrees
 * or sexagesimal text (see {@link Sexagesimal}); absent conditions take the defaults of the
 * compute endpoints (minimum altitude 30°, astronomical darkness, no Moon limits). {@code owner}
 * defaults to the signed-in user; only a coordinator or an admin may name someone else. {@code targetKind} is
 * {@code fixed} when absent (then {@code ra} and {@code dec} are required) or a plugin's kind, whose
 * {@code targetParameters} (for example {@code {"body":"jupiter"}}) give the position; {@code ra} and {@code dec} are
 * then not needed.
 *
 * <p>{@code priority} runs from 1 (lowest) to 5 (highest). With more than one repeat,
 * {@code repeatIntervalHours} is the least start-to-start spacing between two visits and
 * {@code repeatToleranceHours} (default 0, less than the interval) how much closer a repeat may
 * still start; the cross-field rules are checked in {@link RequestService}.
 */
record RequestForm(
        Long version,
        @NotNull Long programId,
        @Size(max = 100) String owner,
        @NotBlank @Size(max = 100) String targetName,
        String ra,
        String dec,
        @NotEmpty @Size(max = 50) List<@Valid @NotNull ExposureForm> exposures,
        @DecimalMin("-1") @DecimalMax("89") Double minAltitudeDeg,
        DarknessLimit darkness,
        @DecimalMin("0") @DecimalMax("180") Double minMoonSeparationDeg,
        @DecimalMin("0") @DecimalMax("1") Double maxMoonIllumination,
        LocalDate earliestNight,
        LocalDate latestNight,
        @Min(1) @Max(100) Integer repeats,
        @DecimalMin(value = "0", inclusive = false) @DecimalMax("8784") Double repeatIntervalHours,
        @DecimalMin("0") @DecimalMax("8784") Double repeatToleranceHours,
        @NotNull @Min(1) @Max(5) Integer priority,
        @Size(max = 40) String targetKind,
        @Size(max = 20) Map<@NotBlank @Size(max = 40) String, @NotNull @Size(max = 200) String> targetParameters) {

    record ExposureForm(
            @NotBlank @Size(max = 40) String filter,
            @NotNull @DecimalMin(value = "0", inclusive = false) @DecimalMax("36000") Double seconds,
            @NotNull @Min(1) @Max(1000) Integer count) {}
}
