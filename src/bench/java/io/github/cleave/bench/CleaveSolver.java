package io.github.cleave.bench;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.synth.SyntheticGridProblem;

/**
 * This engine: every repeat builds a fresh solver without retained capacities (the memory floor a
 * one-off solve needs) and solves it once. One unmeasured warm-up run precedes the repeats.
 */
final class CleaveSolver implements BenchSolver {
  @Override
  public String name() {
    return "cleave";
  }

  @Override
  public Measurement run(SyntheticGridProblem problem, int repeats) {
    long[] build = new long[repeats];
    long[] solve = new long[repeats];
    long flow = -1;
    double bytesPerNode = 0;
    String note = "";
    for (int r = -1; r < repeats; r++) {
      long t0 = System.nanoTime();
      GridMaxFlow solver = problem.toSolver(false);
      long t1 = System.nanoTime();
      MaxFlowResult result = solver.solve();
      long t2 = System.nanoTime();
      if (r >= 0) {
        build[r] = t1 - t0;
        solve[r] = t2 - t1;
      }
      flow = result.flowValue();
      bytesPerNode = (double) solver.stateBytes() / solver.nodeCount();
      note = solver.capacityWidth() + "-bit";
    }
    return new Measurement(
        name(), Timing.medianMs(build), Timing.medianMs(solve), flow, bytesPerNode, note);
  }
}
