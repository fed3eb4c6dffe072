package org.skyrota.planning.model;

/**
 * What a request points at: a fixed ICRS position, or the Sun itself.
 *
 * @param name   catalogue name (for example "NGC 7000"), not blank
 * @param raDeg  ICRS right ascension in degrees, 0..360 (ignored for the Sun)
 * @param decDeg ICRS declination in degrees, -90..90 (ignored for the Sun)
 * @param solar  true for solar observing, which needs a certified solar filter
 */
public record Target(String name, double raDeg, double decDeg, boolean solar) {
    public Target {
        Checks.notBlank("target name", name);
        Checks.range("raDeg of target " + name, raDeg, 0, 360);
        Checks.range("decDeg of target " + name, decDeg, -90, 90);
    }

    public static Target fixed(String name, double raDeg, double decDeg) {
        return new Target(name, raDeg, decDeg, false);
    }

    /** The Sun as a target. Caution: only for instruments with a certified solar filter over the front of the optics. */
    public static Target sun() {
        return new Target("Sun", 0, 0, true);
    }
}
