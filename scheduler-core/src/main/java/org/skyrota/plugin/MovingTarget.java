package org.skyrota.plugin;

/**
 * The position of a target at an instant. Implementations are immutable and thread-safe, and
 * allocate nothing per call, because the sky engine samples them many times a night.
 */
public interface MovingTarget {

    /** A short label for the target, for example {@code "Jupiter"}; not null. */
    String label();

    /**
     * The geocentric apparent position of date (true equator and equinox of date, aberration and
     * light time included).
     *
     * @param jdTt the instant as a Julian Date in Terrestrial Time
     * @param out  receives {@code out[0]} right ascension in radians [0, 2&pi;), {@code out[1]}
     *             declination in radians, {@code out[2]} distance from the Earth's centre in km
     */
    void apparentGeocentric(double jdTt, double[] out);

    /** Whether this target is the Sun or so close to it that only instruments with a certified solar filter may observe it. */
    default boolean isSolar() {
        return false;
    }
}
