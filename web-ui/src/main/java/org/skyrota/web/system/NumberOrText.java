package org.skyrota.web.system;

import java.math.BigDecimal;

import tools.jackson.core.JsonParser;
import tools.jackson.core.JsonToken;
import tools.jackson.databind.DeserializationContext;
import tools.jackson.databind.ValueDeserializer;
import tools.jackson.databind.exc.MismatchedInputException;

/**
 * A member that takes a JSON number or JSON text, as text: a request's {@code ra} and {@code dec} are decimal degrees
 * ({@code 83.82}) or sexagesimal text ({@code "05:35:17.3"}). Everywhere else numbers and text are kept apart
 * ({@link StrictJson}). A number becomes its plain decimal text ({@code 8.382e1} reads as {@code 83.82}), the same
 * double as the number itself; {@code true}, {@code false}, arrays and objects are refused.
 */
public final class NumberOrText extends ValueDeserializer<String> {

    /** What such a member must be, for messages. */
    public static final String RULE = "must be decimal degrees as a JSON number, or sexagesimal text";

    @Override
    public String deserialize(JsonParser p, DeserializationContext context) {
        if (p.hasToken(JsonToken.VALUE_STRING)) {
            return p.getString();
        }
        if (p.hasToken(JsonToken.VALUE_NUMBER_INT) || p.hasToken(JsonToken.VALUE_NUMBER_FLOAT)) {
            double value = p.getDoubleValue();
            if (Double.isFinite(value)) {
                // Double.toString is the shortest text of the double; BigDecimal spells it without an exponent.
                return new BigDecimal(Double.toString(value)).toPlainString();
            }
            // Beyond a double's range: left as written, so that the coordinate's own check names it.
            return p.getString();
        }
        throw MismatchedInputException.from(p, NumberOrText.class, RULE);
    }
}
