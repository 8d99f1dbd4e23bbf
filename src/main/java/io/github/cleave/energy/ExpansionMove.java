package io.github.cleave.energy;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.SolveStatus;
import java.util.BitSet;

/**
 * One alpha-expansion move of a {@link PottsEnergy} as a grid minimum cut: every voxel keeps its
 * label ({@code x_p = 0}, sink side) or takes class α ({@code x_p = 1}, source side), and the cut
 * finds the best such change (Y. Boykov, O. Veksler and R. Zabih, "Fast approximate energy
 * minimization via graph cuts", IEEE TPAMI 23(11):1222–1239, 2001, doi:10.1109/34.969114).
 *
 * <h2>Graph</h2>
 *
 * A free voxel p with label {@code l_p ≠ α} gets {@code source → p = D_p(l_p)} (paid when it keeps
 * its label) and {@code p → sink = D_p(α)} (paid when it takes α); a seed of another class gets
 * {@code p → sink = K}, the hard capacity of {@link PottsEnergy}, larger than anything moving one
 * voxel could save, so it never takes α. A voxel already labelled α, seed or not, is the same
 * either way: its regional term {@code D_p(α)} is a constant and it has no arcs.
 *
 * <p>Each neighbour pair's move term {@code E(x_p, x_q)} has {@code E(0,0) = B[l_p ≠ l_q]}, {@code
 * E(0,1) = B[l_p ≠ α]}, {@code E(1,0) = B[α ≠ l_q]}, {@code E(1,1) = 0}; it is submodular and is
 * represented by terminal arcs and two directed arcs as V. Kolmogorov and R. Zabih, "What energy
 * functions can be minimized via graph cuts?", IEEE TPAMI 26(2):147–159, 2004,
 * doi:10.1109/TPAMI.2004.1262177, construct it, with the constant of every pair zero:
 *
 * <ul>
 *   <li>{@code l_p = l_q ≠ α}: arcs {@code B} both ways, no terminal term (the two-class graph);
 *   <li>{@code l_p ≠ l_q}, both ≠ α: {@code E = B · (1 − x_p x_q)}, split as arcs {@code c_pq} and
 *       {@code c_qp} with {@code c_pq + c_qp = B} (half each, the odd unit on the arc in the odd
 *       direction) and {@code source → p += c_pq}, {@code source → q += c_qp};
 *   <li>{@code l_q = α ≠ l_p}: {@code E = B · (1 − x_p)}, i.e. {@code source → p += B}, no arc;
 *   <li>both α: nothing.
 * </ul>
 *
 * The common part of a voxel's two terminal arcs goes to the constant. Hence, exactly, {@code E(new
 * labelling) = flow value + constant}: the flow proves the move optimal (max-flow min-cut theorem)
 * and certifies the energy reached.
 *
 * <p>Cost: O(n · K_nb) to build into a new {@link GridMaxFlow} (row by row, the bulk setters), plus
 * the solve. Exact while no terminal capacity exceeds {@code Integer.MAX_VALUE} (regional costs of
 * a likelihood model are at most 30 nats, 7680 units). Stateless; not for concurrent use of one
 * labelling array.
 */
final class ExpansionMove {
  private ExpansionMove() {}

  /**
   * The result of one move.
   *
   * @param labels the best labelling within one expansion of α (a new array)
   * @param energy its energy, {@code flowValue + constant} (only a bound if interrupted)
   * @param flowValue the maximum flow of the move's graph
   * @param constant the part of the energy that no cut of the graph changes
   * @param status OPTIMAL, or INTERRUPTED when the thread was interrupted
   * @param buildMs time to build the graph
   * @param solveMs time of the solve
   */
  record Result(
      byte[] labels,
      long energy,
      long flowValue,
      long constant,
      SolveStatus status,
      double buildMs,
      double solveMs) {}

  /**
   * Builds and solves the expansion move of class {@code alpha} from {@code labels} (which must
   * hold the seeds; not modified).
   */
  static Result solve(PottsEnergy energy, byte[] labels, int alpha) {
    return solve(energy, labels, alpha, new int[labels.length], new int[labels.length]);
  }

  /**
   * As {@link #solve(PottsEnergy, byte[], int)}, with the terminal capacities written into {@code
   * source} and {@code sink} (n entries each, overwritten), so that runs of moves allocate them
   * once.
   */
  static Result solve(PottsEnergy energy, byte[] labels, int alpha, int[] source, int[] sink) {
    long start = System.nanoTime();
    PottsPairs g = energy.pairs();
    int width = g.width;
    int directions = g.directions;
    int[] x0 = new int[directions];
    int[] x1 = new int[directions];
    for (int k = 0; k < directions; k++) {
      x0[k] = g.firstX(k);
      x1[k] = g.endX(k);
    }
    boolean[] rowOk = new boolean[directions];
    int[] step = g.step;
    int[][] weight = g.weight;
    int[][] regional = energy.regional();
    int[] toAlpha = regional[alpha - 1];
    byte[] seeds = energy.seeds();
    long hard = energy.hardCapacity();
    byte a = (byte) alpha;

    GridMaxFlow solver = new GridMaxFlow(width, g.height, g.depth, g.neighborhood);
    int[] row = new int[width * directions];
    long constant = 0;
    for (int z = 0; z < g.depth; z++) {
      for (int y = 0; y < g.height; y++) {
        for (int k = 0; k < directions; k++) {
          rowOk[k] = g.rowInside(k, y, z);
        }
        int first = width * (y + g.height * z);
        for (int x = 0, p = first, base = 0; x < width; x++, p++, base += directions) {
          byte lp = labels[p];
          if (lp == a) {
            for (int k = 0; k < directions; k++) {
              row[base + k] = 0;
            }
            constant += toAlpha[p]; // 0 at seeds
            source[p] = 0;
            sink[p] = 0;
            continue;
          }
          long src = regional[(lp & 0xff) - 1][p];
          for (int k = 0; k < directions; k++) {
            int cap = 0;
            if (rowOk[k] && x >= x0[k] && x < x1[k]) {
              int q = p + step[k];
              int b = (k & 1) == 0 ? weight[k >> 1][p] : weight[k >> 1][q];
              byte lq = labels[q];
              if (lq == a) {
                src += b;
              } else if (lq == lp) {
                cap = b;
              } else {
                cap = (k & 1) == 0 ? b >> 1 : b - (b >> 1);
                src += cap;
              }
            }
            row[base + k] = cap;
          }
          long snk = seeds[p] != 0 ? hard : toAlpha[p];
          long common = Math.min(src, snk);
          constant += common;
          source[p] = (int) Math.min(Integer.MAX_VALUE, src - common);
          sink[p] = (int) Math.min(Integer.MAX_VALUE, snk - common);
        }
        solver.setRowNeighborCapacities(y, z, row);
      }
    }
    solver.setTerminalCapacities(source, sink);
    double buildMs = (System.nanoTime() - start) / 1e6;

    MaxFlowResult result = solver.solve();
    byte[] next = labels.clone();
    BitSet takes = result.sourceSide();
    for (int p = takes.nextSetBit(0); p >= 0; p = takes.nextSetBit(p + 1)) {
      next[p] = a;
    }
    return new Result(
        next,
        result.flowValue() + constant,
        result.flowValue(),
        constant,
        result.status(),
        buildMs,
        result.solveNanos() / 1e6);
  }
}
