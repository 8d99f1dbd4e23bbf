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
 * The live cut's dynamic path against a graph built and solved from scratch (STYLE.md item 10:
 * change capacities, re-solve, compare with a fresh solve).
 */
class LiveCutTest {
  @Test
  void strokesReSolvedDynamicallyEqualAFreshCut() {
    for (int seed = 0; seed < 30; seed++) {
      SplittableRandom rnd = new SplittableRandom(seed);
      boolean volume = seed % 5 == 4;
      int w = 24 + rnd.nextInt(24);
      int h = 20 + rnd.nextInt(24);
      int d = volume ? 4 + rnd.nextInt(4) : 1;
      Raster image = blobs(rnd, w, h, d);
      Neighborhood nb = Neighborhood.of(volume ? 6 : (seed % 2 == 0 ? 8 : 4));
      byte[] labels = new byte[w * h * d];
      paint(rnd, labels, w, h, d, 1);
      paint(rnd, labels, w, h, d, 2);
      SeedLabels first = new SeedLabels(w, h, d, labels.clone());
      LikelihoodModel model = ModelLearner.learn(image, first, ModelKind.AUTO);
      double lambda = 0.5 + 4 * rnd.nextDouble();
      LiveCut live = new LiveCut(image, nb);
      live.useModel(model);
      LiveCut.Outcome o = live.update(first, lambda, Double.NaN);
      assertThat(o.dynamic()).isFalse();
      for (int step = 0; step < 6; step++) {
        if (step == 3) {
          java.util.Arrays.fill(labels, (byte) 0); // an undo back to few strokes
          paint(rnd, labels, w, h, d, 1);
          paint(rnd, labels, w, h, d, 2);
        } else {
          paint(rnd, labels, w, h, d, 1 + rnd.nextInt(2));
        }
        SeedLabels now = new SeedLabels(w, h, d, labels.clone());
        LiveCut.Outcome dynamic = live.update(now, lambda, Double.NaN);
        LiveCut fresh = new LiveCut(image, nb);
        fresh.useModel(model);
        LiveCut.Outcome scratch = fresh.update(now, lambda, Double.NaN);
        assertThat(dynamic.dynamic()).isTrue();
        assertThat(dynamic.certified()).isTrue();
        assertThat(dynamic.flowValue())
            .as("seed %d step %d", seed, step)
            .isEqualTo(scratch.flowValue());
        assertThat(dynamic.mask()).as("seed %d step %d", seed, step).isEqualTo(scratch.mask());
        for (int i = 0; i < labels.length; i++) {
          if (labels[i] == 1) {
            assertThat(dynamic.mask()[i]).isEqualTo((byte) 255); // seeds are hard constraints
          } else if (labels[i] == 2) {
            assertThat(dynamic.mask()[i]).isEqualTo((byte) 0);
          }
        }
      }
      // a new boundary penalty rebuilds
      assertThat(live.update(first, lambda * 2, Double.NaN).dynamic()).isFalse();
    }
  }

  static Raster blobs(SplittableRandom rnd, int w, int h, int d) {
    float[] v = new float[w * h * d];
    int blobs = 2 + rnd.nextInt(3);
    double[][] c = new double[blobs][];
    for (int b = 0; b < blobs; b++) {
      c[b] =
          new double[] {
            rnd.nextDouble() * w,
            rnd.nextDouble() * h,
            rnd.nextDouble() * d,
            3 + rnd.nextDouble() * 6
          };
    }
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          double s = 20 + 10 * rnd.nextGaussian();
          for (double[] b : c) {
            double dx = x - b[0];
            double dy = y - b[1];
            double dz = (z - b[2]) * 3;
            if (dx * dx + dy * dy + dz * dz < b[3] * b[3]) {
              s += 100;
            }
          }
          v[(z * h + y) * w + x] = (float) Math.max(0, s);
        }
      }
    }
    return new Raster(w, h, d, new float[][] {v}, VoxelSize.PIXELS, PixelKind.GREY16);
  }

  static void paint(SplittableRandom rnd, byte[] labels, int w, int h, int d, int label) {
    int x0 = rnd.nextInt(w - 3);
    int y0 = rnd.nextInt(h - 3);
    int z = rnd.nextInt(d);
    int len = 2 + rnd.nextInt(8);
    for (int i = 0; i < len; i++) {
      int x = Math.min(w - 1, x0 + i);
      labels[(z * h + y0) * w + x] = (byte) label;
      labels[(z * h + y0 + 1) * w + x] = (byte) label;
    }
  }
}
