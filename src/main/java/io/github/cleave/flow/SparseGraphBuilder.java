package io.github.cleave.flow;

import java.util.Arrays;

/**
 * Collects the arcs of a directed network with integer capacities and builds a {@link
 * SparseMaxFlow} on it. Nodes are numbered {@code 0 .. nodeCount-1}; parallel arcs are kept apart,
 * self-loops are accepted and ignored (they can carry no flow between distinct nodes). Memory while
 * building: 12 bytes per arc. Not thread-safe.
 */
public final class SparseGraphBuilder implements FlowArcSink {
  private final int nodeCount;
  private int[] tails;
  private int[] heads;
  private int[] capacities;
  private int arcCount;
  private int source = -1;
  private int sink = -1;

  /**
   * A builder for a network of {@code nodeCount} nodes and no arcs.
   *
   * @throws IllegalArgumentException if {@code nodeCount < 2}
   */
  public SparseGraphBuilder(int nodeCount) {
    this(nodeCount, 16);
  }

  /**
   * A builder for a network of {@code nodeCount} nodes and no arcs, with room for {@code
   * expectedArcs} arcs before its arrays must grow.
   *
   * @throws IllegalArgumentException if {@code nodeCount < 2} or {@code expectedArcs < 0}
   */
  public SparseGraphBuilder(int nodeCount, int expectedArcs) {
    if (expectedArcs < 0) {
      throw new IllegalArgumentException("expected arc count " + expectedArcs + " is negative");
    }
    tails = new int[Math.max(1, expectedArcs)];
    heads = new int[tails.length];
    capacities = new int[tails.length];
    if (nodeCount < 2) {
      throw new IllegalArgumentException(
          "a flow network needs at least 2 nodes (a source and a sink), got " + nodeCount);
    }
    this.nodeCount = nodeCount;
  }

  /** Number of nodes. */
  public int nodeCount() {
    return nodeCount;
  }

  /** Number of arcs added so far, self-loops included. */
  public int arcCount() {
    return arcCount;
  }

  /**
   * Adds the arc {@code from -> to}.
   *
   * @throws IllegalArgumentException if a node is outside {@code 0 .. nodeCount-1} or the capacity
   *     outside {@code 0 .. Integer.MAX_VALUE}
   */
  @Override
  public void addArc(int from, int to, long capacity) {
    checkNode(from, "tail");
    checkNode(to, "head");
    if (capacity < 0 || capacity > Integer.MAX_VALUE) {
      throw new IllegalArgumentException(
          "arc "
              + from
              + " -> "
              + to
              + " has capacity "
              + capacity
              + "; capacities must lie in 0.."
              + Integer.MAX_VALUE);
    }
    if (arcCount == tails.length) {
      if (arcCount == Integer.MAX_VALUE / 2) {
        throw new IllegalArgumentException("more than " + arcCount + " arcs");
      }
      int grown = (int) Math.min(Integer.MAX_VALUE / 2, 2L * arcCount);
      tails = Arrays.copyOf(tails, grown);
      heads = Arrays.copyOf(heads, grown);
      capacities = Arrays.copyOf(capacities, grown);
    }
    tails[arcCount] = from;
    heads[arcCount] = to;
    capacities[arcCount] = (int) capacity;
    arcCount++;
  }

  /** Sets the source node. */
  public SparseGraphBuilder setSource(int node) {
    checkNode(node, "source");
    source = node;
    return this;
  }

  /** Sets the sink node. */
  public SparseGraphBuilder setSink(int node) {
    checkNode(node, "sink");
    sink = node;
    return this;
  }

  /**
   * Builds the solver. The builder may be reused afterwards: the solver shares the builder's arrays
   * but reads only the arcs added so far, which later additions leave as they are.
   *
   * @throws IllegalStateException if the source or the sink has not been set
   * @throws IllegalArgumentException if the source and the sink are the same node
   */
  public SparseMaxFlow build() {
    if (source < 0 || sink < 0) {
      throw new IllegalStateException(
          "set both terminals before building: source " + source + ", sink " + sink);
    }
    if (source == sink) {
      throw new IllegalArgumentException(
          "the source and the sink are the same node (" + source + "); they must differ");
    }
    // The solver shares the arrays, no copy: it reads only the arcs added so far, which never
    // change, and arcs added to the builder later go after them (or into grown copies).
    return new SparseMaxFlow(nodeCount, source, sink, tails, heads, capacities, arcCount);
  }

  private void checkNode(int node, String role) {
    if (node < 0 || node >= nodeCount) {
      throw new IllegalArgumentException(
          role + " node " + node + " does not exist; nodes are 0.." + (nodeCount - 1));
    }
  }
}
