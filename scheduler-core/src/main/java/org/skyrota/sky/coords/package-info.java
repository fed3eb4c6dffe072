/**
 * Coordinates of date: obliquity, nutation (IAU 1980, Meeus Table 22.A), precession (IAU 2006), the
 * apparent place of ICRS targets, horizontal coordinates, separations and diurnal parallax (WGS84).
 *
 * <p>These are the inside of the engine: static functions over primitives in radians that write into
 * caller-supplied {@code out} arrays and allocate nothing, so batch loops stay cheap. Degrees belong at
 * the boundary ({@link org.skyrota.sky.coords.EquatorialDeg}).
 */
package org.skyrota.sky.coords;
