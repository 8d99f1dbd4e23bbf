package io.github.cleave.flow;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

/** Seeded random max-flow problems: sparse digraphs of varied density, and grid problems. */
final class RandomFlowProblems {
  private RandomFlowProblems() {}

  /** A random digraph with parallel arcs, loops and arcs into the source or out of the sink. */
  static FlowProblem sparse(SplittableRandom random, int index) {
    int n = 2 + random.nextInt(40);
    int m = random.nextInt(1 + n * (1 + random.nextInt(6)));
    int maxCap =
        switch (index % 3) {
          case 0 -> 5;
          case 1 -> 1000;
          default -> Integer.MAX_VALUE;
        };
    int source = random.nextInt(n);
    int sink = (source + 1 + random.nextInt(n - 1)) % n;
    long[][] arcs = new long[m][];
    for (int i = 0; i < m; i++) {
      arcs[i] =
          new long[] {
            random.nextInt(n), random.nextInt(n), random.nextInt(maxCap) + (long) random.nextInt(2)
          };
      arcs[i][2] = Math.min(arcs[i][2], Integer.MAX_VALUE);
    }
    return FlowProblem.of("sparse#" + index, n, source, sink, arcs);
  }

  /**
   * A random grid problem with every arc kind a grid-structured DIMACS file may hold; capacities
   * are kept small enough that merged parallel arcs and arc pairs fit the grid solver's limits.
   */
  static FlowProblem grid(SplittableRandom random, Neighborhood nb, int index) {
    int w = 1 + random.nextInt(7);
    int h = 1 + random.nextInt(7);
    int d = nb.isThreeDimensional() ? 1 + random.nextInt(4) : 1;
    FlowProblem.GridShape shape = new FlowProblem.GridShape(w, h, d, nb);
    int n = shape.pixels();
    int source = n;
    int sink = n + 1;
    int maxCap = index % 2 == 0 ? 20 : 100_000;
    List<long[]> arcs = new ArrayList<>();
    for (int p = 0; p < n; p++) {
      int x = p % w;
      int y = (p / w) % h;
      int z = p / (w * h);
      if (random.nextInt(3) != 0) {
        arcs.add(new long[] {source, p, random.nextInt(maxCap)});
      }
      if (random.nextInt(3) != 0) {
        arcs.add(new long[] {p, sink, random.nextInt(maxCap)});
      }
      for (int k = 0; k < nb.size(); k++) {
        int qx = x + nb.dx(k);
        int qy = y + nb.dy(k);
        int qz = z + nb.dz(k);
        if (qx < 0 || qx >= w || qy < 0 || qy >= h || qz < 0 || qz >= d) {
          continue;
        }
        if (random.nextInt(4) != 0) {
          arcs.add(new long[] {p, qx + w * (qy + h * qz), random.nextInt(maxCap)});
        }
      }
    }
    if (random.nextInt(5) == 0) {
      arcs.add(new long[] {source, sink, random.nextInt(maxCap)}); // direct arc
    }
    if (random.nextInt(5) == 0 && n > 0) {
      arcs.add(new long[] {random.nextInt(n), source, random.nextInt(maxCap)}); // carries no flow
    }
    FlowProblem plain =
        FlowProblem.of(
            "grid-" + nb + "#" + index, n + 2, source, sink, arcs.toArray(long[][]::new));
    return new FlowProblem(
        plain.name(),
        plain.nodeCount(),
        source,
        sink,
        plain.tails(),
        plain.heads(),
        plain.capacities(),
        shape);
  }
}
