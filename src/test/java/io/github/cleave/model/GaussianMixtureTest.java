package io.github.cleave.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class GaussianMixtureTest {

  /** A random symmetric positive-definite matrix A Aᵀ + 0.05 I. */
  static double[][] randomCovariance(SplittableRandom rng, int d, double scale) {
    double[][] a = new double[d][d];
    for (double[] row : a) {
      for (int j = 0; j < d; j++) {
        row[j] = rng.nextGaussian() * scale;
      }
    }
    double[][] s = new double[d][d];
    for (int i = 0; i < d; i++) {
      for (int j = 0; j < d; j++) {
        for (int k = 0; k < d; k++) {
          s[i][j] += a[i][k] * a[j][k];
        }
      }
      s[i][i] += 0.05 * scale * scale;
    }
    for (int i = 0; i < d; i++) {
      for (int j = 0; j < i; j++) {
        s[j][i] = s[i][j];
      }
    }
    return s;
  }

  /** A random mixture of k components in d dimensions. */
  static GaussianMixture randomMixture(SplittableRandom rng, int d, int k) {
    double[] w = new double[k];
    double sum = 0;
    for (int j = 0; j < k; j++) {
      w[j] = 0.1 + rng.nextDouble();
      sum += w[j];
    }
    double[][] mu = new double[k][d];
    double[][][] cov = new double[k][][];
    for (int j = 0; j < k; j++) {
      w[j] /= sum;
      for (int i = 0; i < d; i++) {
        mu[j][i] = rng.nextDouble() * 200;
      }
      cov[j] = randomCovariance(rng, d, 2 + rng.nextDouble() * 20);
    }
    return GaussianMixture.of(w, mu, cov);
  }

  /**
   * Closed-form multivariate normal density (Bishop, Pattern Recognition and Machine Learning,
   * 2006, eq. 2.43): N(x | mu, S) = (2 pi)^(-d/2) |S|^(-1/2) exp(-1/2 (x - mu)^T S^-1 (x - mu)),
   * with the determinant and the inverse from Gauss-Jordan elimination with partial pivoting.
   */
  static double closedFormLogDensity(double[] x, double[] mu, double[][] s) {
    int d = x.length;
    double[][] a = new double[d][2 * d];
    for (int i = 0; i < d; i++) {
      System.arraycopy(s[i], 0, a[i], 0, d);
      a[i][d + i] = 1;
    }
    double det = 1;
    for (int col = 0; col < d; col++) {
      int piv = col;
      for (int r = col + 1; r < d; r++) {
        if (Math.abs(a[r][col]) > Math.abs(a[piv][col])) {
          piv = r;
        }
      }
      if (piv != col) {
        double[] t = a[piv];
        a[piv] = a[col];
        a[col] = t;
        det = -det;
      }
      double p = a[col][col];
      det *= p;
      for (int j = 0; j < 2 * d; j++) {
        a[col][j] /= p;
      }
      for (int r = 0; r < d; r++) {
        if (r != col) {
          double f = a[r][col];
          for (int j = 0; j < 2 * d; j++) {
            a[r][j] -= f * a[col][j];
          }
        }
      }
    }
    double q = 0;
    for (int i = 0; i < d; i++) {
      for (int j = 0; j < d; j++) {
        q += (x[i] - mu[i]) * a[i][d + j] * (x[j] - mu[j]);
      }
    }
    return -0.5 * d * Math.log(2 * Math.PI) - 0.5 * Math.log(det) - 0.5 * q;
  }

  @Test
  void componentLogDensityEqualsTheClosedFormNormalDensity() {
    SplittableRandom rng = new SplittableRandom(2043);
    for (int trial = 0; trial < 200; trial++) {
      int d = 1 + rng.nextInt(5);
      GaussianMixture g = randomMixture(rng, d, 1 + rng.nextInt(3));
      for (int p = 0; p < 20; p++) {
        int k = rng.nextInt(g.componentCount());
        double[] x = new double[d];
        for (int i = 0; i < d; i++) {
          x[i] = g.means()[k][i] + rng.nextGaussian() * 15;
        }
        double want = closedFormLogDensity(x, g.means()[k], g.covariances()[k]);
        assertThat(g.componentLogDensity(k, x))
            .isCloseTo(want, within(1e-9 * (1 + Math.abs(want))));
      }
    }
  }

  @Test
  void mixtureLogDensityIsTheLogOfTheWeightedSum() {
    // p(x) = sum_k pi_k N(x | mu_k, S_k) (Bishop 2006, eq. 9.7), each N in closed form (eq. 2.43).
    SplittableRandom rng = new SplittableRandom(97);
    for (int trial = 0; trial < 100; trial++) {
      int d = 1 + rng.nextInt(4);
      GaussianMixture g = randomMixture(rng, d, 1 + rng.nextInt(5));
      double[] x = new double[d];
      for (int i = 0; i < d; i++) {
        x[i] = rng.nextDouble() * 200;
      }
      double p = 0;
      for (int k = 0; k < g.componentCount(); k++) {
        p += g.weights()[k] * Math.exp(closedFormLogDensity(x, g.means()[k], g.covariances()[k]));
      }
      if (p > 1e-250) {
        assertThat(g.logDensity(x))
            .isCloseTo(Math.log(p), within(1e-8 * (1 + Math.abs(Math.log(p)))));
      }
    }
  }

  @Test
  void emRecoversTheMeansOfAKnownMixture() {
    // Samples from a known 3-component mixture in 3 dimensions (seeded); EM (Dempster, Laird &
    // Rubin 1977) from k-means++ seeds must find means within 0.3 of the true ones (sample-mean
    // error about sigma / sqrt(n) ~ 0.03 with sigma ~ 1.5, n ~ 2000; tolerance common practice, no
    // source).
    for (long seed = 1; seed <= 8; seed++) {
      SplittableRandom rng = new SplittableRandom(seed);
      int d = 3;
      int k = 3;
      double[][] mu = new double[k][d];
      double[][][] cov = new double[k][][];
      double[] w = {0.5, 0.3, 0.2};
      for (int j = 0; j < k; j++) {
        for (int i = 0; i < d; i++) {
          mu[j][i] = 40 * j + rng.nextDouble() * 10 + (i == j ? 20 : 0);
        }
        cov[j] = randomCovariance(rng, d, 1.0);
      }
      GaussianMixture truth = GaussianMixture.of(w, mu, cov);
      int n = 6000;
      double[] x = new double[n * d];
      for (int s = 0; s < n; s++) {
        double u = rng.nextDouble();
        int j = u < w[0] ? 0 : u < w[0] + w[1] ? 1 : 2;
        double[] z = {rng.nextGaussian(), rng.nextGaussian(), rng.nextGaussian()};
        double[] l = Cholesky.factor(flatten(cov[j]), d);
        for (int i = 0; i < d; i++) {
          double v = mu[j][i];
          for (int m = 0; m <= i; m++) {
            v += l[i * d + m] * z[m];
          }
          x[s * d + i] = v;
        }
      }
      GaussianMixture fit = MixtureFitter.fit(x, d, k, 1e-6);
      assertThat(fit.componentCount()).isEqualTo(k);
      for (int j = 0; j < k; j++) {
        int best = nearest(fit.means(), truth.means()[j]);
        for (int i = 0; i < d; i++) {
          assertThat(fit.means()[best][i]).as("seed %d", seed).isCloseTo(mu[j][i], within(0.3));
        }
        assertThat(fit.weights()[best]).as("seed %d", seed).isCloseTo(w[j], within(0.03));
      }
    }
  }

  private static double[] flatten(double[][] m) {
    int d = m.length;
    double[] f = new double[d * d];
    for (int i = 0; i < d; i++) {
      System.arraycopy(m[i], 0, f, i * d, d);
    }
    return f;
  }

  private static int nearest(double[][] points, double[] p) {
    int best = 0;
    double bestD = Double.POSITIVE_INFINITY;
    for (int j = 0; j < points.length; j++) {
      double s = 0;
      for (int i = 0; i < p.length; i++) {
        s += (points[j][i] - p[i]) * (points[j][i] - p[i]);
      }
      if (s < bestD) {
        bestD = s;
        best = j;
      }
    }
    return best;
  }

  @Test
  void identicalSamplesGiveOneRegularisedComponent() {
    double[] x = new double[3 * 50];
    for (int s = 0; s < 50; s++) {
      x[3 * s] = 10;
      x[3 * s + 1] = 20;
      x[3 * s + 2] = 30;
    }
    GaussianMixture g = MixtureFitter.fit(x, 3, 5, 0.25);
    assertThat(g.componentCount()).isEqualTo(1);
    assertThat(g.means()[0]).containsExactly(10, 20, 30);
    assertThat(g.covariances()[0][0]).containsExactly(0.25, 0, 0);
    assertThat(g.logDensity(new double[] {10, 20, 30})).isFinite();
  }

  @Test
  void invalidParametersAreRefused() {
    double[][] mu = {{0, 0}};
    assertThatThrownBy(
            () -> GaussianMixture.of(new double[] {1}, mu, new double[][][] {{{1, 2}, {2, 1}}}))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("not positive definite");
    assertThatThrownBy(
            () -> GaussianMixture.of(new double[] {1}, mu, new double[][][] {{{1, 0.5}, {0, 1}}}))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("symmetric");
    assertThatThrownBy(
            () -> GaussianMixture.of(new double[] {0.5}, mu, new double[][][] {{{1, 0}, {0, 1}}}))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("sum to 1");
  }

  @Test
  void exponentialsAgreeWithTheLibraryWithinOnePartInABillion() {
    SplittableRandom rng = new SplittableRandom(5);
    assertThat(Exponentials.expNonPositive(0)).isEqualTo(1);
    assertThat(Exponentials.expNonPositive(-800)).isZero();
    assertThat(Exponentials.expNonPositive(Double.NEGATIVE_INFINITY)).isZero();
    for (int i = 0; i < 100_000; i++) {
      double x = -rng.nextDouble() * 700;
      assertThat(Exponentials.expNonPositive(x) / StrictMath.exp(x)).isCloseTo(1, within(1e-9));
    }
  }
}
