package org.skyrota.web.site;

import java.time.Instant;
import java.util.List;

/** A stored site as the API shows it. */
record SiteView(
        long id,
        long version,
        String name,
        double latitudeDeg,
        double longitudeDeg,
        double elevationM,
        String timeZone,
        Double darkSkyZenithVMag,
        List<SiteForm.Point> horizon,
        Instant createdAt,
        Instant updatedAt) {

    static SiteView of(Site s) {
        return new SiteView(s.getId(), s.getVersion(), s.getName(), s.getLatitudeDeg(), s.getLongitudeDeg(),
                s.getElevationM(), s.getTimeZone(), s.getDarkSkyZenithVMag(),
                s.getHorizon().stream().map(p -> new SiteForm.Point(p.getAzimuthDeg(), p.getAltitudeDeg())).toList(),
                s.getCreatedAt(), s.getUpdatedAt());
    }
}
