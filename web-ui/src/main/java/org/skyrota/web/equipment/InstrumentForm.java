package org.skyrota.web.equipment;

import java.util.List;

import jakarta.validation.constraints.DecimalMax;
import jakarta.validation.constraints.DecimalMin;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;

import com.fasterxml.jackson.annotation.JsonIgnoreProperties;

/** An instrument as a client sends it; filters by name in wheel order. A stored instrument's {@code id} is ignored. */
@JsonIgnoreProperties({"id"})
record InstrumentForm(
        Long version,
        @NotNull Long telescopeId,
        @NotBlank @Size(max = 100) String name,
        @NotNull @DecimalMin("0") @DecimalMax("3600") Double readoutSeconds,
        @NotNull @DecimalMin("0") @DecimalMax("3600") Double filterChangeSeconds,
        Boolean certifiedSolarFilter,
        @Size(max = 40) List<@NotBlank @Size(max = 40) String> filters) {}
