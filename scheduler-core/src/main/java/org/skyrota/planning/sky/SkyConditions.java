package org.skyrota.planning.sky;

/**
 * Conditions for a target at one instant.
 *
 * @param altitudeDeg        apparent altitude, degrees
 * @param airmass            airmass (Kasten–Young or the engine's choice); infinity below the horizon
 * @param skyBrightnessVMag  sky brightness at the target, V mag per square arcsecond (larger is darker)
 * @param sunSeparationDeg   angle between target and Sun, degrees
 */
public record SkyConditions(double altitudeDeg, double airmass, double skyBrightnessVMag, double sunSeparationDeg) {
}
