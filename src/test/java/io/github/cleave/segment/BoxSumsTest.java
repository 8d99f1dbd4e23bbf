package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** Box sums against the definition: a direct sum over the window, cut at the borders. */
class BoxSumsTest {
  @Test
  void equalDirectSumsOverRandomGridsAndWindows() {
    SplittableRandom random = new SplittableRandom(20261202);
    for (int trial = 0; trial < 300; trial++) {
      int w = 1 + random.nextInt(9);
      int h = 1 + random.nextInt(9);
      int d = 1 + random.nextInt(5);
      int rx = random.nextInt(4);
      int ry = random.nextInt(4);
      int rz = random.nextInt(3);
      float[] values = new float[w * h * d];
      float[] weights = new float[values.length];
      for (int p = 0; p < values.length; p++) {
        values[p] = random.nextInt(1000) / 8f;
        weights[p] = random.nextInt(2);
      }
      boolean weighted = random.nextBoolean();
      float[] sums = new BoxSums(w, h, d, rx, ry, rz).sum(values, weighted ? weights : null);
      for (int z = 0; z < d; z++) {
        for (int y = 0; y < h; y++) {
          for (int x = 0; x < w; x++) {
            double expected = 0;
            for (int z2 = Math.max(0, z - rz); z2 <= Math.min(d - 1, z + rz); z2++) {
              for (int y2 = Math.max(0, y - ry); y2 <= Math.min(h - 1, y + ry); y2++) {
                for (int x2 = Math.max(0, x - rx); x2 <= Math.min(w - 1, x + rx); x2++) {
                  int q = x2 + w * (y2 + h * z2);
                  expected += weighted ? values[q] * weights[q] : values[q];
                }
              }
            }
            assertThat((double) sums[x + w * (y + h * z)]).isCloseTo(expected, within(1e-3));
          }
        }
      }
    }
  }
}
