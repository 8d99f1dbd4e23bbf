package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * {@link PottsEnergy} evaluates the energy of DESIGN.md with [L_p != L_q]: checked against the
 * formula evaluated independently ({@link PottsCases#energy}) and, for two classes, against the
 * flow value of {@link CutProblem} (max-flow min-cut theorem: Ford and Fulkerson, Canadian J. Math.
 * 8, 1956: the flow value is the energy of the labelling its cut gives).
 */
class PottsEnergyTest {
  private static final Neighborhood[] PLANE = {Neighborhood.N4, Neighborhood.N8, Neighborhood.N16};
  private static final Neighborhood[] STACK = {Neighborhood.N6, Neighborhood.N18, Neighborhood.N26};

  @Test
  void energyEqualsTheFormulaOnRandomLabellings() {
    SplittableRandom random = new SplittableRandom(31L);
    for (int trial = 0; trial < 200; trial++) {
      boolean stack = trial % 3 == 0;
      int classes = 2 + random.nextInt(5);
      PottsCases.Case c =
          stack
              ? PottsCases.random(
                  random,
                  3 + random.nextInt(4),
                  3 + random.nextInt(4),
                  2 + random.nextInt(3),
                  STACK[random.nextInt(3)],
                  classes,
                  0.1)
              : PottsCases.random(
                  random,
                  3 + random.nextInt(9),
                  3 + random.nextInt(9),
                  1,
                  PLANE[random.nextInt(3)],
                  classes,
                  0.1);
      PottsEnergy energy = c.energy();
      long[][] pairs = PottsCases.pairs(c);
      assertThat(energy.classCount()).isEqualTo(classes);
      assertThat(energy.size()).isEqualTo(c.size());
      for (int i = 0; i < 5; i++) {
        byte[] labels = PottsCases.randomLabels(random, c, classes);
        assertThat(energy.energy(labels)).isEqualTo(PottsCases.energy(c, pairs, labels));
      }
    }
  }

  @Test
  void brokenSeedGivesTheLargestEnergy() {
    SplittableRandom random = new SplittableRandom(5L);
    PottsCases.Case c = PottsCases.random(random, 6, 5, 1, Neighborhood.N8, 3, 0.3);
    byte[] labels = PottsCases.randomLabels(random, c, 3);
    int seeded = 0;
    while (c.seeds().label(seeded) == 0) {
      seeded++;
    }
    labels[seeded] = (byte) (1 + c.seeds().label(seeded) % 3);
    assertThat(c.energy().energy(labels)).isEqualTo(Long.MAX_VALUE);
  }

  /** With K = 2 the energy of the minimum cut's labelling is the flow value. */
  @Test
  void twoClassEnergyOfTheCutIsTheFlowValue() {
    SplittableRandom random = new SplittableRandom(8L);
    for (int trial = 0; trial < 100; trial++) {
      boolean stack = trial % 2 == 0;
      PottsCases.Case c =
          stack
              ? PottsCases.random(random, 5, 4, 3, STACK[random.nextInt(3)], 2, 0.1)
              : PottsCases.random(random, 9, 7, 1, PLANE[random.nextInt(3)], 2, 0.1);
      CutProblem cut =
          CutProblem.build(c.image(), c.costs()[0], c.costs()[1], c.seeds(), c.parameters(), true);
      MaxFlowResult result = cut.solve();
      assertThat(cut.solver().checkCertificate()).isTrue();
      byte[] labels = new byte[c.size()];
      for (int p = 0; p < labels.length; p++) {
        labels[p] = (byte) (result.isSourceSide(p) ? 1 : 2);
      }
      PottsEnergy energy = c.energy();
      assertThat(energy.energy(labels)).isEqualTo(result.flowValue());
      assertThat(energy.hardCapacity()).isEqualTo(cut.hardCapacity());
    }
  }

  @Test
  void cheapestLabelsTakeTheLowestQuantisedCostTiesToTheLowerClassAndKeepSeeds() {
    int n = 5;
    float[][] costs = {
      {1, 2, 3, 1, 0.5f}, // 256, 512, 768, 256, 128
      {1, 1, 3, 1.001f, 0.4f}, // 256, 256, 768, 256 (rounded: a tie), 102
      {2, 1, 3, 2, 0.1f}, // 512, 256, 768, 512, 26
    };
    byte[] seeds = {0, 0, 0, 0, 1};
    Raster image = Raster.grey(n, 1, 1, new float[n], VoxelSize.PIXELS, PixelKind.FLOAT32);
    EnergyParameters parameters = new EnergyParameters(1, 10, Neighborhood.N4, VoxelSize.PIXELS);
    PottsEnergy energy =
        PottsEnergy.build(image, costs, new SeedLabels(n, 1, 1, seeds), parameters);
    assertThat(energy.cheapestLabels()).containsExactly(1, 2, 1, 1, 1);
  }

  @Test
  void refusesMismatchedInput() {
    Raster image = Raster.grey(3, 2, 1, new float[6], VoxelSize.PIXELS, PixelKind.FLOAT32);
    EnergyParameters parameters = new EnergyParameters(1, 10, Neighborhood.N4, VoxelSize.PIXELS);
    SeedLabels none = SeedLabels.empty(3, 2, 1);
    assertThatThrownBy(() -> PottsEnergy.build(image, new float[1][6], none, parameters))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("1 classes");
    assertThatThrownBy(
            () ->
                PottsEnergy.build(
                    image, new float[][] {new float[6], new float[5]}, none, parameters))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("class 2 has 5");
    SeedLabels third = new SeedLabels(3, 2, 1, new byte[] {0, 0, 3, 0, 0, 0});
    assertThatThrownBy(() -> PottsEnergy.build(image, new float[2][6], third, parameters))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("seed label 3 at voxel 2");
    PottsEnergy energy = PottsEnergy.build(image, new float[3][6], third, parameters);
    assertThatThrownBy(() -> energy.energy(new byte[] {1, 1, 3, 4, 1, 1}))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("label 4 at voxel 3");
    assertThatThrownBy(() -> energy.energy(new byte[5]))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("5 labels for 6 voxels");
    EnergyParameters stack = new EnergyParameters(1, 10, Neighborhood.N6, VoxelSize.PIXELS);
    assertThatThrownBy(() -> PottsEnergy.build(image, new float[2][6], none, stack))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("does not fit");
  }
}
