package io.github.cleave.model;

import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.Locale;

/**
 * One-channel likelihoods from smoothed intensity histograms of the seed voxels (Boykov & Jolly,
 * "Interactive graph cuts for optimal boundary &amp; region segmentation of objects in N-D images",
 * ICCV 2001): the cost of class c at value v is {@code −ln p_c(bin(v))}, clipped to {@link
 * #MAX_COST}, where {@code p_c} is the class's probability per bin.
 *
 * <p><b>Bins.</b> {@code B} equal bins cover {@code [low, high]}: {@code bin(v) = floor((v − low) ·
 * B / (high − low))}, clamped to {@code 0..B−1}, so values outside the range (and ±infinity) fall
 * into the end bins. With {@code low = 0, high = 255, B = 256} every whole value 0..255 has its own
 * bin. A voxel whose value is NaN costs 0 for every class (no evidence either way).
 *
 * <p><b>Learning</b> ({@link ModelLearner}): per class, the count of finite seed values per bin;
 * smoothed with a Gaussian kernel of {@link #SMOOTHING_SIGMA_BINS} bins truncated at ±3σ (weights
 * normalised to sum 1; mass that would leave the range is folded onto the end bin, so nothing is
 * lost); normalised to sum 1; then mixed with a uniform floor, {@code p = (1 − ε) p + ε / B} with ε
 * = {@link #FLOOR_MASS}, so that a value the seeds never showed costs about {@code ln B + 13.8}
 * nats (19.4 for 256 bins): large but finite. Costs are {@code −ln p ≥ 0}; no shift is needed.
 *
 * <p>{@link #costs} is a table lookup per voxel, O(N · C). Immutable and thread-safe.
 */
public final class HistogramModel implements LikelihoodModel {
  /** Default number of bins. */
  public static final int DEFAULT_BINS = 256;

  /** Standard deviation of the smoothing kernel, in bins. */
  public static final double SMOOTHING_SIGMA_BINS = 2.0;

  /** Probability mass spread uniformly over all bins after smoothing. */
  public static final double FLOOR_MASS = 1e-6;

  private final double low;
  private final double high;
  private final int bins;
  private final double scale; // bins / (high - low)
  private final double[][] probabilities; // [class][bin], each row > 0, sums to 1 within 1e-6
  private final float[][] costTable; // [class][bin] = min(MAX_COST, -ln p)

  private HistogramModel(double low, double high, double[][] probabilities) {
    this.low = low;
    this.high = high;
    this.bins = probabilities[0].length;
    this.scale = bins / (high - low);
    this.probabilities = probabilities;
    this.costTable = new float[probabilities.length][bins];
    for (int c = 0; c < probabilities.length; c++) {
      for (int b = 0; b < bins; b++) {
        costTable[c][b] = (float) Math.min(MAX_COST, -StrictMath.log(probabilities[c][b]));
      }
    }
  }

  /**
   * A model from its parameters, used as given.
   *
   * @param low finite lower end of the binned range
   * @param high finite upper end, greater than {@code low}
   * @param probabilities one row per class (at least 2), all of the same length B ≥ 1, every entry
   *     positive and finite, each row summing to 1 within 1e-6
   * @throws IllegalArgumentException naming the offending value
   */
  public static HistogramModel of(double low, double high, double[][] probabilities) {
    if (!Double.isFinite(low) || !Double.isFinite(high) || !(high > low)) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "histogram range %s..%s: both ends must be finite and high above low",
              low,
              high));
    }
    if (probabilities.length < 2) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "%d class histogram(s): a likelihood model needs at least 2 classes",
              probabilities.length));
    }
    int bins = probabilities[0].length;
    if (bins < 1) {
      throw new IllegalArgumentException("a histogram needs at least one bin");
    }
    double[][] copy = new double[probabilities.length][];
    for (int c = 0; c < probabilities.length; c++) {
      double[] p = probabilities[c];
      if (p.length != bins) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "class %d histogram has %d bins, class 1 has %d",
                c + 1,
                p.length,
                bins));
      }
      double sum = 0;
      for (int b = 0; b < bins; b++) {
        if (!(p[b] > 0) || !Double.isFinite(p[b])) {
          throw new IllegalArgumentException(
              String.format(
                  Locale.ROOT,
                  "class %d histogram: bin %d has probability %s; every bin needs a positive"
                      + " finite probability",
                  c + 1,
                  b,
                  p[b]));
        }
        sum += p[b];
      }
      if (Math.abs(sum - 1) > 1e-6) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "class %d histogram sums to %s: probabilities must sum to 1",
                c + 1,
                sum));
      }
      copy[c] = p.clone();
    }
    return new HistogramModel(low, high, copy);
  }

  /**
   * Learns one histogram per class from the finite values of {@code values} at voxels whose seed
   * label is class + 1; the caller has checked that every class has such a value and that the range
   * is valid.
   */
  static HistogramModel learn(
      float[] values, byte[] labels, int classes, double low, double high, int bins) {
    double scale = bins / (high - low);
    // Four partial counts per class, taken in turn, so that runs of equal bins (common: the
    // background is flat) do not make every increment wait for the one before.
    int[][] partial = new int[classes][4 * bins];
    for (int i = SeedLabels.nextLabelled(labels, 0);
        i < labels.length;
        i = SeedLabels.nextLabelled(labels, i + 1)) {
      int label = labels[i] & 0xff;
      float v = values[i];
      if (label == 0 || label > classes || !Float.isFinite(v)) {
        continue;
      }
      partial[label - 1][(i & 3) * bins + bin(v, low, scale, bins)]++;
    }
    double[][] counts = new double[classes][bins];
    for (int c = 0; c < classes; c++) {
      for (int b = 0; b < bins; b++) {
        counts[c][b] =
            (double) partial[c][b]
                + partial[c][bins + b]
                + partial[c][2 * bins + b]
                + partial[c][3 * bins + b];
      }
    }
    double[][] p = new double[classes][];
    for (int c = 0; c < classes; c++) {
      p[c] = smoothedProbabilities(counts[c]);
    }
    return new HistogramModel(low, high, p);
  }

  /** Smooth, normalise and floor one histogram of counts (see the class comment). */
  static double[] smoothedProbabilities(double[] counts) {
    int bins = counts.length;
    int radius = (int) Math.ceil(3 * SMOOTHING_SIGMA_BINS);
    double[] kernel = new double[2 * radius + 1];
    double ksum = 0;
    for (int j = -radius; j <= radius; j++) {
      kernel[j + radius] =
          StrictMath.exp(-(double) j * j / (2 * SMOOTHING_SIGMA_BINS * SMOOTHING_SIGMA_BINS));
      ksum += kernel[j + radius];
    }
    for (int j = 0; j < kernel.length; j++) {
      kernel[j] /= ksum;
    }
    double[] smooth = new double[bins];
    for (int b = 0; b < bins; b++) {
      if (counts[b] == 0) {
        continue;
      }
      for (int j = -radius; j <= radius; j++) {
        int t = Math.min(bins - 1, Math.max(0, b + j));
        smooth[t] += counts[b] * kernel[j + radius];
      }
    }
    double total = 0;
    for (double s : smooth) {
      total += s;
    }
    double[] p = new double[bins];
    for (int b = 0; b < bins; b++) {
      p[b] = (1 - FLOOR_MASS) * (smooth[b] / total) + FLOOR_MASS / bins;
    }
    return p;
  }

  private static int bin(double v, double low, double scale, int bins) {
    double t = (v - low) * scale;
    if (!(t >= 0)) {
      return 0;
    }
    return t >= bins ? bins - 1 : (int) t;
  }

  /** The bin of value {@code v} (NaN falls into bin 0 here; {@link #costs} treats NaN apart). */
  public int bin(double v) {
    return bin(v, low, scale, bins);
  }

  /** Lower end of the binned range. */
  public double low() {
    return low;
  }

  /** Upper end of the binned range. */
  public double high() {
    return high;
  }

  /** Number of bins B. */
  public int binCount() {
    return bins;
  }

  /** The probabilities per bin of class {@code c} (a copy). */
  public double[] probabilities(int c) {
    return probabilities[c].clone();
  }

  /** The cost of class {@code c} at value {@code v}, as {@link #costs} writes it. */
  public float cost(int c, double v) {
    return v != v ? 0f : costTable[c][bin(v)];
  }

  @Override
  public int classCount() {
    return probabilities.length;
  }

  @Override
  public int channelCount() {
    return 1;
  }

  @Override
  public void costs(Raster features, float[][] out) {
    ModelChecks.checkCostArguments(this, features, out);
    float[] values = features.channel(0);
    int n = values.length;
    if (costTable.length == 2) {
      float[] t0 = costTable[0];
      float[] t1 = costTable[1];
      float[] o0 = out[0];
      float[] o1 = out[1];
      for (int i = 0; i < n; i++) {
        float v = values[i];
        if (v != v) {
          o0[i] = 0f;
          o1[i] = 0f;
        } else {
          int b = bin(v, low, scale, bins);
          o0[i] = t0[b];
          o1[i] = t1[b];
        }
      }
      return;
    }
    for (int i = 0; i < n; i++) {
      float v = values[i];
      int b = v != v ? -1 : bin(v, low, scale, bins);
      for (int c = 0; c < costTable.length; c++) {
        out[c][i] = b < 0 ? 0f : costTable[c][b];
      }
    }
  }
}
