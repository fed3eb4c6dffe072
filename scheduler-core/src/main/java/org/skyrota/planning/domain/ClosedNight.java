package org.skyrota.planning.domain;

/** A closed night of one telescope (a site closure becomes one of these per telescope). */
public record ClosedNight(int telescopeIndex, int nightEpochDay, String reason) {
}
