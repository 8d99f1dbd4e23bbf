package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The steps from the boundary agree with the band grown step by step, for every width at once; the
 * grown band is itself checked against its definition (a city-block ball around every boundary
 * voxel) here, by brute force.
 */
class BoundaryBandTest {
  @Test
  void stepsEqualTheGrownBandForEveryWidth() {
    SplittableRandom random = new SplittableRandom(20261202L);
    for (int trial = 0; trial < 200; trial++) {
      int w = 1 + random.nextInt(trial % 2 == 0 ? 30 : 90); // wide rows: eight voxels at a time
      int h = 1 + random.nextInt(30);
      int d = random.nextBoolean() ? 1 : 1 + random.nextInt(4);
      boolean planes = random.nextBoolean();
      byte[] mask = new byte[w * h * d];
      int blobs = 1 + random.nextInt(6);
      for (int b = 0; b < blobs; b++) {
        int cx = random.nextInt(w);
        int cy = random.nextInt(h);
        int cz = random.nextInt(d);
        int r = 1 + random.nextInt(8);
        for (int p = 0; p < mask.length; p++) {
          int x = p % w - cx;
          int y = p / w % h - cy;
          int z = p / (w * h) - cz;
          if (x * x + y * y + 4 * z * z <= r * r) {
            mask[p] = (byte) 255;
          }
        }
      }
      int limit = random.nextInt(8);
      byte[] steps = BoundaryBand.steps(mask, w, h, d, planes, limit);
      boolean[] boundary = BoundaryBand.boundary(mask, w, h, d, planes);
      for (int r = 0; r <= limit; r++) {
        boolean[] grown = BoundaryBand.grow(boundary, w, h, d, r, false);
        for (int p = 0; p < mask.length; p++) {
          boolean near = steps[p] != 0 && steps[p] <= r + 1;
          assertThat(near).as("trial %d, r %d, voxel %d", trial, r, p).isEqualTo(grown[p]);
          assertThat(grown[p]).isEqualTo(withinCityBlock(boundary, w, h, d, p, r));
        }
      }
      for (int p = 0; p < mask.length; p++) {
        assertThat(steps[p] != 0).isEqualTo(withinCityBlock(boundary, w, h, d, p, limit));
      }
    }
  }

  /** Whether a boundary voxel of the same plane lies within city-block distance r of p. */
  private static boolean withinCityBlock(boolean[] boundary, int w, int h, int d, int p, int r) {
    int x = p % w;
    int y = p / w % h;
    int z = p / (w * h);
    for (int qy = Math.max(0, y - r); qy <= Math.min(h - 1, y + r); qy++) {
      int reach = r - Math.abs(qy - y);
      for (int qx = Math.max(0, x - reach); qx <= Math.min(w - 1, x + reach); qx++) {
        if (boundary[qx + w * (qy + h * z)]) {
          return true;
        }
      }
    }
    return false;
  }
}
