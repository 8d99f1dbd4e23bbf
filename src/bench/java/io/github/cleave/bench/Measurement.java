package io.github.cleave.bench;

/**
 * What one solver did on one instance: medians over the repeats, the flow value, and solver state
 * per node (exact array sizes for this engine, heap or resident-memory growth for the others).
 */
record Measurement(
    String solver, double buildMs, double solveMs, long flow, double bytesPerNode, String note) {

  static Measurement skipped(String solver, String why) {
    return new Measurement(solver, Double.NaN, Double.NaN, -1, Double.NaN, why);
  }

  boolean ran() {
    return flow >= 0;
  }
}
