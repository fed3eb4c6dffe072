package org.skyrota.web.site;

import java.util.List;

import jakarta.validation.Valid;
import jakarta.validation.constraints.DecimalMax;
import jakarta.validation.constraints.DecimalMin;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;

import com.fasterxml.jackson.annotation.JsonIgnoreProperties;

import org.skyrota.web.system.IanaZone;

/**
 * A site as a client sends it. {@code version} is the version the edit was made against
 * (ignored when creating); angles in degrees, longitude east-positive; {@code timeZone} an IANA region name. The
 * read-only members of a stored site ({@code id}, {@code createdAt}, {@code updatedAt}) are ignored, so that what a GET
 * answers can be sent back; any other member the form does not have is refused.
 */
@JsonIgnoreProperties({"id", "createdAt", "updatedAt"})
record SiteForm(
        Long version,
        @NotBlank @Size(max = 100) String name,
        @NotNull @DecimalMin("-90") @DecimalMax("90") Double latitudeDeg,
        @NotNull @DecimalMin("-180") @DecimalMax("180") Double longitudeDeg,
        @NotNull @DecimalMin("-500") @DecimalMax("9000") Double elevationM,
        @IanaZone String timeZone,
        @DecimalMin("15") @DecimalMax("23") Double darkSkyZenithVMag,
        @Size(max = 720) List<@Valid @NotNull Point> horizon) {

    record Point(
            @NotNull @DecimalMin("0") @DecimalMax(value = "360", inclusive = false) Double azimuthDeg,
            @NotNull @DecimalMin("-5") @DecimalMax("90") Double altitudeDeg) {}
}
