package io.github.cleave.bench;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.synth.SyntheticGridProblem;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * Dynamic re-solve (Kohli and Torr, ICCV 2005) against a solve from scratch, on one instance: a new
 * foreground stroke (a disc of about 1 % of the pixels made hard foreground seeds), and a boundary
 * penalty changed by +10 % (every neighbour arc). Medians over the repeats; flows must agree.
 */
final class DynamicRows {
  private DynamicRows() {}

  static List<String> run(String name, SyntheticGridProblem problem, int repeats) {
    List<String> rows = new ArrayList<>();
    rows.add(row(name, "stroke, 1 % of pixels", problem, repeats, DynamicRows::stroke));
    rows.add(row(name, "boundary penalty +10 %", problem, repeats, DynamicRows::penalty));
    return rows;
  }

  interface Change {
    int apply(GridMaxFlow solver, SyntheticGridProblem problem, SplittableRandom random);
  }

  private static String row(
      String name, String what, SyntheticGridProblem problem, int repeats, Change change) {
    long[] resolve = new long[repeats];
    long[] scratch = new long[repeats];
    int changed = 0;
    boolean agree = true;
    for (int r = -1; r < repeats; r++) {
      GridMaxFlow solver = problem.toSolver(true);
      solver.solve();
      changed = change.apply(solver, problem, new SplittableRandom(7 + r));
      long t0 = System.nanoTime();
      long dynamic = solver.resolve().flowValue();
      long t1 = System.nanoTime();
      long fresh = solver.solve().flowValue();
      long t2 = System.nanoTime();
      agree &= dynamic == fresh;
      if (r >= 0) {
        resolve[r] = t1 - t0;
        scratch[r] = t2 - t1;
      }
    }
    return String.format(
        Locale.ROOT,
        "| %s | %s | %d | %.1f | %.1f | %.1f | %s |",
        name,
        what,
        changed,
        Timing.medianMs(resolve),
        Timing.medianMs(scratch),
        Timing.medianMs(scratch) / Timing.medianMs(resolve),
        agree ? "yes" : "NO");
  }

  private static int stroke(GridMaxFlow s, SyntheticGridProblem p, SplittableRandom random) {
    int w = p.width();
    int h = p.height();
    double radius = Math.sqrt(0.01 * w * h / Math.PI);
    double cx = radius + random.nextDouble() * (w - 2 * radius);
    double cy = radius + random.nextDouble() * (h - 2 * radius);
    int changed = 0;
    for (int y = 0; y < h; y++) {
      for (int x = 0; x < w; x++) {
        if ((x - cx) * (x - cx) + (y - cy) * (y - cy) <= radius * radius) {
          s.setTerminalCapacities(x + w * y, 1 << 20, 0);
          changed++;
        }
      }
    }
    return changed;
  }

  private static int penalty(GridMaxFlow s, SyntheticGridProblem p, SplittableRandom random) {
    int changed = 0;
    for (int node = 0; node < p.nodeCount(); node++) {
      for (int k = 0; k < p.neighborhood().size(); k++) {
        int c = p.neighborCapacity(node, k);
        if (c > 0 && s.neighbor(node, k) >= 0) {
          s.setNeighborCapacity(node, k, (int) Math.round(c * 1.1));
          changed++;
        }
      }
    }
    return changed;
  }
}
