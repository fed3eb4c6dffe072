/**
 * The atmosphere between target and telescope: refraction (Bennett, Saemundsson), air mass
 * (Kasten–Young) and the brightness of the moonlit sky (Krisciunas–Schaefer). Published in degrees and
 * magnitudes, so these helpers take degrees.
 */
package org.skyrota.sky.atmosphere;
