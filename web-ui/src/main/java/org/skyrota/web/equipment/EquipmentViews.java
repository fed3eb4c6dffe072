package org.skyrota.web.equipment;

import java.util.List;

/** Telescopes and instruments as the API shows them. */
final class EquipmentViews {

    private EquipmentViews() {}

    record TelescopeView(long id, long version, long siteId, String name, double apertureMm, double minAltitudeDeg,
                         double slewRateDegPerS, double settleSeconds, boolean active, String mountKind,
                         boolean needsMeridianFlip, double eastHourAngleLimitDeg, double westHourAngleLimitDeg) {
        static TelescopeView of(Telescope t) {
            return new TelescopeView(t.getId(), t.getVersion(), t.getSite().getId(), t.getName(), t.getApertureMm(),
                    t.getMinAltitudeDeg(), t.getSlewRateDegPerS(), t.getSettleSeconds(), t.isActive(),
                    t.getMountKind().name(), t.needsMeridianFlip(), t.getEastHourAngleLimitDeg(),
                    t.getWestHourAngleLimitDeg());
        }
    }

    record InstrumentView(long id, long version, long telescopeId, String name, double readoutSeconds,
                          double filterChangeSeconds, boolean certifiedSolarFilter, List<String> filters) {
        static InstrumentView of(Instrument i) {
            return new InstrumentView(i.getId(), i.getVersion(), i.getTelescope().getId(), i.getName(), i.getReadoutSeconds(),
                    i.getFilterChangeSeconds(), i.hasCertifiedSolarFilter(), i.getFilters());
        }
    }
}
