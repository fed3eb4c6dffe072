package org.skyrota.constraints;

import java.util.HashMap;
import java.util.Map;
import java.util.function.BiFunction;
import java.util.function.Function;
import java.util.function.Supplier;

import org.optaplanner.core.api.score.stream.uni.UniConstraintCollector;
import org.skyrota.planning.domain.Visit;

/**
 * Collects placed minutes per program and returns the sum over programs of the program's weight times the squared
 * deviation between its share of placed time and its share of the grants, in (per mille)². Programs with nothing
 * placed count too, because unplaced visits are collected as well. Incremental: each visit adds and removes itself.
 */
final class ProgramShareCollector implements UniConstraintCollector<Visit, ProgramShareCollector.Shares, Long> {

    /** Placed minutes and visit count of one program, with its grant share and weight (the same on all its visits). */
    private static final class Entry {
        long placedMinutes;
        int visits;
        double grantShareMille;
        double weight;
    }

    static final class Shares {
        private final Map<String, Entry> byProgram = new HashMap<>();
        private long totalPlaced;

        Runnable add(Visit v) {
            long minutes = v.placedMinutes();
            Entry entry = byProgram.computeIfAbsent(v.programId(), k -> new Entry());
            entry.placedMinutes += minutes;
            entry.visits++;
            entry.grantShareMille = 1000.0 * v.programGrantShare();
            entry.weight = v.programWeight();
            totalPlaced += minutes;
            String program = v.programId();
            return () -> {
                Entry e = byProgram.get(program);
                e.placedMinutes -= minutes;
                e.visits--;
                totalPlaced -= minutes;
                if (e.visits == 0) {
                    byProgram.remove(program);
                }
            };
        }

        long deviation() {
            if (totalPlaced == 0) {
                return 0;
            }
            double sum = 0;
            for (Entry e : byProgram.values()) {
                double shareMille = 1000.0 * e.placedMinutes / totalPlaced;
                double off = shareMille - e.grantShareMille;
                sum += e.weight * off * off;
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
