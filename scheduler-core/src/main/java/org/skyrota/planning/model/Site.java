package org.skyrota.planning.model;

import java.time.ZoneId;
import java.util.Objects;

/**
 * An observing site as the planner sees it.
 *
 * @param id                  stable identifier, not blank
 * @param name                display name, not blank
 * @param latitudeDeg         geodetic latitude in degrees, -90..90
 * @param longitudeDeg        longitude in degrees, east-positive, -180..180
 * @param elevationM          height above sea level in metres
 * @param zone                IANA time zone, or null where only the longitude is known
 * @param horizonAltitudeDeg  lowest usable altitude in degrees set by the local horizon (trees, domes); 0 for a flat horizon
 * @param darkSkyZenithVMag   zenith sky brightness on a moonless astronomical night, V mag per square arcsecond
 */
public record Site(String id, String name, double latitudeDeg, double longitudeDeg, double elevationM,
                   ZoneId zone, double horizonAltitudeDeg, double darkSkyZenithVMag) {
    public Site {
        Checks.notBlank("site id", id);
        Checks.notBlank("site name", name);
        Checks.range("latitudeDeg of site " + id, latitudeDeg, -90, 90);
        Checks.range("longitudeDeg of site " + id, longitudeDeg, -180, 180);
        Checks.range("horizonAltitudeDeg of site " + id, horizonAltitudeDeg, -5, 60);
        Checks.range("darkSkyZenithVMag of site " + id, darkSkyZenithVMag, 15, 23);
    }

    public static Site of(String id, String name, double latitudeDeg, double longitudeDeg, double elevationM,
                          String zoneId, double darkSkyZenithVMag) {
        return new Site(id, name, latitudeDeg, longitudeDeg, elevationM,
                zoneId == null ? null : ZoneId.of(zoneId), 0.0, darkSkyZenithVMag);
    }

    /** The zone that defines this site's nights: its IANA zone, else local mean solar time rounded to the second. */
    public ZoneId nightZone() {
        if (zone != null) {
            return zone;
        }
        int offsetSeconds = (int) Math.round(longitudeDeg / 15.0 * 3600.0);
        return java.time.ZoneOffset.ofTotalSeconds(offsetSeconds);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Site s && s.id.equals(id);
    }

    @Override
    public int hashCode() {
        return Objects.hash(id);
    }
}
