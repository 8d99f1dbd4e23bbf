package io.github.cleave.objects;

import java.util.Arrays;

/**
 * Exact squared Euclidean distance transform of a binary grid, in calibrated units, for anisotropic
 * pixel and voxel sizes.
 *
 * <p>P. F. Felzenszwalb and D. P. Huttenlocher, "Distance transforms of sampled functions", Theory
 * of Computing 8(19):415–428, 2012, doi:10.4086/toc.2012.v008a019: the squared distance is
 * separable, so one 1D lower-envelope-of-parabolas pass along x, then y, then z gives the exact
 * result; a pass along an axis with spacing {@code s} places sample {@code q} at {@code q·s}. Only
 * lines holding foreground are transformed (the others are 0 throughout): time O(length) per such
 * line, plus O(w·h + F) for F foreground voxels; memory one plane of rows and {@code d} values per
 * (x, y) pillar holding foreground.
 *
 * <p>Voxels outside the image are not background (ImageJ's EDM does the same), so an object cut by
 * the image edge is not split at the edge. Where no background exists at all the distance is {@link
 * Float#POSITIVE_INFINITY}.
 */
final class DistanceMap {
  private DistanceMap() {}

  /**
   * Distance from every foreground voxel of {@code runs} to the nearest background voxel, indexed
   * by slot ({@link ForegroundRuns#slotStarts()}).
   *
   * <p>The passes transform the same lines with the same inputs as passes over a whole {@code
   * w·h·d} array would (rows, then columns, then pillars holding foreground; values of untouched
   * lines are 0), so the result is the same bit for bit; only the storage differs. A plane at a
   * time, the rows with foreground are transformed into a buffer, and each column with foreground
   * is assembled from them (0 on rows without foreground) and transformed; the values along every
   * pillar with foreground are kept, {@code d} per pillar (a pillar's value in a plane where its
   * column has no foreground is the row's value, or 0 without a row), and the pillars are
   * transformed last. Memory: one plane of rows and {@code d} doubles per pillar with foreground.
   */
  static float[] distance(ForegroundRuns runs, int[] slots, double sx, double sy, double sz) {
    int w = runs.w;
    int h = runs.h;
    int d = runs.d;
    int[] pillar = new int[w * h]; // pillar number + 1 of (x, y) at x + w·y, 0 = no foreground
    for (int r = 0; r < runs.count; r++) {
      int base = w * (runs.row[r] % h);
      for (int x = runs.start[r]; x <= runs.end[r]; x++) {
        pillar[base + x] = 1;
      }
    }
    int pillars = 0;
    int[] rowPillars = new int[h + 1]; // pillars of row y: rowPillars[y] .. rowPillars[y+1]−1
    for (int y = 0, i = 0; y < h; y++) {
      rowPillars[y] = pillars;
      for (int x = 0; x < w; x++, i++) {
        if (pillar[i] != 0) {
          pillar[i] = ++pillars;
        }
      }
    }
    rowPillars[h] = pillars;
    int[] pillarX = new int[pillars]; // x of each pillar, numbered in index order
    for (int i = 0; i < w * h; i++) {
      if (pillar[i] != 0) {
        pillarX[pillar[i] - 1] = i % w;
      }
    }
    double[] along = new double[pillars * d]; // along[p·d + z]: squared distance of pillar p at z
    Line line = new Line(Math.max(w, Math.max(h, d)));
    double[] rows = new double[w * maxRowsPerPlane(runs)]; // the plane's rows with foreground
    int[] rowOf = new int[h]; // index of row y in rows, −1 if it holds no foreground
    boolean[] columnHas = new boolean[w];
    int[] columns = new int[w];
    double[] column = new double[h];
    for (int z = 0; z < d; z++) {
      int k = 0;
      int nc = 0;
      for (int y = 0; y < h; y++) {
        int row = y + h * z;
        if (runs.first[row] == runs.first[row + 1]) {
          rowOf[y] = -1;
          continue;
        }
        int base = k * w;
        rowOf[y] = k++;
        Arrays.fill(rows, base, base + w, 0.0);
        for (int r = runs.first[row]; r < runs.first[row + 1]; r++) {
          Arrays.fill(rows, base + runs.start[r], base + runs.end[r] + 1, INF);
          for (int x = runs.start[r]; x <= runs.end[r]; x++) {
            if (!columnHas[x]) {
              columnHas[x] = true;
              columns[nc++] = x;
            }
          }
        }
        line.transform(rows, base, 1, w, sx);
        for (int p = rowPillars[y]; p < rowPillars[y + 1]; p++) {
          along[p * d + z] = rows[base + pillarX[p]]; // kept where the column has no foreground
        }
      }
      for (int c = 0; c < nc; c++) {
        int x = columns[c];
        columnHas[x] = false;
        for (int y = 0; y < h; y++) {
          column[y] = rowOf[y] < 0 ? 0 : rows[rowOf[y] * w + x];
        }
        line.transform(column, 0, 1, h, sy);
        for (int y = 0, i = x; y < h; y++, i += w) {
          if (pillar[i] != 0) {
            along[(pillar[i] - 1) * d + z] = column[y];
          }
        }
      }
    }
    if (d > 1) {
      for (int p = 0; p < pillars; p++) {
        line.transform(along, p * d, 1, d, sz);
      }
    }
    float[] out = new float[slots[runs.count]];
    for (int r = 0, s = 0; r < runs.count; r++) {
      int row = runs.row[r];
      int base = w * (row % h);
      int z = row / h;
      for (int x = runs.start[r]; x <= runs.end[r]; x++) {
        out[s++] = (float) Math.sqrt(along[(pillar[base + x] - 1) * d + z]);
      }
    }
    return out;
  }

  private static final double INF = Double.POSITIVE_INFINITY; // not yet reached

  private static int maxRowsPerPlane(ForegroundRuns runs) {
    int max = 0;
    for (int z = 0; z < runs.d; z++) {
      int count = 0;
      for (int row = z * runs.h; row < (z + 1) * runs.h; row++) {
        count += runs.first[row] < runs.first[row + 1] ? 1 : 0;
      }
      max = Math.max(max, count);
    }
    return max;
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
