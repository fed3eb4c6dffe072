package org.skyrota.web.request;

import org.skyrota.sky.visibility.Darkness;
import org.skyrota.sky.visibility.FixedTarget;
import org.skyrota.sky.visibility.ObservingConstraints;

/** The one place where a stored request becomes the sky engine's target and constraints. */
public final class RequestMapper {

    private RequestMapper() {}

    public static FixedTarget toTarget(ObservingRequest r) {
        return FixedTarget.of(r.getRaDeg(), r.getDecDeg());
    }

    public static ObservingConstraints toConstraints(ObservingRequest r) {
        ObservingConstraints c = ObservingConstraints.of(r.getMinAltitudeDeg(), toDarkness(r.getDarkness()));
        if (r.getMinMoonSeparationDeg() != null) {
            c = c.withMinMoonSeparationDeg(r.getMinMoonSeparationDeg());
        }
        if (r.getMaxMoonIllumination() != null) {
            c = c.withMaxMoonIllumination(r.getMaxMoonIllumination());
        }
        if (r.getMaxAirmass() != null) {
            c = c.withMaxAirmass(r.getMaxAirmass());
        }
        return c;
    }

    static Darkness toDarkness(DarknessLimit d) {
        return switch (d) {
            case ASTRONOMICAL -> Darkness.ASTRONOMICAL;
            case NAUTICAL -> Darkness.NAUTICAL;
            case CIVIL -> Darkness.CIVIL;
        };
    }
}
