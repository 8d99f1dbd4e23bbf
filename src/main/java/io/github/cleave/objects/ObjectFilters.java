package io.github.cleave.objects;

import io.github.cleave.image.VoxelSize;

/**
 * Removes objects by size and by contact with the image edge, then renumbers the survivors
 * consecutively in first-voxel order (they keep their relative order). One pass over the voxels to
 * collect, one to rewrite: O(N); none when no limit is set (the labels are returned as they are).
 * Stateless and thread-safe.
 *
 * <p>Size is the calibrated area {@code count·x·y} of a single-plane object (unit²) or the
 * calibrated volume {@code count·x·y·z} of an object in a stack (unit³); limits are inclusive. An
 * object touches the edge when one of its voxels lies in the first or last column or row; in a
 * stack, the first and last plane count only when {@code edgePlanes} is set.
 */
public final class ObjectFilters {
  private ObjectFilters() {}

  /** Applies the size and edge parts of {@code settings}. */
  public static ObjectLabels apply(
      ObjectLabels labels, VoxelSize voxelSize, ObjectSettings settings) {
    return filter(
        labels,
        voxelSize,
        settings.minSize(),
        settings.maxSize(),
        settings.excludeEdges(),
        settings.excludeEdgePlanes());
  }

  /**
   * @param minSize inclusive lower limit in calibrated units; 0 = none
   * @param maxSize inclusive upper limit in calibrated units; 0 or +∞ = none
   * @param excludeEdges drop objects touching an x or y edge
   * @param edgePlanes in a stack, also drop objects touching the first or last plane (needs {@code
   *     excludeEdges})
   */
  public static ObjectLabels filter(
      ObjectLabels labels,
      VoxelSize voxelSize,
      double minSize,
      double maxSize,
      boolean excludeEdges,
      boolean edgePlanes) {
    int w = labels.width();
    int h = labels.height();
    int d = labels.depth();
    double unit = d > 1 ? voxelSize.voxelVolume() : voxelSize.pixelArea();
    boolean noMax = maxSize <= 0 || Double.isInfinite(maxSize);
    if (minSize <= 0 && noMax && !excludeEdges && unit > 0) {
      return labels; // every object is kept: same labels (immutable, so shared)
    }
    int[] raw = labels.raw();
    int count = labels.count();
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
    return ObjectLabels.ordered(w, h, d, out, kept);
  }
}
