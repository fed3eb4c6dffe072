package org.skyrota.planning.model;

/** How a telescope is mounted; alt-azimuth mounts cannot track through the zenith. */
public enum MountKind {
    EQUATORIAL,
    ALT_AZIMUTH
}
