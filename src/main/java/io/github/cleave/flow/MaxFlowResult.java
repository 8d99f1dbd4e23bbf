package io.github.cleave.flow;

import java.util.BitSet;
import java.util.Objects;

/**
 * The outcome of one solve: the flow value, how the solve ended, the minimum cut and timings.
 *
 * <p>Immutable: the cut is copied out of the solver. The per-arc flows are not copied (they can be
 * as large as the network); {@link #visitArcFlows(ArcFlowVisitor)} reads them from the solver and
 * refuses once the solver has been changed or solved again since this result was made.
 */
public final class MaxFlowResult {

  /** Read access to a solver's per-arc flows, valid while its generation is unchanged. */
  interface FlowView {
    /** Incremented by the solver at every change of capacities and every solve. */
    long generation();

    /** Calls {@code visitor} for every arc with positive flow. */
    void visitArcFlows(ArcFlowVisitor visitor);
  }

  private final long flowValue;
  private final SolveStatus status;
  private final BitSet sourceSide;
  private final int nodeCount;
  private final long solveNanos;
  private final SolveStatistics statistics;
  private final FlowView flowView;
  private final long generation;

  MaxFlowResult(
      long flowValue,
      SolveStatus status,
      BitSet sourceSide,
      int nodeCount,
      long solveNanos,
      SolveStatistics statistics,
      FlowView flowView) {
    this.flowValue = flowValue;
    this.status = Objects.requireNonNull(status);
    this.sourceSide = (BitSet) sourceSide.clone();
    this.nodeCount = nodeCount;
    this.solveNanos = solveNanos;
    this.statistics = Objects.requireNonNull(statistics);
    this.flowView = Objects.requireNonNull(flowView);
    this.generation = flowView.generation();
  }

  /** The value of the flow: the maximum flow when {@link #status()} is OPTIMAL. */
  public long flowValue() {
    return flowValue;
  }

  /** How the solve ended. */
  public SolveStatus status() {
    return status;
  }

  /** Number of nodes in the solver's numbering. */
  public int nodeCount() {
    return nodeCount;
  }

  /**
   * True if {@code node} lies on the source side of the minimum cut, i.e. is reachable from the
   * source in the residual graph of the maximum flow.
   *
   * @throws IndexOutOfBoundsException if {@code node} is not in {@code 0 .. nodeCount()-1}
   */
  public boolean isSourceSide(int node) {
    Objects.checkIndex(node, nodeCount);
    return sourceSide.get(node);
  }

  /** A copy of the source side of the cut, one bit per node. */
  public BitSet sourceSide() {
    return (BitSet) sourceSide.clone();
  }

  /** Number of nodes on the source side. */
  public int sourceSideSize() {
    return sourceSide.cardinality();
  }

  /** Time of the solve: initialising the search state plus the max-flow computation. */
  public long solveNanos() {
    return solveNanos;
  }

  /** Counters of the solve. */
  public SolveStatistics statistics() {
    return statistics;
  }

  /**
   * Calls {@code visitor} once for every arc carrying positive flow, in the solver's numbering.
   *
   * @throws IllegalStateException if the solver has been modified or solved again since
   */
  public void visitArcFlows(ArcFlowVisitor visitor) {
    if (flowView.generation() != generation) {
      throw new IllegalStateException(
          "the solver was changed or solved again after this result; read the arc flows first");
    }
    flowView.visitArcFlows(visitor);
  }

  @Override
  public String toString() {
    return "MaxFlowResult[flow="
        + flowValue
        + ", status="
        + status
        + ", sourceSide="
        + sourceSide.cardinality()
        + "/"
        + nodeCount
        + "]";
  }
}
