package io.github.cleave.bench;

import io.github.cleave.synth.SyntheticGridProblem;
import java.util.ArrayList;
import java.util.List;
import org.jgrapht.alg.flow.BoykovKolmogorovMFImpl;
import org.jgrapht.alg.util.Triple;
import org.jgrapht.opt.graph.sparse.SparseIntDirectedWeightedGraph;

/**
 * JGraphT's {@code BoykovKolmogorovMFImpl} on its compact {@code SparseIntDirectedWeightedGraph}.
 * Build is making the graph; solve is constructing the algorithm and computing the flow (the
 * algorithm builds its own residual network there). Memory is the heap growth with graph and
 * algorithm alive, after a full collection.
 */
final class JGraphTSolver implements BenchSolver {
  @Override
  public String name() {
    return "jgrapht-bk";
  }

  @Override
  public Measurement run(SyntheticGridProblem problem, int repeats) {
    long[] build = new long[repeats];
    long[] solve = new long[repeats];
    long flow = -1;
    double bytesPerNode = 0;
    int n = problem.nodeCount();
    List<Triple<Integer, Integer, Double>> arcs = arcs(problem);
    for (int r = 0; r < repeats; r++) {
      long heap0 = Timing.heapUsed();
      long t0 = System.nanoTime();
      SparseIntDirectedWeightedGraph graph = new SparseIntDirectedWeightedGraph(n + 2, arcs);
      long t1 = System.nanoTime();
      BoykovKolmogorovMFImpl<Integer, Integer> bk = new BoykovKolmogorovMFImpl<>(graph);
      double value = bk.getMaximumFlowValue(n, n + 1);
      long t2 = System.nanoTime();
      long heap1 = Timing.heapUsed();
      build[r] = t1 - t0;
      solve[r] = t2 - t1;
      flow = Math.round(value);
      bytesPerNode = Math.max(bytesPerNode, (double) (heap1 - heap0) / n);
      if (bk.getFlowMap().isEmpty()) {
        throw new AssertionError("keep the algorithm alive until the memory reading");
      }
    }
    return new Measurement(
        name(), Timing.medianMs(build), Timing.medianMs(solve), flow, bytesPerNode, "heap growth");
  }

  private static List<Triple<Integer, Integer, Double>> arcs(SyntheticGridProblem problem) {
    int n = problem.nodeCount();
    int k = problem.neighborhood().size();
    List<Triple<Integer, Integer, Double>> arcs = new ArrayList<>();
    for (int node = 0; node < n; node++) {
      if (problem.sourceCapacity(node) > 0) {
        arcs.add(Triple.of(n, node, (double) problem.sourceCapacity(node)));
      }
      if (problem.sinkCapacity(node) > 0) {
        arcs.add(Triple.of(node, n + 1, (double) problem.sinkCapacity(node)));
      }
      for (int dir = 0; dir < k; dir++) {
        int c = problem.neighborCapacity(node, dir);
        if (c > 0) {
          int q = OrToolsSolver.neighbour(problem, node, dir, problem.width(), problem.height());
          arcs.add(Triple.of(node, q, (double) c));
        }
      }
    }
    return arcs;
  }
}
