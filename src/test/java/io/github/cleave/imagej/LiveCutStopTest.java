package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.model.LikelihoodModel;
import io.github.cleave.model.ModelKind;
import io.github.cleave.model.ModelLearner;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Esc during a live cut: a solve stopped by an interrupt leaves the live cut stale, and the next
 * update equals a cut built and solved from scratch (STYLE.md item 10). The interrupt is raised
 * before the call, so the engine's first poll of {@code Thread.interrupted()} stops it: no timing.
 */
class LiveCutStopTest {
  @Test
  void anInterruptedSolveLeavesTheNextUpdateEqualToAFreshCut() {
    int stoppedDynamic = 0;
    for (int seed = 0; seed < 6; seed++) {
      SplittableRandom rnd = new SplittableRandom(100 + seed);
      boolean volume = seed == 5;
      int w = volume ? 64 : 192 + rnd.nextInt(64);
      int h = volume ? 64 : 192 + rnd.nextInt(64);
      int d = volume ? 12 : 1;
      Raster image = manyBlobs(rnd, w, h, d);
      Neighborhood nb = Neighborhood.of(volume ? 6 : 8);
      byte[] labels = new byte[w * h * d];
      for (int i = 0; i < 3; i++) {
        LiveCutTest.paint(rnd, labels, w, h, d, 1);
        LiveCutTest.paint(rnd, labels, w, h, d, 2);
      }
      SeedLabels first = new SeedLabels(w, h, d, labels.clone());
      LikelihoodModel model = ModelLearner.learn(image, first, ModelKind.AUTO);
      double lambda = 2 + 6 * rnd.nextDouble(); // boundary-heavy: many augmentations
      LiveCut live = new LiveCut(image, nb);
      live.useModel(model);

      // a full solve stopped: nothing shown, the kept cut stale
      LiveCut.Outcome stopped = interrupted(live, first, lambda);
      assertThat(stopped.stopped()).as("seed %d: full solve stopped", seed).isTrue();
      assertThat(stopped.mask()).isNull();
      assertThat(live.isStale()).isTrue();

      // the next stroke recomputes normally
      LiveCutTest.paint(rnd, labels, w, h, d, 1);
      SeedLabels second = new SeedLabels(w, h, d, labels.clone());
      LiveCut.Outcome next = live.update(second, lambda, Double.NaN);
      assertThat(next.stopped()).isFalse();
      assertThat(next.dynamic()).isFalse(); // solved from zero flow on the kept graph
      assertThat(live.isStale()).isFalse();
      assertEqualsFresh(next, image, nb, model, second, lambda, seed);

      // a dynamic re-solve stopped (if it runs long enough to be polled), then the next one; a
      // wide band of background seeds over the blobs re-routes much flow
      for (int i = w * h * d / 3; i < 2 * w * h * d / 3; i++) {
        labels[i] = labels[i] == 1 ? 1 : (byte) 2;
      }
      SeedLabels third = new SeedLabels(w, h, d, labels.clone());
      LiveCut.Outcome maybe = interrupted(live, third, lambda);
      if (maybe.stopped()) {
        stoppedDynamic++;
        assertThat(live.isStale()).isTrue();
      } else {
        assertEqualsFresh(maybe, image, nb, model, third, lambda, seed);
      }
      LiveCutTest.paint(rnd, labels, w, h, d, 2);
      SeedLabels fourth = new SeedLabels(w, h, d, labels.clone());
      assertEqualsFresh(
          live.update(fourth, lambda, Double.NaN), image, nb, model, fourth, lambda, seed);
    }
    assertThat(stoppedDynamic).as("some dynamic re-solves were stopped").isPositive();
  }

  /** An update with the thread's interrupt flag raised beforehand; the flag is cleared after. */
  static LiveCut.Outcome interrupted(LiveCut live, SeedLabels seeds, double lambda) {
    Thread.currentThread().interrupt();
    try {
      return live.update(seeds, lambda, Double.NaN);
    } finally {
      Thread.interrupted();
    }
  }

  private static void assertEqualsFresh(
      LiveCut.Outcome o,
      Raster image,
      Neighborhood nb,
      LikelihoodModel model,
      SeedLabels seeds,
      double lambda,
      int seed) {
    LiveCut fresh = new LiveCut(image, nb);
    fresh.useModel(model);
    LiveCut.Outcome scratch = fresh.update(seeds, lambda, Double.NaN);
    assertThat(o.stopped()).isFalse();
    assertThat(o.certified()).isTrue();
    assertThat(o.flowValue()).as("seed %d", seed).isEqualTo(scratch.flowValue());
    assertThat(o.mask()).as("seed %d", seed).isEqualTo(scratch.mask());
  }

  /** Many noisy blobs of low contrast: a cut with long boundaries and many augmentations. */
  static Raster manyBlobs(SplittableRandom rnd, int w, int h, int d) {
    int blobs = 12 + rnd.nextInt(12);
    double[][] c = new double[blobs][];
    for (int b = 0; b < blobs; b++) {
      c[b] =
          new double[] {
            rnd.nextDouble() * w, rnd.nextDouble() * h, rnd.nextDouble() * d, 5 + rnd.nextInt(15)
          };
    }
    float[] v = new float[w * h * d];
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          double s = 40 + 25 * rnd.nextGaussian();
          for (double[] b : c) {
            double dx = x - b[0];
            double dy = y - b[1];
            double dz = (z - b[2]) * 3;
            if (dx * dx + dy * dy + dz * dz < b[3] * b[3]) {
              s += 50;
            }
          }
          v[(z * h + y) * w + x] = (float) Math.max(0, s);
        }
      }
    }
    return new Raster(w, h, d, new float[][] {v}, VoxelSize.PIXELS, PixelKind.GREY16);
  }
}
