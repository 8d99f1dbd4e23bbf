package io.github.cleave.flow;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * Dynamic re-solve (Kohli and Torr, ICCV 2005) must give what a solve from scratch gives: the same
 * flow value and the same minimal source set, with the certificate holding (asserted inside every
 * solve, tests run with -ea). The oracle is a fresh solver on the changed network (STYLE.md 10).
 */
class GridDynamicResolveTest {

  @ParameterizedTest
  @EnumSource(Neighborhood.class)
  void resolveAfterRandomChangesEqualsSolveFromScratch(Neighborhood nb) {
    SplittableRandom random = new SplittableRandom(4242L + nb.ordinal());
    for (int trial = 0; trial < 40; trial++) {
      int w = 2 + random.nextInt(8);
      int h = 2 + random.nextInt(8);
      int d = nb.isThreeDimensional() ? 1 + random.nextInt(4) : 1;
      GridMaxFlow dynamic = randomGrid(w, h, d, nb, random);
      dynamic.solve();
      for (int round = 0; round < 5; round++) {
        int changes = 1 + random.nextInt(Math.max(1, dynamic.nodeCount() / 3));
        for (int c = 0; c < changes; c++) {
          int p = random.nextInt(dynamic.nodeCount());
          if (random.nextBoolean()) {
            dynamic.setTerminalCapacities(p, randomCap(random), randomCap(random));
          } else {
            int k = random.nextInt(nb.size());
            if (dynamic.neighbor(p, k) >= 0) {
              int reverse = dynamic.neighborCapacity(dynamic.neighbor(p, k), k ^ 1);
              dynamic.setNeighborCapacity(p, k, Math.min(randomCap(random), 1000 - reverse));
            }
          }
        }
        MaxFlowResult resolved = dynamic.resolve();
        MaxFlowResult scratch = copyOf(dynamic).solve();
        assertThat(resolved.status()).isEqualTo(SolveStatus.OPTIMAL);
        assertThat(resolved.flowValue())
            .as("trial %d round %d", trial, round)
            .isEqualTo(scratch.flowValue());
        assertThat(resolved.sourceSide()).isEqualTo(scratch.sourceSide());
        assertThat(dynamic.checkCertificate()).isTrue();
      }
      // Restoring a solve from scratch gives the same answer again.
      long value = dynamic.resolve().flowValue();
      assertThat(dynamic.solve().flowValue()).isEqualTo(value);
    }
  }

  @ParameterizedTest
  @EnumSource(
      value = Neighborhood.class,
      names = {"N4", "N8", "N6"})
  void leanSolverResolvesTerminalChanges(Neighborhood nb) {
    SplittableRandom random = new SplittableRandom(99L + nb.ordinal());
    for (int trial = 0; trial < 40; trial++) {
      int w = 2 + random.nextInt(8);
      int h = 2 + random.nextInt(8);
      int d = nb.isThreeDimensional() ? 1 + random.nextInt(3) : 1;
      GridMaxFlow reference = randomGrid(w, h, d, nb, random);
      GridMaxFlow lean = new GridMaxFlow(w, h, d, nb, false);
      int n = reference.nodeCount();
      for (int p = 0; p < n; p++) {
        lean.addTerminalCapacities(p, reference.sourceCapacity(p), reference.sinkCapacity(p));
        for (int k = 0; k < nb.size(); k++) {
          if (reference.neighbor(p, k) >= 0) {
            lean.setNeighborCapacity(p, k, reference.neighborCapacity(p, k));
          }
        }
      }
      lean.solve();
      for (int round = 0; round < 4; round++) {
        for (int c = 0; c < 1 + random.nextInt(n); c++) {
          int p = random.nextInt(n);
          int cs = randomCap(random);
          int ct = randomCap(random);
          lean.addTerminalCapacities(
              p, cs - reference.sourceCapacity(p), ct - reference.sinkCapacity(p));
          reference.setTerminalCapacities(p, cs, ct);
        }
        MaxFlowResult resolved = lean.resolve();
        MaxFlowResult scratch = reference.solve();
        assertThat(resolved.flowValue()).isEqualTo(scratch.flowValue());
        assertThat(resolved.sourceSide()).isEqualTo(scratch.sourceSide());
      }
    }
  }

  private static int randomCap(SplittableRandom random) {
    return random.nextInt(4) == 0 ? 0 : random.nextInt(random.nextBoolean() ? 10 : 500);
  }

  private static GridMaxFlow randomGrid(
      int w, int h, int d, Neighborhood nb, SplittableRandom random) {
    GridMaxFlow grid = new GridMaxFlow(w, h, d, nb, true);
    for (int p = 0; p < grid.nodeCount(); p++) {
      grid.setTerminalCapacities(p, randomCap(random), randomCap(random));
      for (int k = 0; k < nb.size(); k += 2) {
        int q = grid.neighbor(p, k);
        if (q >= 0) {
          grid.setNeighborCapacity(p, k, randomCap(random));
          grid.setNeighborCapacity(q, k ^ 1, randomCap(random));
        }
      }
    }
    return grid;
  }

  /** A new solver with the same capacities, retained, never solved. */
  static GridMaxFlow copyOf(GridMaxFlow grid) {
    GridMaxFlow copy =
        new GridMaxFlow(grid.width(), grid.height(), grid.depth(), grid.neighborhood(), true);
    for (int p = 0; p < grid.nodeCount(); p++) {
      copy.setTerminalCapacities(p, grid.sourceCapacity(p), grid.sinkCapacity(p));
      for (int k = 0; k < grid.neighborhood().size(); k++) {
        if (grid.neighbor(p, k) >= 0) {
          copy.setNeighborCapacity(p, k, grid.neighborCapacity(p, k));
        }
      }
    }
    return copy;
  }
}
