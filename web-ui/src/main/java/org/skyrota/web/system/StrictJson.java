package org.skyrota.web.system;

import java.time.Instant;
import java.time.LocalDate;

import org.springframework.boot.jackson.autoconfigure.JsonMapperBuilderCustomizer;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.core.Ordered;

import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.core.StreamReadFeature;
import tools.jackson.databind.DeserializationContext;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.MapperFeature;
import tools.jackson.databind.ValueDeserializer;
import tools.jackson.databind.cfg.CoercionAction;
import tools.jackson.databind.cfg.CoercionInputShape;
import tools.jackson.databind.cfg.EnumFeature;
import tools.jackson.databind.exc.InvalidFormatException;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.module.SimpleModule;
import tools.jackson.databind.type.LogicalType;

/**
 * JSON bodies are read as they are written, or refused naming the field ({@link ProblemAdvice} answers a 400):
 * <ul>
 * <li>a member the body does not have ({@code "maxAirmas"}, {@code "secnds"}) is refused, not dropped; the read-only
 * members of a resource's own representation are listed on its form and ignored there, so that what a GET answers
 * can be sent back;</li>
 * <li>a member given twice is refused (the second used to win without a word);</li>
 * <li>a number must be a JSON number, and a whole number (a count, a priority, an id) one without a fraction
 * ({@code 2.5} and {@code 2.0} are refused where a whole number is meant; {@code 30} is taken where a decimal is);</li>
 * <li>text must be a JSON string: no number, {@code true} or {@code false} is turned into text, and no text
 * ({@code "3"}, {@code "true"}) into a number or a boolean; an enumerated value is its name, never a position;
 * the one exception is a request's {@code ra} and {@code dec}, decimal degrees as a number or sexagesimal text
 * ({@link NumberOrText});</li>
 * <li>a night is a date from 1900-01-01 to 2200-12-31 and an instant ISO-8601 text with its offset inside those
 * years ({@link SupportedDates}), in every body.</li>
 * </ul>
 * Spring Boot's own defaults leave unknown members out and coerce scalars; this runs after them.
 */
@Configuration(proxyBeanMethods = false)
class StrictJson {

    @Bean
    JsonMapperBuilderCustomizer strictJsonInput() {
        return new Customizer();
    }

    /** Ordered after Spring Boot's standard customizer, which turns the unknown-member check off. */
    static final class Customizer implements JsonMapperBuilderCustomizer, Ordered {

        @Override
        public void customize(JsonMapper.Builder builder) {
            apply(builder);
        }

        @Override
        public int getOrder() {
            return Ordered.LOWEST_PRECEDENCE;
        }
    }

    /** The rules of the class description, on any JSON mapper builder (tests build one without Spring). */
    static JsonMapper.Builder apply(JsonMapper.Builder builder) {
        return builder
                .enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
                .enable(DeserializationFeature.FAIL_ON_NULL_FOR_PRIMITIVES)
                .disable(DeserializationFeature.ACCEPT_FLOAT_AS_INT)
                .disable(MapperFeature.ALLOW_COERCION_OF_SCALARS)
                .enable(EnumFeature.FAIL_ON_NUMBERS_FOR_ENUMS)
                .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
                .withCoercionConfig(LogicalType.Textual, c -> c
                        .setCoercion(CoercionInputShape.Integer, CoercionAction.Fail)
                        .setCoercion(CoercionInputShape.Float, CoercionAction.Fail)
                        .setCoercion(CoercionInputShape.Boolean, CoercionAction.Fail))
                .withCoercionConfig(LogicalType.Integer, c -> c
                        .setCoercion(CoercionInputShape.Float, CoercionAction.Fail)
                        .setCoercion(CoercionInputShape.String, CoercionAction.Fail)
                        .setCoercion(CoercionInputShape.EmptyString, CoercionAction.Fail))
                .withCoercionConfig(LogicalType.Float, c -> c
                        .setCoercion(CoercionInputShape.String, CoercionAction.Fail)
                        .setCoercion(CoercionInputShape.EmptyString, CoercionAction.Fail))
                .withCoercionConfig(LogicalType.Boolean, c -> c
                        .setCoercion(CoercionInputShape.Integer, CoercionAction.Fail)
                        .setCoercion(CoercionInputShape.Float, CoercionAction.Fail)
                        .setCoercion(CoercionInputShape.String, CoercionAction.Fail)
                        .setCoercion(CoercionInputShape.EmptyString, CoercionAction.Fail))
                .withCoercionConfig(LogicalType.Enum, c -> c
                        .setCoercion(CoercionInputShape.Integer, CoercionAction.Fail)
                        .setCoercion(CoercionInputShape.EmptyString, CoercionAction.Fail))
                .addModule(new SimpleModule("skyrota-supported-dates")
                        .addDeserializer(LocalDate.class, new Nights())
                        .addDeserializer(Instant.class, new Instants()));
    }

    /** A night: ISO-8601 text inside {@link SupportedDates}. */
    static final class Nights extends ValueDeserializer<LocalDate> {
        @Override
        public LocalDate deserialize(JsonParser p, DeserializationContext context) {
            if (!p.hasToken(JsonToken.VALUE_STRING)) {
                return (LocalDate) context.handleUnexpectedToken(LocalDate.class, p);
            }
            String text = p.getString();
            try {
                return SupportedDates.parseDate(text);
            } catch (IllegalArgumentException e) {
                throw InvalidFormatException.from(p, e.getMessage(), text, LocalDate.class);
            }
        }
    }

    /** An instant: ISO-8601 text with its offset inside {@link SupportedDates}. */
    static final class Instants extends ValueDeserializer<Instant> {
        @Override
        public Instant deserialize(JsonParser p, DeserializationContext context) {
            if (!p.hasToken(JsonToken.VALUE_STRING)) {
                return (Instant) context.handleUnexpectedToken(Instant.class, p);
            }
            String text = p.getString();
            try {
                return SupportedDates.parseInstant(text);
            } catch (IllegalArgumentException e) {
                throw InvalidFormatException.from(p, e.getMessage(), text, Instant.class);
            }
        }
    }
}
