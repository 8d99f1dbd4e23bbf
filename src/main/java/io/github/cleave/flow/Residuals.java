package io.github.cleave.flow;

/**
 * The residual capacities of a grid's neighbour arcs, {@code residual[p * K + k]}, stored 16 or 32
 * bits wide. The 16-bit form holds 0..65535 and halves the memory and cache traffic of the solver's
 * largest array; the solver uses it while every neighbour capacity is at most {@link
 * #NARROW_CAPACITY}, so that an arc and its reverse sum to at most 65534 (pushing flow only moves
 * residual between the two), and widens to 32 bits when a capacity is set beyond that.
 */
abstract sealed class Residuals permits Residuals.Narrow, Residuals.Wide {
  /** Largest value of the 16-bit form. */
  static final int NARROW_MAX = 0xFFFF;

  /** Largest capacity the solver stores in 16-bit residuals: half of {@link #NARROW_MAX}. */
  static final int NARROW_CAPACITY = NARROW_MAX / 2;

  static Residuals create(int length, boolean narrow) {
    return narrow ? new Narrow(new char[length]) : new Wide(new int[length]);
  }

  abstract int get(int a);

  /** Stores {@code v}, {@code 0 <= v <= maxValue()}. */
  abstract void set(int a, int v);

  abstract int length();

  /** 65535 or {@code Integer.MAX_VALUE}. */
  abstract int maxValue();

  /** 16 or 32. */
  abstract int width();

  abstract long bytes();

  /** Copies {@code length} values of {@code source} from {@code from} to {@code to}. */
  abstract void copyFrom(int[] source, int from, int to, int length);

  /**
   * Stores {@code values[from + i]} at {@code a + i * stride} and at {@code a + i * stride +
   * other}, for i below {@code count}: both arcs of a run of symmetric pairs. Each value must fit.
   */
  abstract void setPairs(int a, int stride, int other, int[] values, int from, int count);

  /** A 32-bit copy. */
  abstract Wide widened();

  /** 16-bit residuals. */
  static final class Narrow extends Residuals {
    private final char[] values;

    Narrow(char[] values) {
      this.values = values;
    }

    @Override
    int get(int a) {
      return values[a];
    }

    @Override
    void set(int a, int v) {
      values[a] = (char) v;
    }

    @Override
    int length() {
      return values.length;
    }

    @Override
    int maxValue() {
      return NARROW_MAX;
    }

    @Override
    int width() {
      return 16;
    }

    @Override
    long bytes() {
      return 2L * values.length;
    }

    @Override
    void copyFrom(int[] source, int from, int to, int length) {
      for (int i = 0; i < length; i++) {
        values[to + i] = (char) source[from + i];
      }
    }

    @Override
    void setPairs(int a, int stride, int other, int[] source, int from, int count) {
      char[] v = values;
      for (int i = 0; i < count; i++, a += stride) {
        char c = (char) source[from + i];
        v[a] = c;
        v[a + other] = c;
      }
    }

    @Override
    Wide widened() {
      int[] wide = new int[values.length];
      for (int i = 0; i < wide.length; i++) {
        wide[i] = values[i];
      }
      return new Wide(wide);
    }
  }

  /** 32-bit residuals. */
  static final class Wide extends Residuals {
    private final int[] values;

    Wide(int[] values) {
      this.values = values;
    }

    @Override
    int get(int a) {
      return values[a];
    }

    @Override
    void set(int a, int v) {
      values[a] = v;
    }

    @Override
    int length() {
      return values.length;
    }

    @Override
    int maxValue() {
      return Integer.MAX_VALUE;
    }

    @Override
    int width() {
      return 32;
    }

    @Override
    long bytes() {
      return 4L * values.length;
    }

    @Override
    void copyFrom(int[] source, int from, int to, int length) {
      System.arraycopy(source, from, values, to, length);
    }

    @Override
    void setPairs(int a, int stride, int other, int[] source, int from, int count) {
      int[] v = values;
      for (int i = 0; i < count; i++, a += stride) {
        int c = source[from + i];
        v[a] = c;
        v[a + other] = c;
      }
    }

    @Override
    Wide widened() {
      return this;
    }
  }
}
