package io.github.cleave.flow;

import java.util.Arrays;
import java.util.BitSet;

/**
 * A max-flow problem for the tests, numbered 0..n-1 with explicit source and sink. A grid problem
 * numbers its pixels 0..W*H*D-1 in row-major order (x fastest), the source W*H*D and the sink
 * W*H*D+1, and has only arcs between grid neighbours and between pixels and terminals.
 */
record FlowProblem(
    String name,
    int nodeCount,
    int source,
    int sink,
    int[] tails,
    int[] heads,
    long[] capacities,
    GridShape grid) {

  /** Shape of a grid problem. */
  record GridShape(int width, int height, int depth, Neighborhood neighborhood) {
    int pixels() {
      return width * height * depth;
    }
  }

  static FlowProblem of(String name, int nodeCount, int source, int sink, long[][] arcs) {
    int m = arcs.length;
    int[] tails = new int[m];
    int[] heads = new int[m];
    long[] caps = new long[m];
    for (int i = 0; i < m; i++) {
      tails[i] = (int) arcs[i][0];
      heads[i] = (int) arcs[i][1];
      caps[i] = arcs[i][2];
    }
    return new FlowProblem(name, nodeCount, source, sink, tails, heads, caps, null);
  }

  int arcCount() {
    return tails.length;
  }

  boolean isGrid() {
    return grid != null;
  }

  /**
   * The nodes reachable from the source in the residual graph of the flow {@code flows[i]} on arc
   * i, computed here independently of any solver.
   */
  BitSet residualReachable(long[] flows) {
    BitSet reached = new BitSet(nodeCount);
    int[] queue = new int[nodeCount];
    int head = 0;
    int tail = 0;
    reached.set(source);
    queue[tail++] = source;
    while (head < tail) {
      int u = queue[head++];
      for (int i = 0; i < tails.length; i++) {
        int v = -1;
        if (tails[i] == u && flows[i] < capacities[i]) {
          v = heads[i];
        } else if (heads[i] == u && flows[i] > 0) {
          v = tails[i];
        }
        if (v >= 0 && !reached.get(v)) {
          reached.set(v);
          queue[tail++] = v;
        }
      }
    }
    return reached;
  }

  @Override
  public String toString() {
    return name + " (" + nodeCount + " nodes, " + tails.length + " arcs)";
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof FlowProblem p
        && p.name.equals(name)
        && Arrays.equals(p.tails, tails)
        && Arrays.equals(p.heads, heads)
        && Arrays.equals(p.capacities, capacities);
  }

  @Override
  public int hashCode() {
    return name.hashCode();
  }
}
