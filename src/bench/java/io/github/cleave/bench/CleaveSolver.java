package io.github.cleave.bench;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.synth.SyntheticGridProblem;

/**
 * This engine, measured as the {@code maxflow --repeat} command measures it: build is making a
 * solver that keeps its capacities (median over the repeats); solve is {@code solve()} on it, from
 * scratch each time, after one unmeasured warm-up solve. Bytes per node are those of a solver
 * without the retained copy of the capacities, the memory a one-off solve needs.
 */
final class CleaveSolver implements BenchSolver {
  @Override
  public String name() {
    return "cleave";
  }

  @Override
  public Measurement run(SyntheticGridProblem problem, int repeats) {
    long[] build = new long[repeats];
    GridMaxFlow solver = null;
    for (int r = 0; r < repeats; r++) {
      solver = null; // let the previous one go before allocating the next
      long t0 = System.nanoTime();
      solver = problem.toSolver(true);
      build[r] = System.nanoTime() - t0;
    }
    long[] solve = new long[repeats];
    long flow = solver.solve().flowValue();
    for (int r = 0; r < repeats; r++) {
      MaxFlowResult result = solver.solve();
      solve[r] = result.solveNanos();
      if (result.flowValue() != flow) {
        throw new AssertionError("repeated solves disagree: " + flow + " vs " + result.flowValue());
      }
    }
    String width = solver.capacityWidth() + "-bit";
    solver = null;
    GridMaxFlow lean = problem.toSolver(false);
    double bytesPerNode = (double) lean.stateBytes() / lean.nodeCount();
    return new Measurement(
        name(), Timing.medianMs(build), Timing.medianMs(solve), flow, bytesPerNode, width);
  }
}
