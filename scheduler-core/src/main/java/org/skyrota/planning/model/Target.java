package org.skyrota.planning.model;

import org.skyrota.plugin.MovingTarget;

/**
 * What a request points at: a fixed ICRS position, the Sun itself, or a moving target (a planet, the Moon, a comet)
 * whose place the sky engine asks for at each instant.
 *
 * @param name   catalogue name (for example "NGC 7000"), not blank
 * @param raDeg  ICRS right ascension in degrees, 0..360 (ignored for the Sun and for a moving target)
 * @param decDeg ICRS declination in degrees, -90..90 (ignored for the Sun and for a moving target)
 * @param solar  true for solar observing, which needs a certified solar filter; always true for a moving target
 *               that says it is solar
 * @param moving the moving target's position, or null for a fixed target or the Sun
 */
public record Target(String name, double raDeg, double decDeg, boolean solar, MovingTarget moving) {
    public Target {
        Checks.notBlank("target name", name);
        Checks.range("raDeg of target " + name, raDeg, 0, 360);
        Checks.range("decDeg of target " + name, decDeg, -90, 90);
        if (moving != null && moving.isSolar() && !solar) {
            throw new IllegalArgumentException("target " + name + " is solar (" + moving.label()
                    + ") and must be marked solar: only a certified solar filter may observe it");
        }
    }

    public Target(String name, double raDeg, double decDeg, boolean solar) {
        this(name, raDeg, decDeg, solar, null);
    }

    public static Target fixed(String name, double raDeg, double decDeg) {
        return new Target(name, raDeg, decDeg, false);
    }

    /** The Sun as a target. Caution: only for instruments with a certified solar filter over the front of the optics. */
    public static Target sun() {
        return new Target("Sun", 0, 0, true);
    }

    /**
     * A moving target, solar when the position says so. Caution: a solar one is treated like the Sun, only for
     * instruments with a certified solar filter over the front of the optics.
     */
    public static Target moving(String name, MovingTarget position) {
        if (position == null) {
            throw new IllegalArgumentException("moving target " + name + " needs a position");
        }
        return new Target(name, 0, 0, position.isSolar(), position);
    }

    /** Whether the target's place changes with time (it has a {@link #moving()} position). */
    public boolean isMoving() {
        return moving != null;
    }
}
