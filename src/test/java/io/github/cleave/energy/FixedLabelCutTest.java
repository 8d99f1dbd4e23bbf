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
 * The graph of the free voxels gives the cut of the whole grid with the fixed voxels as hard seeds:
 * the same mask, and a flow smaller by exactly the boundary between fixed foreground and fixed
 * background voxels (a pair term with one label known is a unary term: Kolmogorov and Zabih, IEEE
 * TPAMI 26(2), 2004). The whole-grid cut is itself checked against enumeration in {@code
 * CutProblemBruteForceTest}.
 */
class FixedLabelCutTest {
  @Test
  void equalsTheWholeGridCutWithFixedVoxelsAsSeedsIn2d() {
    SplittableRandom random = new SplittableRandom(20261202L);
    Neighborhood[] choices = {Neighborhood.N4, Neighborhood.N8, Neighborhood.N16};
    for (int trial = 0; trial < 200; trial++) {
      check(random, 3 + random.nextInt(30), 3 + random.nextInt(30), 1, choices[trial % 3]);
    }
  }

  @Test
  void equalsTheWholeGridCutWithFixedVoxelsAsSeedsIn3d() {
    SplittableRandom random = new SplittableRandom(11L);
    Neighborhood[] choices = {Neighborhood.N6, Neighborhood.N18, Neighborhood.N26};
    for (int trial = 0; trial < 90; trial++) {
      check(
          random,
          3 + random.nextInt(9),
          3 + random.nextInt(9),
          2 + random.nextInt(5),
          choices[trial % 3]);
    }
  }

  private static void check(SplittableRandom random, int w, int h, int d, Neighborhood nb) {
    int n = w * h * d;
    int channels = random.nextInt(4) == 0 ? 2 : 1;
    boolean integers = random.nextBoolean(); // whole numbers take the table by difference
    float[][] values = new float[channels][n];
    float[] fgCost = new float[n];
    float[] bgCost = new float[n];
    byte[] fixed = new byte[n];
    int freeShare = 1 + random.nextInt(9);
    for (int p = 0; p < n; p++) {
      for (int c = 0; c < channels; c++) {
        double v = random.nextDouble() * 300;
        values[c][p] = integers ? (float) Math.floor(v) : (float) v;
      }
      fgCost[p] = (float) (random.nextDouble() * 6);
      bgCost[p] = (float) (random.nextDouble() * 6);
      if (random.nextInt(10) >= freeShare) {
        fixed[p] = (byte) (random.nextBoolean() ? SeedLabels.FOREGROUND : SeedLabels.BACKGROUND);
      }
    }
    VoxelSize size = new VoxelSize(1, 1, 1 + 2 * random.nextDouble(), "um", false);
    Raster image =
        new Raster(w, h, d, values, size, channels == 1 ? PixelKind.GREY16 : PixelKind.FLOAT32);
    EnergyParameters parameters =
        new EnergyParameters(
            0.5 + random.nextDouble() * 4, 10 + random.nextDouble() * 60, nb, size);
    SeedLabels labels = new SeedLabels(w, h, d, fixed);

    CutProblem grid = CutProblem.build(image, fgCost, bgCost, labels, parameters, true);
    MaxFlowResult wholeResult = grid.solve();
    for (boolean compact : new boolean[] {false, true}) { // both representations
      FixedLabelCut part = FixedLabelCut.build(image, fgCost, bgCost, labels, parameters, compact);
      MaxFlowResult partResult = part.solve();
      assertThat(part.mask(partResult)).isEqualTo(CutProblem.mask(wholeResult));
      assertThat(wholeResult.flowValue() - part.flowValue(partResult))
          .isEqualTo(fixedBoundary(image, fixed, parameters));
    }
    int[] free = new int[n]; // the listed form: free voxels and their costs given
    float[] fgListed = new float[n];
    float[] bgListed = new float[n];
    int count = 0;
    for (int p = 0; p < n; p++) {
      if (fixed[p] == 0) {
        fgListed[count] = fgCost[p];
        bgListed[count] = bgCost[p];
        free[count++] = p;
      }
    }
    FixedLabelCut listed =
        FixedLabelCut.buildListed(
            image,
            Arrays.copyOf(free, count),
            Arrays.copyOf(fgListed, count),
            Arrays.copyOf(bgListed, count),
            labels,
            parameters);
    MaxFlowResult listedResult = listed.solve();
    assertThat(listed.mask(listedResult)).isEqualTo(CutProblem.mask(wholeResult));
    assertThat(wholeResult.flowValue() - listed.flowValue(listedResult))
        .isEqualTo(fixedBoundary(image, fixed, parameters));
  }

  @Test
  void theListedFormRefusesALabelledOrUnorderedList() {
    Raster image =
        Raster.grey(4, 4, 1, new float[16], new VoxelSize(1, 1, 1, "um", false), PixelKind.GREY16);
    EnergyParameters parameters = new EnergyParameters(1, 10, Neighborhood.N4, image.voxelSize());
    byte[] fixed = new byte[16];
    java.util.Arrays.fill(fixed, (byte) SeedLabels.BACKGROUND);
    fixed[5] = 0;
    fixed[6] = 0;
    SeedLabels labels = new SeedLabels(4, 4, 1, fixed);
    float[] costs = new float[2];
    org.assertj.core.api.Assertions.assertThatThrownBy(
            () ->
                FixedLabelCut.buildListed(
                    image, new int[] {5, 7}, costs, costs, labels, parameters))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("labelled 2");
    org.assertj.core.api.Assertions.assertThatThrownBy(
            () ->
                FixedLabelCut.buildListed(
                    image, new int[] {6, 5}, costs, costs, labels, parameters))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("out of order");
  }

  /** Σ B_pq over neighbour pairs with p fixed foreground and q fixed background, by the formula. */
  private static long fixedBoundary(Raster image, byte[] fixed, EnergyParameters parameters) {
    Neighborhood nb = parameters.neighborhood();
    double[] lengthWeight = parameters.lengthWeights();
    double sigma = parameters.contrastScale();
    int w = image.width();
    int h = image.height();
    long sum = 0;
    for (int p = 0; p < image.size(); p++) {
      if (fixed[p] != SeedLabels.FOREGROUND) {
        continue;
      }
      int x = p % w;
      int y = p / w % h;
      int z = p / (w * h);
      for (int k = 0; k < nb.size(); k++) {
        int qx = x + nb.dx(k);
        int qy = y + nb.dy(k);
        int qz = z + nb.dz(k);
        if (qx < 0 || qx >= w || qy < 0 || qy >= h || qz < 0 || qz >= image.depth()) {
          continue;
        }
        int q = qx + w * (qy + h * qz);
        if (fixed[q] == SeedLabels.BACKGROUND) {
          double sq = ContrastScale.squaredDifference(image, p, q);
          double scale =
              parameters.boundaryPenalty() * lengthWeight[k] * CapacityScale.UNITS_PER_NAT;
          sum += BoundaryArcs.capacity(scale, sq / (2 * sigma * sigma));
        }
      }
    }
    return sum;
  }
}
