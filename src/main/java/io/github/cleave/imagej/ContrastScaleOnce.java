package io.github.cleave.imagej;

import io.github.cleave.energy.ContrastScale;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;

/**
 * The contrast scale σ the brush's cuts use: the value the user gave, or else the estimate from the
 * features ({@link ContrastScale#estimate}), made once on first use and kept, since the features of
 * a session never change. Not thread-safe: the owner's worker thread uses it.
 */
final class ContrastScaleOnce {
  private final Raster features;
  private final Neighborhood neighborhood;
  private double estimate = Double.NaN;

  ContrastScaleOnce(Raster features, Neighborhood neighborhood) {
    this.features = features;
    this.neighborhood = neighborhood;
  }

  /** {@code given}, or the estimate (made now if not yet) when {@code given} is NaN. */
  double resolve(double given) {
    if (!Double.isNaN(given)) {
      return given;
    }
    if (Double.isNaN(estimate)) {
      estimate = ContrastScale.estimate(features, neighborhood);
    }
    return estimate;
  }

  /** As {@link #resolve} without estimating: NaN while the estimate has not been made. */
  double known(double given) {
    return Double.isNaN(given) ? estimate : given;
  }
}
