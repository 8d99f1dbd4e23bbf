package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.data.Offset.offset;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * σ² = ½ · mean squared neighbour difference (Rother, Kolmogorov and Blake, ACM Trans. Graphics
 * 23(3), 2004, from memory via ../shared/CHECKS.md; DESIGN.md).
 */
class ContrastScaleTest {

  @Test
  void checkerboardWithFourNeighboursHasUnitDifferences() {
    int w = 9;
    int h = 7;
    float[] v = new float[w * h];
    for (int y = 0; y < h; y++) {
      for (int x = 0; x < w; x++) {
        v[x + w * y] = (x + y) % 2;
      }
    }
    Raster r = Raster.grey(w, h, 1, v, VoxelSize.PIXELS, PixelKind.GREY8);
    // every 4-neighbour pair differs by 1: mean squared difference 1, sigma = sqrt(1/2)
    assertThat(ContrastScale.estimate(r, Neighborhood.N4)).isCloseTo(Math.sqrt(0.5), offset(1e-12));
  }

  @Test
  void matchesTheDefinitionOnRandomMultichannelImages() {
    SplittableRandom random = new SplittableRandom(5L);
    for (int trial = 0; trial < 40; trial++) {
      int w = 1 + random.nextInt(9);
      int h = 1 + random.nextInt(9);
      int d = random.nextBoolean() ? 1 : 1 + random.nextInt(4);
      Neighborhood nb = anyNeighborhood(random, d);
      int channels = 1 + random.nextInt(3);
      float[][] data = new float[channels][w * h * d];
      for (float[] c : data) {
        for (int i = 0; i < c.length; i++) {
          c[i] = (float) random.nextDouble(-50, 50);
        }
      }
      Raster r = new Raster(w, h, d, data, VoxelSize.PIXELS, PixelKind.FLOAT32);
      double sum = 0;
      long pairs = 0;
      for (int p = 0; p < w * h * d; p++) {
        int x = p % w;
        int y = p / w % h;
        int z = p / (w * h);
        for (int k = 0; k < nb.size(); k++) { // both directions: every pair twice
          int qx = x + nb.dx(k);
          int qy = y + nb.dy(k);
          int qz = z + nb.dz(k);
          if (qx >= 0 && qy >= 0 && qz >= 0 && qx < w && qy < h && qz < d) {
            int q = qx + w * (qy + h * qz);
            for (float[] c : data) {
              sum += ((double) c[p] - c[q]) * ((double) c[p] - c[q]);
            }
            pairs++;
          }
        }
      }
      double expected = pairs == 0 ? 0 : Math.sqrt(0.5 * sum / pairs);
      double actual = ContrastScale.estimate(r, nb);
      if (expected == 0) {
        assertThat(actual).isPositive().isLessThan(1e-300);
      } else {
        assertThat(actual).isCloseTo(expected, offset(1e-9 * expected));
      }
    }
  }

  @Test
  void wholeNumberImagesGiveTheDefinitionBitForBit() {
    // 8- and 16-bit values: every squared difference and every partial sum is a whole number below
    // 2^53, so the definition summed in doubles is exact and the estimate must equal it exactly.
    SplittableRandom random = new SplittableRandom(17L);
    for (int trial = 0; trial < 60; trial++) {
      int w = 1 + random.nextInt(40);
      int h = 1 + random.nextInt(40);
      int d = random.nextBoolean() ? 1 : 1 + random.nextInt(5);
      Neighborhood nb = anyNeighborhood(random, d);
      int top = random.nextBoolean() ? 255 : 65535;
      float[] v = new float[w * h * d];
      for (int i = 0; i < v.length; i++) {
        v[i] = random.nextInt(top + 1);
      }
      Raster r =
          Raster.grey(
              w, h, d, v, VoxelSize.PIXELS, top == 255 ? PixelKind.GREY8 : PixelKind.GREY16);
      double sum = 0;
      long pairs = 0;
      for (int p = 0; p < v.length; p++) {
        int x = p % w;
        int y = p / w % h;
        int z = p / (w * h);
        for (int k = 0; k < nb.size(); k += 2) {
          int qx = x + nb.dx(k);
          int qy = y + nb.dy(k);
          int qz = z + nb.dz(k);
          if (qx >= 0 && qy >= 0 && qz >= 0 && qx < w && qy < h && qz < d) {
            double diff = (double) v[p] - v[qx + w * (qy + h * qz)];
            sum += diff * diff;
            pairs++;
          }
        }
      }
      double mean = pairs == 0 ? 0 : sum / pairs;
      double expected = mean == 0 ? Double.MIN_NORMAL : Math.sqrt(0.5 * mean);
      assertThat(ContrastScale.estimate(r, nb)).isEqualTo(expected);
    }
  }

  /** One of the three neighbourhoods of a plane (d = 1) or of a stack, at random. */
  private static Neighborhood anyNeighborhood(SplittableRandom random, int d) {
    Neighborhood[] choice =
        d == 1
            ? new Neighborhood[] {Neighborhood.N4, Neighborhood.N8, Neighborhood.N16}
            : new Neighborhood[] {Neighborhood.N6, Neighborhood.N18, Neighborhood.N26};
    return choice[random.nextInt(3)];
  }
}
