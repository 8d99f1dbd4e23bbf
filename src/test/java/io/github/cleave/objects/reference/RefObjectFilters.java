package io.github.cleave.objects.reference;

import io.github.cleave.image.VoxelSize;

/**
 * Removes objects by size and by contact with the image edge, then renumbers the survivors
 * consecutively in first-voxel order (they keep their relative order). One pass over the voxels to
 * collect, one to rewrite: O(N). Stateless and thread-safe.
 *
 * <p>Size is the calibrated area {@code count·x·y} of a single-plane object (unit²) or the
 * calibrated volume {@code count·x·y·z} of an object in a stack (unit³); limits are inclusive. An
 * object touches the edge when one of its voxels lies in the first or last column or row; in a
 * stack, the first and last plane count only when {@code edgePlanes} is set.
 */
final class RefObjectFilters {
  private RefObjectFilters() {}

  /** Filtered labels, renumbered; {@code raw} holds labels 0..count in first-voxel order. */
  static int[] filter(
      int[] raw,
      int count,
      int w,
      int h,
      int d,
      VoxelSize voxelSize,
      double minSize,
      double maxSize,
      boolean excludeEdges,
      boolean edgePlanes) {
    long[] voxels = new long[count + 1];
    boolean[] edge = new boolean[count + 1];
    int i = 0;
    for (int z = 0; z < d; z++) {
      boolean edgePlane = d > 1 && edgePlanes && (z == 0 || z == d - 1);
      for (int y = 0; y < h; y++) {
        boolean edgeRow = edgePlane || y == 0 || y == h - 1;
        for (int x = 0; x < w; x++, i++) {
          int l = raw[i];
          voxels[l]++;
          if (edgeRow || x == 0 || x == w - 1) {
            edge[l] = true;
          }
        }
      }
    }
    double unit = d > 1 ? voxelSize.voxelVolume() : voxelSize.pixelArea();
    boolean noMax = maxSize <= 0 || Double.isInfinite(maxSize);
    int[] map = new int[count + 1];
    int kept = 0;
    for (int l = 1; l <= count; l++) {
      double size = voxels[l] * unit;
      boolean keep = size >= minSize && (noMax || size <= maxSize) && !(excludeEdges && edge[l]);
      map[l] = keep ? ++kept : 0;
    }
    int[] out = new int[raw.length];
    for (int j = 0; j < raw.length; j++) {
      out[j] = map[raw[j]];
    }
    return out;
  }
}
