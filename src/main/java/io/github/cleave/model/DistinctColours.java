package io.github.cleave.model;

import java.util.function.BiConsumer;

/**
 * Evaluates a per-colour function once per distinct 24-bit colour of an 8-bit RGB image instead of
 * once per voxel. Pass 1 marks the colours present in a bit set of 2²⁴ bits (2 MiB); a prefix count
 * of set bits per 64-bit word gives every present colour a dense index (its rank); the function
 * fills one row per distinct colour; pass 2 copies each voxel's row. Exact (no collisions); costs
 * O(N + 2¹⁸ + U · f) for N voxels and U distinct colours. Not thread-safe; one per call.
 */
final class DistinctColours {
  private static final int WORDS = 1 << 18;

  private DistinctColours() {}

  /**
   * Writes {@code out[c][v] = row(colour of v)[c]} for every voxel, where {@code rows} fills a row
   * of {@code out.length} values for a colour given as three doubles 0..255.
   *
   * @return false (and writes nothing) unless every value of the three channels is a whole number
   *     0..255
   */
  static boolean fill(float[][] rgb, float[][] out, BiConsumer<double[], float[]> rows) {
    float[] r = rgb[0];
    float[] g = rgb[1];
    float[] b = rgb[2];
    int n = r.length;
    long[] present = new long[WORDS];
    for (int v = 0; v < n; v++) {
      int key = key(r[v], g[v], b[v]);
      if (key < 0) {
        return false;
      }
      present[key >>> 6] |= 1L << key;
    }
    int[] before = new int[WORDS]; // set bits in all earlier words
    int count = 0;
    for (int w = 0; w < WORDS; w++) {
      before[w] = count;
      count += Long.bitCount(present[w]);
    }
    int classes = out.length;
    float[] table = new float[count * classes];
    float[] row = new float[classes];
    double[] x = new double[3];
    int index = 0;
    for (int w = 0; w < WORDS; w++) {
      long bits = present[w];
      while (bits != 0) {
        int key = w << 6 | Long.numberOfTrailingZeros(bits);
        bits &= bits - 1;
        x[0] = key >>> 16;
        x[1] = (key >>> 8) & 0xff;
        x[2] = key & 0xff;
        rows.accept(x, row);
        System.arraycopy(row, 0, table, index * classes, classes);
        index++;
      }
    }
    for (int v = 0; v < n; v++) {
      int key = key(r[v], g[v], b[v]);
      int w = key >>> 6;
      int at = (before[w] + Long.bitCount(present[w] & ((1L << key) - 1))) * classes;
      for (int c = 0; c < classes; c++) {
        out[c][v] = table[at + c];
      }
    }
    return true;
  }

  /** {@code r << 16 | g << 8 | b}, or -1 unless all three are whole numbers 0..255. */
  private static int key(float r, float g, float b) {
    int ri = (int) r;
    int gi = (int) g;
    int bi = (int) b;
    if (ri != r || gi != g || bi != b || ((ri | gi | bi) & ~0xff) != 0) {
      return -1;
    }
    return ri << 16 | gi << 8 | bi;
  }
}
