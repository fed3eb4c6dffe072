/**
 * The sky engine: time scales, positions of the Sun, the Moon and fixed targets, the night
 * almanac and visibility windows. Angles are degrees at public boundaries and radians inside;
 * instants are {@link java.time.Instant} in UTC.
 */
package org.skyrota.sky;
