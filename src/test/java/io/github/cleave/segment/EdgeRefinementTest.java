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
 * Edge placement on blurred discs and ellipsoids with known levels: the refined cut should follow
 * the half-maximum contour of the noise-free image (the half-maximum edge: common practice in
 * microscopy, no source), change nothing outside its band and keep the seeds.
 */
class EdgeRefinementTest {

  @Test
  void aHaloedCutMovesToTheHalfMaximumContour() {
    SplittableRandom random = new SplittableRandom(41);
    for (int trial = 0; trial < 8; trial++) {
      int w = 96;
      int h = 80;
      double[] clean = new double[w * h];
      double background = 20 + 40 * random.nextDouble();
      double[] levels = {100 + 300 * random.nextDouble(), 100 + 300 * random.nextDouble()};
      double[][] discs = {
        {30, 40, 8 + 4 * random.nextDouble()}, {66, 38, 8 + 4 * random.nextDouble()}
      };
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          clean[x + w * y] = background;
          for (int k = 0; k < 2; k++) {
            double dx = x - discs[k][0];
            double dy = y - discs[k][1];
            if (dx * dx + dy * dy < discs[k][2] * discs[k][2]) {
              clean[x + w * y] = levels[k];
            }
          }
        }
      }
      double[] blurred = Blur.gaussian(clean, w, h, 1, 1.3, 0);
      float[] noisy = new float[w * h];
      byte[] halfMax = new byte[w * h];
      for (int i = 0; i < noisy.length; i++) {
        noisy[i] = (float) (blurred[i] + 3 * normal(random));
      }
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          int k = x < w / 2 ? 0 : 1;
          halfMax[x + w * y] = blurred[x + w * y] >= (levels[k] + background) / 2 ? (byte) 255 : 0;
        }
      }
      byte[] haloed = Blur.dilateOnce(halfMax, w, h);
      Raster image = Raster.grey(w, h, 1, noisy, VoxelSize.PIXELS, PixelKind.FLOAT32);
      SeedLabels seeds = centreSeeds(w, h, 1, discs);
      byte[] refined =
          EdgeRefinement.refine(image, haloed, seeds, parameters(Neighborhood.of(8)), false).mask();
      assertThat(disagreement(refined, halfMax))
          .as("trial %d", trial)
          .isLessThan(disagreement(haloed, halfMax) / 4);
      assertUnchangedAwayFromTheCut(haloed, refined, w, h, 1, EdgeRefinement.BAND, 0);
      assertSeedsKept(refined, seeds);
    }
  }

  @Test
  void aStackRespectsTheCoarserSpacingAlongZ() {
    int w = 48;
    int h = 48;
    int d = 16;
    double[] clean = new double[w * h * d];
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          double u = (x - 24) / 12.0;
          double v = (y - 23) / 10.0;
          double t = (z - 7.5) / 4.5;
          clean[x + w * (y + h * z)] = u * u + v * v + t * t < 1 ? 300 : 40;
        }
      }
    }
    double[] blurred = Blur.gaussian(clean, w, h, d, 1.0, 1.0);
    SplittableRandom random = new SplittableRandom(7);
    float[] noisy = new float[clean.length];
    byte[] halfMax = new byte[clean.length];
    for (int i = 0; i < noisy.length; i++) {
      noisy[i] = (float) (blurred[i] + 3 * normal(random));
      halfMax[i] = blurred[i] >= 170 ? (byte) 255 : 0;
    }
    byte[] haloed = Blur.dilateOnce(halfMax, w, h);
    VoxelSize size = new VoxelSize(0.2, 0.2, 0.6, "um", false);
    Raster image = Raster.grey(w, h, d, noisy, size, PixelKind.FLOAT32);
    SeedLabels seeds = centreSeeds(w, h, d, new double[][] {{24, 23, 3}});
    byte[] refined =
        EdgeRefinement.refine(image, haloed, seeds, parameters(Neighborhood.of(6), size), false)
            .mask();
    assertThat(disagreement(refined, halfMax)).isLessThan(disagreement(haloed, halfMax) / 4);
    // two pixel widths of 0.2 are 0.4 along z, rounded to one plane of 0.6
    assertUnchangedAwayFromTheCut(haloed, refined, w, h, d, EdgeRefinement.BAND, 1);
    assertSeedsKept(refined, seeds);
  }

  @Test
  void dilationIsTheProductOfADiamondAndASegment() {
    SplittableRandom random = new SplittableRandom(3);
    for (int trial = 0; trial < 30; trial++) {
      int w = 3 + random.nextInt(10);
      int h = 3 + random.nextInt(10);
      int d = 1 + random.nextInt(5);
      int rxy = random.nextInt(4);
      int rz = random.nextInt(3);
      boolean[] set = new boolean[w * h * d];
      for (int i = 0; i < set.length; i++) {
        set[i] = random.nextInt(12) == 0;
      }
      boolean[] fast = EdgeRefinement.dilate(set, w, h, d, rxy, rz);
      for (int i = 0; i < set.length; i++) {
        boolean expected = false;
        for (int j = 0; j < set.length && !expected; j++) {
          int dx = Math.abs(i % w - j % w);
          int dy = Math.abs(i / w % h - j / w % h);
          int dz = Math.abs(i / (w * h) - j / (w * h));
          expected = set[j] && dx + dy <= rxy && dz <= rz;
        }
        assertThat(fast[i]).as("trial %d voxel %d", trial, i).isEqualTo(expected);
      }
    }
  }

  private static EnergyParameters parameters(Neighborhood nb) {
    return parameters(nb, VoxelSize.PIXELS);
  }

  private static EnergyParameters parameters(Neighborhood nb, VoxelSize size) {
    return new EnergyParameters(SegmentationSettings.DEFAULT_BOUNDARY_PENALTY, 20, nb, size);
  }

  /**
   * A foreground seed at each centre (half-width a third of the radius, middle plane) and corners.
   */
  private static SeedLabels centreSeeds(int w, int h, int d, double[][] discs) {
    byte[] labels = new byte[w * h * d];
    int z = d / 2;
    for (double[] c : discs) {
      int r = (int) (c[2] / 3);
      for (int y = (int) c[1] - r; y <= (int) c[1] + r; y++) {
        for (int x = (int) c[0] - r; x <= (int) c[0] + r; x++) {
          labels[x + w * (y + h * z)] = SeedLabels.FOREGROUND;
        }
      }
    }
    for (int y = 0; y < 3; y++) {
      for (int x = 0; x < 3; x++) {
        labels[x + w * y] = SeedLabels.BACKGROUND;
      }
    }
    return new SeedLabels(w, h, d, labels);
  }

  private static long disagreement(byte[] a, byte[] b) {
    long count = 0;
    for (int i = 0; i < a.length; i++) {
      if ((a[i] != 0) != (b[i] != 0)) {
        count++;
      }
    }
    return count;
  }

  private static void assertUnchangedAwayFromTheCut(
      byte[] before, byte[] after, int w, int h, int d, int bandXy, int bandZ) {
    boolean[] boundary = new boolean[before.length];
    for (int p = 0; p < before.length; p++) {
      int x = p % w;
      int y = p / w % h;
      int z = p / (w * h);
      boolean fg = before[p] != 0;
      boundary[p] =
          x > 0 && (before[p - 1] != 0) != fg
              || x < w - 1 && (before[p + 1] != 0) != fg
              || y > 0 && (before[p - w] != 0) != fg
              || y < h - 1 && (before[p + w] != 0) != fg
              || z > 0 && (before[p - w * h] != 0) != fg
              || z < d - 1 && (before[p + w * h] != 0) != fg;
    }
    boolean[] band = EdgeRefinement.dilate(boundary, w, h, d, bandXy, bandZ);
    for (int p = 0; p < before.length; p++) {
      if (!band[p]) {
        assertThat(after[p]).as("voxel %d outside the band", p).isEqualTo(before[p]);
      }
    }
  }

  private static void assertSeedsKept(byte[] mask, SeedLabels seeds) {
    for (int p = 0; p < mask.length; p++) {
      if (seeds.label(p) == SeedLabels.FOREGROUND) {
        assertThat(mask[p]).isNotZero();
      } else if (seeds.label(p) == SeedLabels.BACKGROUND) {
        assertThat(mask[p]).isZero();
      }
    }
  }

  private static double normal(SplittableRandom random) {
    double u = 1 - random.nextDouble();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random.nextDouble());
  }

  /** Test helpers: separable Gaussian blur (edges replicated) and a 4-neighbour dilation. */
  private static final class Blur {
    static double[] gaussian(double[] in, int w, int h, int d, double sxy, double sz) {
      double[] out = axis(in, w, h, d, sxy, 1, w);
      out = axis(out, w, h, d, sxy, w, h);
      return axis(out, w, h, d, sz, w * h, d);
    }

    private static double[] axis(
        double[] in, int w, int h, int d, double sigma, int stride, int length) {
      if (sigma <= 0 || length == 1) {
        return in.clone();
      }
      int r = (int) Math.ceil(3.5 * sigma);
      double[] kernel = new double[2 * r + 1];
      double sum = 0;
      for (int i = -r; i <= r; i++) {
        kernel[i + r] = Math.exp(-0.5 * i * i / (sigma * sigma));
        sum += kernel[i + r];
      }
      double[] out = new double[in.length];
      for (int p = 0; p < in.length; p++) {
        int i = p / stride % length;
        int base = p - i * stride;
        double acc = 0;
        for (int k = -r; k <= r; k++) {
          int j = Math.min(length - 1, Math.max(0, i + k));
          acc += kernel[k + r] * in[base + j * stride];
        }
        out[p] = acc / sum;
      }
      return out;
    }

    /** One step of dilation in the plane (4-neighbours): a one-pixel halo all round. */
    static byte[] dilateOnce(byte[] mask, int w, int h) {
      byte[] out = mask.clone();
      for (int p = 0; p < mask.length; p++) {
        int x = p % w;
        int y = p / w % h;
        if (mask[p] == 0
            && (x > 0 && mask[p - 1] != 0
                || x < w - 1 && mask[p + 1] != 0
                || y > 0 && mask[p - w] != 0
                || y < h - 1 && mask[p + w] != 0)) {
          out[p] = (byte) 255;
        }
      }
      return out;
    }
  }
}
