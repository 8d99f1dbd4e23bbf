package io.github.cleave.objects;

import java.util.Arrays;

/**
 * Exact squared Euclidean distance transform of a binary grid, in calibrated units, for anisotropic
 * pixel and voxel sizes.
 *
 * <p>P. F. Felzenszwalb and D. P. Huttenlocher, "Distance transforms of sampled functions", Theory
 * of Computing 8(19):415–428, 2012, doi:10.4086/toc.2012.v008a019: the squared distance is
 * separable, so one 1D lower-envelope-of-parabolas pass along x, then y, then z gives the exact
 * result ({@link ParabolaEnvelope}); a pass along an axis with spacing {@code s} places sample
 * {@code q} at {@code q·s}. Only lines holding foreground are transformed (the others are 0
 * throughout), each from its nonzero samples only.
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
   * <p>The passes transform the same lines with the same values as passes over a whole {@code
   * w·h·d} array would: the rows holding foreground, then the columns holding foreground, then the
   * (x, y) pillars holding foreground; a line that is not transformed keeps its values. So the
   * result is the same bit for bit; only the storage differs: lines are lists of their nonzero
   * samples, a plane at a time for rows and columns, then per pillar. Time and memory about
   * proportional to the foreground voxels and the ends of the background stretches between them,
   * plus O(w·h + h·d).
   */
  static float[] distance(ForegroundRuns runs, int[] slots, double sx, double sy, double sz) {
    int w = runs.w;
    int h = runs.h;
    int d = runs.d;
    ParabolaEnvelope alongX = new ParabolaEnvelope(w, sx);
    ParabolaEnvelope alongY = new ParabolaEnvelope(h, sy);
    ParabolaEnvelope alongZ = d > 1 ? new ParabolaEnvelope(d, sz) : null;
    int longest = Math.max(w, Math.max(h, d));
    int[] inAt = new int[longest];
    double[] in = new double[longest];
    int[] outAt = new int[longest];
    double[] out = new double[longest];
    Samples rowOut = new Samples(slots[runs.count] + 16); // (x, y) of the plane's row outputs
    Samples byColumn = new Samples(16);
    Samples pillars = new Samples(slots[runs.count] + 16); // (x + w·y, z) of column outputs
    boolean[] columnHas = new boolean[w];
    int[] columnStart = new int[w + 1];
    for (int z = 0; z < d; z++) {
      rowOut.size = 0;
      for (int y = 0; y < h; y++) {
        int row = y + h * z;
        int m = 0;
        for (int r = runs.first[row]; r < runs.first[row + 1]; r++) {
          for (int x = runs.start[r]; x <= runs.end[r]; x++) {
            columnHas[x] = true;
            inAt[m] = x;
            in[m++] = Double.POSITIVE_INFINITY;
          }
        }
        int c = alongX.sparse(inAt, in, m, outAt, out);
        for (int i = 0; i < c; i++) {
          rowOut.add(outAt[i], y, out[i]);
        }
      }
      if (rowOut.size == 0) {
        Arrays.fill(columnHas, false);
        continue;
      }
      byColumn.bucket(rowOut, columnStart, w); // by x, y ascending within
      for (int x = 0; x < w; x++) {
        int m = 0;
        for (int i = columnStart[x]; i < columnStart[x + 1]; i++) {
          inAt[m] = byColumn.b[i];
          in[m++] = byColumn.v[i];
        }
        int c =
            columnHas[x] ? alongY.sparse(inAt, in, m, outAt, out) : copy(inAt, in, m, outAt, out);
        columnHas[x] = false;
        for (int i = 0; i < c; i++) {
          pillars.add(x + w * outAt[i], z, out[i]);
        }
      }
    }
    Samples byPillar = new Samples(16);
    int[] pillarStart = new int[w * h + 1];
    byPillar.bucket(pillars, pillarStart, w * h); // by x + w·y, z ascending within
    if (alongZ != null) {
      boolean[] pillarHas = new boolean[w * h];
      for (int r = 0; r < runs.count; r++) {
        int base = w * (runs.row[r] % h);
        Arrays.fill(pillarHas, base + runs.start[r], base + runs.end[r] + 1, true);
      }
      Samples transformed = new Samples(byPillar.size + 16);
      for (int key = 0; key < w * h; key++) {
        int m = 0;
        for (int i = pillarStart[key]; i < pillarStart[key + 1]; i++) {
          inAt[m] = byPillar.b[i];
          in[m++] = byPillar.v[i];
        }
        int c = pillarHas[key] ? alongZ.sparse(inAt, in, m, outAt, out) : 0; // no voxel needs it
        pillarStart[key] = transformed.size;
        for (int i = 0; i < c; i++) {
          transformed.add(key, outAt[i], out[i]);
        }
      }
      pillarStart[w * h] = transformed.size;
      byPillar = transformed;
    }
    float[] result = new float[slots[runs.count]];
    int[] cursor = Arrays.copyOf(pillarStart, w * h); // next output of each pillar, z ascending
    for (int r = 0, s = 0; r < runs.count; r++) {
      int row = runs.row[r];
      int base = w * (row % h);
      int z = row / h;
      for (int x = runs.start[r]; x <= runs.end[r]; x++) {
        int key = base + x;
        int i = cursor[key];
        while (i < pillarStart[key + 1] && byPillar.b[i] < z) {
          i++;
        }
        cursor[key] = i;
        double f = i < pillarStart[key + 1] && byPillar.b[i] == z ? byPillar.v[i] : 0;
        result[s++] = (float) Math.sqrt(f);
      }
    }
    return result;
  }

  private static int copy(int[] at, double[] in, int m, int[] outAt, double[] out) {
    System.arraycopy(at, 0, outAt, 0, m);
    System.arraycopy(in, 0, out, 0, m);
    return m;
  }

  /** A growable list of samples (line key a, position b, value v). */
  private static final class Samples {
    int[] a;
    int[] b;
    double[] v;
    int size;

    Samples(int capacity) {
      a = new int[capacity];
      b = new int[capacity];
      v = new double[capacity];
    }

    void add(int key, int position, double value) {
      if (size == a.length) {
        int grown = 2 * size;
        a = Arrays.copyOf(a, grown);
        b = Arrays.copyOf(b, grown);
        v = Arrays.copyOf(v, grown);
      }
      a[size] = key;
      b[size] = position;
      v[size++] = value;
    }

    /**
     * Fills this list with {@code from}'s samples grouped by key (stable counting sort, keys below
     * {@code keys}); {@code start[key]..start[key+1]} is a key's range.
     */
    void bucket(Samples from, int[] start, int keys) {
      Arrays.fill(start, 0, keys + 1, 0);
      for (int i = 0; i < from.size; i++) {
        start[from.a[i] + 1]++;
      }
      for (int k = 0; k < keys; k++) {
        start[k + 1] += start[k];
      }
      if (a.length < from.size) {
        a = new int[from.size];
        b = new int[from.size];
        v = new double[from.size];
      }
      int[] fill = Arrays.copyOf(start, keys);
      for (int i = 0; i < from.size; i++) {
        int at = fill[from.a[i]]++;
        a[at] = from.a[i];
        b[at] = from.b[i];
        v[at] = from.v[i];
      }
      size = from.size;
    }
  }
}
