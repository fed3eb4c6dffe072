package org.skyrota.planning.domain;

/**
 * One grant as the score sees it: what a program may still spend on the telescopes and nights it covers.
 * Each candidate placement of a visit names the grant it pays from ({@link Visit#grantIndex()}).
 *
 * @param index         its place in the schedule's grants, the key visits name it by
 * @param programId     the program
 * @param grantMinutes  minutes it may still pay for in this run
 * @param grantShare    the program's share of all programs' grants, 0..1 (the same on each of its grants)
 * @param label         how a person names it, for reasons
 */
public record ProgramGrant(int index, String programId, long grantMinutes, double grantShare, String label) {
}
