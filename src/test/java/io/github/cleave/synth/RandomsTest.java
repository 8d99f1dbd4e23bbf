package io.github.cleave.synth;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class RandomsTest {

  @Test
  void poissonHasMeanEqualToVarianceOnBothBranches() {
    // A Poisson variable's mean and variance both equal its parameter (any probability handbook).
    SplittableRandom random = new SplittableRandom(17);
    for (double lambda : new double[] {0.5, 3, 9.9, 10, 50, 400, 5000}) {
      int n = 40000;
      double sum = 0;
      double sumSq = 0;
      for (int i = 0; i < n; i++) {
        int k = Randoms.poisson(random, lambda);
        assertThat(k).isNotNegative();
        sum += k;
        sumSq += (double) k * k;
      }
      double mean = sum / n;
      double var = sumSq / n - mean * mean;
      // tolerance: 5 standard errors of the mean, and 5 % for the variance
      assertThat(mean)
          .as("mean at %s", lambda)
          .isCloseTo(lambda, within(5 * Math.sqrt(lambda / n)));
      assertThat(var / lambda).as("variance at %s", lambda).isCloseTo(1.0, within(0.05));
    }
  }

  @Test
  void logFactorialMatchesTheExactSumPastTheSwitch() {
    double exact = 0;
    for (int k = 2; k <= 60; k++) {
      exact += Math.log(k);
      assertThat(Randoms.logFactorial(k)).as("ln %d!", k).isCloseTo(exact, within(1e-9 * exact));
    }
  }
}
