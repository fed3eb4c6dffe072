/**
 * Rising, setting, transit and twilight events, found by sampling a smooth function of time,
 * examining grazing extrema, and refining with Brent's method. Absent events are empty, never
 * invented. {@link org.skyrota.sky.events.SkyAtSite} gives exact per-instant positions at a site.
 */
package org.skyrota.sky.events;
