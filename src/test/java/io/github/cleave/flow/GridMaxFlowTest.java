package io.github.cleave.flow;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.SplittableRandom;
import org.jgrapht.alg.flow.PushRelabelMFImpl;
import org.jgrapht.graph.DefaultWeightedEdge;
import org.jgrapht.graph.SimpleDirectedWeightedGraph;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Grid-specific behaviour of {@link GridMaxFlow}; the shared contract lives in the contract suite.
 */
class GridMaxFlowTest {

  /** Random grids against JGraphT's push-relabel solver (test-scope oracle, see CHECKS.md). */
  @ParameterizedTest
  @EnumSource(Neighborhood.class)
  void randomGridsMatchJGraphT(Neighborhood nb) {
    SplittableRandom random = new SplittableRandom(20261202L + nb.ordinal());
    for (int trial = 0; trial < 60; trial++) {
      int w = 1 + random.nextInt(7);
      int h = 1 + random.nextInt(7);
      int d = nb.isThreeDimensional() ? 1 + random.nextInt(4) : 1;
      GridMaxFlow grid = new GridMaxFlow(w, h, d, nb, true);
      SimpleDirectedWeightedGraph<Integer, DefaultWeightedEdge> g =
          new SimpleDirectedWeightedGraph<>(DefaultWeightedEdge.class);
      int n = grid.nodeCount();
      int source = n;
      int sink = n + 1;
      for (int v = 0; v < n + 2; v++) {
        g.addVertex(v);
      }
      int maxCap = trial % 2 == 0 ? 10 : 1000;
      for (int p = 0; p < n; p++) {
        int cs = random.nextInt(3) == 0 ? 0 : random.nextInt(maxCap);
        int ct = random.nextInt(3) == 0 ? 0 : random.nextInt(maxCap);
        grid.setTerminalCapacities(p, cs, ct);
        addEdge(g, source, p, cs);
        addEdge(g, p, sink, ct);
        for (int k = 0; k < nb.size(); k++) {
          int q = grid.neighbor(p, k);
          if (q >= 0 && random.nextInt(4) != 0) {
            int c = random.nextInt(maxCap);
            grid.setNeighborCapacity(p, k, c);
            addEdge(g, p, q, c);
          }
        }
      }
      MaxFlowResult result = grid.solve();
      double expected = new PushRelabelMFImpl<>(g).getMaximumFlowValue(source, sink);
      assertThat(result.flowValue())
          .as("trial %d %dx%dx%d", trial, w, h, d)
          .isEqualTo((long) expected);
      assertThat(result.status()).isEqualTo(SolveStatus.OPTIMAL);
      assertThat(grid.checkCertificate()).isTrue();
      // A second solve starts from scratch and gives the same cut.
      MaxFlowResult again = grid.solve();
      assertThat(again.flowValue()).isEqualTo(result.flowValue());
      assertThat(again.sourceSide()).isEqualTo(result.sourceSide());
    }
  }

  private static void addEdge(
      SimpleDirectedWeightedGraph<Integer, DefaultWeightedEdge> g, int u, int v, int cap) {
    if (cap > 0) {
      DefaultWeightedEdge e = g.addEdge(u, v);
      g.setEdgeWeight(e, cap);
    }
  }

  /** The bulk setters fill exactly what the per-arc setters fill (common practice, no source). */
  @ParameterizedTest
  @EnumSource(Neighborhood.class)
  void bulkSettersMatchPerArcSetters(Neighborhood nb) {
    SplittableRandom random = new SplittableRandom(77L + nb.ordinal());
    int w = 6;
    int h = 5;
    int d = nb.isThreeDimensional() ? 4 : 1;
    GridMaxFlow single = new GridMaxFlow(w, h, d, nb, true);
    GridMaxFlow bulk = new GridMaxFlow(w, h, d, nb, true);
    int n = single.nodeCount();
    int[] cs = random.ints(n, 0, 50).toArray();
    int[] ct = random.ints(n, 0, 50).toArray();
    bulk.setTerminalCapacities(cs, ct);
    for (int p = 0; p < n; p++) {
      single.setTerminalCapacities(p, cs[p], ct[p]);
    }
    for (int k = 0; k < nb.size(); k++) {
      int[] caps = random.ints(n, 0, 30).toArray();
      bulk.setNeighborCapacities(k, caps);
      for (int p = 0; p < n; p++) {
        if (single.neighbor(p, k) >= 0) {
          single.setNeighborCapacity(p, k, caps[p]);
        }
      }
    }
    for (int p = 0; p < n; p++) {
      assertThat(bulk.sourceCapacity(p)).isEqualTo(single.sourceCapacity(p));
      assertThat(bulk.sinkCapacity(p)).isEqualTo(single.sinkCapacity(p));
      for (int k = 0; k < nb.size(); k++) {
        assertThat(bulk.neighborCapacity(p, k)).isEqualTo(single.neighborCapacity(p, k));
      }
    }
    assertThat(bulk.solve().flowValue()).isEqualTo(single.solve().flowValue());
    GridMaxFlow lean = new GridMaxFlow(w, h, d, nb, false);
    lean.setTerminalCapacities(cs, ct);
    for (int k = 0; k < nb.size(); k++) {
      int[] caps = new int[n];
      for (int p = 0; p < n; p++) {
        caps[p] = single.neighborCapacity(p, k);
      }
      lean.setNeighborCapacities(k, caps);
    }
    assertThat(lean.solve().flowValue()).isEqualTo(single.solve().flowValue());
  }

  @Test
  void twoDimensionalNeighborhoodRejectsDepth() {
    assertThatThrownBy(() -> new GridMaxFlow(4, 4, 2, Neighborhood.N8))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("depth 2");
  }
}
