package io.github.cleave.energy;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.VoxelSize;
import java.util.Locale;

/**
 * The parameters of the energy {@code E(L) = Σ_p D_p(L_p) + λ · Σ_(p,q) w_k · exp(−‖I_p − I_q‖² /
 * 2σ²) · [L_p ≠ L_q]} (DESIGN.md) that are not learned from seeds.
 *
 * @param boundaryPenalty λ ≥ 0: larger gives smoother, shorter boundaries
 * @param contrastScale σ > 0, in the units of the feature values (see {@link ContrastScale})
 * @param neighborhood the grid neighbourhood; 2D for one plane, 3D for a stack cut as a volume
 * @param voxelSize the calibration; only the ratios of the sizes matter: lengths are measured in
 *     units of the pixel width, so the same λ means the same on images of any magnification
 */
public record EnergyParameters(
    double boundaryPenalty, double contrastScale, Neighborhood neighborhood, VoxelSize voxelSize) {

  /**
   * @throws IllegalArgumentException naming the value when λ is negative or not finite, or σ is not
   *     positive and finite
   */
  public EnergyParameters {
    if (!(boundaryPenalty >= 0) || Double.isInfinite(boundaryPenalty)) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "boundary penalty %s: use a number of 0 or more (typical 0.1 to 20)",
              boundaryPenalty));
    }
    if (!(contrastScale > 0) || Double.isInfinite(contrastScale)) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "contrast scale %s: use a positive number, or leave it out to estimate it",
              contrastScale));
    }
  }

  /** The Cauchy–Crofton weights of the neighbourhood for this calibration, x pixel size = 1. */
  public double[] lengthWeights() {
    return LengthWeightCache.weights(
        neighborhood, 1.0, voxelSize.y() / voxelSize.x(), voxelSize.z() / voxelSize.x());
  }
}
