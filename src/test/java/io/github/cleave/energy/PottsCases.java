package io.github.cleave.energy;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;

/**
 * Seeded random K-class problems for the Potts energy tests, and the energy evaluated straight from
 * its formula (DESIGN.md, with [L_p != L_q]), independently of {@link PottsEnergy} and its graphs.
 */
final class PottsCases {
  private PottsCases() {}

  /** One random problem. */
  record Case(Raster image, float[][] costs, SeedLabels seeds, EnergyParameters parameters) {
    int size() {
      return image.size();
    }

    PottsEnergy energy() {
      return PottsEnergy.build(image, costs, seeds, parameters);
    }
  }

  /**
   * A random problem: grey values in 0..100 (whole numbers, as 8-bit images, half of the time) or
   * two channels, regional costs in 0..8 nats, about {@code seedShare} of the voxels seeded with a
   * random class, anisotropic voxels, λ in 0..5, σ in 5..45.
   */
  static Case random(
      SplittableRandom random,
      int w,
      int h,
      int d,
      Neighborhood nb,
      int classes,
      double seedShare) {
    int n = w * h * d;
    boolean whole = random.nextBoolean();
    int channels = whole ? 1 : 1 + random.nextInt(2);
    float[][] values = new float[channels][n];
    for (float[] channel : values) {
      for (int p = 0; p < n; p++) {
        channel[p] = whole ? random.nextInt(101) : (float) (random.nextDouble() * 100);
      }
    }
    float[][] costs = new float[classes][n];
    for (float[] c : costs) {
      for (int p = 0; p < n; p++) {
        c[p] = (float) (random.nextDouble() * 8);
      }
    }
    byte[] seeds = new byte[n];
    for (int p = 0; p < n; p++) {
      if (random.nextDouble() < seedShare) {
        seeds[p] = (byte) (1 + random.nextInt(classes));
      }
    }
    VoxelSize size =
        d > 1
            ? new VoxelSize(1, 1 + random.nextDouble(), 1 + 2 * random.nextDouble(), "um", false)
            : new VoxelSize(1, 1 + random.nextDouble() * 0.5, 1, "um", false);
    Raster image = new Raster(w, h, d, values, size, whole ? PixelKind.GREY8 : PixelKind.FLOAT32);
    EnergyParameters parameters =
        new EnergyParameters(random.nextDouble() * 5, 5 + random.nextDouble() * 40, nb, size);
    return new Case(image, costs, new SeedLabels(w, h, d, seeds), parameters);
  }

  /**
   * Quantised regional cost of class c (1..K) at voxel p; 0 at seeds, as in the two-class graph.
   */
  static long regional(Case c, int p, int label) {
    return c.seeds().label(p) != 0 ? 0 : (long) Math.rint(256.0 * c.costs()[label - 1][p]);
  }

  /**
   * The unordered neighbour pairs as {p, q, B_pq} with B_pq from the formula: rint(λ · w_k · 256 ·
   * exp(−‖I_p − I_q‖² / 2σ²)), w_k the Cauchy–Crofton weight (Boykov and Kolmogorov, ICCV 2003, via
   * {@link LengthWeights}).
   */
  static long[][] pairs(Case c) {
    Raster image = c.image();
    EnergyParameters parameters = c.parameters();
    Neighborhood nb = parameters.neighborhood();
    VoxelSize s = parameters.voxelSize();
    double[] lengthWeight = LengthWeights.of(nb, 1, s.y() / s.x(), s.z() / s.x());
    double sigma = parameters.contrastScale();
    int w = image.width();
    int h = image.height();
    int d = image.depth();
    java.util.List<long[]> list = new java.util.ArrayList<>();
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          int p = x + w * (y + h * z);
          for (int k = 0; k < nb.size(); k += 2) {
            int qx = x + nb.dx(k);
            int qy = y + nb.dy(k);
            int qz = z + nb.dz(k);
            if (qx < 0 || qy < 0 || qz < 0 || qx >= w || qy >= h || qz >= d) {
              continue;
            }
            int q = qx + w * (qy + h * qz);
            double sq = 0;
            for (int ch = 0; ch < image.channelCount(); ch++) {
              double diff = (double) image.channel(ch)[p] - image.channel(ch)[q];
              sq += diff * diff;
            }
            long b =
                (long)
                    Math.rint(
                        parameters.boundaryPenalty()
                            * lengthWeight[k]
                            * 256.0
                            * Math.exp(-sq / (2 * sigma * sigma)));
            list.add(new long[] {p, q, b});
          }
        }
      }
    }
    return list.toArray(new long[0][]);
  }

  /** E(L) from the formula, or Long.MAX_VALUE if a seed is broken. */
  static long energy(Case c, long[][] pairs, byte[] labels) {
    long e = 0;
    for (int p = 0; p < labels.length; p++) {
      int seed = c.seeds().label(p);
      if (seed != 0 && seed != labels[p]) {
        return Long.MAX_VALUE;
      }
      e += regional(c, p, labels[p]);
    }
    for (long[] pair : pairs) {
      if (labels[(int) pair[0]] != labels[(int) pair[1]]) {
        e += pair[2];
      }
    }
    return e;
  }

  /** A random labelling that respects the seeds. */
  static byte[] randomLabels(SplittableRandom random, Case c, int classes) {
    byte[] labels = new byte[c.size()];
    for (int p = 0; p < labels.length; p++) {
      int seed = c.seeds().label(p);
      labels[p] = (byte) (seed != 0 ? seed : 1 + random.nextInt(classes));
    }
    return labels;
  }
}
