package io.github.cleave.objects;

import java.util.Locale;

/**
 * Index arithmetic and neighbour enumeration on a {@code w × h × d} grid stored row-major ({@code i
 * = x + w·(y + h·z)}). A {@code Grids} instance owns a small buffer that {@link #neighbours(int)}
 * fills: one instance per operation and thread.
 */
final class Grids {
  private final int w;
  private final int h;
  private final int d;
  private final boolean full; // true: 8 (2D) / 26 (3D) neighbours; false: 4 / 6
  final int[] buffer = new int[26]; // neighbour indices written by neighbours()
  private final int[] inner; // offsets of the full neighbourhood, in the order of neighbours()

  Grids(int w, int h, int d, boolean full) {
    this.w = w;
    this.h = h;
    this.d = d;
    this.full = full;
    int[] o = new int[26];
    int m = 0;
    for (int dz = d > 1 ? -1 : 0; dz <= (d > 1 ? 1 : 0); dz++) {
      for (int dy = -1; dy <= 1; dy++) {
        for (int dx = -1; dx <= 1; dx++) {
          if (dx != 0 || dy != 0 || dz != 0) {
            o[m++] = dx + w * (dy + h * dz);
          }
        }
      }
    }
    inner = java.util.Arrays.copyOf(o, m);
  }

  /**
   * Writes the in-image neighbours of voxel {@code i} into {@link #buffer}, in a fixed order (z,
   * then y, then x offsets ascending), and returns their number.
   */
  int neighbours(int i) {
    int x = i % w;
    int r = i / w;
    int y = r % h;
    int z = r / h;
    int n = 0;
    if (!full) { // the axial neighbours, in the same (z, y, x) order as the loops below
      if (z > 0) {
        buffer[n++] = i - w * h;
      }
      if (y > 0) {
        buffer[n++] = i - w;
      }
      if (x > 0) {
        buffer[n++] = i - 1;
      }
      if (x < w - 1) {
        buffer[n++] = i + 1;
      }
      if (y < h - 1) {
        buffer[n++] = i + w;
      }
      if (z < d - 1) {
        buffer[n++] = i + w * h;
      }
      return n;
    }
    if (x > 0 && x < w - 1 && y > 0 && y < h - 1 && (d == 1 || (z > 0 && z < d - 1))) {
      for (int k = 0; k < inner.length; k++) { // away from the border: a fixed table
        buffer[k] = i + inner[k];
      }
      return inner.length;
    }
    int z0 = z > 0 ? -1 : 0;
    int z1 = z < d - 1 ? 1 : 0;
    int y0 = y > 0 ? -1 : 0;
    int y1 = y < h - 1 ? 1 : 0;
    int x0 = x > 0 ? -1 : 0;
    int x1 = x < w - 1 ? 1 : 0;
    for (int dz = z0; dz <= z1; dz++) {
      for (int dy = y0; dy <= y1; dy++) {
        for (int dx = x0; dx <= x1; dx++) {
          int steps = Math.abs(dx) + Math.abs(dy) + Math.abs(dz);
          if (steps == 0 || (!full && steps != 1)) {
            continue;
          }
          buffer[n++] = i + dx + w * (dy + h * dz);
        }
      }
    }
    return n;
  }

  /**
   * @throws IllegalArgumentException if a dimension is not positive or {@code length != w·h·d}
   */
  static void check(int length, int w, int h, int d, String what) {
    if (w < 1 || h < 1 || d < 1 || (long) w * h * d != length) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "%s: %d values for a %d x %d x %d grid; need w*h*d values and positive sizes",
              what,
              length,
              w,
              h,
              d));
    }
  }
}
