package org.skyrota.web.site;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneId;

import org.skyrota.sky.site.HorizonProfile;
import org.skyrota.sky.site.Night;
import org.skyrota.sky.site.SiteLocation;

/** The one place where a stored site becomes the sky engine's {@link SiteLocation}. */
public final class SiteMapper {

    private SiteMapper() {}

    /** When the night of {@code night} begins at the site: local noon of that date ({@link Night#of}). */
    public static Instant nightStart(Site site, LocalDate night) {
        return Night.of(toLocation(site), night).start();
    }

    public static SiteLocation toLocation(Site site) {
        SiteLocation location = SiteLocation.of(site.getLatitudeDeg(), site.getLongitudeDeg(), site.getElevationM(),
                site.getTimeZone() == null ? null : ZoneId.of(site.getTimeZone()));
        if (!site.getHorizon().isEmpty()) {
            location = location.withHorizon(HorizonProfile.of(site.getHorizon().stream()
                    .map(p -> new org.skyrota.sky.site.HorizonPoint(p.getAzimuthDeg() % 360, p.getAltitudeDeg()))
                    .toList()));
        }
        if (site.getDarkSkyZenithVMag() != null) {
            location = location.withSky(site.getDarkSkyZenithVMag(), location.extinctionMagPerAirmass());
        }
        return location;
    }
}
