package org.skyrota.web.request;

import java.time.Instant;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;

/**
 * A stored observing request as the API shows it; coordinates in decimal degrees (0 for a moving target's).
 * {@code alertIvorn} is the IVORN of the VOEvent packet the request was made from, or null.
 */
record RequestView(
        long id,
        long version,
        long programId,
        String owner,
        String targetName,
        double raDeg,
        double decDeg,
        List<RequestForm.ExposureForm> exposures,
        double minAltitudeDeg,
        DarknessLimit darkness,
        Double minMoonSeparationDeg,
        Double maxMoonIllumination,
        Double maxAirmass,
        LocalDate earliestNight,
        LocalDate latestNight,
        int repeats,
        Double repeatIntervalHours,
        Double repeatToleranceHours,
        int priority,
        RequestState state,
        String rejectionReason,
        Instant createdAt,
        Instant updatedAt,
        String targetKind,
        Map<String, String> targetParameters,
        String alertIvorn) {

    static RequestView of(ObservingRequest r) {
        return new RequestView(r.getId(), r.getVersion(), r.getProgram().getId(), r.getOwner(), r.getTargetName(),
                r.getRaDeg(), r.getDecDeg(),
                r.getExposures().stream().map(e -> new RequestForm.ExposureForm(e.getFilterName(), e.getSeconds(), e.getCount())).toList(),
                r.getMinAltitudeDeg(), r.getDarkness(), r.getMinMoonSeparationDeg(), r.getMaxMoonIllumination(),
                r.getMaxAirmass(), r.getEarliestNight(), r.getLatestNight(), r.getRepeats(),
                r.getRepeatIntervalHours(), r.getRepeatToleranceHours(), r.getPriority(), r.getState(), r.getRejectionReason(),
                r.getCreatedAt(), r.getUpdatedAt(), r.getTargetKind(), r.getTargetParameters(), r.getAlertIvorn());
    }
}
