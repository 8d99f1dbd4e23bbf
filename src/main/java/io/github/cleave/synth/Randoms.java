package io.github.cleave.synth;

import java.util.SplittableRandom;

/**
 * Random variates for the phantoms, computed with {@link StrictMath} only so that a seed gives the
 * same numbers on every Java platform and version (the JDK's own {@code nextGaussian} is not
 * specified bit for bit).
 */
final class Randoms {
  private Randoms() {}

  private static final double HALF_LOG_TWO_PI = 0.5 * StrictMath.log(2 * Math.PI);

  /**
   * Standard normal variate by the Box–Muller transform (Box and Muller, Ann. Math. Stat. 1958).
   */
  static double gaussian(SplittableRandom random) {
    double u1 = 1.0 - random.nextDouble(); // in (0, 1]
    double u2 = random.nextDouble();
    return StrictMath.sqrt(-2.0 * StrictMath.log(u1)) * StrictMath.cos(2 * Math.PI * u2);
  }

  /**
   * Poisson variate of the given mean: multiplication of uniforms below mean 10 (Knuth, TAOCP vol.
   * 2, 3.4.1), otherwise the transformed rejection method PTRS (W. Hörmann, "The transformed
   * rejection method for generating Poisson random variables", Insurance: Mathematics and Economics
   * 12(1):39–45, 1993). Expected O(1) uniforms for large means.
   */
  static int poisson(SplittableRandom random, double mean) {
    if (!(mean > 0)) {
      return 0;
    }
    if (mean < 10) {
      double limit = StrictMath.exp(-mean);
      double product = random.nextDouble();
      int k = 0;
      while (product > limit) {
        k++;
        product *= random.nextDouble();
      }
      return k;
    }
    double sqrtMean = StrictMath.sqrt(mean);
    double logMean = StrictMath.log(mean);
    double b = 0.931 + 2.53 * sqrtMean;
    double a = -0.059 + 0.02483 * b;
    double inverseAlpha = 1.1239 + 1.1328 / (b - 3.4);
    double vr = 0.9277 - 3.6224 / (b - 2);
    while (true) {
      double u = random.nextDouble() - 0.5;
      double v = random.nextDouble();
      double us = 0.5 - Math.abs(u);
      long k = (long) Math.floor((2 * a / us + b) * u + mean + 0.43);
      if (us >= 0.07 && v <= vr) {
        return (int) k;
      }
      if (k < 0 || (us < 0.013 && v > us)) {
        continue;
      }
      double lhs =
          StrictMath.log(v) + StrictMath.log(inverseAlpha) - StrictMath.log(a / (us * us) + b);
      if (lhs <= -mean + k * logMean - logFactorial(k)) {
        return (int) k;
      }
    }
  }

  /** ln k! : exact sum below 20, Stirling's series with three correction terms above. */
  static double logFactorial(long k) {
    if (k < 20) {
      double sum = 0;
      for (int i = 2; i <= k; i++) {
        sum += StrictMath.log(i);
      }
      return sum;
    }
    double x = k;
    double x2 = x * x;
    return (x + 0.5) * StrictMath.log(x)
        - x
        + HALF_LOG_TWO_PI
        + 1.0 / (12 * x)
        - 1.0 / (360 * x * x2)
        + 1.0 / (1260 * x * x2 * x2);
  }

  /**
   * A 16-bit camera: each pixel's expected photon count becomes a Poisson count (shot noise), times
   * {@code gain} ADU per photon, plus {@code offset} and Gaussian read noise of standard deviation
   * {@code readNoise} ADU, rounded and clipped to 0..65535.
   */
  static float[] camera16(
      SplittableRandom random, double[] photons, double offset, double gain, double readNoise) {
    float[] out = new float[photons.length];
    for (int i = 0; i < photons.length; i++) {
      double adu = offset + gain * poisson(random, photons[i]) + readNoise * gaussian(random);
      out[i] = (float) Math.min(65535, Math.max(0, Math.rint(adu)));
    }
    return out;
  }
}
