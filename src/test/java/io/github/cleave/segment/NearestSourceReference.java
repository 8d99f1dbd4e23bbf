package io.github.cleave.segment;

import java.util.Arrays;

/**
 * {@link NearestSource} as it was before the band's zones were kept in one array (2026-12-03), for
 * {@link EdgeRefinementReference}.
 */
final class NearestSourceReference {
  private NearestSourceReference() {}

  /** The indices of the true entries of {@code set}, ascending. */
  static int[] members(boolean[] set) {
    int count = 0;
    for (boolean b : set) {
      if (b) {
        count++;
      }
    }
    int[] out = new int[count];
    for (int p = 0, i = 0; i < count; p++) {
      if (set[p]) {
        out[i++] = p;
      }
    }
    return out;
  }

  /**
   * For the i-th voxel of {@code bandVoxels}, the nearest voxel with a nonzero {@code source} value
   * reached through the band (breadth-first, axial steps, ties to the one reached first), or -1.
   * The search starts from the source voxels next to the band, in raster order (the others could
   * reach the band only through these), so its cost follows the size of the band, not of the image.
   *
   * @param rank 1 + the position in {@code bandVoxels} of each band voxel, 0 elsewhere
   */
  static int[] search(
      byte[] source, int[] bandVoxels, int[] rank, int w, int h, int d, boolean planes) {
    int count = bandVoxels.length;
    int[] around = new int[6];
    int[] starts = new int[Math.min(source.length, 6 * count)];
    int found = 0;
    for (int p : bandVoxels) {
      for (int q : BoundaryBand.axialNeighbours(p, w, h, d, planes, around)) {
        if (q >= 0 && source[q] != 0) {
          starts[found++] = q;
        }
      }
    }
    Arrays.sort(starts, 0, found);
    int[] queue = new int[found + count];
    int tail = 0;
    for (int i = 0; i < found; i++) {
      if (i == 0 || starts[i] != starts[i - 1]) {
        queue[tail++] = starts[i];
      }
    }
    int[] from = new int[count];
    Arrays.fill(from, -1);
    for (int head = 0; head < tail; head++) {
      int p = queue[head];
      int origin = rank[p] == 0 ? p : from[rank[p] - 1]; // sources lie outside the band
      for (int q : BoundaryBand.axialNeighbours(p, w, h, d, planes, around)) {
        if (q >= 0 && rank[q] != 0 && from[rank[q] - 1] < 0) {
          from[rank[q] - 1] = origin;
          queue[tail++] = q;
        }
      }
    }
    return from;
  }
}
