package io.github.cleave.energy;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;

/**
 * The contrast scale σ of the boundary term {@code exp(−‖I_p − I_q‖² / 2σ²)} estimated from the
 * image: {@code σ² = ½ · ⟨‖I_p − I_q‖²⟩}, the mean taken over every neighbour pair of the
 * neighbourhood (each unordered pair once) and over all channels of the feature image, so that the
 * exponent becomes {@code ‖ΔI‖² / ⟨‖ΔI‖²⟩} (Rother, Kolmogorov and Blake, ACM Trans. Graphics
 * 23(3), 2004, doi:10.1145/1015706.1015720; DESIGN.md). Pairs with a non-finite value are skipped.
 *
 * <p>O(n · K / 2) for n voxels and K neighbours; one pass, no allocation.
 */
public final class ContrastScale {
  private ContrastScale() {}

  /**
   * σ of {@code features} over the pairs of {@code nb}; a positive number even for a constant image
   * (then the smallest positive value, so that every boundary weight is 1 for equal neighbours).
   */
  public static double estimate(Raster features, Neighborhood nb) {
    int w = features.width();
    int h = features.height();
    int d = features.depth();
    float[][] channels = new float[features.channelCount()][];
    for (int c = 0; c < channels.length; c++) {
      channels[c] = features.channel(c);
    }
    double sum = 0;
    long pairs = 0;
    for (int k = 0; k < nb.size(); k += 2) {
      int dx = nb.dx(k);
      int dy = nb.dy(k);
      int dz = nb.dz(k);
      int step = dx + w * (dy + h * dz);
      for (int z = Math.max(0, -dz); z < Math.min(d, d - dz); z++) {
        for (int y = Math.max(0, -dy); y < Math.min(h, h - dy); y++) {
          int x0 = Math.max(0, -dx);
          int x1 = Math.min(w, w - dx);
          int base = w * (y + h * z);
          if (channels.length == 1) {
            float[] v = channels[0];
            for (int p = base + x0; p < base + x1; p++) {
              double diff = (double) v[p] - v[p + step];
              double sq = diff * diff; // equal to 0 + diff², the sum below for one channel
              if (Double.isFinite(sq)) {
                sum += sq;
                pairs++;
              }
            }
          } else {
            for (int p = base + x0; p < base + x1; p++) {
              double sq = 0;
              for (float[] v : channels) {
                double diff = (double) v[p] - v[p + step];
                sq += diff * diff;
              }
              if (Double.isFinite(sq)) {
                sum += sq;
                pairs++;
              }
            }
          }
        }
      }
    }
    double mean = pairs == 0 ? 0 : sum / pairs;
    double sigma = Math.sqrt(0.5 * mean);
    return sigma > 0 ? sigma : Double.MIN_NORMAL;
  }

  /** {@code ‖I_p − I_q‖²} over all channels. */
  static double squaredDifference(Raster features, int p, int q) {
    double sq = 0;
    for (int c = 0; c < features.channelCount(); c++) {
      float[] v = features.channel(c);
      double diff = (double) v[p] - v[q];
      sq += diff * diff;
    }
    return sq;
  }
}
