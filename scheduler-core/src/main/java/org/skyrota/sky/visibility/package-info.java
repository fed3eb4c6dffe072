/**
 * Visibility windows: maximal intervals within a night where every constraint of a request
 * holds (apparent topocentric altitude of date above the minimum and the site's horizon
 * profile, darkness, airmass, Moon separation and illumination while the Moon is up, sky
 * brightness, Sun separation, a time window). {@link org.skyrota.sky.visibility.VisibilityCalculator}
 * is the plain per-instant definition (one-minute sampling, exact positions);
 * {@link org.skyrota.sky.visibility.BatchVisibility} is the fast path for many targets, sites and
 * nights, tested against it. Moving targets ({@link org.skyrota.plugin.MovingTarget}: planets, the
 * Moon, comets) take the per-instant path, their geocentric place moved to the site by the
 * parallax of their distance. Windows shorter than a minute are not reported.
 */
package org.skyrota.sky.visibility;
