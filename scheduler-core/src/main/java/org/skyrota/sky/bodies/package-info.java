/**
 * The Sun (truncated VSOP87, Meeus ch. 25 and Appendix III) and the Moon (Meeus ch. 47 and 48):
 * geocentric apparent places of date in radians and km, and the Moon's phase and illumination.
 * Apply {@link org.skyrota.sky.coords.Topocentric} for the place seen from a site.
 *
 * <p>Safety: never point unfiltered optics at or near the Sun.
 */
package org.skyrota.sky.bodies;
