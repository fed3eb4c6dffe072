package org.skyrota.web.equipment;

import jakarta.validation.constraints.DecimalMax;
import jakarta.validation.constraints.DecimalMin;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;

import com.fasterxml.jackson.annotation.JsonIgnoreProperties;


/**
 * A telescope as a client sends it; {@code version} is required when editing. The mount fields may be left out:
 * {@code mountKind} defaults to {@code EQUATORIAL}, {@code needsMeridianFlip} to false, the hour-angle limits to none
 * (-180 and 180 degrees). A flip or a limit on an {@code ALT_AZIMUTH} mount is refused naming the field. A stored
 * telescope's {@code id} is ignored, so that what a GET answers can be sent back.
 */
@JsonIgnoreProperties({"id"})
record TelescopeForm(
        Long version,
        @NotNull Long siteId,
        @NotBlank @Size(max = 100) String name,
        @NotNull @DecimalMin(value = "0", inclusive = false) @DecimalMax("20000") Double apertureMm,
        @NotNull @DecimalMin("-5") @DecimalMax("89") Double minAltitudeDeg,
        @NotNull @DecimalMin(value = "0", inclusive = false) @DecimalMax("90") Double slewRateDegPerS,
        @NotNull @DecimalMin("0") @DecimalMax("3600") Double settleSeconds,
        Boolean active,
        MountKind mountKind,
        Boolean needsMeridianFlip,
        @DecimalMin("-180") @DecimalMax("0") Double eastHourAngleLimitDeg,
        @DecimalMin("0") @DecimalMax("180") Double westHourAngleLimitDeg) {}
