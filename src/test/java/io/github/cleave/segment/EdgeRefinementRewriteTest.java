package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The edge refinement with its band prepared in fewer passes ({@link EdgeZones}, levels kept per
 * source) gives the same mask and flow as the implementation before that change ({@link
 * EdgeRefinementReference}), on random noisy blob images, planes and stacks (with and without a
 * reach along z, cut as a volume or plane by plane), one or two channels, random cuts and seeds.
 */
class EdgeRefinementRewriteTest {

  @Test
  void sameMaskAndFlowAsBeforeTheRewrite() {
    SplittableRandom random = new SplittableRandom(2026_12_03L);
    for (int trial = 0; trial < 150; trial++) {
      boolean stack = random.nextInt(3) == 0;
      int w = 8 + random.nextInt(40);
      int h = 8 + random.nextInt(40);
      int d = stack ? 2 + random.nextInt(7) : 1;
      int n = w * h * d;
      int channels = random.nextInt(4) == 0 ? 2 : 1;
      float[][] values = new float[channels][n];
      byte[] mask = new byte[n];
      int blobs = 1 + random.nextInt(5);
      double[][] centre = new double[blobs][4];
      for (double[] c : centre) {
        c[0] = random.nextDouble() * w;
        c[1] = random.nextDouble() * h;
        c[2] = random.nextDouble() * d;
        c[3] = 2 + random.nextDouble() * 8;
      }
      boolean whole = random.nextBoolean(); // whole numbers (table path) or fractions
      for (int p = 0; p < n; p++) {
        int x = p % w;
        int y = p / w % h;
        int z = p / (w * h);
        boolean in = false;
        for (double[] c : centre) {
          double dx = x - c[0];
          double dy = y - c[1];
          double dz = (z - c[2]) * 2;
          in |= dx * dx + dy * dy + dz * dz < c[3] * c[3];
        }
        for (int k = 0; k < channels; k++) {
          double v = (in ? 120 + 40 * k : 30) + 15 * random.nextGaussian();
          values[k][p] = (float) (whole ? Math.rint(Math.max(0, v)) : v);
        }
        boolean cut = random.nextInt(12) == 0 ? !in : in; // a cut with some wrong voxels
        mask[p] = cut ? (byte) 255 : 0;
      }
      byte[] labels = new byte[n];
      for (int p = 0; p < n; p++) {
        if (random.nextInt(40) == 0) {
          labels[p] = (byte) (1 + random.nextInt(2));
        }
      }
      double zSpacing = stack ? 0.3 + 3 * random.nextDouble() : 1;
      VoxelSize size = new VoxelSize(1, 1, zSpacing, "um", false);
      Raster image =
          new Raster(w, h, d, values, size, whole ? PixelKind.GREY16 : PixelKind.FLOAT32);
      boolean perPlane = stack && random.nextInt(3) == 0; // then a plane's neighbourhood
      Neighborhood nb =
          stack && !perPlane
              ? Neighborhood.of(new int[] {6, 18, 26}[random.nextInt(3)])
              : Neighborhood.of(new int[] {4, 8, 16}[random.nextInt(3)]);
      EnergyParameters parameters =
          new EnergyParameters(
              0.5 + 5 * random.nextDouble(), 5 + 30 * random.nextDouble(), nb, size);
      SeedLabels seeds = new SeedLabels(w, h, d, labels);
      Segmenter.CutOutcome now =
          EdgeRefinement.refine(image, mask.clone(), seeds, parameters, perPlane);
      Segmenter.CutOutcome before =
          EdgeRefinementReference.refine(image, mask.clone(), seeds, parameters, perPlane);
      assertThat(now.mask()).as("trial %d", trial).isEqualTo(before.mask());
      assertThat(now.flow()).as("trial %d", trial).isEqualTo(before.flow());
    }
  }
}
