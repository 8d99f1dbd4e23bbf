package io.github.cleave.energy;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;

/**
 * The boundary weights {@code B_pq} of every neighbour pair of a grid, kept for many cuts over the
 * same image: one int per pair, the very capacities that {@link CutProblem} puts on its neighbour
 * arcs (computed by {@link BoundaryArcs.PairCapacities}, row by row).
 *
 * <p>Layout: {@code weight[h][p]} is {@code B} between voxel {@code p} and its neighbour in
 * direction {@code k = 2h} ({@code p + step[2h]}), 0 where that neighbour lies outside the grid;
 * the pair seen from the other end, direction {@code 2h + 1}, is read at the neighbour. Directions
 * come in opposite pairs {@code (k, k ^ 1)} (see {@link Neighborhood}), so this holds each
 * unordered pair exactly once: {@code n · K / 2} ints for n voxels and K neighbours.
 *
 * <p>Built in O(n · K) plus the tables of {@link BoundaryArcs.PairCapacities}. Immutable after
 * construction; safe to read from several threads.
 */
final class PottsPairs {
  final int width;
  final int height;
  final int depth;
  final Neighborhood neighborhood;
  final int directions; // K
  final int[] step; // step[k]: index offset of the neighbour in direction k
  final int[][] weight; // weight[h][p] = B(p, p + step[2h]) >= 0; 0 where outside the grid
  final int largestSum; // >= the sum of B_pq over the neighbours q of any voxel p

  private PottsPairs(Raster features, EnergyParameters parameters) {
    this.width = features.width();
    this.height = features.height();
    this.depth = features.depth();
    this.neighborhood = parameters.neighborhood();
    this.directions = neighborhood.size();
    this.step = new int[directions];
    for (int k = 0; k < directions; k++) {
      step[k] = neighborhood.dx(k) + width * (neighborhood.dy(k) + height * neighborhood.dz(k));
    }
    this.weight = new int[directions / 2][features.size()];
    this.largestSum = fill(features, parameters);
  }

  /** The weights of every pair of {@code features} under {@code parameters}. */
  static PottsPairs of(Raster features, EnergyParameters parameters) {
    return new PottsPairs(features, parameters);
  }

  /**
   * Fills {@link #weight} row by row; returns an upper bound of the sum of the weights around one
   * voxel ({@link BoundaryArcs.PairCapacities#largestSum()}).
   */
  private int fill(Raster features, EnergyParameters parameters) {
    BoundaryArcs.PairCapacities pairs = new BoundaryArcs.PairCapacities(features, parameters);
    for (int h = 0; h < weight.length; h++) {
      int k = 2 * h;
      int x0 = firstX(k);
      int x1 = endX(k);
      for (int z = 0; z < depth; z++) {
        for (int y = 0; y < height; y++) {
          if (rowInside(k, y, z) && x0 < x1) {
            int first = width * (y + height * z);
            pairs.line(k, first + x0, first + x1, weight[h], first + x0);
          }
        }
      }
    }
    return pairs.largestSum();
  }

  /** First x whose neighbour in direction k has an x inside the grid. */
  int firstX(int k) {
    return Math.min(width, Math.max(0, -neighborhood.dx(k)));
  }

  /** One past the last x whose neighbour in direction k has an x inside the grid. */
  int endX(int k) {
    return Math.max(firstX(k), Math.min(width, width - neighborhood.dx(k)));
  }

  /** Whether row (y, z) has its neighbour row in direction k inside the grid. */
  boolean rowInside(int k, int y, int z) {
    int qy = y + neighborhood.dy(k);
    int qz = z + neighborhood.dz(k);
    return qy >= 0 && qy < height && qz >= 0 && qz < depth;
  }

  /**
   * {@code Σ B_pq [labels[p] ≠ labels[q]]} over every unordered neighbour pair, in capacity units.
   * O(n · K / 2).
   */
  long boundaryEnergy(byte[] labels) {
    long e = 0;
    for (int h = 0; h < weight.length; h++) {
      int k = 2 * h;
      int s = step[k];
      int[] w = weight[h];
      int x0 = firstX(k);
      int x1 = endX(k);
      for (int z = 0; z < depth; z++) {
        for (int y = 0; y < height; y++) {
          if (!rowInside(k, y, z)) {
            continue;
          }
          int first = width * (y + height * z);
          for (int p = first + x0; p < first + x1; p++) {
            if (labels[p] != labels[p + s]) {
              e += w[p];
            }
          }
        }
      }
    }
    return e;
  }
}
