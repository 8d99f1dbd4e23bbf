package io.github.cleave.model;

import java.util.Locale;

/**
 * The feature distribution of one class: a mixture of K full-covariance Gaussians in d dimensions,
 * {@code p(x) = Σ_k π_k N(x | μ_k, Σ_k)} with {@code N(x | μ, Σ) = (2π)^(-d/2) |Σ|^(-1/2) exp(−½ (x
 * − μ)ᵀ Σ⁻¹ (x − μ))} (Bishop, Pattern Recognition and Machine Learning, 2006, eq. 2.43).
 *
 * <p>Built only from valid parameters ({@link #of}); keeps the inverse Cholesky factor {@code L⁻¹}
 * ({@code Σ = L Lᵀ}) and {@code ln π_k − ½ ln|Σ_k| − (d/2) ln 2π} of every component, so that a
 * log-density costs O(K d²) multiplications and K exponentials, evaluated as a log-sum-exp. The
 * accessors return copies. Immutable and thread-safe.
 */
public final class GaussianMixture {
  private static final double LOG_TWO_PI = StrictMath.log(2 * Math.PI);

  private final int dimension;
  private final int components;
  private final double[] weights; // [k], each > 0, sum 1 within 1e-6
  private final double[] means; // [k * d + i]
  private final double[] covariances; // [(k * d + i) * d + j], symmetric positive definite
  private final double[] inverseFactors; // [(k * d + i) * d + j]: L_k⁻¹, lower triangular
  private final double[] logNormalisers; // [k]: ln π_k − ½ ln|Σ_k| − (d/2) ln 2π

  private GaussianMixture(int dimension, double[] weights, double[] means, double[] covariances) {
    this.dimension = dimension;
    this.components = weights.length;
    this.weights = weights;
    this.means = means;
    this.covariances = covariances;
    int d = dimension;
    int dd = d * d;
    this.inverseFactors = new double[components * dd];
    this.logNormalisers = new double[components];
    for (int k = 0; k < components; k++) {
      double[] a = new double[dd];
      System.arraycopy(covariances, k * dd, a, 0, dd);
      double[] l = Cholesky.factor(a, d);
      if (l == null) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "covariance of component %d is not positive definite: a covariance must be a"
                    + " symmetric positive-definite matrix",
                k + 1));
      }
      System.arraycopy(Cholesky.invertLower(l, d), 0, inverseFactors, k * dd, dd);
      logNormalisers[k] =
          StrictMath.log(weights[k]) - 0.5 * Cholesky.logDeterminant(l, d) - 0.5 * d * LOG_TWO_PI;
    }
  }

  /**
   * A mixture from its parameters, used as given (no renormalisation).
   *
   * @param weights K ≥ 1 finite positive weights summing to 1 within 1e-6
   * @param means K vectors of the same length d ≥ 1, finite
   * @param covariances K symmetric (within 1e-9 relative) positive-definite d × d matrices
   * @throws IllegalArgumentException naming the offending component and what is required
   */
  public static GaussianMixture of(double[] weights, double[][] means, double[][][] covariances) {
    int k = weights.length;
    if (k == 0 || means.length != k || covariances.length != k) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "%d weights, %d means and %d covariances: a mixture needs at least one component"
                  + " and the same count of each",
              k,
              means.length,
              covariances.length));
    }
    int d = means[0].length;
    if (d == 0) {
      throw new IllegalArgumentException("a mixture needs at least one dimension");
    }
    double sum = 0;
    double[] w = new double[k];
    double[] mu = new double[k * d];
    double[] cov = new double[k * d * d];
    for (int c = 0; c < k; c++) {
      if (!(weights[c] > 0) || !Double.isFinite(weights[c])) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "weight of component %d is %s: weights must be positive and finite",
                c + 1,
                weights[c]));
      }
      w[c] = weights[c];
      sum += weights[c];
      if (means[c].length != d) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "mean of component %d has %d values; component 1 has %d",
                c + 1,
                means[c].length,
                d));
      }
      for (int i = 0; i < d; i++) {
        if (!Double.isFinite(means[c][i])) {
          throw new IllegalArgumentException(
              String.format(Locale.ROOT, "mean of component %d is not finite", c + 1));
        }
        mu[c * d + i] = means[c][i];
      }
      copyCovariance(c, covariances[c], d, cov);
    }
    if (Math.abs(sum - 1) > 1e-6) {
      throw new IllegalArgumentException(
          String.format(Locale.ROOT, "weights sum to %s: they must sum to 1", sum));
    }
    return new GaussianMixture(d, w, mu, cov);
  }

  private static void copyCovariance(int c, double[][] m, int d, double[] cov) {
    if (m.length != d) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "covariance of component %d has %d rows; %d needed",
              c + 1,
              m.length,
              d));
    }
    for (int i = 0; i < d; i++) {
      if (m[i].length != d) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "covariance of component %d: row %d has %d values; %d needed",
                c + 1,
                i + 1,
                m[i].length,
                d));
      }
    }
    for (int i = 0; i < d; i++) {
      for (int j = 0; j < d; j++) {
        double a = m[i][j];
        double b = m[j][i];
        if (!Double.isFinite(a) || Math.abs(a - b) > 1e-9 * Math.max(Math.abs(a), Math.abs(b))) {
          throw new IllegalArgumentException(
              String.format(
                  Locale.ROOT,
                  "covariance of component %d is not finite and symmetric at (%d, %d)",
                  c + 1,
                  i + 1,
                  j + 1));
        }
        cov[(c * d + i) * d + j] = a;
      }
    }
  }

  /** Package-private constructor for the fitter: flat arrays, taken over, not copied. */
  static GaussianMixture ofFlat(int d, double[] weights, double[] means, double[] covariances) {
    return new GaussianMixture(d, weights, means, covariances);
  }

  /** Feature dimension d. */
  public int dimension() {
    return dimension;
  }

  /** Number of components K. */
  public int componentCount() {
    return components;
  }

  /** The K mixing weights (a copy). */
  public double[] weights() {
    return weights.clone();
  }

  /** The K means, each of length d (copies). */
  public double[][] means() {
    double[][] m = new double[components][dimension];
    for (int k = 0; k < components; k++) {
      System.arraycopy(means, k * dimension, m[k], 0, dimension);
    }
    return m;
  }

  /** The K covariance matrices, each d × d (copies). */
  public double[][][] covariances() {
    int d = dimension;
    double[][][] m = new double[components][d][d];
    for (int k = 0; k < components; k++) {
      for (int i = 0; i < d; i++) {
        System.arraycopy(covariances, (k * d + i) * d, m[k][i], 0, d);
      }
    }
    return m;
  }

  /** {@code ln p(x)}, computed as a log-sum-exp over the components. */
  public double logDensity(double[] x) {
    double[] terms = new double[components];
    double max = Double.NEGATIVE_INFINITY;
    for (int k = 0; k < components; k++) {
      terms[k] = logNormalisers[k] - 0.5 * mahalanobis(k, x);
      max = Math.max(max, terms[k]);
    }
    double s = 0;
    for (int k = 0; k < components; k++) {
      s += Exponentials.expNonPositive(terms[k] - max);
    }
    return max + Math.log(s);
  }

  /** {@code ln N(x | μ_k, Σ_k)} of one component, without its weight. */
  double componentLogDensity(int k, double[] x) {
    return logNormalisers[k] - StrictMath.log(weights[k]) - 0.5 * mahalanobis(k, x);
  }

  /** Squared Mahalanobis distance {@code |L_k⁻¹ (x − μ_k)|²}. */
  double mahalanobis(int k, double[] x) {
    int d = dimension;
    int base = k * d * d;
    double q = 0;
    for (int i = 0; i < d; i++) {
      double y = 0;
      int row = base + i * d;
      for (int j = 0; j <= i; j++) {
        y += inverseFactors[row + j] * (x[j] - means[k * d + j]);
      }
      q += y * y;
    }
    return q;
  }

  // Flat views for the hot loop of GaussianMixtureModel (shared, never written).
  double[] flatMeans() {
    return means;
  }

  double[] flatInverseFactors() {
    return inverseFactors;
  }

  double[] logNormalisers() {
    return logNormalisers;
  }
}
