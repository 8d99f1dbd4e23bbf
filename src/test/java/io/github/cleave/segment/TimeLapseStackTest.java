package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.image.FrameSeries;
import io.github.cleave.image.Raster;
import io.github.cleave.quality.Agreement;
import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * A time-lapse of z-stacks: the stack phantom drifting one voxel in x per time point, cut as
 * volumes time point by time point from the strokes of the first. Each time point must agree with
 * its shifted truth as well as the first does with its own, less 0.02 (Dice, Ecology 26(3):297–302,
 * 1945; the margin: common practice, no source), and every object of the first time point keeps its
 * number.
 */
class TimeLapseStackTest {
  private static final int FRAMES = 3;

  @Test
  void stacksDriftingOverTimeKeepTheirQualityAndNumbers() {
    Phantom p = SamplePhantoms.stack(SamplePhantoms.DEFAULT_SEED, 128, 128, 32);
    Raster[] frames = new Raster[FRAMES];
    byte[][] truths = new byte[FRAMES][];
    int[][] objects = new int[FRAMES][];
    for (int t = 0; t < FRAMES; t++) {
      frames[t] = shifted(p.image(), t);
      truths[t] = shifted(p.truth(), p.image(), t);
      objects[t] = shifted(p.truthLabels(), p.image(), t);
    }
    TimeLapseResult result =
        TimeLapseSegmenter.segment(
            FrameSeries.of(frames),
            p.seeds(),
            0,
            SegmentationSettings.defaults(),
            TimeLapseOptions.defaults());
    double first = Agreement.dice(result.frame(0).segmentation().mask(), truths[0]);
    assertThat(first).isGreaterThan(0.94); // the stack phantom at its default seed: 0.950
    Map<Integer, Integer> numberOfObject = new HashMap<>();
    for (int t = 0; t < FRAMES; t++) {
      Segmentation s = result.frame(t).segmentation();
      assertThat(s.objects().depth()).isEqualTo(32);
      assertThat(Agreement.dice(s.mask(), truths[t]))
          .as("time point %d", t + 1)
          .isGreaterThan(first - 0.02);
      int[] tracked = result.frame(t).trackedLabels();
      for (int k = 1; k <= p.objectCount(); k++) {
        int centre = centreVoxel(objects[t], k);
        if (centre >= 0 && tracked[centre] != 0) {
          Integer before = numberOfObject.putIfAbsent(k, tracked[centre]);
          assertThat(before == null ? tracked[centre] : before)
              .as("object %d at time point %d", k, t + 1)
              .isEqualTo(tracked[centre]);
        }
      }
    }
  }

  /** The voxel of object k nearest the mean of its voxels, or -1 if it has none. */
  private static int centreVoxel(int[] labels, int k) {
    long n = 0;
    double sum = 0;
    for (int i = 0; i < labels.length; i++) {
      if (labels[i] == k) {
        sum += i;
        n++;
      }
    }
    if (n == 0) {
      return -1;
    }
    int best = -1;
    double mean = sum / n;
    for (int i = 0; i < labels.length; i++) {
      if (labels[i] == k && (best < 0 || Math.abs(i - mean) < Math.abs(best - mean))) {
        best = i;
      }
    }
    return best;
  }

  private static Raster shifted(Raster r, int dx) {
    float[] v = r.channel(0);
    float[] out = new float[v.length];
    for (int i = 0; i < v.length; i++) {
      int x = i % r.width();
      out[i] = v[i - Math.min(x, dx)];
    }
    return Raster.grey(r.width(), r.height(), r.depth(), out, r.voxelSize(), r.kind());
  }

  private static byte[] shifted(byte[] v, Raster r, int dx) {
    byte[] out = new byte[v.length];
    for (int i = 0; i < v.length; i++) {
      out[i] = v[i - Math.min(i % r.width(), dx)];
    }
    return out;
  }

  private static int[] shifted(int[] v, Raster r, int dx) {
    int[] out = new int[v.length];
    for (int i = 0; i < v.length; i++) {
      out[i] = v[i - Math.min(i % r.width(), dx)];
    }
    return out;
  }
}
