package org.skyrota.web.program;

import java.time.LocalDate;
import java.util.List;

import jakarta.validation.Valid;
import jakarta.validation.constraints.AssertTrue;
import jakarta.validation.constraints.DecimalMax;
import jakarta.validation.constraints.DecimalMin;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Pattern;
import jakarta.validation.constraints.Size;

import com.fasterxml.jackson.annotation.JsonIgnoreProperties;

/** A program as a client sends it; {@code version} is required when editing. A stored program's {@code id} is ignored. */
@JsonIgnoreProperties({"id"})
record ProgramForm(
        Long version,
        @NotBlank @Size(max = 40) @Pattern(regexp = "[A-Za-z0-9][A-Za-z0-9._-]*", message = "may hold letters, digits, '.', '_' and '-' only") String code,
        @NotBlank @Size(max = 200) String title,
        @NotBlank @Size(max = 100) String principalInvestigator,
        Boolean active,
        @Size(max = 100) List<@Valid @NotNull GrantForm> grants) {

    /** A grant: on {@code telescopeId}, or at {@code siteId}, or (neither given) anywhere in the network. */
    record GrantForm(
            Long telescopeId,
            Long siteId,
            @NotNull @DecimalMin(value = "0", inclusive = false) @DecimalMax("10000") Double hours,
            @NotNull LocalDate firstNight,
            @NotNull LocalDate lastNight) {

        // Nights out of order: both are named, so that each field shows it.
        @AssertTrue(message = "must not be after lastNight")
        boolean isFirstNight() {
            return inOrder();
        }

        @AssertTrue(message = "must not be before firstNight")
        boolean isLastNight() {
            return inOrder();
        }

        private boolean inOrder() {
            return firstNight == null || lastNight == null || !lastNight.isBefore(firstNight);
        }

        @AssertTrue(message = "give telescopeId or siteId, not both (neither: the grant pays anywhere)")
        boolean isSiteId() {
            return telescopeId == null || siteId == null;
        }
    }
}
