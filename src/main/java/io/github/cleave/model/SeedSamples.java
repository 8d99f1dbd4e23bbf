package io.github.cleave.model;

import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;

/**
 * The feature vectors of the seed voxels, one flat row-major array {@code x[s * d + i]} per class,
 * in voxel order. Voxels with a NaN or infinite value in any channel are skipped. A class with more
 * than {@code limit} usable voxels is thinned deterministically by a fixed stride: of its m usable
 * voxels in voxel order, sample t (0 ≤ t &lt; limit) is voxel number {@code floor(t · m / limit)}.
 */
final class SeedSamples {
  private SeedSamples() {}

  /** Number of usable seed voxels per class (index = label − 1). */
  static long[] usableCounts(Raster features, byte[] labels, int classes) {
    int d = features.channelCount();
    float[][] ch = channels(features);
    long[] counts = new long[classes];
    for (int v = SeedLabels.nextLabelled(labels, 0);
        v < labels.length;
        v = SeedLabels.nextLabelled(labels, v + 1)) {
      int label = labels[v] & 0xff;
      if (label != 0 && label <= classes && finite(ch, d, v)) {
        counts[label - 1]++;
      }
    }
    return counts;
  }

  /** Samples per class, at most {@code limit} each; {@code counts} from {@link #usableCounts}. */
  static double[][] gather(Raster features, byte[] labels, int classes, long[] counts, int limit) {
    int d = features.channelCount();
    float[][] ch = channels(features);
    double[][] out = new double[classes][];
    long[] seen = new long[classes];
    int[] taken = new int[classes];
    long[] next = new long[classes]; // index (among usable voxels) of the next sample to take
    for (int c = 0; c < classes; c++) {
      out[c] = new double[(int) Math.min(counts[c], limit) * d];
    }
    for (int v = SeedLabels.nextLabelled(labels, 0);
        v < labels.length;
        v = SeedLabels.nextLabelled(labels, v + 1)) {
      int label = labels[v] & 0xff;
      if (label == 0 || label > classes || !finite(ch, d, v)) {
        continue;
      }
      int c = label - 1;
      long index = seen[c]++;
      int want = out[c].length / d;
      if (taken[c] < want && index == next[c]) {
        for (int i = 0; i < d; i++) {
          out[c][taken[c] * d + i] = ch[i][v];
        }
        taken[c]++;
        next[c] = counts[c] <= limit ? taken[c] : taken[c] * counts[c] / limit;
      }
    }
    return out;
  }

  private static float[][] channels(Raster r) {
    float[][] ch = new float[r.channelCount()][];
    for (int i = 0; i < ch.length; i++) {
      ch[i] = r.channel(i);
    }
    return ch;
  }

  private static boolean finite(float[][] ch, int d, int v) {
    for (int i = 0; i < d; i++) {
      if (!Float.isFinite(ch[i][v])) {
        return false;
      }
    }
    return true;
  }
}
