package io.github.cleave.flow;

import java.util.BitSet;

/**
 * The proof of optimality of a {@link GridMaxFlow} solve, computed from the retained capacities and
 * the residuals only (never from the search trees, which it checks):
 *
 * <ol>
 *   <li>Every arc pair keeps its total capacity ({@code r(p,q) + r(q,p) = c(p,q) + c(q,p)}, both
 *       residuals non-negative), so the net flow on every arc lies within its capacity.
 *   <li>Terminal residuals lie within the terminal capacities, and at every node the net flow from
 *       the source minus the net flow to the sink equals the net flow out to the neighbours
 *       (conservation).
 *   <li>The flow value equals the flow leaving the source.
 *   <li>The set R reachable from the source in the residual graph contains no node with residual
 *       capacity to the sink, R is the solver's source tree, and the capacity of the cut (R, not R)
 *       equals the flow value.
 * </ol>
 *
 * By the max-flow min-cut theorem, 1–4 prove that the flow is maximum and the cut minimum. O(nK)
 * time, one bit set and one int queue of n entries.
 */
final class GridCertificate {
  private final GridMaxFlow solver;
  private final GridSearch search;
  private final GridLayout g;
  private final int directions;
  private final long totalShift; // sum of the reparametrisation shifts

  GridCertificate(GridMaxFlow solver) {
    this.solver = solver;
    this.search = solver.search;
    this.g = solver.layout;
    this.directions = g.directions;
    long sum = 0;
    if (solver.shift != null) {
      for (long s : solver.shift) {
        sum += s;
      }
    }
    this.totalShift = sum;
  }

  /** Source capacity of padded node p in the reparametrised network the flow belongs to. */
  private long sourceCap(int p) {
    return solver.sourceCapacity[p] + (solver.shift == null ? 0 : solver.shift[p]);
  }

  /** Sink capacity of padded node p in the reparametrised network the flow belongs to. */
  private long sinkCap(int p) {
    return solver.sinkCapacity[p] + (solver.shift == null ? 0 : solver.shift[p]);
  }

  /** Throws {@link CertificateViolation} naming the first condition that fails. */
  void check() {
    Residuals residual = search.residual;
    int[] capacity = solver.capacity;
    long sourceFlow = solver.sourceSinkCapacity;
    for (int p = 0; p < g.paddedCount; p++) {
      boolean inside = g.isInside(p);
      if (!inside) {
        checkBorder(p);
        continue;
      }
      long netOut = 0;
      for (int k = 0; k < directions; k++) {
        int a = p * directions + k;
        int q = p + g.offset[k];
        int b = q * directions + (k ^ 1);
        if (residual.get(a) < 0
            || residual.get(b) < 0
            || (long) residual.get(a) + residual.get(b) != (long) capacity[a] + capacity[b]) {
          throw violation(
              "arc pair between node "
                  + g.unpadded(p)
                  + " and its neighbour in direction "
                  + k
                  + " has residuals "
                  + residual.get(a)
                  + ", "
                  + residual.get(b)
                  + " but capacities "
                  + capacity[a]
                  + ", "
                  + capacity[b]);
        }
        netOut += capacity[a] - residual.get(a);
      }
      long cs = sourceCap(p);
      long ct = sinkCap(p);
      int t = search.terminal[p];
      long rs = Math.max(t, 0);
      long rt = Math.max(-(long) t, 0);
      if (rs > cs || rt > ct) {
        throw violation(
            "node "
                + g.unpadded(p)
                + " has terminal residual "
                + t
                + " outside its capacities (source "
                + cs
                + ", sink "
                + ct
                + ")");
      }
      long fromSource = cs - rs;
      long toSink = ct - rt;
      if (fromSource - toSink != netOut) {
        throw violation(
            "flow is not conserved at node "
                + g.unpadded(p)
                + ": in from the source "
                + fromSource
                + ", out to the sink "
                + toSink
                + ", net out to neighbours "
                + netOut);
      }
      sourceFlow += fromSource;
    }
    if (sourceFlow != search.flow + totalShift) {
      throw violation(
          "flow value "
              + search.flow
              + " (+ reparametrisation "
              + totalShift
              + ") differs from the flow leaving the source "
              + sourceFlow);
    }
    checkCut(reachableFromSource());
  }

  private void checkBorder(int p) {
    if (search.terminal[p] != 0 || search.tree[p] != GridSearch.FREE) {
      throw violation("border node " + p + " carries terminal residual or joined a tree");
    }
    for (int k = 0; k < directions; k++) {
      int a = p * directions + k;
      if (search.residual.get(a) != 0 || solver.capacity[a] != 0) {
        throw violation("border node " + p + " has a non-zero arc in direction " + k);
      }
    }
  }

  /** Breadth-first search from the source over arcs with positive residual; padded indices. */
  private BitSet reachableFromSource() {
    BitSet reached = new BitSet(g.paddedCount);
    IntFifo queue = new IntFifo(1024);
    for (int p = 0; p < g.paddedCount; p++) {
      if (search.terminal[p] > 0) {
        reached.set(p);
        queue.add(p);
      }
    }
    while (!queue.isEmpty()) {
      int p = queue.poll();
      for (int k = 0; k < directions; k++) {
        int q = p + g.offset[k];
        if (search.residual.get(p * directions + k) > 0 && !reached.get(q)) {
          reached.set(q);
          queue.add(q);
        }
      }
    }
    return reached;
  }

  private void checkCut(BitSet reached) {
    long cut = solver.sourceSinkCapacity - totalShift;
    for (int p = 0; p < g.paddedCount; p++) {
      boolean inS = reached.get(p);
      if (inS != (search.tree[p] == GridSearch.SOURCE_TREE)) {
        throw violation(
            "node "
                + g.unpadded(p)
                + (inS
                    ? " is reachable from the source in the residual graph but not in the"
                        + " solver's source set"
                    : " is in the solver's source set but not reachable from the source"));
      }
      if (!g.isInside(p)) {
        continue;
      }
      if (inS) {
        if (search.terminal[p] < 0) {
          throw violation("the sink is reachable from the source through node " + g.unpadded(p));
        }
        cut += sinkCap(p);
        for (int k = 0; k < directions; k++) {
          if (!reached.get(p + g.offset[k])) {
            cut += solver.capacity[p * directions + k];
          }
        }
      } else {
        cut += sourceCap(p);
      }
    }
    if (cut != search.flow) {
      throw violation("cut capacity " + cut + " differs from flow value " + search.flow);
    }
  }

  /**
   * Reports every arc with positive flow: terminal arcs with the terminal as {@link
   * GridMaxFlow#SOURCE} or {@link GridMaxFlow#SINK}, neighbour arcs with their net flow.
   */
  void visitArcFlows(ArcFlowVisitor visitor) {
    if (solver.sourceSinkCapacity > 0) {
      visitor.arc(GridMaxFlow.SOURCE, GridMaxFlow.SINK, solver.sourceSinkCapacity);
    }
    int node = 0;
    for (int z = 0; z < g.depth; z++) {
      for (int y = 0; y < g.height; y++) {
        int p = g.padded(0, y, z);
        for (int x = 0; x < g.width; x++, p++, node++) {
          int t = search.terminal[p];
          long fromSource = solver.sourceCapacity[p] - Math.max(t, 0);
          long toSink = solver.sinkCapacity[p] - Math.max(-(long) t, 0);
          if (fromSource > 0) {
            visitor.arc(GridMaxFlow.SOURCE, node, fromSource);
          }
          for (int k = 0; k < directions; k++) {
            int a = p * directions + k;
            long net = (long) solver.capacity[a] - search.residual.get(a);
            if (net > 0) {
              visitor.arc(node, g.unpadded(p + g.offset[k]), net);
            }
          }
          if (toSink > 0) {
            visitor.arc(node, GridMaxFlow.SINK, toSink);
          }
        }
      }
    }
  }

  private static CertificateViolation violation(String message) {
    return new CertificateViolation("max-flow certificate failed: " + message);
  }
}
