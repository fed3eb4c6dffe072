package org.skyrota.web.system;

import java.lang.annotation.Documented;
import java.lang.annotation.ElementType;
import java.lang.annotation.Retention;
import java.lang.annotation.RetentionPolicy;
import java.lang.annotation.Target;
import java.time.ZoneId;
import java.util.Optional;

import jakarta.validation.Constraint;
import jakarta.validation.ConstraintValidator;
import jakarta.validation.ConstraintValidatorContext;
import jakarta.validation.Payload;

/**
 * The annotated string, when not null, is the name of a region of the IANA time-zone database ({@code Europe/Madrid},
 * {@code America/Santiago}, {@code Etc/GMT-5}, {@code UTC}), spelled as the database spells it. {@link ZoneId#of}
 * takes more than that: fixed offsets ({@code +05:00}) and offsets after a prefix ({@code GMT+5},
 * {@code UTC+02:00}) are not regions, follow no daylight-saving rules and read the wrong way round to many people
 * ({@code Etc/GMT-5} is five hours east of Greenwich), so they are refused.
 */
@Documented
@Constraint(validatedBy = IanaZone.Validator.class)
@Target({ElementType.FIELD, ElementType.PARAMETER, ElementType.RECORD_COMPONENT, ElementType.TYPE_USE})
@Retention(RetentionPolicy.RUNTIME)
public @interface IanaZone {

    String MESSAGE = "must be an IANA time-zone region such as Europe/Madrid (or Etc/GMT-5 for a fixed offset), not an offset";

    String message() default MESSAGE;

    Class<?>[] groups() default {};

    Class<? extends Payload>[] payload() default {};

    class Validator implements ConstraintValidator<IanaZone, String> {

        /** The zone of an IANA region name, or empty for anything else (offsets, prefixed offsets, unknown names). */
        public static Optional<ZoneId> region(String name) {
            // The region ids of the JDK's time-zone database (tzdb), the IANA names; offsets are never among them.
            return name != null && ZoneId.getAvailableZoneIds().contains(name) ? Optional.of(ZoneId.of(name)) : Optional.empty();
        }

        @Override
        public boolean isValid(String value, ConstraintValidatorContext context) {
            return value == null || region(value).isPresent();
        }
    }
}
