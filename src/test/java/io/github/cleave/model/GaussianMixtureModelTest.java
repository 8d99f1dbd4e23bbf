package io.github.cleave.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class GaussianMixtureModelTest {

  /** A w x h 8-bit RGB image: a bright disk on a dim background, noisy; seeds in both. */
  private static Raster colourImage(SplittableRandom rng, int w, int h, double noise) {
    float[][] ch = new float[3][w * h];
    for (int i = 0; i < w * h; i++) {
      int x = i % w;
      int y = i / w;
      boolean inside = (x - w / 2) * (x - w / 2) + (y - h / 2) * (y - h / 2) < w * h / 16;
      for (int c = 0; c < 3; c++) {
        double v = (inside ? 150 + 30 * c : 60 + 10 * c) + noise * rng.nextGaussian();
        ch[c][i] = (float) Math.max(0, Math.min(255, Math.rint(v)));
      }
    }
    return new Raster(w, h, 1, ch, VoxelSize.PIXELS, PixelKind.RGB);
  }

  private static SeedLabels diskSeeds(int w, int h) {
    byte[] labels = new byte[w * h];
    for (int i = 0; i < labels.length; i++) {
      int x = i % w;
      int y = i / w;
      if (Math.abs(x - w / 2) < w / 10 && Math.abs(y - h / 2) < h / 10) {
        labels[i] = 1;
      } else if (x < w / 8) {
        labels[i] = 2;
      }
    }
    return new SeedLabels(w, h, 1, labels);
  }

  @Test
  void learningTwiceGivesIdenticalModelsAndCosts() {
    Raster r = colourImage(new SplittableRandom(3), 96, 80, 20);
    SeedLabels s = diskSeeds(96, 80);
    GaussianMixtureModel a = (GaussianMixtureModel) ModelLearner.learn(r, s, ModelKind.AUTO);
    GaussianMixtureModel b = (GaussianMixtureModel) ModelLearner.learn(r, s, ModelKind.AUTO);
    for (int c = 0; c < 2; c++) {
      assertThat(a.mixture(c).weights()).isEqualTo(b.mixture(c).weights());
      assertThat(a.mixture(c).means()).isDeepEqualTo(b.mixture(c).means());
      assertThat(a.mixture(c).covariances()).isDeepEqualTo(b.mixture(c).covariances());
    }
    float[][] ca = TestImages.costs(a, r);
    float[][] cb = TestImages.costs(b, r);
    assertThat(ca).isDeepEqualTo(cb);
  }

  @Test
  void costsAreShiftedNegativeLogDensitiesClippedToTheRange() {
    // Cost of class c = min(MAX_COST, -ln p_c(x) - min_c' (-ln p_c'(x))): the per-voxel shift
    // documented in GaussianMixtureModel; p_c from GaussianMixture.logDensity, which the
    // closed-form
    // test in GaussianMixtureTest ties to Bishop 2006 eq. 2.43.
    SplittableRandom rng = new SplittableRandom(17);
    for (int trial = 0; trial < 30; trial++) {
      int d = 1 + rng.nextInt(4);
      int classes = 2 + rng.nextInt(2);
      GaussianMixture[] g = new GaussianMixture[classes];
      for (int c = 0; c < classes; c++) {
        g[c] = GaussianMixtureTest.randomMixture(rng, d, 1 + rng.nextInt(4));
      }
      GaussianMixtureModel m = GaussianMixtureModel.of(List.of(g));
      int n = 300;
      float[][] ch = new float[d][n];
      for (int i = 0; i < n; i++) {
        for (int j = 0; j < d; j++) {
          ch[j][i] = (float) (rng.nextDouble() * 240 - 20);
        }
      }
      Raster r = new Raster(n, 1, 1, ch, VoxelSize.PIXELS, PixelKind.FLOAT32);
      float[][] out = TestImages.costs(m, r);
      for (int i = 0; i < n; i++) {
        double[] x = new double[d];
        for (int j = 0; j < d; j++) {
          x[j] = ch[j][i];
        }
        double[] e = new double[classes];
        double min = Double.POSITIVE_INFINITY;
        for (int c = 0; c < classes; c++) {
          e[c] = -g[c].logDensity(x);
          min = Math.min(min, e[c]);
        }
        float smallest = Float.POSITIVE_INFINITY;
        for (int c = 0; c < classes; c++) {
          double want = Math.min(LikelihoodModel.MAX_COST, e[c] - min);
          assertThat((double) out[c][i]).isCloseTo(want, within(1e-5 * (1 + want)));
          assertThat(out[c][i]).isBetween(0f, (float) LikelihoodModel.MAX_COST);
          smallest = Math.min(smallest, out[c][i]);
        }
        assertThat(smallest).isZero();
      }
    }
  }

  @Test
  void distinctColourEvaluationEqualsVoxelByVoxelEvaluation() {
    Raster rgb = colourImage(new SplittableRandom(8), 64, 64, 6);
    GaussianMixtureModel m =
        (GaussianMixtureModel) ModelLearner.learn(rgb, diskSeeds(64, 64), ModelKind.AUTO);
    float[][] ch = {rgb.channel(0), rgb.channel(1), rgb.channel(2)};
    Raster asFloat = new Raster(64, 64, 1, ch, VoxelSize.PIXELS, PixelKind.FLOAT32);
    assertThat(TestImages.costs(m, rgb)).isDeepEqualTo(TestImages.costs(m, asFloat));
  }

  @Test
  void bothClassesAreCheapWhereTheirSeedsAre() {
    Raster r = colourImage(new SplittableRandom(4), 80, 80, 12);
    GaussianMixtureModel m =
        (GaussianMixtureModel) ModelLearner.learn(r, diskSeeds(80, 80), ModelKind.GAUSSIAN_MIXTURE);
    assertThat(m.mixture(0).componentCount()).isEqualTo(ModelLearner.DEFAULT_COMPONENTS);
    float[][] out = TestImages.costs(m, r);
    int centre = 40 + 80 * 40;
    int corner = 2 + 80 * 2;
    assertThat(out[0][centre]).isZero();
    assertThat(out[1][centre]).isGreaterThan(10f);
    assertThat(out[1][corner]).isZero();
    assertThat(out[0][corner]).isGreaterThan(10f);
  }

  @Test
  void seedsOfOneColourEachStillGiveAModel() {
    float[][] ch = new float[3][20];
    byte[] labels = new byte[20];
    for (int i = 0; i < 20; i++) {
      boolean fg = i < 10;
      ch[0][i] = fg ? 200 : 30;
      ch[1][i] = fg ? 100 : 30;
      ch[2][i] = fg ? 50 : 30;
      labels[i] = (byte) (fg ? 1 : 2);
    }
    Raster r = TestImages.row(PixelKind.RGB, ch);
    GaussianMixtureModel m =
        (GaussianMixtureModel) ModelLearner.learn(r, TestImages.seeds(labels), ModelKind.AUTO);
    assertThat(m.mixture(0).componentCount()).isEqualTo(1);
    float[][] out = TestImages.costs(m, r);
    assertThat(out[0][0]).isZero();
    assertThat(out[1][0]).isEqualTo((float) LikelihoodModel.MAX_COST);
    assertThat(out[1][15]).isZero();

    // Every seed, of both classes, one and the same colour: no evidence, cost 0 everywhere.
    float[][] flat = new float[3][20];
    for (float[] c : flat) {
      java.util.Arrays.fill(c, 77);
    }
    Raster same = TestImages.row(PixelKind.RGB, flat);
    LikelihoodModel m2 = ModelLearner.learn(same, TestImages.seeds(labels), ModelKind.AUTO);
    for (float[] row : TestImages.costs(m2, same)) {
      for (float c : row) {
        assertThat(c).isZero();
      }
    }
  }

  @Test
  void nanVoxelsCostNothingAndNanSeedsAreSkipped() {
    float[][] ch = {
      {10, 12, Float.NaN, 200, 210, 11, Float.NaN},
      {10, 11, 5, 200, 205, 10, 4},
    };
    byte[] labels = {1, 1, 1, 2, 2, 0, 2};
    Raster r = TestImages.row(PixelKind.FLOAT32, ch);
    LikelihoodModel m = ModelLearner.learn(r, TestImages.seeds(labels), ModelKind.AUTO);
    float[][] out = TestImages.costs(m, r);
    assertThat(out[0][2]).isZero();
    assertThat(out[1][2]).isZero();
    assertThat(out[0][5]).isZero();
    assertThat(out[1][5]).isPositive();
  }

  @Test
  void largeSeedSetsAreThinnedByAFixedStride() {
    int n = 50_001;
    float[] v = new float[n];
    byte[] labels = new byte[n];
    for (int i = 0; i < n; i++) {
      v[i] = i;
      labels[i] = (byte) (i % 2 == 0 ? 1 : 2);
    }
    labels[4] = 0;
    Raster r = TestImages.row(PixelKind.FLOAT32, v);
    long[] usable = SeedSamples.usableCounts(r, labels, 2);
    assertThat(usable).containsExactly(25_000, 25_000);
    double[][] s = SeedSamples.gather(r, labels, 2, usable, 20_000);
    assertThat(s[0]).hasSize(20_000);
    // Foreground voxels in order: 0, 2, 6, 8, ...; sample t is number floor(t * 25000 / 20000),
    // and number m >= 2 is voxel 2m + 2.
    assertThat(s[0][0]).isEqualTo(0);
    assertThat(s[0][1]).isEqualTo(2);
    assertThat(s[0][4]).isEqualTo(12); // number 5
    assertThat(s[0][19_999]).isEqualTo(2 * (19_999 * 25_000L / 20_000) + 2);
    double[][] small = SeedSamples.gather(r, labels, 2, usable, 30_000);
    assertThat(small[1]).hasSize(25_000);
  }
}
