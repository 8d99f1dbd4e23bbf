package io.github.cleave.flow;

import org.jgrapht.alg.flow.PushRelabelMFImpl;
import org.jgrapht.graph.DefaultWeightedEdge;
import org.jgrapht.graph.DirectedWeightedPseudograph;

/**
 * Maximum flow value by JGraphT's push-relabel implementation ({@code
 * org.jgrapht:jgrapht-core:1.5.2}, test scope), an independent oracle (CHECKS.md). Capacities are
 * doubles there; our test values stay below 2^53 in sum, so the value is exact.
 */
final class JGraphTOracle {
  private JGraphTOracle() {}

  static long maxFlow(FlowProblem p) {
    DirectedWeightedPseudograph<Integer, DefaultWeightedEdge> g =
        new DirectedWeightedPseudograph<>(DefaultWeightedEdge.class);
    for (int v = 0; v < p.nodeCount(); v++) {
      g.addVertex(v);
    }
    for (int i = 0; i < p.arcCount(); i++) {
      if (p.tails()[i] != p.heads()[i] && p.capacities()[i] > 0) {
        g.setEdgeWeight(g.addEdge(p.tails()[i], p.heads()[i]), p.capacities()[i]);
      }
    }
    return Math.round(new PushRelabelMFImpl<>(g).getMaximumFlowValue(p.source(), p.sink()));
  }
}
