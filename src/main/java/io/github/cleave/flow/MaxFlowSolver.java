package io.github.cleave.flow;

/**
 * A maximum-flow / minimum-cut solver for one network.
 *
 * <p>The network is built through the implementation's own methods. {@link #solve()} computes a
 * maximum flow from scratch (discarding the flow of any earlier solve) and returns an immutable
 * {@link MaxFlowResult}. Implementations are not thread-safe: one thread builds and solves; the
 * results may be read from any thread.
 */
public interface MaxFlowSolver {
  /**
   * Number of nodes in the solver's numbering (the range of {@link MaxFlowResult#isSourceSide}).
   */
  int nodeCount();

  /**
   * Computes a maximum flow and the minimum cut whose source side is the set of nodes reachable
   * from the source in the residual graph. If the thread is interrupted, returns early with status
   * {@link SolveStatus#INTERRUPTED}; the interrupt flag stays set.
   */
  MaxFlowResult solve();

  /**
   * Proves the current flow optimal: every arc flow lies within its capacity, flow is conserved at
   * every non-terminal node, the sink is not reachable from the source in the residual graph, the
   * solver's cut is that reachable set, and its capacity equals the flow value.
   *
   * @return {@code true}, so that it can be called as {@code assert solver.checkCertificate()}
   * @throws CertificateViolation naming the first broken condition
   */
  boolean checkCertificate();
}
