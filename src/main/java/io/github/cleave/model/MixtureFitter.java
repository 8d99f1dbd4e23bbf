package io.github.cleave.model;

import java.util.SplittableRandom;

/**
 * Fits a full-covariance Gaussian mixture to samples by maximum likelihood: k-means++ seeding
 * (Arthur & Vassilvitskii, "k-means++: the advantages of careful seeding", SODA 2007) with a fixed
 * random seed, a few Lloyd iterations, then expectation-maximisation (Dempster, Laird & Rubin,
 * "Maximum likelihood from incomplete data via the EM algorithm", J. Royal Statistical Society B
 * 39(1), 1977), as Rother, Kolmogorov & Blake (2004) initialise their colour models.
 *
 * <p>Every covariance gets {@code regularisation · I} added after each estimate, so that it stays
 * positive definite even when the samples are all equal or lie in a plane. A component whose
 * responsibility mass falls below {@link #MIN_COMPONENT_MASS} samples is dropped and the weights
 * renormalised. EM stops after {@link #MAX_EM_ITERATIONS} iterations or when the mean
 * log-likelihood per sample improves by less than {@link #TOLERANCE}.
 *
 * <p>Deterministic bit for bit: fixed seed, sequential sums in a fixed order, {@link StrictMath}
 * for every logarithm, {@link Exponentials} for every exponential. Cost O(n · K · d² · iterations).
 */
final class MixtureFitter {
  static final long RANDOM_SEED = 0x5EED_C1EAL;
  static final int LLOYD_ITERATIONS = 10;
  static final int MAX_EM_ITERATIONS = 50;
  static final double TOLERANCE = 1e-4;
  static final double MIN_COMPONENT_MASS = 1e-3;

  private MixtureFitter() {}

  /**
   * @param x samples row-major, {@code x[s * d + i]}, all finite, at least one
   * @param components wanted number of components (fewer when there are fewer distinct samples)
   * @param regularisation positive value added to every covariance diagonal
   */
  static GaussianMixture fit(double[] x, int d, int components, double regularisation) {
    int n = x.length / d;
    double[] centres = seedCentres(x, n, d, components);
    int k = centres.length / d;
    int[] assign = new int[n];
    for (int it = 0; it < LLOYD_ITERATIONS; it++) {
      boolean changed = assignNearest(x, n, d, centres, k, assign) || it == 0;
      centres = centroids(x, n, d, k, assign, centres);
      if (!changed) {
        break;
      }
    }
    assignNearest(x, n, d, centres, k, assign);
    double[] resp = new double[n * k];
    for (int s = 0; s < n; s++) {
      resp[s * k + assign[s]] = 1;
    }
    Params p = maximise(x, n, d, k, resp, regularisation);
    double previous = Double.NEGATIVE_INFINITY;
    for (int it = 0; it < MAX_EM_ITERATIONS; it++) {
      GaussianMixture g = GaussianMixture.ofFlat(d, p.weights, p.means, p.covariances);
      k = g.componentCount();
      resp = new double[n * k];
      double meanLog = expect(g, x, n, d, resp) / n;
      p = maximise(x, n, d, k, resp, regularisation);
      if (meanLog - previous < TOLERANCE) {
        break;
      }
      previous = meanLog;
    }
    return GaussianMixture.ofFlat(d, p.weights, p.means, p.covariances);
  }

  /** k-means++ seeding; stops early when every remaining sample coincides with a centre. */
  private static double[] seedCentres(double[] x, int n, int d, int wanted) {
    SplittableRandom rng = new SplittableRandom(RANDOM_SEED);
    double[] centres = new double[wanted * d];
    int first = rng.nextInt(n);
    System.arraycopy(x, first * d, centres, 0, d);
    int k = 1;
    double[] dist = new double[n];
    for (int s = 0; s < n; s++) {
      dist[s] = squaredDistance(x, s * d, centres, 0, d);
    }
    while (k < wanted) {
      double total = 0;
      for (int s = 0; s < n; s++) {
        total += dist[s];
      }
      if (!(total > 0)) {
        break;
      }
      double target = rng.nextDouble() * total;
      int pick = -1;
      double acc = 0;
      for (int s = 0; s < n; s++) {
        if (dist[s] > 0) {
          pick = s;
          acc += dist[s];
          if (acc > target) {
            break;
          }
        }
      }
      System.arraycopy(x, pick * d, centres, k * d, d);
      for (int s = 0; s < n; s++) {
        dist[s] = Math.min(dist[s], squaredDistance(x, s * d, centres, k * d, d));
      }
      k++;
    }
    return java.util.Arrays.copyOf(centres, k * d);
  }

  private static double squaredDistance(double[] a, int ia, double[] b, int ib, int d) {
    double s = 0;
    for (int i = 0; i < d; i++) {
      double t = a[ia + i] - b[ib + i];
      s += t * t;
    }
    return s;
  }

  /** Nearest centre of every sample (lowest index on ties); true when some assignment changed. */
  private static boolean assignNearest(
      double[] x, int n, int d, double[] centres, int k, int[] assign) {
    boolean changed = false;
    for (int s = 0; s < n; s++) {
      int best = 0;
      double bestD = Double.POSITIVE_INFINITY;
      for (int c = 0; c < k; c++) {
        double dd = squaredDistance(x, s * d, centres, c * d, d);
        if (dd < bestD) {
          bestD = dd;
          best = c;
        }
      }
      changed |= assign[s] != best;
      assign[s] = best;
    }
    return changed;
  }

  /** Centroids of the assigned samples; a centre with no sample keeps its place. */
  private static double[] centroids(
      double[] x, int n, int d, int k, int[] assign, double[] previous) {
    double[] sum = new double[k * d];
    int[] count = new int[k];
    for (int s = 0; s < n; s++) {
      int c = assign[s];
      count[c]++;
      for (int i = 0; i < d; i++) {
        sum[c * d + i] += x[s * d + i];
      }
    }
    for (int c = 0; c < k; c++) {
      for (int i = 0; i < d; i++) {
        sum[c * d + i] = count[c] == 0 ? previous[c * d + i] : sum[c * d + i] / count[c];
      }
    }
    return sum;
  }

  /** E-step: responsibilities {@code resp[s * k + c]}; returns the total log-likelihood. */
  private static double expect(GaussianMixture g, double[] x, int n, int d, double[] resp) {
    int k = g.componentCount();
    double[] norm = g.logNormalisers();
    double[] point = new double[d];
    double total = 0;
    for (int s = 0; s < n; s++) {
      System.arraycopy(x, s * d, point, 0, d);
      double max = Double.NEGATIVE_INFINITY;
      for (int c = 0; c < k; c++) {
        double t = norm[c] - 0.5 * g.mahalanobis(c, point);
        resp[s * k + c] = t;
        max = Math.max(max, t);
      }
      double sum = 0;
      for (int c = 0; c < k; c++) {
        double e = Exponentials.expNonPositive(resp[s * k + c] - max);
        resp[s * k + c] = e;
        sum += e;
      }
      for (int c = 0; c < k; c++) {
        resp[s * k + c] /= sum;
      }
      total += max + StrictMath.log(sum);
    }
    return total;
  }

  /** Flat mixture parameters. */
  private record Params(double[] weights, double[] means, double[] covariances) {}

  /** M-step from responsibilities; drops components with too little mass. */
  private static Params maximise(double[] x, int n, int d, int k, double[] resp, double reg) {
    double[] mass = new double[k];
    for (int s = 0; s < n; s++) {
      for (int c = 0; c < k; c++) {
        mass[c] += resp[s * k + c];
      }
    }
    int kept = 0;
    for (int c = 0; c < k; c++) {
      if (mass[c] >= MIN_COMPONENT_MASS) {
        kept++;
      }
    }
    double[] w = new double[kept];
    double[] mu = new double[kept * d];
    double[] cov = new double[kept * d * d];
    double keptMass = 0;
    int o = 0;
    for (int c = 0; c < k; c++) {
      if (mass[c] < MIN_COMPONENT_MASS) {
        continue;
      }
      keptMass += mass[c];
      w[o] = mass[c];
      for (int s = 0; s < n; s++) {
        double r = resp[s * k + c];
        for (int i = 0; i < d; i++) {
          mu[o * d + i] += r * x[s * d + i];
        }
      }
      for (int i = 0; i < d; i++) {
        mu[o * d + i] /= mass[c];
      }
      int base = o * d * d;
      for (int s = 0; s < n; s++) {
        double r = resp[s * k + c];
        if (r == 0) {
          continue;
        }
        for (int i = 0; i < d; i++) {
          double di = x[s * d + i] - mu[o * d + i];
          for (int j = 0; j <= i; j++) {
            cov[base + i * d + j] += r * di * (x[s * d + j] - mu[o * d + j]);
          }
        }
      }
      for (int i = 0; i < d; i++) {
        for (int j = 0; j <= i; j++) {
          double v = cov[base + i * d + j] / mass[c] + (i == j ? reg : 0);
          cov[base + i * d + j] = v;
          cov[base + j * d + i] = v;
        }
      }
      o++;
    }
    for (int c = 0; c < kept; c++) {
      w[c] /= keptMass;
    }
    return new Params(w, mu, cov);
  }
}
