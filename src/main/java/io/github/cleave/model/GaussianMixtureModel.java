package io.github.cleave.model;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import java.util.List;
import java.util.Locale;

/**
 * Colour or multichannel likelihoods: one full-covariance {@link GaussianMixture} per class, as in
 * Rother, Kolmogorov & Blake, "Interactive foreground extraction using iterated graph cuts", ACM
 * Trans. Graphics 23(3), 2004, learned by {@link ModelLearner}.
 *
 * <p>Cost of class c at a voxel with feature vector x: {@code −ln p_c(x)}, then <b>shifted per
 * voxel</b> by subtracting the smallest cost over the classes at that voxel (the most likely class
 * costs 0; a constant per voxel added to every class changes no cut), then clipped to {@code [0,
 * MAX_COST]}. So costs are differences of log-likelihoods, capped at 30 nats. A voxel with a NaN in
 * any channel costs 0 for every class (no evidence); infinite values give the clipped cost.
 *
 * <p>{@link #costs} costs O(N · C · K · d²) with N voxels, C classes, K components: per component a
 * triangular product with the precomputed inverse Cholesky factor and one exponential. For an 8-bit
 * RGB image ({@link io.github.cleave.image.PixelKind#RGB}, whole values 0..255) costs are kept in a
 * direct-mapped cache keyed by the 24-bit colour, which pays on images with many repeated colours.
 * Results are identical with and without the cache. Immutable and thread-safe.
 */
public final class GaussianMixtureModel implements LikelihoodModel {
  /** Log-sum-exp terms this far below the largest add less than 10⁻¹⁶ relative: skipped. */
  private static final double NEGLIGIBLE = -37;

  private final GaussianMixture[] classes;
  private final int dimension;

  private GaussianMixtureModel(GaussianMixture[] classes) {
    this.classes = classes;
    this.dimension = classes[0].dimension();
  }

  /**
   * A model from one mixture per class (index 0 foreground, 1 background, 2.. further classes).
   *
   * @throws IllegalArgumentException if there are fewer than two classes or the mixtures differ in
   *     dimension
   */
  public static GaussianMixtureModel of(List<GaussianMixture> perClass) {
    if (perClass.size() < 2) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "%d class mixture(s): a likelihood model needs at least 2 classes",
              perClass.size()));
    }
    GaussianMixture[] a = perClass.toArray(new GaussianMixture[0]);
    for (int c = 1; c < a.length; c++) {
      if (a[c].dimension() != a[0].dimension()) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "class %d mixture has %d dimensions, class 1 has %d: all classes need the same"
                    + " channels",
                c + 1,
                a[c].dimension(),
                a[0].dimension()));
      }
    }
    return new GaussianMixtureModel(a);
  }

  /** The mixture of class {@code c} (0-based). */
  public GaussianMixture mixture(int c) {
    return classes[c];
  }

  @Override
  public int classCount() {
    return classes.length;
  }

  @Override
  public int channelCount() {
    return dimension;
  }

  @Override
  public void costs(Raster features, float[][] out) {
    ModelChecks.checkCostArguments(this, features, out);
    int n = features.size();
    int d = dimension;
    float[][] ch = new float[d][];
    for (int i = 0; i < d; i++) {
      ch[i] = features.channel(i);
    }
    Evaluator eval = new Evaluator(classes);
    if (d == 3
        && features.kind() == PixelKind.RGB
        && DistinctColours.fill(ch, out, eval::shiftedCosts)) {
      return;
    }
    double[] x = new double[d];
    float[] row = new float[classes.length];
    for (int v = 0; v < n; v++) {
      boolean nan = false;
      for (int i = 0; i < d; i++) {
        float f = ch[i][v];
        nan |= f != f;
        x[i] = f;
      }
      if (nan) {
        for (float[] o : out) {
          o[v] = 0f;
        }
        continue;
      }
      eval.shiftedCosts(x, row);
      for (int c = 0; c < row.length; c++) {
        out[c][v] = row[c];
      }
    }
  }

  /** Per-voxel evaluation with scratch space; one per call, not shared between threads. */
  static final class Evaluator {
    private final GaussianMixture[] classes;
    private final double[] cost;
    private final double[] terms;
    private final double[] diff;

    Evaluator(GaussianMixture[] classes) {
      this.classes = classes;
      this.cost = new double[classes.length];
      int maxK = 0;
      for (GaussianMixture m : classes) {
        maxK = Math.max(maxK, m.componentCount());
      }
      this.terms = new double[maxK];
      this.diff = new double[classes[0].dimension()];
    }

    private double mahalanobis(double[] x, double[] mu, double[] inv, int k) {
      int d = diff.length;
      for (int i = 0; i < d; i++) {
        diff[i] = x[i] - mu[k * d + i];
      }
      double q = 0;
      int base = k * d * d;
      for (int i = 0; i < d; i++) {
        double y = 0;
        int r = base + i * d;
        for (int j = 0; j <= i; j++) {
          y += inv[r + j] * diff[j];
        }
        q += y * y;
      }
      return q;
    }

    /** {@link #mahalanobis} unrolled for three channels (the same operations in the same order). */
    private static double mahalanobis3(double[] x, double[] mu, double[] inv, int k) {
      int m = k * 3;
      int b = k * 9;
      double d0 = x[0] - mu[m];
      double d1 = x[1] - mu[m + 1];
      double d2 = x[2] - mu[m + 2];
      double y0 = 0 + inv[b] * d0;
      double y1 = 0 + inv[b + 3] * d0 + inv[b + 4] * d1;
      double y2 = 0 + inv[b + 6] * d0 + inv[b + 7] * d1 + inv[b + 8] * d2;
      return 0 + y0 * y0 + y1 * y1 + y2 * y2;
    }

    /** Writes the shifted, clipped costs of feature vector {@code x} into {@code row}. */
    void shiftedCosts(double[] x, float[] row) {
      int d = diff.length;
      double min = Double.POSITIVE_INFINITY;
      for (int c = 0; c < classes.length; c++) {
        GaussianMixture m = classes[c];
        double[] mu = m.flatMeans();
        double[] inv = m.flatInverseFactors();
        double[] norm = m.logNormalisers();
        int kk = m.componentCount();
        double max = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < kk; k++) {
          double t =
              norm[k] - 0.5 * (d == 3 ? mahalanobis3(x, mu, inv, k) : mahalanobis(x, mu, inv, k));
          terms[k] = t;
          if (t > max) {
            max = t;
          }
        }
        double s = 0;
        for (int k = 0; k < kk; k++) {
          double t = terms[k] - max;
          if (t > NEGLIGIBLE) {
            s += Exponentials.expNonPositive(t);
          }
        }
        double logP = max + Math.log(s);
        double e = Double.isNaN(logP) ? Double.POSITIVE_INFINITY : -logP;
        cost[c] = e;
        if (e < min) {
          min = e;
        }
      }
      for (int c = 0; c < classes.length; c++) {
        double e = cost[c] - min;
        // inf - inf (every class infinitely unlikely) is NaN: no evidence, cost 0.
        row[c] = e != e ? 0f : (float) Math.min(MAX_COST, e);
      }
    }
  }
}
