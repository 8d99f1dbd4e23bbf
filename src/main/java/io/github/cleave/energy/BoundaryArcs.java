package io.github.cleave.energy;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;
import java.util.Arrays;

/**
 * Fills the neighbour arcs of a grid solver with the contrast-sensitive boundary term {@code λ ·
 * w_k · exp(−‖I_p − I_q‖² / 2σ²)}, quantised by {@link CapacityScale}; the weight is symmetric, so
 * each unordered pair is computed once and stored for both directions. A pair with a non-finite
 * feature value gets weight 0.
 *
 * <p>Every capacity is that of {@link #capacity(double, double)} applied to {@code ‖I_p − I_q‖² ·
 * (1 / 2σ²)}, the squared difference summed over the channels in channel order; only the way it is
 * evaluated depends on the image, never the value:
 *
 * <ul>
 *   <li>one channel of whole numbers (8- and 16-bit images): a table indexed by {@code |I_p −
 *       I_q|}, filled with the formula itself up to the first difference whose capacity is 0;
 *   <li>otherwise: the exact step function of {@link ExponentialSteps};
 *   <li>the formula directly where a table would cost more than it saves (small images, huge
 *       weights).
 * </ul>
 *
 * <p>The solver is filled row by row, one direction of each opposite pair at a time: the row's pair
 * values are computed into one buffer and stored for both arcs at once ({@code
 * GridMaxFlow.setSymmetricRowCapacities}), while the two rows they touch are in cache. O(n · K / 2)
 * table look-ups for n voxels and K neighbours, plus the tables (a few thousand exponentials,
 * shared by directions of equal weight) and one buffer of a row.
 */
final class BoundaryArcs {
  private BoundaryArcs() {}

  /**
   * Sets every neighbour arc of {@code solver} (a new one: arcs leaving the grid are left as they
   * are) and returns an upper bound of the sum of the capacities of the arcs leaving one voxel
   * ({@link PairCapacities#largestSum()}).
   */
  static int set(GridMaxFlow solver, Raster features, EnergyParameters parameters) {
    return set(solver, features, parameters, features.size() / 4);
  }

  /**
   * As {@link #set(GridMaxFlow, Raster, EnergyParameters)}, with a table allowed to cost at most
   * {@code budget} exponentials per direction (the default, a quarter of the voxels, keeps tables
   * from costing more than they save; tests vary it to reach every path).
   */
  static int set(GridMaxFlow solver, Raster features, EnergyParameters parameters, int budget) {
    PairCapacities pairs = new PairCapacities(features, parameters, budget);
    Neighborhood nb = parameters.neighborhood();
    int width = features.width();
    int height = features.height();
    int depth = features.depth();
    int[] line = new int[width];
    for (int z = 0; z < depth; z++) {
      for (int y = 0; y < height; y++) {
        int first = width * (y + height * z);
        for (int k = 0; k < nb.size(); k += 2) { // one direction of each opposite pair
          int qy = y + nb.dy(k);
          int qz = z + nb.dz(k);
          int x0 = Math.max(0, -nb.dx(k));
          int x1 = Math.min(width, width - nb.dx(k));
          if (qy >= 0 && qy < height && qz >= 0 && qz < depth && x0 < x1) {
            pairs.line(k, first + x0, first + x1, line, 0);
            solver.setSymmetricRowCapacities(y, z, k, x0, x1 - x0, line);
          }
        }
      }
    }
    return pairs.largestSum();
  }

  /**
   * The capacities of single pairs, equal to those {@link #set} stores, for graphs over part of a
   * grid: {@code between(p, k)} is the capacity between voxel {@code p} and its neighbour in
   * direction {@code k}, which the caller guarantees to lie inside the grid. Built in O(n) (a check
   * for whole numbers) plus the tables; O(channels) per pair. Immutable.
   */
  static final class PairCapacities {
    private final float[][] channels;
    private final float[]
        grey; // the one channel, of whole numbers, when a table by difference applies
    private final Object[] tables; // per direction: int[] by difference, steps, or null
    private final double[] scales; // per direction, for the formula
    private final int[] steps; // per direction: index offset of the neighbour
    private final double inverseTwoSigmaSquared;

    PairCapacities(Raster features, EnergyParameters parameters) {
      this(features, parameters, features.size() / 4);
    }

    /** With tables allowed to cost at most {@code budget} exponentials per direction. */
    PairCapacities(Raster features, EnergyParameters parameters, int budget) {
      Neighborhood nb = parameters.neighborhood();
      double sigma = parameters.contrastScale();
      inverseTwoSigmaSquared = 1.0 / (2 * sigma * sigma);
      channels = new float[features.channelCount()][];
      for (int c = 0; c < channels.length; c++) {
        channels[c] = features.channel(c);
      }
      int greyRange = channels.length == 1 ? features.wholeNumberRange(0) : -1;
      tables = new Object[nb.size()];
      scales = new double[nb.size()];
      steps = new int[nb.size()];
      boolean byDifference = false;
      for (int k = 0; k < nb.size(); k += 2) {
        double scale =
            parameters.boundaryPenalty()
                * parameters.lengthWeights()[k]
                * CapacityScale.UNITS_PER_NAT;
        Object table =
            k > 0 && scale == scales[k - 2]
                ? tables[k - 2]
                : table(scale, inverseTwoSigmaSquared, greyRange, budget);
        byDifference |= table instanceof int[];
        for (int j = k; j <= k + 1; j++) {
          tables[j] = table;
          scales[j] = scale;
          steps[j] = nb.dx(j) + features.width() * (nb.dy(j) + features.height() * nb.dz(j));
        }
      }
      grey = byDifference ? channels[0] : null;
    }

    int between(int p, int k) {
      int q = p + steps[k];
      Object table = tables[k];
      if (table instanceof int[] differences) {
        int d = Math.abs((int) grey[p] - (int) grey[q]);
        return d < differences.length ? differences[d] : 0;
      }
      double exponent = ContrastScale.squaredDifference(channels, p, q) * inverseTwoSigmaSquared;
      return table instanceof ExponentialSteps s
          ? s.capacity(exponent)
          : capacity(scales[k], exponent);
    }

    /**
     * {@code out[at + p − from] = between(p, k)} for p from {@code from} to {@code to}, every
     * neighbour inside the grid.
     */
    void line(int k, int from, int to, int[] out, int at) {
      int step = steps[k];
      Object table = tables[k];
      if (table instanceof int[] differences) {
        greyLine(grey, differences, from, to, step, out, at - from);
      } else if (table instanceof ExponentialSteps s) {
        for (int p = from; p < to; p++) {
          double sq = ContrastScale.squaredDifference(channels, p, p + step);
          out[p - from + at] = s.capacity(sq * inverseTwoSigmaSquared);
        }
      } else {
        double scale = scales[k];
        for (int p = from; p < to; p++) {
          double sq = ContrastScale.squaredDifference(channels, p, p + step);
          out[p - from + at] = capacity(scale, sq * inverseTwoSigmaSquared);
        }
      }
    }

    /** Index offset of the neighbour in direction k. */
    int step(int k) {
      return steps[k];
    }

    /**
     * {@code Σ_k capacity(scale_k, 0)} over every direction: the capacities of a voxel whose
     * neighbours all equal it, which bounds the sum of the capacities of the arcs leaving any voxel
     * from above (a capacity never rises with the difference).
     */
    int largestSum() {
      int sum = 0;
      for (double scale : scales) {
        sum += capacity(scale, 0);
      }
      return sum;
    }
  }

  /**
   * The boundary capacity of a pair whose exponent {@code ‖ΔI‖² / 2σ²} is {@code exponent}: the
   * reference formula that every faster path reproduces exactly.
   */
  static int capacity(double scale, double exponent) {
    double value = scale * Math.exp(-exponent);
    return value >= 0 ? (int) Math.min(Integer.MAX_VALUE / 64, Math.rint(value)) : 0;
  }

  /**
   * {@code out[p + shift] = table[|v[p] − v[p + step]|]} (0 beyond the table) for p in [from, to),
   * on whole-number values.
   */
  private static void greyLine(
      float[] v, int[] table, int from, int to, int step, int[] out, int shift) {
    int length = table.length;
    for (int p = from; p < to; p++) {
      int diff = Math.abs((int) v[p] - (int) v[p + step]);
      out[p + shift] = diff < length ? table[diff] : 0;
    }
  }

  /** An int[] by absolute difference, an {@link ExponentialSteps}, or null for the formula. */
  private static Object table(
      double scale, double inverseTwoSigmaSquared, int greyRange, int budget) {
    if (greyRange >= 0) {
      int[] table = differenceTable(scale, inverseTwoSigmaSquared, greyRange, budget);
      if (table != null) {
        return table;
      }
    }
    return ExponentialSteps.of(scale, Math.min(budget / 12, ExponentialSteps.MAX_STEPS));
  }

  /**
   * {@code table[d] = capacity(scale, d² / 2σ²)} for d from 0 up to {@code range} or to the first
   * 0, whichever comes first (the capacity never rises again: see {@link ExponentialSteps}); null
   * if that would take more than {@code budget} entries.
   */
  private static int[] differenceTable(
      double scale, double inverseTwoSigmaSquared, int range, int budget) {
    int[] table = new int[Math.min(range, budget) + 1];
    for (int d = 0; d < table.length; d++) {
      double diff = d;
      int cap = capacity(scale, diff * diff * inverseTwoSigmaSquared);
      table[d] = cap;
      if (cap == 0) {
        return Arrays.copyOf(table, d + 1);
      }
    }
    return table.length == range + 1 ? table : null;
  }
}
