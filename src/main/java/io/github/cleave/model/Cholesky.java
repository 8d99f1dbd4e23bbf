package io.github.cleave.model;

/**
 * Small dense symmetric positive-definite matrices stored row-major in {@code double[d * d]}:
 * Cholesky factor, inverse of a lower-triangular factor, log-determinant. O(d³) each; no allocation
 * beyond the result.
 */
final class Cholesky {
  private Cholesky() {}

  /**
   * The lower-triangular {@code L} with {@code L Lᵀ = a} (upper part zero), reading only the lower
   * triangle of {@code a}; null when {@code a} is not numerically positive definite (a pivot not
   * strictly positive or not finite).
   */
  static double[] factor(double[] a, int d) {
    double[] l = new double[d * d];
    for (int i = 0; i < d; i++) {
      for (int j = 0; j <= i; j++) {
        double s = a[i * d + j];
        for (int k = 0; k < j; k++) {
          s -= l[i * d + k] * l[j * d + k];
        }
        if (i == j) {
          if (!(s > 0) || !Double.isFinite(s)) {
            return null;
          }
          l[i * d + i] = Math.sqrt(s);
        } else {
          l[i * d + j] = s / l[j * d + j];
        }
      }
    }
    return l;
  }

  /** The inverse of a lower-triangular matrix with non-zero diagonal, itself lower triangular. */
  static double[] invertLower(double[] l, int d) {
    double[] m = new double[d * d];
    for (int j = 0; j < d; j++) {
      m[j * d + j] = 1.0 / l[j * d + j];
      for (int i = j + 1; i < d; i++) {
        double s = 0;
        for (int k = j; k < i; k++) {
          s += l[i * d + k] * m[k * d + j];
        }
        m[i * d + j] = -s / l[i * d + i];
      }
    }
    return m;
  }

  /** {@code ln det(L Lᵀ) = 2 Σ ln L_ii} for a Cholesky factor {@code l}. */
  static double logDeterminant(double[] l, int d) {
    double s = 0;
    for (int i = 0; i < d; i++) {
      s += StrictMath.log(l[i * d + i]);
    }
    return 2 * s;
  }
}
