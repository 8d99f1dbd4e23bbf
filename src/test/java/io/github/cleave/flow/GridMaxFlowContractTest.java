package io.github.cleave.flow;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.BitSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The max-flow contract, run against the grid solver, built the way a grid-structured DIMACS file
 * is read (through {@link GridArcSink}, which merges parallel arcs).
 */
class GridMaxFlowContractTest extends MaxFlowContractTest {

  static GridMaxFlow build(FlowProblem p) {
    FlowProblem.GridShape s = p.grid();
    GridMaxFlow grid = new GridMaxFlow(s.width(), s.height(), s.depth(), s.neighborhood(), true);
    // DIMACS ids: pixel i is i + 1; the terminals keep ids outside 1..pixels.
    GridArcSink sink = new GridArcSink(grid, p.source() + 1, p.sink() + 1);
    for (int i = 0; i < p.arcCount(); i++) {
      sink.addArc(p.tails()[i] + 1, p.heads()[i] + 1, p.capacities()[i]);
    }
    return grid;
  }

  @Override
  SolvedProblem solve(FlowProblem p) {
    GridMaxFlow grid = build(p);
    MaxFlowResult result = grid.solve();
    assertThat(grid.checkCertificate()).isTrue();
    int n = grid.nodeCount();
    int source = n;
    int sink = n + 1;
    // The network as the solver holds it, with one index per (tail, head) pair.
    List<long[]> arcs = new ArrayList<>();
    Map<Long, Integer> index = new HashMap<>();
    for (int v = 0; v < n; v++) {
      addArc(arcs, index, source, v, grid.sourceCapacity(v));
      addArc(arcs, index, v, sink, grid.sinkCapacity(v));
      for (int k = 0; k < grid.neighborhood().size(); k++) {
        int q = grid.neighbor(v, k);
        if (q >= 0) {
          addArc(arcs, index, v, q, grid.neighborCapacity(v, k));
        }
      }
    }
    long direct = 0;
    for (int i = 0; i < p.arcCount(); i++) {
      if (p.tails()[i] == p.source() && p.heads()[i] == p.sink()) {
        direct += p.capacities()[i];
      }
    }
    addArc(arcs, index, source, sink, direct);
    long[] flows = new long[arcs.size()];
    result.visitArcFlows(
        (from, to, flow) -> {
          int u = from == GridMaxFlow.SOURCE ? source : from;
          int v = to == GridMaxFlow.SINK ? sink : to;
          flows[index.get(key(u, v))] += flow;
        });
    FlowProblem network =
        new FlowProblem(
            p.name() + " as held",
            n + 2,
            source,
            sink,
            arcs.stream().mapToInt(a -> (int) a[0]).toArray(),
            arcs.stream().mapToInt(a -> (int) a[1]).toArray(),
            arcs.stream().mapToLong(a -> a[2]).toArray(),
            p.grid());
    BitSet side = result.sourceSide();
    side.set(source);
    return new SolvedProblem(result, network, flows, side);
  }

  private static void addArc(List<long[]> arcs, Map<Long, Integer> index, int u, int v, long c) {
    index.put(key(u, v), arcs.size());
    arcs.add(new long[] {u, v, c});
  }

  private static long key(int u, int v) {
    return ((long) u << 32) | (v & 0xFFFFFFFFL);
  }

  @Override
  boolean supports(FlowProblem p) {
    return p.isGrid();
  }

  @Test
  void sourceEqualToSinkIsRejected() {
    GridMaxFlow grid = new GridMaxFlow(2, 2, 1, Neighborhood.N4, true);
    assertThatThrownBy(() -> new GridArcSink(grid, 5, 5))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("source and sink are both node 5");
  }

  @Test
  void certificateCatchesATamperedResidual() {
    // The proof of optimality must not be a formality: change one residual after a solve and the
    // check names the broken condition (common practice, no source).
    GridMaxFlow grid =
        build(RandomFlowProblems.grid(new java.util.SplittableRandom(3), Neighborhood.N8, 0));
    grid.solve();
    int a = 0;
    while (grid.search.residual.get(a) == 0 && a < grid.search.residual.length() - 1) {
      a++;
    }
    grid.search.residual.set(a, grid.search.residual.get(a) - 1);
    assertThatThrownBy(grid::checkCertificate).isInstanceOf(CertificateViolation.class);
  }

  @Test
  void arcsThatAreNotGridNeighboursAreRejected() {
    GridMaxFlow grid = new GridMaxFlow(3, 3, 1, Neighborhood.N4, true);
    GridArcSink sink = new GridArcSink(grid, 10, 11);
    assertThatThrownBy(() -> sink.addArc(1, 5, 1))
        .hasMessageContaining("node 1 and node 5 are not 4-neighbours");
  }
}
