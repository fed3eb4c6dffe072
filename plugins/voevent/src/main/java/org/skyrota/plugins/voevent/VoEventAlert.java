package org.skyrota.plugins.voevent;

import java.time.Instant;
import java.util.Objects;

/**
 * What Skyrota takes from a VOEvent 2.0 packet.
 *
 * @param ivorn          the packet's identifier, for example {@code ivo://example.test/alerts#1}; not blank
 * @param role           {@code observation}, {@code prediction}, {@code utility} or {@code test}
 * @param authoredAt     {@code Who/Date}: when the packet was written, or null when absent
 * @param eventTime      {@code WhereWhen/.../Time/TimeInstant/ISOTime}: when the event happened, UTC; not null
 * @param raDeg          right ascension, degrees [0, 360), in the frame {@code coordSystem} names (FK5 J2000 or ICRS)
 * @param decDeg         declination, degrees [&minus;90, 90]
 * @param errorRadiusDeg {@code Error2Radius} in degrees, or null when absent
 * @param coordSystem    the {@code coord_system_id}, for example {@code UTC-FK5-GEO}
 * @param importance     {@code Why/@importance} from 0 to 1, or null when absent
 * @param name           a name for the target: the first {@code Why/Inference/Name}, else the ivorn's fragment
 */
public record VoEventAlert(
        String ivorn,
        String role,
        Instant authoredAt,
        Instant eventTime,
        double raDeg,
        double decDeg,
        Double errorRadiusDeg,
        String coordSystem,
        Double importance,
        String name) {

    public VoEventAlert {
        if (ivorn == null || ivorn.isBlank()) {
            throw new IllegalArgumentException("ivorn must not be blank");
        }
        Objects.requireNonNull(role, "role");
        Objects.requireNonNull(eventTime, "eventTime");
        if (!(raDeg >= 0 && raDeg < 360)) {
            throw new IllegalArgumentException("raDeg must be in [0, 360): " + raDeg);
        }
        if (!(decDeg >= -90 && decDeg <= 90)) {
            throw new IllegalArgumentException("decDeg must be in [-90, 90]: " + decDeg);
        }
        if (importance != null && !(importance >= 0 && importance <= 1)) {
            throw new IllegalArgumentException("importance must be between 0 and 1: " + importance);
        }
    }
}
