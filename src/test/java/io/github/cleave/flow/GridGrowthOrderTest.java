package io.github.cleave.flow;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Both orders of growth of the grid solver (one queue where ties are few, the trees taking turns
 * where they are many) give the maximum flow and the minimal source set, from scratch and after
 * dynamic changes: checked against the sparse solver built from the same arcs (the
 * residual-reachable set is unique, so two correct solvers agree on it; max-flow min-cut theorem)
 * and by the grid solver's own certificate, over random grids whose share of ties (nodes with equal
 * terminal capacities) is drawn from 0 to 80 %.
 */
class GridGrowthOrderTest {
  private static final Neighborhood[] SOME = {Neighborhood.N4, Neighborhood.N8, Neighborhood.N6};
  private static final double[] TIE_SHARES = {0, 0.03, 0.3, 0.8};

  @Test
  void bothOrdersGiveTheMinimalCutFromScratchAndAfterChanges() {
    SplittableRandom random = new SplittableRandom(20261203L);
    int[] seen = new int[2]; // solves with one queue, with turns
    for (int trial = 0; trial < 120; trial++) {
      RandomGrid built = RandomGrid.of(random, SOME[trial % SOME.length]);
      GridMaxFlow grid = built.grid();
      int[][] terminals = built.terminals();
      int n = grid.nodeCount();
      for (int round = 0; round < 3; round++) {
        MaxFlowResult result = round == 0 ? grid.solve() : grid.resolve();
        MaxFlowResult expected = sparse(grid, terminals, built.neighbours()).solve();
        assertThat(result.flowValue())
            .as("trial %d round %d", trial, round)
            .isEqualTo(expected.flowValue());
        assertThat(result.sourceSide())
            .as("trial %d round %d", trial, round)
            .isEqualTo(expected.sourceSide().get(0, n));
        assertThat(grid.checkCertificate()).isTrue();
        seen[grid.search.treesTakeTurns() ? 1 : 0]++;
        for (int c = 0; c < 1 + n / 10; c++) { // then change some terminals and solve again
          int p = random.nextInt(n);
          terminals[p] = randomTerminals(random, built.tieShare());
          grid.setTerminalCapacities(p, terminals[p][0], terminals[p][1]);
        }
      }
    }
    assertThat(seen[0]).as("solves with one queue").isPositive();
    assertThat(seen[1]).as("solves with turns").isPositive();
  }

  @Test
  void aSecondSolveFromScratchGivesTheSameArcFlows() {
    // Determinism, our requirement: whatever the order of growth, a solve from scratch does not
    // depend on what the solver did before.
    SplittableRandom random = new SplittableRandom(7L);
    for (int trial = 0; trial < 40; trial++) {
      GridMaxFlow grid = RandomGrid.of(random, SOME[trial % SOME.length]).grid();
      String first = arcFlows(grid.solve());
      assertThat(arcFlows(grid.solve())).as("trial %d", trial).isEqualTo(first);
    }
  }

  /**
   * A grid of random size with random neighbour capacities and terminal capacities of which a
   * random share are ties, the capacities kept for the sparse oracle.
   */
  private record RandomGrid(
      GridMaxFlow grid, int[][] terminals, int[][] neighbours, double tieShare) {
    static RandomGrid of(SplittableRandom random, Neighborhood nb) {
      int w = 6 + random.nextInt(20);
      int h = 6 + random.nextInt(20);
      int d = nb.isThreeDimensional() ? 2 + random.nextInt(5) : 1;
      double tieShare = TIE_SHARES[random.nextInt(TIE_SHARES.length)];
      int n = w * h * d;
      int[][] terminals = new int[n][2];
      int[][] neighbours = new int[n][nb.size()];
      GridMaxFlow grid = new GridMaxFlow(w, h, d, nb, true);
      for (int p = 0; p < n; p++) {
        terminals[p] = randomTerminals(random, tieShare);
        grid.setTerminalCapacities(p, terminals[p][0], terminals[p][1]);
        for (int k = 0; k < nb.size(); k++) {
          if (grid.neighbor(p, k) >= 0) {
            neighbours[p][k] = random.nextInt(100);
            grid.setNeighborCapacity(p, k, neighbours[p][k]);
          }
        }
      }
      return new RandomGrid(grid, terminals, neighbours, tieShare);
    }
  }

  private static String arcFlows(MaxFlowResult result) {
    StringBuilder flows = new StringBuilder();
    result.visitArcFlows(
        (from, to, flow) ->
            flows.append(from).append('>').append(to).append(':').append(flow).append(' '));
    return flows.toString();
  }

  /** Equal capacities (a tie) with probability {@code tieShare}, else different ones. */
  private static int[] randomTerminals(SplittableRandom random, double tieShare) {
    if (random.nextDouble() < tieShare) {
      int c = random.nextInt(50);
      return new int[] {c, c};
    }
    int cs = random.nextInt(200);
    int ct = random.nextInt(200);
    return new int[] {cs == ct ? cs + 1 : cs, ct};
  }

  private static SparseMaxFlow sparse(GridMaxFlow grid, int[][] terminals, int[][] neighbours) {
    int n = grid.nodeCount();
    SparseGraphBuilder builder = new SparseGraphBuilder(n + 2);
    builder.setSource(n).setSink(n + 1);
    for (int p = 0; p < n; p++) {
      builder.addArc(n, p, terminals[p][0]);
      builder.addArc(p, n + 1, terminals[p][1]);
      for (int k = 0; k < neighbours[p].length; k++) {
        int q = grid.neighbor(p, k);
        if (q >= 0) {
          builder.addArc(p, q, neighbours[p][k]);
        }
      }
    }
    return builder.build();
  }
}
