/**
 * Time scales of the sky engine: Julian Dates in UTC, TT and UT1 from {@link java.time.Instant}, the
 * leap-second table, ΔT (Espenak–Meeus) and the Earth's rotation (ERA, GMST IAU 2006, GAST).
 * Every method names its scale ({@code jdUtc}, {@code jdTt}, {@code jdUt1}); angles are radians.
 */
package org.skyrota.sky.time;
