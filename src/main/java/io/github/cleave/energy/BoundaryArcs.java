package io.github.cleave.energy;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;

/**
 * Fills the neighbour arcs of a grid solver with the contrast-sensitive boundary term {@code λ ·
 * w_k · exp(−‖I_p − I_q‖² / 2σ²)}, quantised by {@link CapacityScale}; the weight is symmetric, so
 * each unordered pair is computed once and stored for both directions. A pair with a non-finite
 * feature value gets weight 0.
 */
final class BoundaryArcs {
  private BoundaryArcs() {}

  /**
   * Sets every neighbour arc of {@code solver} and adds to {@code neighbourSum[p]} the capacities
   * of the arcs leaving {@code p}.
   */
  static void set(
      GridMaxFlow solver, Raster features, EnergyParameters parameters, int[] neighbourSum) {
    Neighborhood nb = parameters.neighborhood();
    double[] lengthWeight = parameters.lengthWeights();
    double sigma = parameters.contrastScale();
    double inverseTwoSigmaSquared = 1.0 / (2 * sigma * sigma);
    int w = features.width();
    int h = features.height();
    int d = features.depth();
    int n = features.size();
    int[] forward = new int[n];
    int[] backward = new int[n];
    for (int k = 0; k < nb.size(); k += 2) {
      int dx = nb.dx(k);
      int dy = nb.dy(k);
      int dz = nb.dz(k);
      int step = dx + w * (dy + h * dz);
      double scale = parameters.boundaryPenalty() * lengthWeight[k] * CapacityScale.UNITS_PER_NAT;
      for (int z = Math.max(0, -dz); z < Math.min(d, d - dz); z++) {
        for (int y = Math.max(0, -dy); y < Math.min(h, h - dy); y++) {
          int x0 = Math.max(0, -dx);
          int x1 = Math.min(w, w - dx);
          int base = w * (y + h * z);
          if (features.channelCount() == 1) {
            float[] v = features.channel(0);
            for (int p = base + x0; p < base + x1; p++) {
              double diff = (double) v[p] - v[p + step];
              int cap = capacity(scale, diff * diff * inverseTwoSigmaSquared);
              forward[p] = cap;
              backward[p + step] = cap;
              neighbourSum[p] += cap;
              neighbourSum[p + step] += cap;
            }
          } else {
            for (int p = base + x0; p < base + x1; p++) {
              double sq = ContrastScale.squaredDifference(features, p, p + step);
              int cap = capacity(scale, sq * inverseTwoSigmaSquared);
              forward[p] = cap;
              backward[p + step] = cap;
              neighbourSum[p] += cap;
              neighbourSum[p + step] += cap;
            }
          }
        }
      }
      solver.setNeighborCapacities(k, forward);
      solver.setNeighborCapacities(k ^ 1, backward);
    }
  }

  private static int capacity(double scale, double exponent) {
    double value = scale * Math.exp(-exponent);
    return value >= 0 ? (int) Math.min(Integer.MAX_VALUE / 64, Math.rint(value)) : 0;
  }
}
