package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * With two classes, one alpha-expansion run from the cheapest labels reaches the two-class minimum
 * cut of {@link CutProblem}: the energy is submodular, and a labelling that neither expansion
 * lowers is a global minimum (from the union and intersection with any optimum, by submodularity:
 * Kolmogorov and Zabih, IEEE TPAMI 26(2), 2004, for the submodular inequality). So the energy
 * reached equals the flow value of the cut (max-flow min-cut theorem), and the mask (class 1 =
 * foreground) contains the cut's minimal source set, equal to it unless minimum cuts tie. With
 * these seeds 98 of the 100 masks are identical; the two others are tied cuts of the same energy
 * (the expansion keeps a labelling unless a move lowers the energy strictly, so it need not end on
 * the smallest foreground). Started from the background instead, as the pipeline starts it, every
 * mask is identical.
 */
class AlphaExpansionTwoClassTest {

  @Test
  void planesWithEightNeighboursGiveTheMinimumCut() {
    SplittableRandom random = new SplittableRandom(937505L);
    int same = 0;
    for (int trial = 0; trial < 60; trial++) {
      same +=
          check(random, 10 + random.nextInt(25), 10 + random.nextInt(25), 1, Neighborhood.N8)
              ? 1
              : 0;
    }
    assertThat(same).isGreaterThanOrEqualTo(57); // the rest: tied minimum cuts, equal energies
  }

  @Test
  void stacksWithSixNeighboursGiveTheMinimumCut() {
    SplittableRandom random = new SplittableRandom(60L);
    for (int trial = 0; trial < 40; trial++) {
      check(
          random,
          5 + random.nextInt(8),
          5 + random.nextInt(8),
          2 + random.nextInt(6),
          Neighborhood.N6);
    }
  }

  /**
   * A blob image: a bright disc or ball on a dark ground with noise, regional costs from two
   * Gaussian likelihoods (negative log, shifted), a few seeds of each class, random λ.
   */
  private static boolean check(SplittableRandom random, int w, int h, int d, Neighborhood nb) {
    int n = w * h * d;
    float[] values = new float[n];
    float[][] costs = new float[2][n];
    byte[] seeds = new byte[n];
    double cx = w * random.nextDouble();
    double cy = h * random.nextDouble();
    double cz = d * random.nextDouble();
    double r = 2 + Math.min(w, h) * 0.3 * random.nextDouble();
    double noise = 10 + 40 * random.nextDouble();
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          int p = x + w * (y + h * z);
          double dist = Math.sqrt(sq(x - cx) + sq(y - cy) + sq(2 * (z - cz)));
          double v = (dist < r ? 150 : 60) + noise * random.nextGaussian();
          values[p] = (float) Math.rint(Math.max(0, Math.min(255, v)));
          costs[0][p] = (float) (sq((values[p] - 150) / 40) / 2);
          costs[1][p] = (float) (sq((values[p] - 60) / 40) / 2);
          if (random.nextInt(40) == 0) {
            seeds[p] = (byte) (dist < r - 1 ? 1 : dist > r + 1 ? 2 : 0);
          }
        }
      }
    }
    VoxelSize size = new VoxelSize(1, 1, d > 1 ? 2 : 1, "um", false);
    Raster image = Raster.grey(w, h, d, values, size, PixelKind.GREY8);
    EnergyParameters parameters =
        new EnergyParameters(
            0.5 + 8 * random.nextDouble(), 10 + 30 * random.nextDouble(), nb, size);
    SeedLabels seedLabels = new SeedLabels(w, h, d, seeds);

    CutProblem cut = CutProblem.build(image, costs[0], costs[1], seedLabels, parameters, true);
    MaxFlowResult result = cut.solve();
    assertThat(cut.solver().checkCertificate()).isTrue();
    PottsEnergy energy = PottsEnergy.build(image, costs, seedLabels, parameters);
    AlphaExpansion.Outcome outcome = AlphaExpansion.run(energy, energy.cheapestLabels(), 100);

    assertThat(outcome.energy()).isEqualTo(result.flowValue());
    byte[] mask = CutProblem.mask(result);
    byte[] fromExpansion = new byte[n];
    for (int p = 0; p < n; p++) {
      fromExpansion[p] = (byte) (outcome.labels()[p] == 1 ? 255 : 0);
    }
    // The minimal source set lies inside every minimum cut's source side (minimum cuts are closed
    // under intersection: Ford and Fulkerson, Flows in Networks, 1962; from memory), so the
    // expansion's foreground contains the cut's foreground, equal to it unless cuts tie.
    for (int p = 0; p < n; p++) {
      if (mask[p] != 0) {
        assertThat(fromExpansion[p]).isEqualTo(mask[p]);
      }
    }
    // From the background (seeds their class) the first move is the two-class cut itself, with the
    // same choice among tied cuts (the minimal source set), and no later move lowers its energy:
    // then the mask is identical in every case.
    byte[] background = seeds.clone();
    for (int p = 0; p < n; p++) {
      background[p] = background[p] == 0 ? 2 : background[p];
    }
    byte[] fromBackground = AlphaExpansion.run(energy, background, 100).labels();
    for (int p = 0; p < n; p++) {
      assertThat(fromBackground[p] == 1).isEqualTo(mask[p] != 0);
    }
    return Arrays.equals(fromExpansion, mask);
  }

  private static double sq(double v) {
    return v * v;
  }
}
