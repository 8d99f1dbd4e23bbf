package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.flow.Neighborhood;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * On tiny grids with three classes, alpha-expansion is compared with every labelling: its result is
 * within a factor 2 of the global minimum (Y. Boykov, O. Veksler and R. Zabih, "Fast approximate
 * energy minimization via graph cuts", IEEE TPAMI 23(11), 2001, Theorem 6.1: for the Potts model an
 * expansion local minimum is within 2 times the optimum), and no single expansion move, found by
 * enumerating all 2^n of them, lowers its energy (the definition of the local minimum, same paper,
 * Section 3). Energies come from the formula ({@link PottsCases#energy}), not from the graphs.
 */
class AlphaExpansionExhaustiveTest {
  private static final int CLASSES = 3;

  @Test
  void threeByThreeIsAnExpansionLocalMinimumWithinTwiceTheOptimum() {
    SplittableRandom random = new SplittableRandom(2001L);
    for (int trial = 0; trial < 60; trial++) {
      check(random, 3, 3, trial % 2 == 0 ? Neighborhood.N4 : Neighborhood.N8);
    }
  }

  @Test
  void fourByThreeIsAnExpansionLocalMinimumWithinTwiceTheOptimum() {
    SplittableRandom random = new SplittableRandom(2004L);
    for (int trial = 0; trial < 16; trial++) {
      check(random, 4, 3, trial % 2 == 0 ? Neighborhood.N4 : Neighborhood.N8);
    }
  }

  private static void check(SplittableRandom random, int w, int h, Neighborhood nb) {
    // Strong boundaries now and then, so that the local minimum is not simply the cheapest labels.
    PottsCases.Case c = PottsCases.random(random, w, h, 1, nb, CLASSES, 0.1);
    if (random.nextBoolean()) {
      c =
          new PottsCases.Case(
              c.image(),
              c.costs(),
              c.seeds(),
              new EnergyParameters(
                  5 + 20 * random.nextDouble(), 1000, nb, c.parameters().voxelSize()));
    }
    PottsEnergy energy = c.energy();
    long[][] pairs = PottsCases.pairs(c);
    AlphaExpansion.Outcome outcome = AlphaExpansion.run(energy, energy.cheapestLabels(), 100);

    byte[] result = outcome.labels();
    long reached = PottsCases.energy(c, pairs, result);
    assertThat(outcome.energy()).isEqualTo(reached);
    long optimum = optimum(c, pairs, w * h);
    assertThat(reached).isGreaterThanOrEqualTo(optimum).isLessThanOrEqualTo(2 * optimum);
    for (int alpha = 1; alpha <= CLASSES; alpha++) {
      assertThat(bestExpansion(c, pairs, result, alpha)).isGreaterThanOrEqualTo(reached);
    }
  }

  /** The smallest energy over all K^n labellings, in odometer order. */
  private static long optimum(PottsCases.Case c, long[][] pairs, int n) {
    byte[] labels = new byte[n];
    java.util.Arrays.fill(labels, (byte) 1);
    long best = Long.MAX_VALUE;
    while (true) {
      best = Math.min(best, PottsCases.energy(c, pairs, labels));
      int p = 0;
      while (p < n && labels[p] == CLASSES) {
        labels[p++] = 1;
      }
      if (p == n) {
        return best;
      }
      labels[p]++;
    }
  }

  /** The smallest energy over every labelling one expansion of alpha away from {@code labels}. */
  private static long bestExpansion(PottsCases.Case c, long[][] pairs, byte[] labels, int alpha) {
    int n = labels.length;
    long best = Long.MAX_VALUE;
    byte[] moved = new byte[n];
    for (int subset = 0; subset < 1 << n; subset++) {
      for (int p = 0; p < n; p++) {
        moved[p] = (subset >> p & 1) == 1 ? (byte) alpha : labels[p];
      }
      best = Math.min(best, PottsCases.energy(c, pairs, moved));
    }
    return best;
  }
}
