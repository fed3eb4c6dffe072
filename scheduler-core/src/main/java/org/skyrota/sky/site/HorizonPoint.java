package org.skyrota.sky.site;

/**
 * One vertex of a local horizon profile: the lowest usable apparent altitude in a given
 * direction.
 *
 * @param azimuthDeg azimuth east of north, 0 (inclusive) to 360 (exclusive)
 * @param altitudeDeg minimum apparent altitude in that direction, −90 to 90
 */
public record HorizonPoint(double azimuthDeg, double altitudeDeg) {

    public HorizonPoint {
        if (!(azimuthDeg >= 0 && azimuthDeg < 360)) {
            throw new IllegalArgumentException("azimuthDeg must be in [0, 360): " + azimuthDeg);
        }
        if (!(altitudeDeg >= -90 && altitudeDeg <= 90)) {
            throw new IllegalArgumentException("altitudeDeg must be in [-90, 90]: " + altitudeDeg);
        }
    }

    public static HorizonPoint of(double azimuthDeg, double altitudeDeg) {
        return new HorizonPoint(azimuthDeg, altitudeDeg);
    }
}
