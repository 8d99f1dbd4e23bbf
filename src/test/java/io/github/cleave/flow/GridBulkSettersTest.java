package io.github.cleave.flow;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The bulk setters store exactly what the one-arc setter stores, and the solves agree: the flow
 * value and the source side of a grid built arc by arc equal those of the same grid built in bulk
 * (a max flow's value and minimal source set do not depend on how the network was entered; the
 * one-arc build is checked against JGraphT in {@code GridVersusSparseTest}).
 */
class GridBulkSettersTest {
  private static final Neighborhood[] ALL = {
    Neighborhood.N4, Neighborhood.N8, Neighborhood.N16,
    Neighborhood.N6, Neighborhood.N18, Neighborhood.N26
  };

  @Test
  void symmetricSetterEqualsArcByArc() {
    SplittableRandom random = new SplittableRandom(20261202L);
    for (int trial = 0; trial < 120; trial++) {
      Neighborhood nb = ALL[trial % ALL.length];
      int w = 1 + random.nextInt(12);
      int h = 1 + random.nextInt(12);
      int d = nb.isThreeDimensional() ? 1 + random.nextInt(5) : 1;
      GridMaxFlow bulk = new GridMaxFlow(w, h, d, nb, random.nextBoolean()); // both storages
      GridMaxFlow single = new GridMaxFlow(w, h, d, nb, true);
      int n = w * h * d;
      for (int k = 0; k < nb.size(); k += 2) {
        int[] caps = new int[n];
        for (int p = 0; p < n; p++) {
          caps[p] = random.nextInt(50);
          int q = single.neighbor(p, k);
          if (q >= 0) {
            single.setNeighborCapacity(p, k, caps[p]);
            single.setNeighborCapacity(q, k ^ 1, caps[p]);
          }
        }
        bulk.setSymmetricNeighborCapacities(k, caps);
      }
      terminals(random, n, bulk, single);
      assertSameNetworkAndCut(bulk, single, n, nb);
    }
  }

  @Test
  void listedNodesSetterEqualsArcByArc() {
    SplittableRandom random = new SplittableRandom(7L);
    for (int trial = 0; trial < 120; trial++) {
      Neighborhood nb = ALL[trial % ALL.length];
      int w = 1 + random.nextInt(12);
      int h = 1 + random.nextInt(12);
      int d = nb.isThreeDimensional() ? 1 + random.nextInt(5) : 1;
      int n = w * h * d;
      GridMaxFlow bulk = new GridMaxFlow(w, h, d, nb, random.nextBoolean()); // both storages
      GridMaxFlow single = new GridMaxFlow(w, h, d, nb, true);
      int[] nodes = new int[n];
      int count = 0;
      for (int p = 0; p < n; p++) {
        if (random.nextInt(3) > 0) {
          nodes[count++] = p;
        }
      }
      int[] caps = new int[count * nb.size()];
      for (int i = 0; i < count; i++) {
        for (int k = 0; k < nb.size(); k++) {
          caps[i * nb.size() + k] = random.nextInt(40);
          if (single.neighbor(nodes[i], k) >= 0) {
            single.setNeighborCapacity(nodes[i], k, caps[i * nb.size() + k]);
          }
        }
      }
      bulk.setNeighborCapacitiesOf(nodes, count, caps);
      terminals(random, n, bulk, single);
      assertSameNetworkAndCut(bulk, single, n, nb);
    }
  }

  @Test
  void rowSetterEqualsArcByArc() {
    SplittableRandom random = new SplittableRandom(11L);
    for (int trial = 0; trial < 120; trial++) {
      Neighborhood nb = ALL[trial % ALL.length];
      int w = 1 + random.nextInt(12);
      int h = 1 + random.nextInt(12);
      int d = nb.isThreeDimensional() ? 1 + random.nextInt(5) : 1;
      int n = w * h * d;
      GridMaxFlow bulk = new GridMaxFlow(w, h, d, nb, random.nextBoolean()); // both storages
      GridMaxFlow single = new GridMaxFlow(w, h, d, nb, true);
      boolean wide = trial % 5 == 0; // values beyond the 16-bit residuals in some rows
      int[] row = new int[w * nb.size()];
      for (int z = 0; z < d; z++) {
        for (int y = 0; y < h; y++) {
          for (int x = 0; x < w; x++) {
            int p = x + w * (y + h * z);
            for (int k = 0; k < nb.size(); k++) {
              int c =
                  wide && random.nextInt(7) == 0 ? 40000 + random.nextInt(9) : random.nextInt(40);
              row[x * nb.size() + k] = c;
              if (single.neighbor(p, k) >= 0) {
                single.setNeighborCapacity(p, k, c);
              }
            }
          }
          bulk.setRowNeighborCapacities(y, z, row);
        }
      }
      terminals(random, n, bulk, single);
      assertSameNetworkAndCut(bulk, single, n, nb);
    }
  }

  @Test
  void symmetricRowSetterEqualsArcByArc() {
    SplittableRandom random = new SplittableRandom(17L);
    for (int trial = 0; trial < 120; trial++) {
      Neighborhood nb = ALL[trial % ALL.length];
      int w = 1 + random.nextInt(12);
      int h = 1 + random.nextInt(12);
      int d = nb.isThreeDimensional() ? 1 + random.nextInt(5) : 1;
      int n = w * h * d;
      GridMaxFlow bulk = new GridMaxFlow(w, h, d, nb, random.nextBoolean()); // both storages
      GridMaxFlow single = new GridMaxFlow(w, h, d, nb, true);
      boolean wide = trial % 5 == 0; // values beyond the 16-bit residuals in some rows
      int[] line = new int[w];
      for (int z = 0; z < d; z++) {
        for (int y = 0; y < h; y++) {
          for (int k = random.nextInt(2); k < nb.size(); k += 2) { // either direction of a pair
            int qy = y + nb.dy(k);
            int qz = z + nb.dz(k);
            int x0 = Math.max(0, -nb.dx(k));
            int x1 = Math.min(w, w - nb.dx(k));
            if (qy < 0 || qy >= h || qz < 0 || qz >= d || x0 >= x1) {
              continue;
            }
            int from = x0 + random.nextInt(x1 - x0); // any run inside the row
            int count = random.nextInt(x1 - from + 1);
            for (int i = 0; i < count; i++) {
              int c =
                  wide && random.nextInt(7) == 0 ? 40000 + random.nextInt(9) : random.nextInt(40);
              line[i] = c;
              int p = from + i + w * (y + h * z);
              single.setNeighborCapacity(p, k, c);
              single.setNeighborCapacity(single.neighbor(p, k), k ^ 1, c);
            }
            bulk.setSymmetricRowCapacities(y, z, k, from, count, line);
          }
        }
      }
      terminals(random, n, bulk, single);
      assertSameNetworkAndCut(bulk, single, n, nb);
    }
  }

  @Test
  void symmetricRowSetterRefusesPairsOutsideTheGridAndOversizedValues() {
    GridMaxFlow solver = new GridMaxFlow(3, 3, 1, Neighborhood.N4, false);
    int[] line = new int[3];
    assertThatThrownBy(() -> solver.setSymmetricRowCapacities(2, 0, 2, 0, 3, line))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("not all inside");
    assertThatThrownBy(() -> solver.setSymmetricRowCapacities(0, 0, 0, 0, 3, line))
        .hasMessageContaining("not all inside");
    assertThatThrownBy(() -> solver.setSymmetricRowCapacities(0, 0, 0, 0, 4, line))
        .hasMessageContaining("not all inside");
    line[1] = Integer.MAX_VALUE / 2 + 1;
    assertThatThrownBy(() -> solver.setSymmetricRowCapacities(0, 0, 0, 0, 2, line))
        .hasMessageContaining("must be between 0 and");
    line[1] = -1;
    assertThatThrownBy(() -> solver.setSymmetricRowCapacities(0, 0, 0, 0, 2, line))
        .hasMessageContaining("must be between 0 and");
  }

  @Test
  void listedTerminalSetterEqualsNodeByNode() {
    SplittableRandom random = new SplittableRandom(13L);
    for (int trial = 0; trial < 120; trial++) {
      Neighborhood nb = ALL[trial % ALL.length];
      GridMaxFlow[] pair = equalArcs(random, nb, random.nextBoolean()); // both storages
      GridMaxFlow bulk = pair[0];
      GridMaxFlow single = pair[1];
      int n = bulk.nodeCount();
      int[] nodes = new int[n];
      int[] source = new int[n];
      int[] sink = new int[n];
      int count = 0;
      for (int p = 0; p < n; p++) {
        if (random.nextInt(3) == 0) {
          nodes[count] = p;
          source[count] = random.nextInt(60);
          sink[count] = random.nextInt(60);
          single.setTerminalCapacities(p, source[count], sink[count]);
          count++;
        }
      }
      bulk.setTerminalCapacitiesOf(nodes, count, source, sink);
      assertSameNetworkAndCut(bulk, single, n, nb);
    }
  }

  @Test
  void wholeGridTerminalSetterEqualsNodeByNodeAndAddsWhenCalledAgain() {
    SplittableRandom random = new SplittableRandom(17L);
    for (int trial = 0; trial < 120; trial++) {
      Neighborhood nb = ALL[trial % ALL.length];
      GridMaxFlow[] pair = equalArcs(random, nb, false); // its terminals start at zero
      GridMaxFlow bulk = pair[0];
      GridMaxFlow single = pair[1];
      int n = bulk.nodeCount();
      int[][] source = new int[2][n];
      int[][] sink = new int[2][n];
      int calls = 1 + random.nextInt(2); // a second call adds to the first (not retained)
      for (int c = 0; c < calls; c++) {
        for (int p = 0; p < n; p++) {
          source[c][p] = random.nextInt(60);
          sink[c][p] = random.nextInt(60);
        }
        bulk.setTerminalCapacities(source[c], sink[c]);
      }
      for (int p = 0; p < n; p++) {
        single.setTerminalCapacities(p, source[0][p] + source[1][p], sink[0][p] + sink[1][p]);
      }
      assertSameNetworkAndCut(bulk, single, n, nb);
    }
  }

  @Test
  void wholeGridTerminalSetterRefusesNegativeCapacities() {
    GridMaxFlow solver = new GridMaxFlow(4, 3, 1, Neighborhood.N8, false);
    int[] source = new int[12];
    int[] sink = new int[12];
    sink[9] = -5;
    assertThatThrownBy(() -> solver.setTerminalCapacities(source, sink))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("node 9");
  }

  @Test
  void bulkTerminalChangesAfterASolveEqualChangesOneByOne() {
    SplittableRandom random = new SplittableRandom(99L);
    for (int trial = 0; trial < 120; trial++) {
      Neighborhood nb = ALL[trial % ALL.length];
      int w = 1 + random.nextInt(12);
      int h = 1 + random.nextInt(12);
      int d = nb.isThreeDimensional() ? 1 + random.nextInt(5) : 1;
      int n = w * h * d;
      boolean retain = random.nextBoolean();
      GridMaxFlow bulk = new GridMaxFlow(w, h, d, nb, retain);
      GridMaxFlow single = new GridMaxFlow(w, h, d, nb, retain);
      for (int k = 0; k < nb.size(); k += 2) {
        int[] caps = new int[n];
        for (int p = 0; p < n; p++) {
          caps[p] = random.nextInt(50);
        }
        bulk.setSymmetricNeighborCapacities(k, caps);
        single.setSymmetricNeighborCapacities(k, caps);
      }
      terminals(random, n, bulk, single);
      bulk.solve();
      single.solve();
      int[] sourceDelta = new int[n];
      int[] sinkDelta = new int[n];
      for (int p = 0; p < n; p++) {
        if (random.nextInt(3) == 0) {
          sourceDelta[p] = random.nextInt(40);
          sinkDelta[p] = random.nextInt(40);
          single.addTerminalCapacities(p, sourceDelta[p], sinkDelta[p]);
        }
      }
      bulk.addTerminalCapacities(sourceDelta, sinkDelta);
      MaxFlowResult rb = bulk.resolve();
      MaxFlowResult rs = single.resolve();
      assertThat(rb.flowValue()).isEqualTo(rs.flowValue());
      assertThat(rb.sourceSide()).isEqualTo(rs.sourceSide());
    }
  }

  @Test
  void refusesCapacitiesWhoseArcPairCouldOverflow() {
    GridMaxFlow solver = new GridMaxFlow(3, 3, 1, Neighborhood.N4, true);
    int[] caps = new int[9];
    caps[4] = Integer.MAX_VALUE / 2 + 1;
    assertThatThrownBy(() -> solver.setSymmetricNeighborCapacities(0, caps))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("must be between 0 and");
    int[] negative = new int[Neighborhood.N4.size()];
    negative[1] = -1;
    assertThatThrownBy(() -> solver.setRowNeighborCapacities(3, 0, new int[3 * 4]))
        .hasMessageContaining("row (y 3, z 0)");
    assertThatThrownBy(() -> solver.setRowNeighborCapacities(0, 0, new int[3 * 4 - 1]))
        .hasMessageContaining("need 12");
    int[] huge = new int[9 * 4];
    huge[6] = Integer.MAX_VALUE / 2 + 1;
    assertThatThrownBy(() -> solver.setRowNeighborCapacities(1, 0, huge))
        .hasMessageContaining("direction 2");
    assertThatThrownBy(() -> solver.setNeighborCapacitiesOf(new int[] {4}, 1, negative))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("must be between 0 and");
  }

  /**
   * A solver to fill in bulk (retaining its capacities or not) and one that retains them, of the
   * same random size, with the same random symmetric neighbour capacities and no terminals.
   */
  private static GridMaxFlow[] equalArcs(
      SplittableRandom random, Neighborhood nb, boolean bulkRetains) {
    int w = 1 + random.nextInt(12);
    int h = 1 + random.nextInt(12);
    int d = nb.isThreeDimensional() ? 1 + random.nextInt(5) : 1;
    int n = w * h * d;
    GridMaxFlow bulk = new GridMaxFlow(w, h, d, nb, bulkRetains);
    GridMaxFlow single = new GridMaxFlow(w, h, d, nb, true);
    int[] caps = new int[n];
    for (int k = 0; k < nb.size(); k += 2) {
      for (int p = 0; p < n; p++) {
        caps[p] = random.nextInt(30);
      }
      bulk.setSymmetricNeighborCapacities(k, caps);
      single.setSymmetricNeighborCapacities(k, caps);
    }
    return new GridMaxFlow[] {bulk, single};
  }

  private static void terminals(SplittableRandom random, int n, GridMaxFlow a, GridMaxFlow b) {
    int[] source = new int[n];
    int[] sink = new int[n];
    for (int p = 0; p < n; p++) {
      source[p] = random.nextInt(60);
      sink[p] = random.nextInt(60);
    }
    a.setTerminalCapacities(source, sink);
    b.setTerminalCapacities(source.clone(), sink.clone());
  }

  private static void assertSameNetworkAndCut(
      GridMaxFlow a, GridMaxFlow b, int n, Neighborhood nb) {
    for (int p = 0; p < n && a.retainsCapacities(); p++) {
      for (int k = 0; k < nb.size(); k++) {
        assertThat(a.neighborCapacity(p, k)).isEqualTo(b.neighborCapacity(p, k));
      }
    }
    MaxFlowResult ra = a.solve();
    MaxFlowResult rb = b.solve();
    assertThat(ra.flowValue()).isEqualTo(rb.flowValue());
    assertThat(ra.sourceSide()).isEqualTo(rb.sourceSide());
    assertThat(b.checkCertificate()).isTrue();
  }
}
