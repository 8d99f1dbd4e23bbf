package io.github.cleave.synth;

import io.github.cleave.image.Raster;
import io.github.cleave.quality.Agreement;
import io.github.cleave.quality.OtsuBaseline;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

/** Shared measurements on phantoms for the tests. */
final class PhantomChecks {
  private PhantomChecks() {}

  /**
   * Otsu baseline Dice against the truth. Grey images: the driving channel, foreground above the
   * threshold. RGB: the best over red, green, blue and luminance (ITU-R BT.601 weights 0.299,
   * 0.587, 0.114; from memory), each with both polarities, so the difficulty claim holds for every
   * reasonable single-channel Otsu.
   */
  static double otsuDice(Phantom p) {
    Raster r = p.image();
    if (r.channelCount() != 3) {
      return Agreement.dice(p.truth(), OtsuBaseline.mask(r, p.drivingChannel()));
    }
    float[] lum = new float[r.size()];
    for (int i = 0; i < lum.length; i++) {
      lum[i] =
          (float) (0.299 * r.channel(0)[i] + 0.587 * r.channel(1)[i] + 0.114 * r.channel(2)[i]);
    }
    double best = 0;
    for (float[] values : new float[][] {r.channel(0), r.channel(1), r.channel(2), lum}) {
      byte[] mask = OtsuBaseline.mask(values);
      best = Math.max(best, Agreement.dice(p.truth(), mask));
      for (int i = 0; i < mask.length; i++) {
        mask[i] = (byte) (1 - mask[i]);
      }
      best = Math.max(best, Agreement.dice(p.truth(), mask));
    }
    return best;
  }

  /**
   * Connected components of the voxels where {@code member[i]} holds, 8-connected in a plane and
   * 26-connected in a stack: a list of voxel index lists.
   */
  static List<List<Integer>> components(boolean[] member, int w, int h, int d) {
    boolean[] seen = new boolean[member.length];
    List<List<Integer>> out = new ArrayList<>();
    int[] queue = new int[member.length];
    for (int s = 0; s < member.length; s++) {
      if (!member[s] || seen[s]) {
        continue;
      }
      List<Integer> comp = new ArrayList<>();
      int head = 0;
      int tail = 0;
      queue[tail++] = s;
      seen[s] = true;
      while (head < tail) {
        int i = queue[head++];
        comp.add(i);
        int x = i % w;
        int y = (i / w) % h;
        int z = i / (w * h);
        for (int oz = -1; oz <= 1; oz++) {
          for (int oy = -1; oy <= 1; oy++) {
            for (int ox = -1; ox <= 1; ox++) {
              int nx = x + ox;
              int ny = y + oy;
              int nz = z + oz;
              if (nx < 0 || ny < 0 || nz < 0 || nx >= w || ny >= h || nz >= d) {
                continue;
              }
              int j = nx + w * (ny + h * nz);
              if (member[j] && !seen[j]) {
                seen[j] = true;
                queue[tail++] = j;
              }
            }
          }
        }
      }
      out.add(comp);
    }
    return out;
  }

  /** Unordered pairs of distinct object labels that are face neighbours (4- or 6-adjacent). */
  static Set<Long> touchingPairs(int[] labels, int w, int h, int d) {
    Set<Long> pairs = new HashSet<>();
    for (int i = 0; i < labels.length; i++) {
      int x = i % w;
      int y = (i / w) % h;
      int z = i / (w * h);
      int[] next = {x + 1 < w ? i + 1 : -1, y + 1 < h ? i + w : -1, z + 1 < d ? i + w * h : -1};
      for (int j : next) {
        if (j >= 0 && labels[i] != 0 && labels[j] != 0 && labels[i] != labels[j]) {
          int a = Math.min(labels[i], labels[j]);
          int b = Math.max(labels[i], labels[j]);
          pairs.add(((long) a << 32) | b);
        }
      }
    }
    return pairs;
  }
}
