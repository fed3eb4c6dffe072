package org.skyrota.planning.model;

import java.time.ZoneId;
import java.util.Objects;

import org.skyrota.sky.site.HorizonProfile;
import org.skyrota.sky.site.Night;

/**
 * An observing site as the planner sees it.
 *
 * @param id                  stable identifier, not blank
 * @param name                display name, not blank
 * @param latitudeDeg         geodetic latitude in degrees, -90..90
 * @param longitudeDeg        longitude in degrees, east-positive, -180..180
 * @param elevationM          height above sea level in metres
 * @param zone                IANA time zone, or null where only the longitude is known
 * @param horizon             lowest usable apparent altitude by azimuth set by the local horizon (trees, buildings,
 *                            dome limits), piecewise linear between its points; {@link HorizonProfile#flat()} for none;
 *                            not null. The sky model applies it to every window at this site.
 * @param darkSkyZenithVMag   zenith sky brightness on a moonless astronomical night, V mag per square arcsecond
 */
public record Site(String id, String name, double latitudeDeg, double longitudeDeg, double elevationM,
                   ZoneId zone, HorizonProfile horizon, double darkSkyZenithVMag) {
    public Site {
        Checks.notBlank("site id", id);
        Checks.notBlank("site name", name);
        Checks.range("latitudeDeg of site " + id, latitudeDeg, -90, 90);
        Checks.range("longitudeDeg of site " + id, longitudeDeg, -180, 180);
        Checks.notNull("horizon of site " + id + " (HorizonProfile.flat() for none)", horizon);
        Checks.range("darkSkyZenithVMag of site " + id, darkSkyZenithVMag, 15, 23);
    }

    public static Site of(String id, String name, double latitudeDeg, double longitudeDeg, double elevationM,
                          String zoneId, double darkSkyZenithVMag) {
        return new Site(id, name, latitudeDeg, longitudeDeg, elevationM,
                zoneId == null ? null : ZoneId.of(zoneId), HorizonProfile.flat(), darkSkyZenithVMag);
    }

    /** This site with another horizon profile, not null. */
    public Site withHorizon(HorizonProfile newHorizon) {
        return new Site(id, name, latitudeDeg, longitudeDeg, elevationM, zone, newHorizon, darkSkyZenithVMag);
    }

    /**
     * The zone that defines this site's nights: its IANA zone, else local mean solar time rounded to the second, the
     * same zone the sky engine's {@link Night} uses. The night an instant belongs to is
     * {@code Night.containing(site.nightZone(), instant)}.
     */
    public ZoneId nightZone() {
        return Night.zoneOf(zone, longitudeDeg);
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
