package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The graph of {@link CutProblem} minimises the energy of DESIGN.md: on tiny random images the flow
 * value equals the smallest energy over every labelling that respects the seeds, found by
 * enumeration (max-flow min-cut theorem: Ford and Fulkerson, "Maximal flow through a network",
 * Canadian J. Math. 8, 1956), and the mask of the cut attains it. The energy is evaluated here from
 * its formula, independently of the graph construction.
 */
class CutProblemBruteForceTest {

  @Test
  void flowEqualsMinimumEnergyOverAllLabellingsIn2d() {
    SplittableRandom random = new SplittableRandom(20261202L);
    for (int trial = 0; trial < 150; trial++) {
      int w = 2 + random.nextInt(3);
      int h = 2 + random.nextInt(3);
      Neighborhood nb = random.nextBoolean() ? Neighborhood.N4 : Neighborhood.N8;
      check(random, w, h, 1, nb);
    }
  }

  @Test
  void flowEqualsMinimumEnergyOverAllLabellingsIn3dWithAnisotropicVoxels() {
    SplittableRandom random = new SplittableRandom(7L);
    Neighborhood[] choices = {Neighborhood.N6, Neighborhood.N18, Neighborhood.N26};
    for (int trial = 0; trial < 60; trial++) {
      check(random, 2, 2 + random.nextInt(2), 2, choices[random.nextInt(3)]);
    }
  }

  private static void check(SplittableRandom random, int w, int h, int d, Neighborhood nb) {
    int n = w * h * d;
    float[] values = new float[n];
    float[] fgCost = new float[n];
    float[] bgCost = new float[n];
    byte[] seeds = new byte[n];
    for (int p = 0; p < n; p++) {
      values[p] = (float) (random.nextDouble() * 100);
      fgCost[p] = (float) (random.nextDouble() * 8);
      bgCost[p] = (float) (random.nextDouble() * 8);
      int s = random.nextInt(10);
      seeds[p] = (byte) (s == 0 ? 1 : s == 1 ? 2 : 0);
    }
    VoxelSize size =
        new VoxelSize(1, 1 + random.nextDouble(), 1 + 2 * random.nextDouble(), "um", false);
    Raster image = Raster.grey(w, h, d, values, size, PixelKind.FLOAT32);
    EnergyParameters parameters =
        new EnergyParameters(random.nextDouble() * 5, 5 + random.nextDouble() * 40, nb, size);
    CutProblem problem =
        CutProblem.build(image, fgCost, bgCost, new SeedLabels(w, h, d, seeds), parameters, true);
    MaxFlowResult result = problem.solve();
    assertThat(problem.solver().checkCertificate()).isTrue();

    VoxelSize s = parameters.voxelSize();
    double[] lengthWeight = LengthWeights.of(nb, 1, s.y() / s.x(), s.z() / s.x());
    long best = Long.MAX_VALUE;
    for (int labelling = 0; labelling < (1 << n); labelling++) {
      if (respectsSeeds(labelling, seeds)) {
        best =
            Math.min(
                best, energy(labelling, seeds, image, fgCost, bgCost, parameters, lengthWeight));
      }
    }
    assertThat(result.flowValue()).isEqualTo(best);
    int cutLabelling = 0;
    for (int p = 0; p < n; p++) {
      if (result.isSourceSide(p)) {
        cutLabelling |= 1 << p;
      }
    }
    assertThat(respectsSeeds(cutLabelling, seeds)).isTrue();
    assertThat(energy(cutLabelling, seeds, image, fgCost, bgCost, parameters, lengthWeight))
        .isEqualTo(best);
  }

  private static boolean respectsSeeds(int labelling, byte[] seeds) {
    for (int p = 0; p < seeds.length; p++) {
      boolean fg = (labelling >> p & 1) == 1;
      if (seeds[p] == 1 && !fg || seeds[p] == 2 && fg) {
        return false;
      }
    }
    return true;
  }

  /** E(L) in capacity units, straight from the formula of DESIGN.md (seeds cost nothing). */
  private static long energy(
      int labelling,
      byte[] seeds,
      Raster image,
      float[] fgCost,
      float[] bgCost,
      EnergyParameters parameters,
      double[] lengthWeight) {
    int w = image.width();
    int h = image.height();
    int d = image.depth();
    float[] v = image.channel(0);
    Neighborhood nb = parameters.neighborhood();
    double sigma = parameters.contrastScale();
    long e = 0;
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          int p = x + w * (y + h * z);
          boolean fg = (labelling >> p & 1) == 1;
          if (seeds[p] == 0) {
            e += Math.rint(256.0 * (fg ? fgCost[p] : bgCost[p]));
          }
          for (int k = 0; k < nb.size(); k += 2) {
            int qx = x + nb.dx(k);
            int qy = y + nb.dy(k);
            int qz = z + nb.dz(k);
            if (qx < 0 || qy < 0 || qz < 0 || qx >= w || qy >= h || qz >= d) {
              continue;
            }
            int q = qx + w * (qy + h * qz);
            if (fg != ((labelling >> q & 1) == 1)) {
              double diff = (double) v[p] - v[q];
              e +=
                  Math.rint(
                      parameters.boundaryPenalty()
                          * lengthWeight[k]
                          * 256.0
                          * Math.exp(-diff * diff / (2 * sigma * sigma)));
            }
          }
        }
      }
    }
    return e;
  }
}
