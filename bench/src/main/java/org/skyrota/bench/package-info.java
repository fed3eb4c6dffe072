/**
 * Benchmark programs. Each class {@code <Name>Bench} is run by {@code bench/run name} and prints
 * one line per result: {@code BENCH <name> key=value ...}. Benchmarks are programs, never timed tests.
 */
package org.skyrota.bench;
