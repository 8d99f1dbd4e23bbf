package io.github.cleave.segment;

import java.util.Arrays;

/**
 * The nearest source voxel of every voxel of a list, reached through the list's voxels by axial
 * steps: how {@link EdgeRefinement} finds, for each band voxel, the interior voxel whose object
 * level and the ring voxel whose background level it is judged against. Breadth-first from the
 * sources next to the list, in raster order, so ties go to the source reached first; O(m log m) for
 * m list voxels (the sort of the starting sources), independent of the image size. Stateless.
 */
final class NearestSource {
  private NearestSource() {}

  /**
   * For the i-th voxel of {@code bandVoxels}, the nearest voxel of zone {@code sourceZone} reached
   * through the band (breadth-first, axial steps, ties to the one reached first), or -1. The search
   * starts from the source voxels next to the band, in raster order (the others could reach the
   * band only through these), so its cost follows the size of the band, not of the image.
   *
   * @param zone a zone per voxel; the sources lie outside the band
   * @param rank 1 + the position in {@code bandVoxels} of each band voxel, 0 elsewhere
   */
  static int[] search(
      byte[] zone,
      byte sourceZone,
      int[] bandVoxels,
      int[] rank,
      int w,
      int h,
      int d,
      boolean planes) {
    int count = bandVoxels.length;
    int[] around = new int[6];
    int[] starts = new int[Math.min(zone.length, 6 * count)];
    int found = 0;
    for (int p : bandVoxels) {
      for (int q : BoundaryBand.axialNeighbours(p, w, h, d, planes, around)) {
        if (q >= 0 && zone[q] == sourceZone) {
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
