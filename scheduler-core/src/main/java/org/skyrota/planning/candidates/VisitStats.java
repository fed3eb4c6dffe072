package org.skyrota.planning.candidates;

import java.util.List;

/**
 * What candidate generation learned about one visit, kept for the left-out reasons.
 *
 * @param eligibleTelescopes     telescopes with an instrument for the plan (and a certified solar filter for solar targets)
 * @param nightsConsidered       nights in the visit's own range within the horizon (at the site where it has most)
 * @param windowNights           site-nights with at least one visibility window long enough for the visit
 * @param closedWindowNights     of those, site-nights on which every telescope with such a window was closed
 * @param observableMinutes      total length of the long-enough windows, summed over sites and nights
 * @param longestWindowMinutes   the longest single window seen (long enough or not)
 * @param neededMinutes          the visit's length on its fastest eligible telescope
 * @param filters                the filters of its plan
 * @param ungrantedWindowNights  of the open site-nights with a window, those where no grant of its program pays for
 *                               any telescope that could take it
 * @param problem                why its request could not be prepared at all (bad data), or null
 */
public record VisitStats(int eligibleTelescopes, int nightsConsidered, int windowNights, int closedWindowNights,
                         long observableMinutes, long longestWindowMinutes, int neededMinutes, List<String> filters,
                         int ungrantedWindowNights, String problem) {

    /** What is known of a visit whose request could not be prepared: only why. */
    public static VisitStats unprepared(List<String> filters, String problem) {
        return new VisitStats(0, 0, 0, 0, 0, 0, 0, filters, 0, problem);
    }
}
