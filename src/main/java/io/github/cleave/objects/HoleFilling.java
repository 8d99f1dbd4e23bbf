package io.github.cleave.objects;

/**
 * Fills holes: background regions that are not connected to the image border become foreground.
 *
 * <p>In a single plane ({@code d == 1}) background is 4-connected and the border is the outer row
 * and column of pixels; this is the complement of the 8-connected foreground used by {@link
 * ConnectedComponents}, so a hole is exactly what an 8-connected closed outline encloses. In a
 * stack ({@code d > 1}) background is 6-connected in the volume and the border is all six faces,
 * the first and last plane included: a region open to the top or bottom plane is not a hole (a cell
 * cut by the stack's z range keeps its open side); only cavities closed in 3D are filled. To fill
 * plane by plane instead, call {@link #fill} on each plane with {@code d = 1}.
 *
 * <p>Method: a breadth-first flood of the background from every border voxel; whatever background
 * it does not reach is a hole. O(N) time, one byte and at most one queue entry per voxel. Stateless
 * and thread-safe.
 */
public final class HoleFilling {
  private HoleFilling() {}

  /**
   * A new mask, 255 on the foreground of {@code mask} and on its holes, 0 elsewhere.
   *
   * @throws IllegalArgumentException if the length does not match the dimensions
   */
  public static byte[] fill(byte[] mask, int w, int h, int d) {
    Grids.check(mask.length, w, h, d, "mask");
    int n = mask.length;
    byte[] outside = new byte[n]; // 1 = background reached from the border
    int[] queue = new int[n];
    int tail = 0;
    for (int z = 0; z < d; z++) {
      boolean facePlane = d > 1 && (z == 0 || z == d - 1);
      for (int y = 0; y < h; y++) {
        boolean edgeRow = facePlane || y == 0 || y == h - 1;
        int row = w * (y + h * z);
        for (int x = 0; x < w; x++) {
          // border voxels only: every x on edge rows and face planes, else the first and last
          if (!edgeRow && x != 0 && x != w - 1) {
            x = w - 2; // skip to the last column
            continue;
          }
          int i = row + x;
          if (mask[i] == 0 && outside[i] == 0) {
            outside[i] = 1;
            queue[tail++] = i;
          }
        }
      }
    }
    Grids grid = new Grids(w, h, d, false);
    int[] nb = grid.buffer;
    int head = 0;
    while (head < tail) {
      int p = queue[head++];
      int m = grid.neighbours(p);
      for (int j = 0; j < m; j++) {
        int q = nb[j];
        if (mask[q] == 0 && outside[q] == 0) {
          outside[q] = 1;
          queue[tail++] = q;
        }
      }
    }
    byte[] out = new byte[n];
    for (int i = 0; i < n; i++) {
      if (outside[i] == 0) {
        out[i] = (byte) 255;
      }
    }
    return out;
  }
}
