package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class DistanceMapTest {

  /** The distance map in whole-grid layout, 0 on the background. */
  static float[] wholeGrid(byte[] mask, int w, int h, int d, double sx, double sy, double sz) {
    ForegroundRuns runs = ForegroundRuns.of(mask, null, w, h, d);
    int[] slots = runs.slotStarts();
    float[] bySlot = DistanceMap.distance(runs, slots, sx, sy, sz);
    float[] out = new float[mask.length];
    for (int r = 0, s = 0; r < runs.count; r++) {
      for (int x = runs.start[r]; x <= runs.end[r]; x++) {
        out[runs.row[r] * w + x] = bySlot[s++];
      }
    }
    return out;
  }

  /** Brute force: the Euclidean distance to every background voxel, minimum taken. */
  @Test
  void matchesBruteForceWithAnisotropicSpacing() {
    SplittableRandom rnd = new SplittableRandom(61);
    for (int t = 0; t < 200; t++) {
      int w = 1 + rnd.nextInt(12);
      int h = 1 + rnd.nextInt(12);
      int d = 1 + rnd.nextInt(5);
      double sx = rnd.nextDouble(0.2, 3);
      double sy = rnd.nextDouble(0.2, 3);
      double sz = rnd.nextDouble(0.2, 3);
      byte[] mask = Phantoms.noise(rnd, w * h * d, rnd.nextDouble(0.5, 1.0));
      float[] dist = wholeGrid(mask, w, h, d, sx, sy, sz);
      for (int i = 0; i < mask.length; i++) {
        double best = Double.POSITIVE_INFINITY;
        if (mask[i] == 0) {
          best = 0;
        } else {
          for (int j = 0; j < mask.length; j++) {
            if (mask[j] == 0) {
              double dx = (i % w - j % w) * sx;
              double dy = ((i / w) % h - (j / w) % h) * sy;
              double dz = (i / (w * h) - j / (w * h)) * sz;
              best = Math.min(best, Math.sqrt(dx * dx + dy * dy + dz * dz));
            }
          }
        }
        if (Double.isInfinite(best)) {
          assertThat(dist[i]).isEqualTo(Float.POSITIVE_INFINITY);
        } else {
          assertThat((double) dist[i])
              .as("trial %d voxel %d", t, i)
              .isCloseTo(best, within(1e-5 * (1 + best)));
        }
      }
    }
  }

  @Test
  void floodQueuePopsHighestFirstAndEqualPrioritiesInArrivalOrder() {
    SplittableRandom rnd = new SplittableRandom(62);
    FloodQueue q = new FloodQueue();
    float[] prio = new float[500];
    for (int i = 0; i < prio.length; i++) {
      prio[i] = rnd.nextInt(20);
      q.push(i, prio[i]);
    }
    int last = -1;
    float lastPriority = Float.POSITIVE_INFINITY;
    while (!q.isEmpty()) {
      float p = q.topPriority();
      int v = q.pop();
      assertThat(prio[v]).isEqualTo(p);
      assertThat(p).isLessThanOrEqualTo(lastPriority);
      if (p == lastPriority) {
        assertThat(v).isGreaterThan(last);
      }
      last = v;
      lastPriority = p;
    }
  }
}
