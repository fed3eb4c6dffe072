package org.skyrota.constraints;

import java.util.HashMap;
import java.util.Map;
import java.util.function.BiFunction;
import java.util.function.Function;
import java.util.function.Supplier;

import org.optaplanner.core.api.score.stream.uni.UniConstraintCollector;
import org.skyrota.planning.domain.Visit;

/**
 * Collects placed minutes per program and returns the sum over programs of the squared deviation between the
 * program's share of placed time and its share of the grants, in (per mille)². Programs with nothing placed
 * count too, because unplaced visits are collected as well. Incremental: each visit adds and removes itself.
 */
final class ProgramShareCollector implements UniConstraintCollector<Visit, ProgramShareCollector.Shares, Long> {

    static final class Shares {
        private final Map<String, long[]> byProgram = new HashMap<>();
        private long totalPlaced;

        Runnable add(Visit v) {
            long minutes = v.placedMinutes();
            long[] entry = byProgram.computeIfAbsent(v.programId(), k -> new long[3]);
            entry[0] += minutes;
            entry[1]++;
            entry[2] = Math.round(v.programGrantShare() * 1_000_000);
            totalPlaced += minutes;
            String program = v.programId();
            return () -> {
                long[] e = byProgram.get(program);
                e[0] -= minutes;
                e[1]--;
                totalPlaced -= minutes;
                if (e[1] == 0) {
                    byProgram.remove(program);
                }
            };
        }

        long deviation() {
            if (totalPlaced == 0) {
                return 0;
            }
            double sum = 0;
            for (long[] e : byProgram.values()) {
                double shareMille = 1000.0 * e[0] / totalPlaced;
                double grantMille = e[2] / 1000.0;
                sum += (shareMille - grantMille) * (shareMille - grantMille);
            }
            return Math.round(sum);
        }
    }

    @Override
    public Supplier<Shares> supplier() {
        return Shares::new;
    }

    @Override
    public BiFunction<Shares, Visit, Runnable> accumulator() {
        return Shares::add;
    }

    @Override
    public Function<Shares, Long> finisher() {
        return Shares::deviation;
    }
}
