package org.skyrota.planning.solver;

import java.time.Duration;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;

/**
 * A new best plan during a run.
 *
 * @param bestScore             its score
 * @param elapsed               time since the run started
 * @param placedVisits          visits placed in it
 * @param weightedPlacedMinutes priority weight times nominal minutes, summed over placed visits
 */
public record Progress(HardMediumSoftLongScore bestScore, Duration elapsed, int placedVisits, long weightedPlacedMinutes) {
}
