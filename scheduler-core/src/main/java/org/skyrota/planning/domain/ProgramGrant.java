package org.skyrota.planning.domain;

/**
 * A program's grant as the score sees it.
 *
 * @param programId     the program
 * @param grantMinutes  minutes granted over the horizon
 * @param grantShare    its share of all programs' grants, 0..1
 */
public record ProgramGrant(String programId, long grantMinutes, double grantShare) {
}
