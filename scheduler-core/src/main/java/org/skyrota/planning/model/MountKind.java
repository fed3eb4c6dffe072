package org.skyrota.planning.model;

/**
 * How a telescope is mounted. Alt-azimuth mounts cannot track through the zenith; equatorial mounts may have
 * hour-angle limits, and a German equatorial mount must flip to the other side of its pier when the target crosses
 * the meridian ({@link Telescope#needsMeridianFlip()}).
 */
public enum MountKind {
    EQUATORIAL,
    ALT_AZIMUTH
}
