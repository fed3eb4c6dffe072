package org.skyrota.planning.solver;

import java.time.Duration;
import java.util.Map;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;

/**
 * How long and with which weights one run solves.
 *
 * @param timeLimit           stop after this long (not null)
 * @param unimprovedTimeLimit stop earlier when the best score has not improved for this long, or null
 * @param weightOverrides     rule name to weight, replacing the defaults for this run (see constraints/WEIGHTS.md)
 * @param randomSeed          seed of the solver's random choices, for repeatable runs
 */
public record SolveOptions(Duration timeLimit, Duration unimprovedTimeLimit,
                           Map<String, HardMediumSoftLongScore> weightOverrides, long randomSeed) {
    public SolveOptions {
        if (timeLimit == null || timeLimit.isNegative() || timeLimit.isZero()) {
            throw new IllegalArgumentException("timeLimit must be positive, got " + timeLimit);
        }
        if (unimprovedTimeLimit != null && (unimprovedTimeLimit.isNegative() || unimprovedTimeLimit.isZero())) {
            throw new IllegalArgumentException("unimprovedTimeLimit must be positive or null, got " + unimprovedTimeLimit);
        }
        weightOverrides = Map.copyOf(weightOverrides == null ? Map.of() : weightOverrides);
    }

    public static SolveOptions of(Duration timeLimit) {
        return new SolveOptions(timeLimit, null, Map.of(), 0L);
    }

    public SolveOptions withUnimprovedTimeLimit(Duration limit) {
        return new SolveOptions(timeLimit, limit, weightOverrides, randomSeed);
    }

    public SolveOptions withWeights(Map<String, HardMediumSoftLongScore> overrides) {
        return new SolveOptions(timeLimit, unimprovedTimeLimit, overrides, randomSeed);
    }

    public SolveOptions withSeed(long seed) {
        return new SolveOptions(timeLimit, unimprovedTimeLimit, weightOverrides, seed);
    }
}
