package io.github.cleave.flow;

/**
 * Counters of one solve, for benchmarks and diagnostics.
 *
 * @param augmentations augmenting paths found and saturated
 * @param orphansAdopted orphans that found a new parent in their own tree
 * @param orphansFreed orphans that found none and left their tree
 */
public record SolveStatistics(long augmentations, long orphansAdopted, long orphansFreed) {}
