package io.github.cleave.flow;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.jgrapht.alg.flow.PushRelabelMFImpl;
import org.jgrapht.graph.DefaultWeightedEdge;
import org.jgrapht.graph.DirectedWeightedMultigraph;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The grid solver stores residuals 16 bits wide while every neighbour capacity is at most 32767 and
 * 32 bits otherwise; the answer must not depend on it. Oracle: JGraphT's push-relabel solver (test
 * scope, see CHECKS.md).
 */
class GridCapacityWidthTest {

  private static final int[] SCALES = {100, 32_768, 40_000, 1 << 29};

  @ParameterizedTest
  @EnumSource(Neighborhood.class)
  void everyWayOfBuildingGivesTheOracleFlowAtEveryWidth(Neighborhood nb) {
    SplittableRandom random = new SplittableRandom(4242L + nb.ordinal());
    for (int trial = 0; trial < 30; trial++) {
      int w = 1 + random.nextInt(6);
      int h = 1 + random.nextInt(6);
      int d = nb.isThreeDimensional() ? 1 + random.nextInt(4) : 1;
      int scale = SCALES[trial % SCALES.length];
      int n = w * h * d;
      int k = nb.size();
      int[] cs = new int[n];
      int[] ct = new int[n];
      int[] caps = new int[n * k]; // interleaved, with junk in the slots of arcs leaving the grid
      GridMaxFlow perArc = new GridMaxFlow(w, h, d, nb, false);
      GridMaxFlow retained = new GridMaxFlow(w, h, d, nb, true);
      DirectedWeightedMultigraph<Integer, DefaultWeightedEdge> g =
          new DirectedWeightedMultigraph<>(DefaultWeightedEdge.class);
      for (int v = 0; v < n + 2; v++) {
        g.addVertex(v);
      }
      int largest = 0;
      for (int p = 0; p < n; p++) {
        cs[p] = random.nextInt(3) == 0 ? 0 : random.nextInt(scale);
        ct[p] = random.nextInt(3) == 0 ? 0 : random.nextInt(scale);
        addEdge(g, n, p, cs[p]);
        addEdge(g, p, n + 1, ct[p]);
        for (int dir = 0; dir < k; dir++) {
          caps[p * k + dir] = random.nextInt(scale);
        }
      }
      perArc.setTerminalCapacities(cs, ct);
      retained.setTerminalCapacities(cs, ct);
      for (int p = 0; p < n; p++) {
        for (int dir = 0; dir < k; dir++) {
          int q = perArc.neighbor(p, dir);
          if (q >= 0) {
            perArc.setNeighborCapacity(p, dir, caps[p * k + dir]);
            retained.setNeighborCapacity(p, dir, caps[p * k + dir]);
            addEdge(g, p, q, caps[p * k + dir]);
            largest = Math.max(largest, caps[p * k + dir]);
          }
        }
      }
      GridMaxFlow interleaved = new GridMaxFlow(w, h, d, nb, false);
      interleaved.setTerminalCapacities(cs, ct);
      interleaved.setNeighborCapacities(caps);

      long expected = Math.round(new PushRelabelMFImpl<>(g).getMaximumFlowValue(n, n + 1));
      int expectedWidth = largest <= 32767 ? 16 : 32;
      for (GridMaxFlow solver : new GridMaxFlow[] {perArc, interleaved, retained}) {
        assertThat(solver.solve().flowValue())
            .as("trial %d, %dx%dx%d, scale %d", trial, w, h, d, scale)
            .isEqualTo(expected);
        assertThat(solver.capacityWidth()).as("trial %d", trial).isEqualTo(expectedWidth);
      }
      assertThat(retained.checkCertificate()).isTrue();
    }
  }

  @ParameterizedTest
  @EnumSource(Neighborhood.class)
  void raisingACapacityPastSixteenBitsAfterASolveWidensAndResolvesExactly(Neighborhood nb) {
    SplittableRandom random = new SplittableRandom(99L + nb.ordinal());
    int w = 6;
    int h = 5;
    int d = nb.isThreeDimensional() ? 4 : 1;
    GridMaxFlow dynamic = new GridMaxFlow(w, h, d, nb, true);
    int n = dynamic.nodeCount();
    dynamic.setTerminalCapacities(
        random.ints(n, 0, 3000).toArray(), random.ints(n, 0, 3000).toArray());
    int[] caps = random.ints(n * nb.size(), 0, 1000).toArray();
    dynamic.setNeighborCapacities(caps);
    dynamic.solve();
    assertThat(dynamic.capacityWidth()).isEqualTo(16);
    for (int change = 0; change < 10; change++) {
      int p = random.nextInt(n);
      int dir = random.nextInt(nb.size());
      if (dynamic.neighbor(p, dir) >= 0) {
        dynamic.setNeighborCapacity(p, dir, 40_000 + random.nextInt(30_000));
        dynamic.setNeighborCapacity(dynamic.neighbor(p, dir), dir ^ 1, 40_000);
      }
      dynamic.setTerminalCapacities(p, random.nextInt(100_000), random.nextInt(100_000));
      MaxFlowResult resolved = dynamic.resolve();
      GridMaxFlow scratch = GridDynamicResolveTest.copyOf(dynamic);
      MaxFlowResult fresh = scratch.solve();
      assertThat(resolved.flowValue()).as("change %d", change).isEqualTo(fresh.flowValue());
      assertThat(resolved.sourceSide()).isEqualTo(fresh.sourceSide());
    }
    assertThat(dynamic.capacityWidth()).isEqualTo(32);
  }

  @org.junit.jupiter.api.Test
  void bulkCapacitiesWhosePairsOverflowAreRejected() {
    // An arc and its reverse must fit one int together (the residual of either can reach the sum).
    for (boolean retain : new boolean[] {false, true}) {
      GridMaxFlow grid = new GridMaxFlow(3, 2, 1, Neighborhood.N4, retain);
      int[] caps = new int[6 * 4];
      caps[0] = Integer.MAX_VALUE; // node 0, direction 0 (+x) ...
      caps[1 * 4 + 1] = 5; // ... and its reverse, node 1, direction 1 (-x)
      org.assertj.core.api.Assertions.assertThatThrownBy(() -> grid.setNeighborCapacities(caps))
          .isInstanceOf(IllegalArgumentException.class)
          .hasMessageContaining("their sum must not exceed");
    }
  }

  private static void addEdge(
      DirectedWeightedMultigraph<Integer, DefaultWeightedEdge> g, int u, int v, int cap) {
    if (cap > 0) {
      g.setEdgeWeight(g.addEdge(u, v), cap);
    }
  }
}
