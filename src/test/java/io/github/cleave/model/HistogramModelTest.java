package io.github.cleave.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class HistogramModelTest {

  /** Seeds from N(60, 10) (foreground) and N(180, 15) (background), 8-bit, plus unseeded voxels. */
  private static Raster twoDistributions(SplittableRandom rng, byte[] labels) {
    float[] v = new float[labels.length];
    for (int i = 0; i < v.length; i++) {
      double x =
          i % 3 == 0
              ? 60 + 10 * rng.nextGaussian()
              : i % 3 == 1 ? 180 + 15 * rng.nextGaussian() : 0;
      labels[i] = (byte) (i % 3 == 2 ? 0 : i % 3 + 1);
      v[i] = (float) Math.max(0, Math.min(255, Math.rint(x)));
    }
    return TestImages.row(PixelKind.GREY8, v);
  }

  @Test
  void ownClassIsCheaperInsideItsRange() {
    for (long seed = 1; seed <= 20; seed++) {
      SplittableRandom rng = new SplittableRandom(seed);
      byte[] labels = new byte[600 + rng.nextInt(3000)];
      Raster r = twoDistributions(rng, labels);
      HistogramModel m =
          (HistogramModel) ModelLearner.learn(r, TestImages.seeds(labels), ModelKind.AUTO);
      assertThat(m.binCount()).isEqualTo(256);
      for (int v = 45; v <= 75; v++) {
        assertThat(m.cost(0, v)).as("value %d, seed %d", v, seed).isLessThan(m.cost(1, v));
      }
      for (int v = 160; v <= 200; v++) {
        assertThat(m.cost(1, v)).as("value %d, seed %d", v, seed).isLessThan(m.cost(0, v));
      }
    }
  }

  @Test
  void costIsMinusLogOfTheSmoothedFlooredHistogramOfASingleSample() {
    // Definition of the regional term (Boykov & Jolly, ICCV 2001): R = -ln Pr(I | class), with the
    // histogram smoothed by the documented kernel: a single sample in bin b gives
    // Pr(b + j) = (1 - eps) g(j) / sum g + eps / B with g(j) = exp(-j^2 / (2 sigma^2)), |j| <= 6.
    int bins = 64;
    double[] counts = new double[bins];
    counts[30] = 1;
    double[] p = HistogramModel.smoothedProbabilities(counts);
    double sigma = HistogramModel.SMOOTHING_SIGMA_BINS;
    double gsum = 0;
    for (int j = -6; j <= 6; j++) {
      gsum += Math.exp(-j * j / (2 * sigma * sigma));
    }
    double eps = HistogramModel.FLOOR_MASS;
    for (int b = 0; b < bins; b++) {
      int j = b - 30;
      double g = Math.abs(j) <= 6 ? Math.exp(-j * j / (2 * sigma * sigma)) / gsum : 0;
      assertThat(p[b]).isCloseTo((1 - eps) * g + eps / bins, within(1e-15));
    }
  }

  @Test
  void costsMatchAnIndependentlyComputedHistogramOnATinyExample() {
    // Eight bins over 0..8 (GREY16 values 0..7 give one bin per value); foreground values
    // {1, 1, 2, 5}, background {6, 7, 7}. Expected: -ln of the smoothed (mass folded back at the
    // ends), normalised, floored histogram (Boykov & Jolly 2001 definition; recipe in the
    // HistogramModel class comment).
    float[] v = {1, 1, 2, 5, 6, 7, 7, 0, 3, 4};
    byte[] labels = {1, 1, 1, 1, 2, 2, 2, 0, 0, 0};
    Raster r = TestImages.row(PixelKind.GREY16, v);
    HistogramModel m =
        (HistogramModel) ModelLearner.learn(r, TestImages.seeds(labels), ModelKind.HISTOGRAM);
    assertThat(m.binCount()).isEqualTo(8);
    double[][] expected = {
      expectedProbabilities(new int[] {1, 1, 2, 5}, 8),
      expectedProbabilities(new int[] {6, 7, 7}, 8)
    };
    float[][] out = TestImages.costs(m, r);
    for (int c = 0; c < 2; c++) {
      for (int i = 0; i < v.length; i++) {
        double want = Math.min(LikelihoodModel.MAX_COST, -Math.log(expected[c][(int) v[i]]));
        assertThat((double) out[c][i])
            .as("class %d value %s", c, v[i])
            .isCloseTo(want, within(1e-5));
      }
    }
  }

  private static double[] expectedProbabilities(int[] samples, int bins) {
    double sigma = HistogramModel.SMOOTHING_SIGMA_BINS;
    double[] h = new double[bins];
    double norm = 0;
    for (int j = -6; j <= 6; j++) {
      norm += Math.exp(-j * j / (2 * sigma * sigma));
    }
    for (int s : samples) {
      for (int j = -6; j <= 6; j++) {
        int t = Math.min(bins - 1, Math.max(0, s + j));
        h[t] += Math.exp(-j * j / (2 * sigma * sigma)) / norm;
      }
    }
    double eps = HistogramModel.FLOOR_MASS;
    for (int b = 0; b < bins; b++) {
      h[b] = (1 - eps) * h[b] / samples.length + eps / bins;
    }
    return h;
  }

  @Test
  void unseenValuesCostALargeFiniteAmountAndAllCostsAreBounded() {
    SplittableRandom rng = new SplittableRandom(7);
    byte[] labels = new byte[900];
    Raster r = twoDistributions(rng, labels);
    HistogramModel m =
        (HistogramModel) ModelLearner.learn(r, TestImages.seeds(labels), ModelKind.AUTO);
    float[] probe = new float[256 + 4];
    for (int i = 0; i < 256; i++) {
      probe[i] = i;
    }
    probe[256] = -1000;
    probe[257] = 1e9f;
    probe[258] = Float.POSITIVE_INFINITY;
    probe[259] = Float.NEGATIVE_INFINITY;
    float[][] out = TestImages.costs(m, TestImages.row(PixelKind.GREY8, probe));
    for (float[] row : out) {
      for (float c : row) {
        assertThat(c).isFinite().isBetween(0f, (float) LikelihoodModel.MAX_COST);
      }
    }
    // 255 is far from both ranges: about ln 256 - ln 1e-6 = 19.4 nats for both classes.
    assertThat(out[0][255]).isGreaterThan(15f);
    assertThat(out[1][255]).isGreaterThan(15f);
    // Outside the range clamps to the end bins.
    assertThat(out[0][256]).isEqualTo(out[0][0]);
    assertThat(out[1][257]).isEqualTo(out[1][255]);
    assertThat(out[1][258]).isEqualTo(out[1][255]);
    assertThat(out[0][259]).isEqualTo(out[0][0]);
  }

  @Test
  void nanVoxelsCostNothingForEveryClass() {
    float[] v = {10, 10, 200, 200, Float.NaN, 10, Float.NaN};
    byte[] labels = {1, 1, 2, 2, 1, 3, 2};
    HistogramModel m =
        (HistogramModel)
            ModelLearner.learn(
                TestImages.row(PixelKind.FLOAT32, v), TestImages.seeds(labels), ModelKind.AUTO);
    assertThat(m.classCount()).isEqualTo(3);
    assertThat(m.low()).isEqualTo(10);
    assertThat(m.high()).isEqualTo(200);
    float[][] out = TestImages.costs(m, TestImages.row(PixelKind.FLOAT32, v));
    for (int c = 0; c < 3; c++) {
      assertThat(out[c][4]).isZero();
      assertThat(out[c][6]).isZero();
      assertThat(out[c][0]).isPositive();
    }
  }

  @Test
  void bulkCostsAgreeWithSingleValueCostsForSeveralClasses() {
    SplittableRandom rng = new SplittableRandom(11);
    for (int trial = 0; trial < 20; trial++) {
      int n = 200 + rng.nextInt(300);
      int classes = 2 + rng.nextInt(3);
      float[] v = new float[n];
      byte[] labels = new byte[n];
      for (int i = 0; i < n; i++) {
        v[i] = (float) (rng.nextDouble() * 1000 - 300);
        labels[i] = (byte) (i < classes ? i + 1 : rng.nextInt(classes + 1));
      }
      Raster r = TestImages.row(PixelKind.FLOAT32, v);
      HistogramModel m =
          (HistogramModel) ModelLearner.learn(r, TestImages.seeds(labels), ModelKind.AUTO);
      float[][] out = TestImages.costs(m, r);
      for (int c = 0; c < classes; c++) {
        for (int i = 0; i < n; i++) {
          assertThat(out[c][i]).isEqualTo(m.cost(c, v[i]));
          assertThat((double) out[c][i])
              .isCloseTo(-Math.log(m.probabilities(c)[m.bin(v[i])]), within(1e-5));
        }
      }
    }
  }

  @Test
  void wholeValuesOfAnEightBitImageHaveOneBinEach() {
    HistogramModel m =
        (HistogramModel)
            ModelLearner.learn(
                TestImages.row(PixelKind.GREY8, new float[] {3, 250}),
                TestImages.seeds(new byte[] {1, 2}),
                ModelKind.AUTO);
    for (int v = 0; v < 256; v++) {
      assertThat(m.bin(v)).isEqualTo(v);
    }
  }
}
