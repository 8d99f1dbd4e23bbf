package io.github.cleave.flow;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.util.BitSet;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * What every max-flow solver of the project must do, run against each solver by a subclass. Each
 * answer is checked against an outside value (a published worked example or JGraphT's push-relabel
 * solver) and against a residual-graph search done here, not by the solver: the flow respects
 * capacities and conservation, its value is the cut capacity, and the solver's source side is
 * exactly the set reachable from the source in the residual graph.
 */
abstract class MaxFlowContractTest {

  /** Builds and solves {@code problem} with the solver under test. */
  abstract SolvedProblem solve(FlowProblem problem);

  /** Whether the solver under test can represent {@code problem} (the grid solver: grids only). */
  abstract boolean supports(FlowProblem problem);

  // Cormen, Leiserson, Rivest & Stein, Introduction to Algorithms, 3rd ed., Fig. 26.1:
  // s=0, v1..v4=1..4, t=5; maximum flow 23, minimum cut S = {s, v1, v2, v4} (CHECKS.md).
  static final FlowProblem CLRS_FIG_26_1 =
      FlowProblem.of(
          "CLRS 3rd ed. Fig. 26.1",
          6,
          0,
          5,
          new long[][] {
            {0, 1, 16},
            {0, 2, 13},
            {2, 1, 4},
            {1, 3, 12},
            {3, 2, 9},
            {2, 4, 14},
            {4, 3, 7},
            {3, 5, 20},
            {4, 5, 4}
          });

  // Sedgewick & Wayne, Algorithms, 4th ed., section 6.4, data file tinyFN: maximum flow 4.
  static final FlowProblem TINY_FN =
      FlowProblem.of(
          "Sedgewick & Wayne tinyFN",
          6,
          0,
          5,
          new long[][] {
            {0, 1, 2}, {0, 2, 3}, {1, 3, 3}, {1, 4, 1}, {2, 3, 1}, {2, 4, 1}, {3, 5, 2}, {4, 5, 3}
          });

  // DIMACS implementation challenge, max-flow problem format description, example file
  // (nodes 1..6 there, 0..5 here): maximum flow 15.
  static final FlowProblem DIMACS_EXAMPLE =
      FlowProblem.of(
          "DIMACS format description example",
          6,
          0,
          5,
          new long[][] {
            {0, 1, 5}, {0, 2, 15}, {1, 3, 5}, {1, 4, 5}, {2, 3, 5}, {2, 4, 5}, {3, 5, 15}, {4, 5, 5}
          });

  @Test
  void clrsFigure26_1() {
    assumeTrue(supports(CLRS_FIG_26_1));
    SolvedProblem solved = solveAndCheck(CLRS_FIG_26_1);
    assertThat(solved.result().flowValue()).isEqualTo(23);
    // The minimal source set of the cut; CLRS name this cut, and it is the residual-reachable one.
    BitSet expected = new BitSet();
    expected.set(0);
    expected.set(1);
    expected.set(2);
    expected.set(4);
    assertThat(solved.sourceSide()).isEqualTo(expected);
  }

  @Test
  void sedgewickWayneTinyFn() {
    assumeTrue(supports(TINY_FN));
    assertThat(solveAndCheck(TINY_FN).result().flowValue()).isEqualTo(4);
  }

  @Test
  void dimacsFormatExample() {
    assumeTrue(supports(DIMACS_EXAMPLE));
    assertThat(solveAndCheck(DIMACS_EXAMPLE).result().flowValue()).isEqualTo(15);
  }

  @Test
  void randomSparseGraphsMatchJGraphT() {
    SplittableRandom random = new SplittableRandom(202612021L);
    int checked = 0;
    for (int i = 0; i < 300; i++) {
      FlowProblem p = RandomFlowProblems.sparse(random, i);
      if (supports(p)) {
        assertThat(solveAndCheck(p).result().flowValue())
            .as("%s", p)
            .isEqualTo(JGraphTOracle.maxFlow(p));
        checked++;
      }
    }
    assumeTrue(checked > 0, "the solver under test takes no general graphs");
  }

  @Test
  void randomGridsOfEveryNeighborhoodMatchJGraphT() {
    SplittableRandom random = new SplittableRandom(202612022L);
    for (Neighborhood nb : Neighborhood.values()) {
      for (int i = 0; i < 40; i++) {
        FlowProblem p = RandomFlowProblems.grid(random, nb, i);
        assertThat(solveAndCheck(p).result().flowValue())
            .as("%s", p)
            .isEqualTo(JGraphTOracle.maxFlow(p));
      }
    }
  }

  @Test
  void flowBeyondTheIntRangeIsExact() {
    // Five disjoint paths of capacity Integer.MAX_VALUE: the value 5 (2^31 - 1) needs a long
    // (handbook arithmetic: disjoint paths add).
    long max = Integer.MAX_VALUE;
    FlowProblem p =
        grid(
            "five saturated columns",
            5,
            1,
            new long[][] {
              {5, 0, max}, {5, 1, max}, {5, 2, max}, {5, 3, max}, {5, 4, max},
              {0, 6, max}, {1, 6, max}, {2, 6, max}, {3, 6, max}, {4, 6, max}
            });
    assertThat(solveAndCheck(p).result().flowValue()).isEqualTo(5 * max);
    // A chain whose arcs are all at the limit except one: the bottleneck decides.
    FlowProblem chain =
        grid(
            "chain at the limit",
            4,
            1,
            new long[][] {{4, 0, max}, {0, 1, max}, {1, 2, max - 7}, {2, 3, max}, {3, 5, max}});
    assertThat(solveAndCheck(chain).result().flowValue()).isEqualTo(max - 7);
  }

  @Test
  void networksWithoutUsableArcsCarryNoFlow() {
    FlowProblem empty = grid("no arcs", 1, 1, new long[][] {});
    assertThat(solveAndCheck(empty).result().flowValue()).isZero();
    FlowProblem zeros =
        grid("zero capacities", 2, 1, new long[][] {{2, 0, 0}, {0, 1, 0}, {1, 3, 0}});
    assertThat(solveAndCheck(zeros).result().flowValue()).isZero();
    FlowProblem cutOff = grid("disconnected", 3, 1, new long[][] {{3, 0, 9}, {2, 4, 9}});
    SolvedProblem solved = solveAndCheck(cutOff);
    assertThat(solved.result().flowValue()).isZero();
    assertThat(solved.sourceSide().get(0)).isTrue();
    assertThat(solved.sourceSide().get(2)).isFalse();
  }

  @Test
  void handComputedGridExample() {
    // Two pixels: source -> 0 (5), 0 -> 1 (3), 1 -> sink (7); the middle arc is the bottleneck, so
    // the value is 3 and the minimal source set is {source, 0} (max-flow min-cut theorem, by hand).
    FlowProblem p = grid("two pixels", 2, 1, new long[][] {{2, 0, 5}, {0, 1, 3}, {1, 3, 7}});
    SolvedProblem solved = solveAndCheck(p);
    assertThat(solved.result().flowValue()).isEqualTo(3);
    assertThat(solved.sourceSide().get(0)).isTrue();
    assertThat(solved.sourceSide().get(1)).isFalse();
  }

  /** A 2D 4-neighbourhood grid problem with pixels 0..w*h-1, source w*h and sink w*h+1. */
  static FlowProblem grid(String name, int w, int h, long[][] arcs) {
    FlowProblem plain = FlowProblem.of(name, w * h + 2, w * h, w * h + 1, arcs);
    return new FlowProblem(
        name,
        plain.nodeCount(),
        plain.source(),
        plain.sink(),
        plain.tails(),
        plain.heads(),
        plain.capacities(),
        new FlowProblem.GridShape(w, h, 1, Neighborhood.N4));
  }

  /** Solves {@code p} and checks the answer against the residual graph, independently. */
  SolvedProblem solveAndCheck(FlowProblem p) {
    SolvedProblem solved = solve(p);
    MaxFlowResult result = solved.result();
    assertThat(result.status()).isEqualTo(SolveStatus.OPTIMAL);
    FlowProblem net = solved.network();
    long[] flows = solved.flows();
    long[] balance = new long[net.nodeCount()];
    for (int i = 0; i < net.arcCount(); i++) {
      assertThat(flows[i]).as("flow on arc %d of %s", i, p).isBetween(0L, net.capacities()[i]);
      if (net.tails()[i] != net.heads()[i]) {
        balance[net.tails()[i]] += flows[i];
        balance[net.heads()[i]] -= flows[i];
      }
    }
    for (int v = 0; v < net.nodeCount(); v++) {
      if (v != net.source() && v != net.sink()) {
        assertThat(balance[v]).as("conservation at node %d of %s", v, p).isZero();
      }
    }
    assertThat(balance[net.source()]).as("value of %s", p).isEqualTo(result.flowValue());
    BitSet reachable = net.residualReachable(flows);
    assertThat(reachable.get(net.sink())).as("sink reachable in %s", p).isFalse();
    long cut = 0;
    for (int i = 0; i < net.arcCount(); i++) {
      if (reachable.get(net.tails()[i]) && !reachable.get(net.heads()[i])) {
        cut += net.capacities()[i];
      }
    }
    assertThat(cut).as("cut capacity of %s", p).isEqualTo(result.flowValue());
    assertThat(solved.sourceSide()).as("source side of %s", p).isEqualTo(reachable);
    return solved;
  }
}
