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

import com.fasterxml.jackson.annotation.JsonIgnoreProperties;

import org.skyrota.web.system.NumberOrText;

import tools.jackson.databind.annotation.JsonDeserialize;

/**
 * An observing request as a client sends it. {@code ra} and {@code dec} are decimal degrees, as JSON numbers,
 * or sexagesimal text (see {@link Sexagesimal}); {@code raDeg} and {@code decDeg}, the names a request read back
 * carries, are taken in their place (decimal degrees only), so that what a GET answers can be sent back with PUT
 * unchanged; given beside {@code ra} or {@code dec}, they must agree. The read-only members of a stored request
 * ({@code id}, {@code state}, {@code rejectionReason}, {@code createdAt}, {@code updatedAt}) are ignored; any other
 * member the form does not have is refused. Absent conditions take the defaults of the
 * compute endpoints (minimum altitude 30°, astronomical darkness, no Moon limits). {@code owner}
 * defaults to the signed-in user; only a coordinator or an admin may name someone else. {@code targetKind} is
 * {@code fixed} when absent (then {@code ra} and {@code dec} are required) or a plugin's kind, whose
 * {@code targetParameters} (for example {@code {"body":"jupiter"}}) give the position; {@code ra} and {@code dec} are
 * then not needed.
 *
 * <p>{@code maxAirmass} limits the Kasten–Young airmass as {@code minAltitudeDeg} limits the altitude (the stricter
 * of the two decides): at least 1, the zenith's airmass by definition, and at most 10, about 5.2° up, our choice (the
 * sky engine takes up to 40, but a limit that high limits nothing the minimum altitude does not).
 *
 * <p>{@code priority} runs from 1 (lowest) to 5 (highest). With more than one repeat,
 * {@code repeatIntervalHours} is the least start-to-start spacing between two visits and
 * {@code repeatToleranceHours} (default 0, less than the interval) how much closer a repeat may
 * still start; the cross-field rules are checked in {@link RequestService}.
 */
@JsonIgnoreProperties({"id", "state", "rejectionReason", "createdAt", "updatedAt", "alertIvorn"})
record RequestForm(
        Long version,
        @NotNull Long programId,
        @Size(max = 100) String owner,
        @NotBlank @Size(max = 100) String targetName,
        @JsonDeserialize(using = NumberOrText.class) String ra,
        @JsonDeserialize(using = NumberOrText.class) String dec,
        Double raDeg,
        Double decDeg,
        @NotEmpty @Size(max = 50) List<@Valid @NotNull ExposureForm> exposures,
        @DecimalMin("-1") @DecimalMax("89") Double minAltitudeDeg,
        DarknessLimit darkness,
        @DecimalMin("0") @DecimalMax("180") Double minMoonSeparationDeg,
        @DecimalMin("0") @DecimalMax("1") Double maxMoonIllumination,
        @DecimalMin("1") @DecimalMax("10") Double maxAirmass,
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
