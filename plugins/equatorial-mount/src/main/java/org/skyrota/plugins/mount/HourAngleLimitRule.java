package org.skyrota.plugins.mount;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;
import org.optaplanner.core.api.score.stream.ConstraintBuilder;
import org.optaplanner.core.api.score.stream.ConstraintFactory;
import org.optaplanner.core.api.score.stream.Joiners;
import org.skyrota.constraints.ScoreRule;
import org.skyrota.planning.domain.TelescopeMount;
import org.skyrota.planning.domain.Visit;
import org.skyrota.plugin.PluginApi;
import org.skyrota.plugin.PluginDescriptor;
import org.skyrota.sky.coords.HourAngle;

/**
 * Hard: a visit must stay within its telescope's hour-angle limits for its whole length; the penalty is the minutes
 * it spends beyond them. Limits stand for what stops an equatorial mount: a pier or tripod leg, a cable wrap, the
 * dome slit's reach. Guard the real mount with its own limit switches too: a plan is no substitute for them.
 */
public final class HourAngleLimitRule implements ScoreRule {

    public static final String NAME = "Outside hour-angle limits";
    static final PluginDescriptor DESCRIPTOR =
            new PluginDescriptor("equatorial-mount.hour-angle-limits", "Equatorial mount: hour-angle limits", "1.0",
                    PluginApi.VERSION);

    @Override
    public PluginDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public String description() {
        return "A visit must stay inside its telescope's east and west hour-angle limits; costs each minute beyond them.";
    }

    @Override
    public String ruleName() {
        return NAME;
    }

    /** One hard point per minute, as the built-in hard rules count. */
    @Override
    public HardMediumSoftLongScore defaultWeight() {
        return HardMediumSoftLongScore.ofHard(1);
    }

    @Override
    public ConstraintBuilder define(ConstraintFactory factory, HardMediumSoftLongScore weight) {
        return factory.forEach(Visit.class)
                .filter(v -> !Double.isNaN(v.hourAngleAtStartDeg()))
                .join(TelescopeMount.class, Joiners.equal(Visit::telescopeIndex, TelescopeMount::telescopeIndex))
                .filter((v, m) -> minutesOutside(v.hourAngleAtStartDeg(), v.hourAngleAtEndDeg(), m) > 0)
                .penalizeLong(weight, (v, m) -> minutesOutside(v.hourAngleAtStartDeg(), v.hourAngleAtEndDeg(), m));
    }

    /**
     * Minutes of a visit beyond the limits. The visit runs from hour angle {@code startDeg} in [-180, 180) to
     * {@code endDeg}, counted on without wrapping; past 180° it is east of the lower meridian again, where the
     * allowed range is the east limit + 360° onwards.
     */
    static long minutesOutside(double startDeg, double endDeg, TelescopeMount mount) {
        double east = mount.eastHourAngleLimitDeg();
        double west = mount.westHourAngleLimitDeg();
        double inside = overlap(startDeg, endDeg, east, west) + overlap(startDeg, endDeg, east + 360, west + 360);
        double outsideDeg = Math.max(0, endDeg - startDeg - inside);
        // Under a millionth of a degree is rounding of the stored hour angles, not an excursion.
        return (long) Math.ceil(outsideDeg / HourAngle.DEG_PER_MINUTE - 1e-4);
    }

    private static double overlap(double a0, double a1, double b0, double b1) {
        return Math.max(0, Math.min(a1, b1) - Math.max(a0, b0));
    }
}
