package org.skyrota.sky.visibility;

import java.util.Locale;

/**
 * How dark the sky must be: the Sun's centre below a geometric altitude (twilights, no
 * refraction), or below the sunset altitude (−0.8333°, the upper limb at the horizon with
 * standard refraction), or no condition at all.
 */
public enum Darkness {
    ASTRONOMICAL(-18.0),
    NAUTICAL(-12.0),
    CIVIL(-6.0),
    SUNSET(-0.8333),
    ANY(Double.POSITIVE_INFINITY);

    private final double sunAltitudeLimitDeg;

    Darkness(double sunAltitudeLimitDeg) {
        this.sunAltitudeLimitDeg = sunAltitudeLimitDeg;
    }

    /** The Sun's centre must be below this geometric altitude ({@code +∞} for {@link #ANY}). */
    public double sunAltitudeLimitDeg() {
        return sunAltitudeLimitDeg;
    }

    /**
     * The darkness named in lower or upper case ("astronomical", "nautical", "civil",
     * "sunset", "any").
     *
     * @throws IllegalArgumentException naming the unknown value
     */
    public static Darkness parse(String name) {
        if (name == null) {
            throw new IllegalArgumentException("darkness must not be null");
        }
        try {
            return valueOf(name.trim().toUpperCase(Locale.ROOT));
        } catch (IllegalArgumentException e) {
            throw new IllegalArgumentException(
                    "darkness must be one of astronomical, nautical, civil, sunset, any: " + name, e);
        }
    }
}
