package io.github.cleave.energy;

/**
 * The quantised boundary weight {@link BoundaryArcs#capacity(double, double) c(x) = rint(scale ·
 * exp(−x))} as the step function it is, evaluated without an exponential and bit for bit equal to
 * the direct formula.
 *
 * <p>{@code c} is non-increasing in {@code x}: {@link Math#exp} is semi-monotonic by its
 * specification, and negation, multiplication by a positive constant, {@code min} and {@code rint}
 * keep the order. So {@code c(x) ≥ j} holds exactly for {@code x < t_j}, where {@code t_j} is the
 * smallest double with {@code c(t_j) < j}, and {@code c(x)} is the number of thresholds above
 * {@code x}. Each threshold is found from the estimate {@code ln(scale / (j − ½))} by widening a
 * bracket and bisecting over the ordered bit patterns of positive doubles, always deciding with the
 * direct formula, so no rounding argument about logarithms is needed.
 *
 * <p>A lookup takes the bucket of {@code x} on a uniform grid over {@code [0, t_1)}, starts at the
 * first threshold of that bucket and steps past the thresholds not above {@code x} (buckets are
 * half as wide as the closest two thresholds, so mostly none). Building costs about ten
 * exponentials per step, {@code m = c(0)} steps. Immutable and thread-safe.
 */
final class ExponentialSteps {
  /** More steps than this are not worth a table (weights above about 250 nats per arc). */
  static final int MAX_STEPS = 1 << 16;

  /** The most buckets of the look-up grid. */
  private static final int MAX_BUCKETS = 1 << 18;

  private final double[] thresholds; // ascending: t_m, ..., t_1
  private final int[] start; // start[b]: the number of thresholds in buckets below b
  private final double bucketsPerUnit;
  private final double limit; // t_1: from there on the capacity is 0; 0 when all are 0

  private ExponentialSteps(double[] thresholds, int[] start, double bucketsPerUnit) {
    this.thresholds = thresholds;
    this.start = start;
    this.bucketsPerUnit = bucketsPerUnit;
    this.limit = thresholds.length == 0 ? 0 : thresholds[thresholds.length - 1];
  }

  /**
   * The steps of {@code rint(scale · exp(−x))}, or null when there are more than {@code maxSteps}.
   */
  static ExponentialSteps of(double scale, int maxSteps) {
    int m = BoundaryArcs.capacity(scale, 0);
    if (m > maxSteps) {
      return null;
    }
    double[] t = new double[m];
    for (int j = 1; j <= m; j++) {
      t[m - j] = threshold(scale, j);
    }
    // Buckets half as wide as the closest two thresholds, so that a bucket mostly holds none or
    // one and the look-up seldom steps (correct for any width; the width only saves time).
    double gap = m == 0 ? 1 : t[0];
    for (int i = 1; i < m; i++) {
      if (t[i] > t[i - 1]) {
        gap = Math.min(gap, t[i] - t[i - 1]);
      }
    }
    double buckets = m == 0 ? 0 : Math.min(MAX_BUCKETS, Math.max(2 * m + 16, 2 * t[m - 1] / gap));
    double perUnit = m == 0 ? 0 : buckets / t[m - 1];
    int last = m == 0 ? 0 : (int) (t[m - 1] * perUnit);
    int[] start = new int[last + 2];
    // start[b] = #{i : bucket(t[i]) < b}; thresholds ascend, so their buckets do too.
    int i = 0;
    for (int b = 0; b < start.length; b++) {
      while (i < m && (int) (t[i] * perUnit) < b) {
        i++;
      }
      start[b] = i;
    }
    return new ExponentialSteps(t, start, perUnit);
  }

  /** {@code BoundaryArcs.capacity(scale, x)} for any {@code x ≥ 0} or NaN. */
  int capacity(double x) {
    if (!(x < limit)) {
      return 0; // beyond the last step, +∞, NaN
    }
    int i = start[(int) (x * bucketsPerUnit)];
    double[] t = thresholds;
    // most buckets hold at most one threshold: its step is taken without a branch, and the loop
    // below, for the rare crowded bucket, is almost never entered (a well predicted branch)
    i += t[i] <= x ? 1 : 0;
    while (t[i] <= x) {
      i++; // ends at the latest at t[m - 1] = limit > x
    }
    return t.length - i;
  }

  /** The smallest double {@code x ≥ 0} with {@code capacity(scale, x) < j}, for {@code j ≥ 1}. */
  private static double threshold(double scale, int j) {
    double guess = Math.max(0, Math.log(scale / (j - 0.5)));
    long lo; // capacity(lo) >= j
    long hi; // capacity(hi) < j
    long g = Double.doubleToLongBits(guess);
    if (below(scale, g, j)) {
      hi = g;
      long step = 1;
      lo = g;
      while (true) {
        lo = Math.max(0, g - step);
        if (lo == 0 || !below(scale, lo, j)) {
          break;
        }
        step <<= 1;
      }
      if (below(scale, lo, j)) {
        return Double.longBitsToDouble(lo); // only at x = 0, which capacity(0) = m >= j excludes
      }
    } else {
      lo = g;
      long step = 1;
      hi = g;
      while (true) {
        hi = g + step;
        if (below(scale, hi, j)) {
          break;
        }
        step <<= 1;
      }
    }
    while (hi - lo > 1) {
      long mid = lo + ((hi - lo) >>> 1);
      if (below(scale, mid, j)) {
        hi = mid;
      } else {
        lo = mid;
      }
    }
    return Double.longBitsToDouble(hi);
  }

  private static boolean below(double scale, long bits, int j) {
    return BoundaryArcs.capacity(scale, Double.longBitsToDouble(bits)) < j;
  }
}
