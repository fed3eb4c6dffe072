package org.skyrota.planning.model;

/** How dark the sky must be: the Sun's centre below the named twilight altitude, or any time (daytime and solar work). */
public enum DarknessLimit {
    ANY(90.0),
    CIVIL(-6.0),
    NAUTICAL(-12.0),
    ASTRONOMICAL(-18.0);

    private final double sunAltitudeDeg;

    DarknessLimit(double sunAltitudeDeg) {
        this.sunAltitudeDeg = sunAltitudeDeg;
    }

    /** The Sun's geometric altitude the centre must stay below, degrees. */
    public double sunAltitudeDeg() {
        return sunAltitudeDeg;
    }

    public String words() {
        return switch (this) {
            case ANY -> "at any time";
            case CIVIL -> "after civil dusk";
            case NAUTICAL -> "after nautical dusk";
            case ASTRONOMICAL -> "dark";
        };
    }
}
