package io.github.cleave.flow;

/** How a solve ended. */
public enum SolveStatus {
  /** A maximum flow was found; the cut is a minimum cut. */
  OPTIMAL,
  /**
   * The solving thread was interrupted before the flow was maximal. The flow is feasible but the
   * reported value is only a lower bound, and the cut is not minimal.
   */
  INTERRUPTED
}
