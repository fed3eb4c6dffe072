package org.skyrota.sky.events;

/**
 * An instant where a function of time passes through zero.
 *
 * @param epochSecond the instant, UTC seconds since 1970 (fractional)
 * @param rising true when the function goes from negative to positive
 */
public record Crossing(double epochSecond, boolean rising) {
}
