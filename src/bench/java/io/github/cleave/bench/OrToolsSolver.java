package io.github.cleave.bench;

import com.google.ortools.Loader;
import com.google.ortools.graph.MaxFlow;
import io.github.cleave.synth.SyntheticGridProblem;

/**
 * Google OR-tools' max flow ({@code com.google.ortools.graph.MaxFlow}, a push-relabel solver in
 * native code). Nodes {@code 0..n-1} are the pixels, {@code n} the source, {@code n+1} the sink;
 * one arc per positive capacity. Build is the {@code addArcWithCapacity} calls, solve the {@code
 * solve} call. Memory is the growth of the process's resident set over build and solve.
 */
final class OrToolsSolver implements BenchSolver {
  OrToolsSolver() {
    Loader.loadNativeLibraries();
  }

  @Override
  public String name() {
    return "or-tools";
  }

  @Override
  public Measurement run(SyntheticGridProblem problem, int repeats) {
    long[] build = new long[repeats];
    long[] solve = new long[repeats];
    long flow = -1;
    double bytesPerNode = 0;
    int n = problem.nodeCount();
    for (int r = 0; r < repeats; r++) {
      long rss0 = Timing.residentBytes();
      long t0 = System.nanoTime();
      MaxFlow mf = new MaxFlow();
      addArcs(problem, mf);
      long t1 = System.nanoTime();
      MaxFlow.Status status = mf.solve(n, n + 1);
      long t2 = System.nanoTime();
      long rss1 = Timing.residentBytes();
      if (status != MaxFlow.Status.OPTIMAL) {
        mf.delete();
        return Measurement.skipped(name(), "status " + status);
      }
      build[r] = t1 - t0;
      solve[r] = t2 - t1;
      flow = mf.getOptimalFlow();
      bytesPerNode = Math.max(bytesPerNode, (double) (rss1 - rss0) / n);
      mf.delete();
    }
    return new Measurement(
        name(), Timing.medianMs(build), Timing.medianMs(solve), flow, bytesPerNode, "RSS growth");
  }

  private static void addArcs(SyntheticGridProblem problem, MaxFlow mf) {
    int n = problem.nodeCount();
    int k = problem.neighborhood().size();
    int w = problem.width();
    int h = problem.height();
    for (int node = 0; node < n; node++) {
      int cs = problem.sourceCapacity(node);
      int ct = problem.sinkCapacity(node);
      if (cs > 0) {
        mf.addArcWithCapacity(n, node, cs);
      }
      if (ct > 0) {
        mf.addArcWithCapacity(node, n + 1, ct);
      }
      for (int dir = 0; dir < k; dir++) {
        int c = problem.neighborCapacity(node, dir);
        if (c > 0) {
          mf.addArcWithCapacity(node, neighbour(problem, node, dir, w, h), c);
        }
      }
    }
  }

  static int neighbour(SyntheticGridProblem problem, int node, int dir, int w, int h) {
    int x = node % w + problem.neighborhood().dx(dir);
    int rest = node / w;
    int y = rest % h + problem.neighborhood().dy(dir);
    int z = rest / h + problem.neighborhood().dz(dir);
    return x + w * (y + h * z);
  }
}
