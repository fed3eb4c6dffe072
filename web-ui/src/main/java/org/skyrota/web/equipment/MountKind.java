package org.skyrota.web.equipment;

/** How a stored telescope is mounted; the planning mapper turns it into the planner's own mount kind. */
public enum MountKind {
    /** Polar-aligned axes; may flip at the meridian and have hour-angle limits. */
    EQUATORIAL,
    /** Altitude and azimuth axes; no hour-angle limits or flips. */
    ALT_AZIMUTH
}
