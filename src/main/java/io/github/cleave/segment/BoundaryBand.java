package io.github.cleave.segment;

/**
 * Clears the labels of the voxels within a given number of steps of a mask's boundary, steps
 * counted along the axes (city-block distance); a boundary voxel is one with an axial neighbour of
 * the other class. O(n · width) time, no recursion.
 */
final class BoundaryBand {
  private BoundaryBand() {}

  static void clear(byte[] labels, byte[] mask, int w, int h, int d, int width) {
    int n = mask.length;
    int[] front = new int[n];
    int frontSize = 0;
    boolean[] inBand = new boolean[n];
    for (int p = 0; p < n; p++) {
      if (isBoundary(mask, p, w, h, d)) {
        inBand[p] = true;
        front[frontSize++] = p;
      }
    }
    int[] next = new int[n];
    for (int step = 1; step < width && frontSize > 0; step++) {
      int nextSize = 0;
      for (int i = 0; i < frontSize; i++) {
        int p = front[i];
        int x = p % w;
        int y = p / w % h;
        int z = p / (w * h);
        int[] neighbours = {
          x > 0 ? p - 1 : -1,
          x < w - 1 ? p + 1 : -1,
          y > 0 ? p - w : -1,
          y < h - 1 ? p + w : -1,
          z > 0 ? p - w * h : -1,
          z < d - 1 ? p + w * h : -1
        };
        for (int q : neighbours) {
          if (q >= 0 && !inBand[q]) {
            inBand[q] = true;
            next[nextSize++] = q;
          }
        }
      }
      int[] t = front;
      front = next;
      next = t;
      frontSize = nextSize;
    }
    for (int p = 0; p < n; p++) {
      if (inBand[p]) {
        labels[p] = 0;
      }
    }
  }

  private static boolean isBoundary(byte[] mask, int p, int w, int h, int d) {
    boolean fg = mask[p] != 0;
    int x = p % w;
    int y = p / w % h;
    int z = p / (w * h);
    return x > 0 && (mask[p - 1] != 0) != fg
        || x < w - 1 && (mask[p + 1] != 0) != fg
        || y > 0 && (mask[p - w] != 0) != fg
        || y < h - 1 && (mask[p + w] != 0) != fg
        || z > 0 && (mask[p - w * h] != 0) != fg
        || z < d - 1 && (mask[p + w * h] != 0) != fg;
  }
}
