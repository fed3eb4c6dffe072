package org.skyrota.web.site;

import jakarta.persistence.Column;
import jakarta.persistence.Embeddable;

/** One point of a site's local horizon: the lowest usable altitude at an azimuth (east of north). */
@Embeddable
public class HorizonPoint {

    @Column(name = "azimuth_deg", nullable = false)
    private double azimuthDeg;

    @Column(name = "altitude_deg", nullable = false)
    private double altitudeDeg;

    protected HorizonPoint() {}

    public HorizonPoint(double azimuthDeg, double altitudeDeg) {
        this.azimuthDeg = azimuthDeg;
        this.altitudeDeg = altitudeDeg;
    }

    public double getAzimuthDeg() {
        return azimuthDeg;
    }

    public double getAltitudeDeg() {
        return altitudeDeg;
    }
}
