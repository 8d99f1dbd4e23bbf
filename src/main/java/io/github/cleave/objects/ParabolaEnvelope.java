package io.github.cleave.objects;

import java.util.Arrays;

/**
 * The 1D squared distance transform of one line by the lower envelope of parabolas (P. F.
 * Felzenszwalb and D. P. Huttenlocher, Theory of Computing 8(19):415–428, 2012), sample {@code q}
 * at position {@code q·s}: {@code out(q) = min over samples v of (q·s − v·s)² + f(v)}, with {@code
 * f = +∞} for samples nothing has reached yet (no parabola). Reusable buffers for lines up to a
 * fixed length; not thread-safe.
 *
 * <p>{@link #transform} works on a whole line. {@link #sparse} gives the same values, bit for bit,
 * from the nonzero samples of a line (all others 0), in time proportional to their number: a
 * stretch of five or more zeros between them contributes only its two first and two last samples to
 * the envelope, with a stand-in for the ones between. This is exact because the envelope of
 * consecutive zero parabolas is fixed in advance: with {@code Z(v)} the computed meeting point of
 * the zero parabolas at v and v+1, checked once per axis that {@code Z} increases and that {@code
 * v·s ≤ Z(v) < (v+1)·s}, no parabola inside such a stretch is ever removed by its neighbours, the
 * output inside it is 0, and its two last parabolas are those a whole-line pass would hold. Should
 * a later parabola reach below them (which would need rounding far beyond a half sample), or should
 * the check fail, the line is transformed whole instead.
 */
final class ParabolaEnvelope {
  private static final int STAND_IN = -1; // vertex of the entry standing for a stretch's inside
  private final int length;
  private final double s;
  private final double[] values; // the line's input values, by sample
  private final int[] vertex; // samples of the parabolas in the lower envelope
  private final double[] bound; // bound[k]..bound[k+1]: where parabola k is lowest
  private final double[] zero; // zero[v]: meeting point of the zero parabolas at v and v + 1
  private final boolean stretches; // the zero checks hold: long zero stretches may be skipped
  private final double[] line; // a whole line, for the fallback

  /** Buffers for lines of {@code length} samples at spacing {@code s}. */
  ParabolaEnvelope(int length, double s) {
    this.length = length;
    this.s = s;
    values = new double[length];
    vertex = new int[2 * length + 2];
    bound = new double[2 * length + 3];
    line = new double[length];
    explicit = new int[length];
    zero = new double[Math.max(0, length - 1)];
    boolean ok = true;
    for (int v = 0; v + 1 < length; v++) {
      zero[v] = meet(0, v + 1, 0, v);
      ok &= zero[v] >= v * s && zero[v] < (v + 1) * s && (v == 0 || zero[v] > zero[v - 1]);
    }
    stretches = ok;
  }

  /** Transforms {@code f[start + j·stride]}, {@code j < length}, in place (the whole line). */
  void transform(double[] f, int start, int stride, int length) {
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
      double cut = intersection(q, vertex[k]);
      while (cut <= bound[k]) {
        k--;
        cut = intersection(q, vertex[k]);
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

  /**
   * The transform of the line whose nonzero samples are {@code at[0..m)} (ascending) with values
   * {@code in[0..m)}: writes its nonzero outputs, ascending, to {@code outAt} / {@code out} (room
   * for the line's length) and returns their number.
   */
  int sparse(int[] at, double[] in, int m, int[] outAt, double[] out) {
    if (m == 0) {
      return 0; // the whole line is 0, and so is its transform
    }
    int k = envelope(at, in, m);
    if (k == FAIL) {
      return whole(at, in, m, outAt, out);
    }
    if (k < 0) {
      return copy(at, in, m, outAt, out); // no parabola: the line stays unreached
    }
    int count = 0;
    int j = 0;
    for (int i = 0; i < explicitCount; i++) {
      int q = explicit[i];
      double pos = q * s;
      while (bound[j + 1] < pos) {
        j++;
      }
      if (vertex[j] == STAND_IN) {
        return whole(at, in, m, outAt, out);
      }
      double delta = pos - vertex[j] * s;
      double value = delta * delta + values[vertex[j]];
      if (value != 0) {
        outAt[count] = q;
        out[count++] = value;
      }
    }
    return count;
  }

  private static final int FAIL = Integer.MIN_VALUE;
  private int explicitCount; // samples the envelope was built from, ascending: explicit[0..count)
  private final int[] explicit;

  /** Builds the envelope of the nonzero samples and the zero stretches; the top index or FAIL. */
  private int envelope(int[] at, double[] in, int m) {
    explicitCount = 0;
    int k = -1;
    int guard = -1; // entry that must stay: the last stretch's second-last zero
    int q = 0;
    for (int i = 0; i <= m; i++) {
      int end = i < m ? at[i] : length; // zeros at q..end−1
      if (stretches && end - q >= 5) {
        k = add(q, 0.0, k, guard);
        k = k == FAIL ? FAIL : add(q + 1, 0.0, k, guard);
        if (k == FAIL || k < 1 || vertex[k - 1] != q || vertex[k] != q + 1) {
          return FAIL;
        }
        k++;
        vertex[k] = STAND_IN; // the zeros q+2..end−3 (or to the end), bounds zero[q+1..]
        bound[k] = zero[q + 1];
        bound[k + 1] = Double.POSITIVE_INFINITY;
        if (end < length) {
          for (int z = end - 2; z < end; z++) {
            values[z] = 0.0;
            explicit[explicitCount++] = z;
            k++;
            vertex[k] = z;
            bound[k] = zero[z - 1];
          }
          bound[k + 1] = Double.POSITIVE_INFINITY;
          guard = k - 1;
        }
      } else {
        for (int z = q; z < end && k != FAIL; z++) {
          k = add(z, 0.0, k, guard);
        }
      }
      if (k == FAIL) {
        return FAIL;
      }
      if (i < m) {
        k = add(at[i], in[i], k, guard);
        if (k == FAIL) {
          return FAIL;
        }
        q = at[i] + 1;
      }
    }
    return k;
  }

  /** The whole-line step for sample q of value v; the new top index, or FAIL at the guard. */
  private int add(int q, double v, int k, int guard) {
    values[q] = v;
    explicit[explicitCount++] = q;
    if (v == Double.POSITIVE_INFINITY) {
      return k; // no parabola
    }
    if (k < 0) {
      vertex[0] = q;
      bound[0] = Double.NEGATIVE_INFINITY;
      bound[1] = Double.POSITIVE_INFINITY;
      return 0;
    }
    double cut = intersection(q, vertex[k]);
    while (cut <= bound[k]) {
      if (k == guard) {
        return FAIL;
      }
      k--;
      cut = intersection(q, vertex[k]);
    }
    k++;
    vertex[k] = q;
    bound[k] = cut;
    bound[k + 1] = Double.POSITIVE_INFINITY;
    return k;
  }

  /** The fallback: the line made whole, transformed, its nonzero outputs listed. */
  private int whole(int[] at, double[] in, int m, int[] outAt, double[] out) {
    Arrays.fill(line, 0.0);
    for (int i = 0; i < m; i++) {
      line[at[i]] = in[i];
    }
    transform(line, 0, 1, length);
    int count = 0;
    for (int q = 0; q < length; q++) {
      if (line[q] != 0) {
        outAt[count] = q;
        out[count++] = line[q];
      }
    }
    return count;
  }

  private static int copy(int[] at, double[] in, int m, int[] outAt, double[] out) {
    System.arraycopy(at, 0, outAt, 0, m);
    System.arraycopy(in, 0, out, 0, m);
    return m;
  }

  /** Position where the parabolas rooted at samples q and v (q > v) meet. */
  private double intersection(int q, int v) {
    return meet(values[q], q, values[v], v);
  }

  private double meet(double fq, int q, double fv, int v) {
    double pq = q * s;
    double pv = v * s;
    return ((fq + pq * pq) - (fv + pv * pv)) / (2 * (pq - pv));
  }
}
