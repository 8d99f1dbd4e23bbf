package io.github.cleave.flow;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.BitSet;
import org.junit.jupiter.api.Test;

/** The max-flow contract, run against the general sparse solver. */
class SparseMaxFlowContractTest extends MaxFlowContractTest {

  static SparseMaxFlow build(FlowProblem p) {
    SparseGraphBuilder builder = new SparseGraphBuilder(p.nodeCount());
    for (int i = 0; i < p.arcCount(); i++) {
      builder.addArc(p.tails()[i], p.heads()[i], p.capacities()[i]);
    }
    return builder.setSource(p.source()).setSink(p.sink()).build();
  }

  @Override
  SolvedProblem solve(FlowProblem p) {
    SparseMaxFlow solver = build(p);
    MaxFlowResult result = solver.solve();
    assertThat(solver.checkCertificate()).isTrue();
    long[] flows = new long[p.arcCount()];
    for (int i = 0; i < flows.length; i++) {
      flows[i] = solver.arcFlow(i);
    }
    long[] visited = {0};
    result.visitArcFlows((from, to, flow) -> visited[0] += flow);
    long total = 0;
    for (long f : flows) {
      total += f;
    }
    assertThat(visited[0]).as("visitArcFlows reports every arc with flow").isEqualTo(total);
    return new SolvedProblem(result, p, flows, result.sourceSide());
  }

  @Override
  boolean supports(FlowProblem p) {
    return true;
  }

  @Test
  void sourceEqualToSinkIsRejected() {
    SparseGraphBuilder builder = new SparseGraphBuilder(3).setSource(1).setSink(1);
    assertThatThrownBy(builder::build)
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("the source and the sink are the same node (1)");
  }

  @Test
  void badArcsAndMissingTerminalsAreRejected() {
    SparseGraphBuilder builder = new SparseGraphBuilder(3);
    assertThatThrownBy(() -> builder.addArc(0, 3, 1)).hasMessageContaining("head node 3");
    assertThatThrownBy(() -> builder.addArc(0, 1, -1)).hasMessageContaining("capacity -1");
    assertThatThrownBy(() -> builder.addArc(0, 1, 1L << 31)).hasMessageContaining("0..2147483647");
    assertThatThrownBy(builder::build).isInstanceOf(IllegalStateException.class);
    assertThatThrownBy(() -> new SparseGraphBuilder(1)).hasMessageContaining("at least 2 nodes");
  }

  @Test
  void certificateCatchesATamperedResidual() {
    // The proof of optimality must not be a formality (common practice, no source).
    SparseMaxFlow solver = build(CLRS_FIG_26_1);
    solver.solve();
    solver.residual[0]++;
    assertThatThrownBy(solver::checkCertificate).isInstanceOf(CertificateViolation.class);
  }

  @Test
  void twoNodesWithoutArcsCarryNoFlow() {
    SparseMaxFlow solver = new SparseGraphBuilder(2).setSource(0).setSink(1).build();
    MaxFlowResult result = solver.solve();
    assertThat(result.flowValue()).isZero();
    BitSet expected = new BitSet();
    expected.set(0);
    assertThat(result.sourceSide()).isEqualTo(expected);
  }

  @Test
  void interruptedSolveSaysSoAndKeepsTheFlag() {
    FlowProblem p = RandomFlowProblems.grid(new java.util.SplittableRandom(5), Neighborhood.N8, 1);
    SparseMaxFlow solver = build(p);
    Thread.currentThread().interrupt();
    try {
      // A small problem may finish before the first interrupt check; then it is optimal.
      MaxFlowResult result = solver.solve();
      assertThat(result.status()).isIn(SolveStatus.INTERRUPTED, SolveStatus.OPTIMAL);
      assertThat(Thread.currentThread().isInterrupted()).isTrue();
    } finally {
      Thread.interrupted();
    }
  }

  @Test
  void resultsRefuseArcFlowsAfterAnotherSolve() {
    SparseMaxFlow solver = build(CLRS_FIG_26_1);
    MaxFlowResult first = solver.solve();
    solver.solve();
    assertThatThrownBy(() -> first.visitArcFlows((u, v, f) -> {}))
        .isInstanceOf(IllegalStateException.class);
  }
}
