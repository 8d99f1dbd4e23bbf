package io.github.cleave.objects;

/**
 * Exact squared Euclidean distance transform of a binary grid, in calibrated units, for anisotropic
 * pixel and voxel sizes.
 *
 * <p>P. F. Felzenszwalb and D. P. Huttenlocher, "Distance transforms of sampled functions", Theory
 * of Computing 8(19):415–428, 2012, doi:10.4086/toc.2012.v008a019: the squared distance is
 * separable, so one 1D lower-envelope-of-parabolas pass along x, then y, then z gives the exact
 * result; a pass along an axis with spacing {@code s} places sample {@code q} at {@code q·s}. Only
 * lines holding foreground are transformed (the others are 0 throughout). O(N) time per pass,
 * O(max(w, h, d)) extra memory besides the map and one flag per line.
 *
 * <p>Voxels outside the image are not background (ImageJ's EDM does the same), so an object cut by
 * the image edge is not split at the edge. Where no background exists at all the distance is {@link
 * Float#POSITIVE_INFINITY}.
 */
final class DistanceMap {
  private DistanceMap() {}

  /** Distance from every foreground voxel of {@code mask} to the nearest background voxel. */
  static float[] distance(byte[] mask, int w, int h, int d, double sx, double sy, double sz) {
    int n = mask.length;
    double[] f = new double[n]; // squared distances, +inf where not yet reached
    boolean[] rowHas = new boolean[h * d]; // lines holding foreground, by axis
    boolean[] columnHas = new boolean[w * d]; // x + w·z
    boolean[] pillarHas = new boolean[w * h]; // x + w·y
    for (int z = 0, i = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++, i++) {
          if (mask[i] != 0) {
            f[i] = Double.POSITIVE_INFINITY;
            rowHas[y + h * z] = true;
            columnHas[x + w * z] = true;
            pillarHas[x + w * y] = true;
          }
        }
      }
    }
    // a line without foreground is 0 throughout and stays so: only lines with foreground are done
    Line line = new Line(Math.max(w, Math.max(h, d)));
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        if (rowHas[y + h * z]) {
          line.transform(f, w * (y + h * z), 1, w, sx);
        }
      }
    }
    for (int z = 0; z < d; z++) {
      for (int x = 0; x < w; x++) {
        if (columnHas[x + w * z]) {
          line.transform(f, x + w * h * z, w, h, sy);
        }
      }
    }
    if (d > 1) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          if (pillarHas[x + w * y]) {
            line.transform(f, x + w * y, w * h, d, sz);
          }
        }
      }
    }
    float[] out = new float[n];
    for (int i = 0; i < n; i++) {
      if (mask[i] != 0) { // background stays 0
        out[i] = (float) Math.sqrt(f[i]);
      }
    }
    return out;
  }

  /** Buffers for the 1D transform of one line. */
  private static final class Line {
    private final double[] values; // the line's input values
    private final int[] vertex; // sample positions of the parabolas in the lower envelope
    private final double[] bound; // bound[k]..bound[k+1]: where parabola k is lowest

    Line(int length) {
      values = new double[length];
      vertex = new int[length];
      bound = new double[length + 1];
    }

    /** Transforms {@code f[start + j·stride]}, {@code j < length}, in place. */
    void transform(double[] f, int start, int stride, int length, double s) {
      boolean allBackground = true;
      for (int q = 0, i = start; q < length && allBackground; q++, i += stride) {
        allBackground = f[i] == 0;
      }
      if (allBackground) {
        return; // distance 0 everywhere: nothing to do (most lines of a sparse mask)
      }
      int k = -1;
      for (int q = 0; q < length; q++) {
        double fq = f[start + q * stride];
        values[q] = fq;
        if (fq == Double.POSITIVE_INFINITY) {
          continue; // no parabola: nothing reached this sample yet
        }
        if (k < 0) {
          k = 0;
          vertex[0] = q;
          bound[0] = Double.NEGATIVE_INFINITY;
          bound[1] = Double.POSITIVE_INFINITY;
          continue;
        }
        double cut = intersection(q, vertex[k], s);
        while (cut <= bound[k]) {
          k--;
          cut = intersection(q, vertex[k], s);
        }
        k++;
        vertex[k] = q;
        bound[k] = cut;
        bound[k + 1] = Double.POSITIVE_INFINITY;
      }
      if (k < 0) {
        return; // the whole line is unreached
      }
      int j = 0;
      for (int q = 0; q < length; q++) {
        double pos = q * s;
        while (bound[j + 1] < pos) {
          j++;
        }
        double delta = pos - vertex[j] * s;
        f[start + q * stride] = delta * delta + values[vertex[j]];
      }
    }

    /** Position where the parabolas rooted at samples q and v (q > v) meet. */
    private double intersection(int q, int v, double s) {
      double pq = q * s;
      double pv = v * s;
      return ((values[q] + pq * pq) - (values[v] + pv * pv)) / (2 * (pq - pv));
    }
  }
}
