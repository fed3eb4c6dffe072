package org.skyrota.plugin;

import java.time.Instant;
import java.time.LocalDate;

/**
 * One visit of a plan, as exporters see it.
 *
 * @param visitId     the visit's id in Skyrota
 * @param requestId   the request's id
 * @param title       the request's title
 * @param targetName  the target's name
 * @param raDeg       ICRS right ascension in degrees, or null for a moving target
 * @param decDeg      ICRS declination in degrees, or null for a moving target
 * @param site        the site's name
 * @param telescope   the telescope's name
 * @param night       the night (local date of the evening)
 * @param start       start of the visit, UTC
 * @param end         end of the visit, UTC
 * @param owner       the requester's user name
 * @param program     the program's name
 * @param exposurePlan the exposure plan in short text, for example {@code "V 3x60s, R 3x60s"}
 * @param sequence    how many times the visit has changed, as a calendar counts it (RFC 5545 SEQUENCE: the published
 *                    revision in which it last changed); -1 where the plan does not say (then the plan's revision)
 */
public record PlannedVisitRecord(
        long visitId,
        long requestId,
        String title,
        String targetName,
        Double raDeg,
        Double decDeg,
        String site,
        String telescope,
        LocalDate night,
        Instant start,
        Instant end,
        String owner,
        String program,
        String exposurePlan,
        int sequence) {

    /** A visit whose plan does not count its changes ({@code sequence} -1). */
    public PlannedVisitRecord(long visitId, long requestId, String title, String targetName, Double raDeg, Double decDeg,
                              String site, String telescope, LocalDate night, Instant start, Instant end, String owner,
                              String program, String exposurePlan) {
        this(visitId, requestId, title, targetName, raDeg, decDeg, site, telescope, night, start, end, owner, program,
                exposurePlan, -1);
    }
}
