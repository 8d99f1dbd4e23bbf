package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.energy.AlphaExpansion;
import io.github.cleave.energy.ContrastScale;
import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.energy.PottsEnergy;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.model.LikelihoodModel;
import io.github.cleave.model.ModelKind;
import io.github.cleave.model.ModelLearner;
import java.util.SplittableRandom;
import java.util.concurrent.CancellationException;
import org.junit.jupiter.api.Test;

/**
 * The multi-class preview against the energy package's public API over random images of three to
 * five classes, planes and volumes: the same class map and energy, seeds kept, the energy no higher
 * than the start's; an interrupt ends an update with {@link CancellationException} and the next
 * update is whole again.
 */
class LiveClassesTest {
  @Test
  void updatesEqualTheExpansionOfThePottsEnergy() {
    int cases = 0;
    for (int seed = 0; seed < 24; seed++) {
      SplittableRandom rnd = new SplittableRandom(seed);
      boolean volume = seed % 4 == 3;
      int k = 3 + rnd.nextInt(3);
      int w = 20 + rnd.nextInt(20);
      int h = 16 + rnd.nextInt(20);
      int d = volume ? 3 + rnd.nextInt(3) : 1;
      Raster image = levels(rnd, w, h, d, k);
      Neighborhood nb = Neighborhood.of(volume ? 6 : (seed % 2 == 0 ? 8 : 4));
      byte[] labels = new byte[w * h * d];
      for (int c = 1; c <= k; c++) {
        LiveCutTest.paint(rnd, labels, w, h, d, c);
      }
      SeedLabels seeds = new SeedLabels(w, h, d, labels.clone());
      if (CutInputs.missingClass(seeds) != 0) {
        continue; // a later stroke covered a class entirely: not a case the session cuts
      }
      cases++;
      LikelihoodModel model = ModelLearner.learn(image, seeds, ModelKind.AUTO);
      double lambda = 0.5 + 4 * rnd.nextDouble();
      LiveClasses live = new LiveClasses(image, nb);
      live.useModel(model);
      assertThat(live.classCount()).isEqualTo(k);
      for (int step = 0; step < 3; step++) {
        SeedLabels now = new SeedLabels(w, h, d, labels.clone());
        LiveClasses.Outcome o = live.update(now, lambda, Double.NaN);

        float[][] costs = new float[k][image.size()];
        model.costs(image, costs);
        EnergyParameters p =
            new EnergyParameters(lambda, ContrastScale.estimate(image, nb), nb, image.voxelSize());
        PottsEnergy energy = PottsEnergy.build(image, costs, now, p);
        AlphaExpansion.Outcome direct =
            AlphaExpansion.run(
                energy, AlphaExpansion.backgroundStart(now), AlphaExpansion.DEFAULT_MAX_CYCLES);
        assertThat(o.classes()).as("seed %d step %d", seed, step).isEqualTo(direct.labels());
        assertThat(o.energy()).isEqualTo(direct.energy()).isEqualTo(energy.energy(o.classes()));
        assertThat(o.energy())
            .isLessThanOrEqualTo(energy.energy(AlphaExpansion.backgroundStart(now)));
        assertThat(o.classCount()).isEqualTo(k);
        for (int i = 0; i < labels.length; i++) {
          if (labels[i] != 0) {
            assertThat(o.classes()[i]).isEqualTo(labels[i]); // seeds are hard constraints
          }
        }
        LiveCutTest.paint(rnd, labels, w, h, d, 1 + rnd.nextInt(k)); // the next stroke
      }
    }
    assertThat(cases).isGreaterThanOrEqualTo(18);
  }

  @Test
  void anInterruptEndsTheUpdateAndTheNextOneIsWhole() {
    SplittableRandom rnd = new SplittableRandom(42);
    int w = 40;
    int h = 30;
    Raster image = levels(rnd, w, h, 1, 3);
    byte[] labels = new byte[w * h];
    for (int c = 1; c <= 3; c++) {
      LiveCutTest.paint(rnd, labels, w, h, 1, c);
    }
    SeedLabels seeds = new SeedLabels(w, h, 1, labels);
    LiveClasses live = new LiveClasses(image, Neighborhood.of(8));
    live.useModel(ModelLearner.learn(image, seeds, ModelKind.AUTO));
    byte[] whole = live.update(seeds, 1, Double.NaN).classes();
    Thread.currentThread().interrupt();
    try {
      assertThatThrownBy(() -> live.update(seeds, 1, Double.NaN))
          .isInstanceOf(CancellationException.class);
      assertThat(Thread.currentThread().isInterrupted()).isTrue();
    } finally {
      Thread.interrupted();
    }
    assertThat(live.update(seeds, 1, Double.NaN).classes()).isEqualTo(whole);
    assertThatThrownBy(() -> new LiveClasses(image, Neighborhood.of(8)).update(seeds, 1, 1))
        .isInstanceOf(IllegalStateException.class);
  }

  /** Bands of {@code k} grey levels (50 apart) with noise and a few random discs of each level. */
  static Raster levels(SplittableRandom rnd, int w, int h, int d, int k) {
    float[] v = new float[w * h * d];
    int discs = 2 * k;
    double[][] c = new double[discs][];
    for (int b = 0; b < discs; b++) {
      c[b] =
          new double[] {
            rnd.nextDouble() * w, rnd.nextDouble() * h, 2 + rnd.nextDouble() * 6, b % k
          };
    }
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          double level = 0;
          for (double[] b : c) {
            double dx = x - b[0];
            double dy = y - b[1];
            if (dx * dx + dy * dy < b[2] * b[2]) {
              level = b[3];
            }
          }
          v[(z * h + y) * w + x] = (float) (100 + 50 * level + 12 * rnd.nextGaussian());
        }
      }
    }
    return new Raster(w, h, d, new float[][] {v}, VoxelSize.PIXELS, PixelKind.GREY16);
  }
}
