package io.github.cleave.energy;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.Locale;

/**
 * The energy of {@link CutProblem} when most voxels have fixed labels: a graph over the free voxels
 * only, for re-deciding a thin band around a finished cut.
 *
 * <p>Fixed voxels leave the graph; the boundary term between a free voxel {@code p} and a fixed
 * neighbour {@code q} becomes a terminal capacity of {@code p}: {@code B_pq} more on {@code source
 * → p} when {@code q} is fixed foreground (calling {@code p} background would pay it), on {@code p
 * → sink} when {@code q} is fixed background (V. Kolmogorov and R. Zabih, "What energy functions
 * can be minimized via graph cuts?", IEEE TPAMI 26(2), 2004, doi:10.1109/TPAMI.2004.1262177: a pair
 * term with one label known is a unary term). Boundary capacities are those of {@link CutProblem},
 * evaluated pair by pair by the same tables, and regional costs are quantised by {@link
 * CapacityScale} alike. So the energy of every labelling of the free voxels equals that of {@link
 * CutProblem} with the fixed voxels as hard seeds, less a constant (the boundary between fixed
 * voxels), and the minimal source set is the same: {@link #mask} returns the same mask.
 *
 * <p>Cost: O(n) to list the free voxels, O(f · K) for f free voxels and K neighbours to build, and
 * a solve whose search stays among the free voxels. Memory: the grid solver (sized for the whole
 * grid) plus {@code f · K} ints while building. Not thread-safe.
 */
public final class FixedLabelCut {
  private final GridMaxFlow solver;
  private final byte[] fixed;

  private FixedLabelCut(GridMaxFlow solver, byte[] fixed) {
    this.solver = solver;
    this.fixed = fixed;
  }

  /**
   * Builds the graph of the free voxels.
   *
   * @param features the values the boundary term compares (the driving channels)
   * @param foregroundCost {@code D_p(fg)} in nats per voxel, finite and ≥ 0 where free
   * @param backgroundCost {@code D_p(bg)} in nats per voxel, finite and ≥ 0 where free
   * @param labels {@link SeedLabels#FOREGROUND} or {@link SeedLabels#BACKGROUND} where fixed, 0
   *     where free
   * @throws IllegalArgumentException if sizes differ or the neighbourhood does not fit the image
   */
  public static FixedLabelCut build(
      Raster features,
      float[] foregroundCost,
      float[] backgroundCost,
      SeedLabels labels,
      EnergyParameters parameters) {
    int n = features.size();
    if (foregroundCost.length != n || backgroundCost.length != n || labels.size() != n) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "energy: %d voxels, %d and %d regional costs, %d labels",
              n,
              foregroundCost.length,
              backgroundCost.length,
              labels.size()));
    }
    Neighborhood nb = parameters.neighborhood();
    CutProblem.checkFits(features, nb);
    int w = features.width();
    int h = features.height();
    int d = features.depth();
    int directions = nb.size();
    byte[] fixed = labels.labels();
    int free = 0;
    for (byte label : fixed) {
      if (label != SeedLabels.FOREGROUND && label != SeedLabels.BACKGROUND) {
        free++;
      }
    }
    int[] nodes = new int[free];
    int[] caps = new int[free * directions];
    int[] source = new int[free];
    int[] sink = new int[free];
    BoundaryArcs.PairCapacities pairs = new BoundaryArcs.PairCapacities(features, parameters);
    int i = 0;
    for (int p = 0; p < n; p++) {
      if (fixed[p] == SeedLabels.FOREGROUND || fixed[p] == SeedLabels.BACKGROUND) {
        continue;
      }
      int x = p % w;
      int y = p / w % h;
      int z = p / (w * h);
      long toSource = CapacityScale.toCapacity(backgroundCost[p]);
      long toSink = CapacityScale.toCapacity(foregroundCost[p]);
      for (int k = 0; k < directions; k++) {
        int qx = x + nb.dx(k);
        int qy = y + nb.dy(k);
        int qz = z + nb.dz(k);
        if (qx < 0 || qx >= w || qy < 0 || qy >= h || qz < 0 || qz >= d) {
          continue;
        }
        int q = qx + w * (qy + h * qz);
        int cap = pairs.between(p, k);
        if (fixed[q] == SeedLabels.FOREGROUND) {
          toSource += cap;
        } else if (fixed[q] == SeedLabels.BACKGROUND) {
          toSink += cap;
        } else {
          caps[i * directions + k] = cap;
        }
      }
      source[i] = (int) Math.min(Integer.MAX_VALUE, toSource);
      sink[i] = (int) Math.min(Integer.MAX_VALUE, toSink);
      nodes[i++] = p;
    }
    GridMaxFlow solver = new GridMaxFlow(w, h, d, nb);
    solver.setNeighborCapacitiesOf(nodes, free, caps);
    solver.setTerminalCapacitiesOf(nodes, free, source, sink);
    return new FixedLabelCut(solver, fixed);
  }

  /** Solves the cut of the free voxels. */
  public MaxFlowResult solve() {
    return solver.solve();
  }

  /**
   * The foreground mask: 255 for fixed foreground and for free voxels on the source side of the
   * cut, 0 elsewhere.
   */
  public byte[] mask(MaxFlowResult result) {
    byte[] mask = CutProblem.mask(result);
    for (int p = 0; p < mask.length; p++) {
      if (fixed[p] == SeedLabels.FOREGROUND) {
        mask[p] = (byte) 255;
      } else if (fixed[p] == SeedLabels.BACKGROUND) {
        mask[p] = 0;
      }
    }
    return mask;
  }
}
