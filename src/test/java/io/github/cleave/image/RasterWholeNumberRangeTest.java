package io.github.cleave.image;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * {@link Raster#wholeNumberRange} against a plain reference over random channels: whole numbers of
 * every magnitude around the exact-float limit 2²⁴ (IEEE 754 single precision has a 24-bit
 * significand: the standard, from memory), fractions, NaN and infinities; and the kept value is the
 * same on every call. {@link Raster#wholeNumberMinimum} is the plain minimum where the range holds.
 */
class RasterWholeNumberRangeTest {
  private static final VoxelSize PIXELS = new VoxelSize(1, 1, 1, "pixel", true);

  @Test
  void equalsTheReferenceOnRandomChannels() {
    SplittableRandom random = new SplittableRandom(23L);
    for (int trial = 0; trial < 400; trial++) {
      int n = 1 + random.nextInt(60);
      float[] values = new float[n];
      int bound = random.nextBoolean() ? 70000 : (1 << 24) + 3;
      for (int i = 0; i < n; i++) {
        values[i] = random.nextInt(2 * bound + 1) - bound;
      }
      int spoil = random.nextInt(6);
      if (spoil == 1) {
        values[random.nextInt(n)] += 0.5f;
      } else if (spoil == 2) {
        values[random.nextInt(n)] = Float.NaN;
      } else if (spoil == 3) {
        values[random.nextInt(n)] = Float.NEGATIVE_INFINITY;
      }
      Raster image = Raster.grey(n, 1, 1, values, PIXELS, PixelKind.FLOAT32);
      int expected = reference(values);
      assertThat(image.wholeNumberRange(0)).as("trial %d", trial).isEqualTo(expected);
      assertThat(image.wholeNumberRange(0)).isEqualTo(expected);
      if (expected >= 0) { // the smallest value, found by the same pass
        float min = Float.POSITIVE_INFINITY;
        for (float v : values) {
          min = Math.min(min, v);
        }
        assertThat(image.wholeNumberMinimum(0)).as("trial %d", trial).isEqualTo((int) min);
      }
    }
  }

  /** Max − min when every value is finite, whole and at most 2²⁴ in magnitude; else -1. */
  private static int reference(float[] values) {
    double min = Double.POSITIVE_INFINITY;
    double max = Double.NEGATIVE_INFINITY;
    for (float v : values) {
      double x = v;
      if (Double.isNaN(x) || Double.isInfinite(x) || x != Math.floor(x) || Math.abs(x) > 16777216) {
        return -1;
      }
      min = Math.min(min, x);
      max = Math.max(max, x);
    }
    return (int) (max - min);
  }
}
