package io.github.cleave.energy;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;

/**
 * The boundary capacities of a grid, row by row, every arc of a voxel together, each symmetric pair
 * evaluated once.
 *
 * <p>A direction whose neighbour comes later in raster order (positive index step s) is a forward
 * direction: its pair values are computed for the row, and kept in a ring of s entries (slot {@code
 * p mod s}). The opposite direction of a voxel q reads the pair of {@code q − s}, computed s voxels
 * earlier: from the ring when that voxel lies in an earlier row, read before this row overwrites
 * the slot; from the row's own values when the direction runs along x. A slot is written again only
 * s voxels later, so it still holds the pair when it is read.
 *
 * <p>O(K / 2) table look-ups and O(K) copies per voxel; memory: a ring of s ints per forward
 * direction that crosses rows (up to a plane's worth in 3D) and a few rows. Not thread-safe.
 */
final class ArcRows {
  private final BoundaryArcs.PairCapacities pairs;
  private final Neighborhood nb;
  private final int width;
  private final int height;
  private final int depth;
  private final int directions;
  private final int[][] ring; // per forward direction that crosses rows; null otherwise
  private final int[][] lines; // per forward direction: its values on the present row
  private final int[] x0; // per direction: first x whose neighbour is inside the row range
  private final int[] x1; // per direction: end of that range

  ArcRows(BoundaryArcs.PairCapacities pairs, Raster features, Neighborhood nb) {
    this.pairs = pairs;
    this.nb = nb;
    this.width = features.width();
    this.height = features.height();
    this.depth = features.depth();
    this.directions = nb.size();
    ring = new int[directions][];
    lines = new int[directions][];
    x0 = new int[directions];
    x1 = new int[directions];
    for (int k = 0; k < directions; k++) {
      x0[k] = Math.min(width, Math.max(0, -nb.dx(k)));
      x1[k] = Math.max(x0[k], Math.min(width, width - nb.dx(k)));
      int s = pairs.step(k);
      if (s > 0) {
        lines[k] = new int[width];
        if (nb.dy(k) != 0 || nb.dz(k) != 0) {
          ring[k] = new int[s];
        }
      }
    }
  }

  /**
   * The capacities of every arc leaving row (y, z), interleaved: {@code row[x * K + k]} for the arc
   * from x in direction k, 0 for arcs leaving the grid. Rows must come in raster order, starting
   * with the first.
   */
  void fill(int y, int z, int[] row) {
    int first = width * (y + height * z);
    for (int k = 0; k < directions; k++) { // opposites of ring directions: read before the writes
      int f = k ^ 1;
      if (pairs.step(k) == 0) {
        clearOutside(row, k, width, width); // |dx| ≥ width: every such arc leaves the grid
      } else if (pairs.step(k) < 0 && ring[f] != null) {
        int from = inside(k, y, z) ? x0[k] : width;
        clearOutside(row, k, from, x1[k]);
        copyFromRing(row, k, ring[f], first, from, x1[k]);
      }
    }
    for (int k = 0; k < directions; k++) { // forward directions
      if (pairs.step(k) > 0) {
        int from = inside(k, y, z) ? x0[k] : width;
        int to = Math.max(from, x1[k]);
        clearOutside(row, k, from, to);
        int[] line = lines[k];
        pairs.line(k, first + from, first + to, line);
        for (int x = from, a = from * directions + k; x < to; x++, a += directions) {
          row[a] = line[x - from];
        }
        if (ring[k] != null) {
          toRing(ring[k], line, first, from, to);
        }
      }
    }
    for (int k = 0; k < directions; k++) { // opposites of directions along x: this row's values
      int f = k ^ 1;
      if (pairs.step(k) < 0 && ring[f] == null) {
        int from = x0[k];
        int to = x1[k];
        clearOutside(row, k, from, to);
        int[] line = lines[f]; // line[i] is the pair of voxel x0[f] + i and its neighbour
        int shift = nb.dx(k) - x0[f]; // voxel x pairs with x + dx(k)
        for (int x = from, a = from * directions + k; x < to; x++, a += directions) {
          row[a] = line[x + shift];
        }
      }
    }
  }

  /** Whether row (y, z) has its neighbour row in direction k inside the grid. */
  private boolean inside(int k, int y, int z) {
    int qy = y + nb.dy(k);
    int qz = z + nb.dz(k);
    return qy >= 0 && qy < height && qz >= 0 && qz < depth;
  }

  /** Zeroes the entries of direction k outside x in [from, to). */
  private void clearOutside(int[] row, int k, int from, int to) {
    for (int x = 0; x < Math.min(from, width); x++) {
      row[x * directions + k] = 0;
    }
    for (int x = Math.max(from, to); x < width; x++) {
      row[x * directions + k] = 0;
    }
  }

  /** Stores the values of voxels {@code first + x}, x in [from, to), at slots (voxel mod s). */
  private static void toRing(int[] ring, int[] line, int first, int from, int to) {
    int s = ring.length;
    int slot = (first + from) % s;
    for (int x = from; x < to; x++) {
      ring[slot] = line[x - from];
      if (++slot == s) {
        slot = 0;
      }
    }
  }

  /**
   * Writes into direction k, for x in [from, to), the pair of voxel {@code first + x − s} kept at
   * slot {@code (first + x − s) mod s = (first + x) mod s}.
   */
  private void copyFromRing(int[] row, int k, int[] ring, int first, int from, int to) {
    int s = ring.length;
    int slot = (first + from) % s;
    for (int x = from, a = from * directions + k; x < to; x++, a += directions) {
      row[a] = ring[slot];
      if (++slot == s) {
        slot = 0;
      }
    }
  }
}
