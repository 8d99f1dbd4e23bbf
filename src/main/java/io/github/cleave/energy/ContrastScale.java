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
 * <p>O(n · K / 2) for n voxels and K neighbours; one pass, no allocation. Rows are summed in four
 * interleaved partial sums (a fixed order, so the result is the same on every run).
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
          if (x1 <= x0) {
            continue; // the image is narrower than the step
          }
          int base = w * (y + h * z);
          double rowSum = rowSum(channels, base + x0, base + x1, step);
          if (Double.isFinite(rowSum)) {
            sum += rowSum;
            pairs += x1 - x0;
          } else {
            for (int p = base + x0; p < base + x1; p++) {
              double sq = squaredDifference(channels, p, p + step);
              if (Double.isFinite(sq)) {
                sum += sq;
                pairs++;
              }
            }
          }
        }
      }
    }
    return sigmaOf(pairs == 0 ? 0 : sum / pairs);
  }

  private static double sigmaOf(double meanSquaredDifference) {
    double sigma = Math.sqrt(0.5 * meanSquaredDifference);
    return sigma > 0 ? sigma : Double.MIN_NORMAL;
  }

  /**
   * The sum of {@code ‖I_p − I_{p+step}‖²} for p from {@code from} to {@code to}: finite exactly
   * when every term is (floats cannot make a finite sum of one row overflow). Four partial sums, so
   * that the additions do not wait for each other.
   */
  private static double rowSum(float[][] channels, int from, int to, int step) {
    double s0 = 0;
    double s1 = 0;
    double s2 = 0;
    double s3 = 0;
    int p = from;
    if (channels.length == 1) {
      float[] v = channels[0];
      for (; p + 3 < to; p += 4) {
        double d0 = (double) v[p] - v[p + step];
        double d1 = (double) v[p + 1] - v[p + 1 + step];
        double d2 = (double) v[p + 2] - v[p + 2 + step];
        double d3 = (double) v[p + 3] - v[p + 3 + step];
        s0 += d0 * d0;
        s1 += d1 * d1;
        s2 += d2 * d2;
        s3 += d3 * d3;
      }
    }
    for (; p < to; p++) {
      s0 += squaredDifference(channels, p, p + step);
    }
    return (s0 + s1) + (s2 + s3);
  }

  /** {@code ‖I_p − I_q‖²} over all channels. */
  static double squaredDifference(Raster features, int p, int q) {
    float[][] channels = new float[features.channelCount()][];
    for (int c = 0; c < channels.length; c++) {
      channels[c] = features.channel(c);
    }
    return squaredDifference(channels, p, q);
  }

  /** {@code ‖I_p − I_q‖²} over the channels, summed in channel order. */
  static double squaredDifference(float[][] channels, int p, int q) {
    double sq = 0;
    for (float[] v : channels) {
      double diff = (double) v[p] - v[q];
      sq += diff * diff;
    }
    return sq;
  }
}
