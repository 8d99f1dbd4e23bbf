package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class ObjectDistancesTest {

  /** Euclidean distance between voxel centres i and j. */
  private static double between(int i, int j, int w, int h, VoxelSize s) {
    double dx = (i % w - j % w) * s.x();
    double dy = ((i / w) % h - (j / w) % h) * s.y();
    double dz = (i / (w * h) - j / (w * h)) * s.z();
    return Math.sqrt(dx * dx + dy * dy + dz * dz);
  }

  /** Random labels: a few random boxes numbered with random numbers, later ones on top. */
  static int[] randomLabels(SplittableRandom rnd, int w, int h, int d) {
    int[] labels = new int[w * h * d];
    int boxes = rnd.nextInt(0, 6);
    for (int b = 0; b < boxes; b++) {
      int k = rnd.nextInt(1, 40);
      int x0 = rnd.nextInt(w);
      int y0 = rnd.nextInt(h);
      int z0 = rnd.nextInt(d);
      int x1 = Math.min(w - 1, x0 + rnd.nextInt(w));
      int y1 = Math.min(h - 1, y0 + rnd.nextInt(h));
      int z1 = Math.min(d - 1, z0 + rnd.nextInt(d));
      for (int z = z0; z <= z1; z++) {
        for (int y = y0; y <= y1; y++) {
          for (int x = x0; x <= x1; x++) {
            labels[x + w * (y + h * z)] = k;
          }
        }
      }
    }
    return labels;
  }

  // Oracle: brute-force minimum over all voxels (definition of the Euclidean distance transform).
  @Test
  void toOtherLabelsMatchesBruteForce() {
    SplittableRandom rnd = new SplittableRandom(4101);
    for (int trial = 0; trial < 300; trial++) {
      int w = 1 + rnd.nextInt(12);
      int h = 1 + rnd.nextInt(12);
      int d = 1 + rnd.nextInt(4);
      VoxelSize s =
          new VoxelSize(
              rnd.nextDouble(0.2, 3), rnd.nextDouble(0.2, 3), rnd.nextDouble(0.2, 3), "um", false);
      int[] labels = randomLabels(rnd, w, h, d);
      float[] dist = ObjectDistances.toOtherLabels(labels, w, h, d, s);
      for (int i = 0; i < labels.length; i++) {
        double best = Double.POSITIVE_INFINITY;
        if (labels[i] == 0) {
          best = 0;
        } else {
          for (int j = 0; j < labels.length; j++) {
            if (labels[j] != labels[i]) {
              best = Math.min(best, between(i, j, w, h, s));
            }
          }
        }
        if (Double.isInfinite(best)) {
          assertThat(dist[i]).as("trial %d voxel %d", trial, i).isEqualTo(Float.POSITIVE_INFINITY);
        } else {
          assertThat((double) dist[i])
              .as("trial %d voxel %d", trial, i)
              .isCloseTo(best, within(1e-5 * (1 + best)));
        }
      }
    }
  }

  @Test
  void toBackgroundMatchesBruteForce() {
    SplittableRandom rnd = new SplittableRandom(4102);
    for (int trial = 0; trial < 200; trial++) {
      int w = 1 + rnd.nextInt(12);
      int h = 1 + rnd.nextInt(12);
      int d = 1 + rnd.nextInt(4);
      VoxelSize s = new VoxelSize(1, rnd.nextDouble(0.5, 2), rnd.nextDouble(0.5, 4), "um", false);
      byte[] mask = Phantoms.noise(rnd, w * h * d, rnd.nextDouble(0.3, 1.0));
      float[] dist = ObjectDistances.toBackground(mask, w, h, d, s);
      for (int i = 0; i < mask.length; i++) {
        double best = mask[i] == 0 ? 0 : Double.POSITIVE_INFINITY;
        for (int j = 0; j < mask.length && mask[i] != 0; j++) {
          if (mask[j] == 0) {
            best = Math.min(best, between(i, j, w, h, s));
          }
        }
        if (Double.isInfinite(best)) {
          assertThat(dist[i]).isEqualTo(Float.POSITIVE_INFINITY);
        } else {
          assertThat((double) dist[i]).isCloseTo(best, within(1e-5 * (1 + best)));
        }
      }
    }
  }

  @Test
  void refusesWrongSizesAndNegativeLabels() {
    assertThatThrownBy(() -> ObjectDistances.toOtherLabels(new int[5], 2, 2, 1, VoxelSize.PIXELS))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("5 values");
    assertThatThrownBy(
            () -> ObjectDistances.toOtherLabels(new int[] {0, -1, 0, 0}, 2, 2, 1, VoxelSize.PIXELS))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("-1");
  }
}
