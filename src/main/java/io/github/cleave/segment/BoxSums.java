package io.github.cleave.segment;

/**
 * Sums over an axis-aligned box window ({@code 2rx+1 × 2ry+1 × 2rz+1} voxels, cut at the image
 * borders) at every voxel of a {@code w × h × d} grid, by running sums along one axis at a time
 * (the box is separable). O(n) per call whatever the window. Along x each row is summed in double
 * precision from its own prefix sums; along y and z whole rows are added and subtracted at once (a
 * running sum of rows, in double precision), so that every pass reads memory in order.
 */
final class BoxSums {
  private final int w;
  private final int h;
  private final int d;
  private final int rx;
  private final int ry;
  private final int rz;

  BoxSums(int w, int h, int d, int rx, int ry, int rz) {
    this.w = w;
    this.h = h;
    this.d = d;
    this.rx = rx;
    this.ry = ry;
    this.rz = rz;
  }

  /** The window sums of {@code values}, times {@code weights} voxel by voxel if not null. */
  float[] sum(float[] values, float[] weights) {
    float[] out = new float[values.length];
    for (int p = 0; p < values.length; p++) {
      out[p] = weights == null ? values[p] : values[p] * weights[p];
    }
    alongX(out);
    if (ry > 0 && h > 1) {
      for (int z = 0; z < d; z++) {
        acrossRows(out, z * w * h, w, h, ry);
      }
    }
    if (rz > 0 && d > 1) {
      acrossRows(out, 0, w * h, d, rz);
    }
    return out;
  }

  /** In place: each value becomes the sum of the values within {@code rx} steps along x. */
  private void alongX(float[] a) {
    if (rx == 0 || w == 1) {
      return;
    }
    double[] prefix = new double[w + 1];
    for (int start = 0; start < a.length; start += w) {
      for (int i = 0; i < w; i++) {
        prefix[i + 1] = prefix[i] + a[start + i];
      }
      for (int i = 0; i < w; i++) {
        a[start + i] = (float) (prefix[Math.min(w, i + rx + 1)] - prefix[Math.max(0, i - rx)]);
      }
    }
  }

  /**
   * In place over {@code count} consecutive rows of {@code rowLength} values from {@code start}:
   * each value becomes the sum of the values in the same column of the rows within {@code r} rows.
   * A running sum of rows: the window's sum moves from row to row by adding the row entering it
   * (still original: it lies ahead) and subtracting the row leaving it, whose original values are
   * kept in a ring of {@code r + 1} rows.
   */
  private static void acrossRows(float[] a, int start, int rowLength, int count, int r) {
    float[] ring = new float[(r + 1) * rowLength];
    double[] window = new double[rowLength];
    for (int row = 0; row < Math.min(r, count); row++) {
      add(window, a, start + row * rowLength, 1);
    }
    for (int row = 0; row < count; row++) {
      int base = start + row * rowLength;
      int slot = (row % (r + 1)) * rowLength; // held row - r - 1, which leaves the window now
      int entering = row + r;
      if (entering < count) {
        add(window, a, start + entering * rowLength, 1);
      }
      if (row - r - 1 >= 0) {
        add(window, ring, slot, -1);
      }
      System.arraycopy(a, base, ring, slot, rowLength);
      for (int i = 0; i < rowLength; i++) {
        a[base + i] = (float) window[i];
      }
    }
  }

  private static void add(double[] window, float[] rows, int from, int sign) {
    for (int i = 0; i < window.length; i++) {
      window[i] += sign * rows[from + i];
    }
  }
}
