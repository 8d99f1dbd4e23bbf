package io.github.cleave.flow;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.BitSet;
import java.util.SplittableRandom;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The two solvers of the project against each other on random grids of every neighbourhood: same
 * value and same minimal source set (the residual-reachable set is unique, so two correct solvers
 * must agree on it; max-flow min-cut theorem).
 */
class GridVersusSparseTest {

  @ParameterizedTest
  @EnumSource(Neighborhood.class)
  void sameValueAndSameMinimalSourceSet(Neighborhood nb) {
    SplittableRandom random = new SplittableRandom(31337L + nb.ordinal());
    for (int i = 0; i < 60; i++) {
      FlowProblem p = RandomFlowProblems.grid(random, nb, i);
      GridMaxFlow grid = GridMaxFlowContractTest.build(p);
      SparseMaxFlow sparse = SparseMaxFlowContractTest.build(p);
      MaxFlowResult g = grid.solve();
      MaxFlowResult s = sparse.solve();
      assertThat(g.flowValue()).as("%s", p).isEqualTo(s.flowValue());
      BitSet gridSide = g.sourceSide();
      BitSet sparsePixels = s.sourceSide().get(0, grid.nodeCount());
      assertThat(gridSide).as("%s", p).isEqualTo(sparsePixels);
    }
  }
}
