package io.github.cleave.segment;

/**
 * Sums over an axis-aligned box window ({@code 2rx+1 × 2ry+1 × 2rz+1} voxels, cut at the image
 * borders) at every voxel of a {@code w × h × d} grid, by running sums along one axis at a time
 * (the box is separable). O(n) per call whatever the window, in double precision along each line.
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
    axis(out, 1, w, rx);
    axis(out, w, h, ry);
    axis(out, w * h, d, rz);
    return out;
  }

  /** In place: each value becomes the sum of the values within {@code r} steps along one axis. */
  private void axis(float[] a, int stride, int length, int r) {
    if (r == 0 || length == 1) {
      return;
    }
    double[] line = new double[length + 1]; // prefix sums
    int n = a.length;
    for (int start = 0; start < n; start++) {
      if ((start / stride) % length != 0) {
        continue;
      }
      for (int i = 0; i < length; i++) {
        line[i + 1] = line[i] + a[start + i * stride];
      }
      for (int i = 0; i < length; i++) {
        int lo = Math.max(0, i - r);
        int hi = Math.min(length - 1, i + r);
        a[start + i * stride] = (float) (line[hi + 1] - line[lo]);
      }
    }
  }
}
