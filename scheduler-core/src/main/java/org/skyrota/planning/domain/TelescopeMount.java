package org.skyrota.planning.domain;

import org.skyrota.planning.model.MountKind;

/**
 * A telescope's mount as the score rules see it: a problem fact, one per telescope, joined to visits by
 * {@link Placement#telescopeIndex()}.
 *
 * @param telescopeIndex        the telescope's index in {@link Schedule#telescopeIds()}
 * @param mount                 the mount kind
 * @param needsMeridianFlip     whether the mount must flip when its target crosses the meridian
 * @param eastHourAngleLimitDeg most negative hour angle it reaches, degrees (-180 for none)
 * @param westHourAngleLimitDeg most positive hour angle it reaches, degrees (180 for none)
 */
public record TelescopeMount(int telescopeIndex, MountKind mount, boolean needsMeridianFlip,
                             double eastHourAngleLimitDeg, double westHourAngleLimitDeg) {
}
