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

/**
 * Soft: on a mount that must flip (a German equatorial mount), a visit should not cross the meridian, because the
 * flip interrupts the exposures: the mount swings the tube to the other side of the pier, then the field must be
 * found and guiding started again. Each crossing visit costs the rule's weight once. A flip swings the tube through a
 * wide arc: keep the sweep clear of people and obstacles, as with any unattended slew.
 */
public final class MeridianFlipRule implements ScoreRule {

    public static final String NAME = "Meridian flip during visit";
    static final PluginDescriptor DESCRIPTOR =
            new PluginDescriptor("equatorial-mount.meridian-flip", "Equatorial mount: meridian flip", "1.0",
                    PluginApi.VERSION);

    @Override
    public PluginDescriptor descriptor() {
        return DESCRIPTOR;
    }

    @Override
    public String description() {
        return "On a mount that must flip, a visit that crosses the meridian costs about ten minutes of lost time.";
    }

    @Override
    public String ruleName() {
        return NAME;
    }

    /**
     * Ten soft points per crossing visit, what ten minutes of idle time cost: a flip with re-centring and restarting
     * the guider takes some minutes on a club mount (common practice, no source; our own estimate).
     */
    @Override
    public HardMediumSoftLongScore defaultWeight() {
        return HardMediumSoftLongScore.ofSoft(10);
    }

    @Override
    public ConstraintBuilder define(ConstraintFactory factory, HardMediumSoftLongScore weight) {
        return factory.forEach(Visit.class)
                .filter(v -> crossesMeridian(v.hourAngleAtStartDeg(), v.hourAngleAtEndDeg()))
                .join(TelescopeMount.class, Joiners.equal(Visit::telescopeIndex, TelescopeMount::telescopeIndex),
                        Joiners.filtering((v, m) -> m.needsMeridianFlip()))
                .penalizeLong(weight, (v, m) -> 1L);
    }

    /**
     * Whether a visit from hour angle {@code startDeg} to {@code endDeg} (counted on without wrapping) passes the
     * upper meridian, where the hour angle is zero. Starting or ending on it is not a crossing; NaN (not computed)
     * never is.
     */
    static boolean crossesMeridian(double startDeg, double endDeg) {
        return startDeg < 0 && endDeg > 0;
    }
}
