package org.skyrota.planning.solver;

import java.time.Duration;
import java.util.Map;

import org.optaplanner.core.api.score.buildin.hardmediumsoftlong.HardMediumSoftLongScore;

/**
 * How long and with which weights one run solves.
 *
 * @param timeLimit           stop after this long (not null)
 * @param unimprovedTimeLimit stop earlier when the best score has not improved for this long, or null
 * @param weightOverrides     rule name to weight, replacing the defaults for this run (see the README, "Planner score rules and their default weights")
 * @param randomSeed          seed of the solver's random choices, for repeatable runs
 * @param evaluationLimit     stop after this many score evaluations, or 0 for no such limit: with a fixed seed
 *                            this makes a run repeatable whatever the machine's load (tests use it)
 * @param cancellation        a handle that ends the run early with the best plan so far, or null for none
 */
public record SolveOptions(Duration timeLimit, Duration unimprovedTimeLimit,
                           Map<String, HardMediumSoftLongScore> weightOverrides, long randomSeed,
                           long evaluationLimit, Cancellation cancellation) {
    public SolveOptions {
        if (timeLimit == null || timeLimit.isNegative() || timeLimit.isZero()) {
            throw new IllegalArgumentException("timeLimit must be positive, got " + timeLimit);
        }
        if (unimprovedTimeLimit != null && (unimprovedTimeLimit.isNegative() || unimprovedTimeLimit.isZero())) {
            throw new IllegalArgumentException("unimprovedTimeLimit must be positive or null, got " + unimprovedTimeLimit);
        }
        weightOverrides = Map.copyOf(weightOverrides == null ? Map.of() : weightOverrides);
        if (evaluationLimit < 0) {
            throw new IllegalArgumentException("evaluationLimit must not be negative, got " + evaluationLimit);
        }
    }

    public static SolveOptions of(Duration timeLimit) {
        return new SolveOptions(timeLimit, null, Map.of(), 0L, 0L, null);
    }

    public SolveOptions withUnimprovedTimeLimit(Duration limit) {
        return new SolveOptions(timeLimit, limit, weightOverrides, randomSeed, evaluationLimit, cancellation);
    }

    public SolveOptions withWeights(Map<String, HardMediumSoftLongScore> overrides) {
        return new SolveOptions(timeLimit, unimprovedTimeLimit, overrides, randomSeed, evaluationLimit, cancellation);
    }

    public SolveOptions withSeed(long seed) {
        return new SolveOptions(timeLimit, unimprovedTimeLimit, weightOverrides, seed, evaluationLimit, cancellation);
    }

    public SolveOptions withEvaluationLimit(long limit) {
        return new SolveOptions(timeLimit, unimprovedTimeLimit, weightOverrides, randomSeed, limit, cancellation);
    }

    /** These options with a handle that can end the run early (see {@link Cancellation}). */
    public SolveOptions withCancellation(Cancellation handle) {
        return new SolveOptions(timeLimit, unimprovedTimeLimit, weightOverrides, randomSeed, evaluationLimit, handle);
    }
}
