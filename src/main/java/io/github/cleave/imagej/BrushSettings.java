package io.github.cleave.imagej;

import io.github.cleave.model.ModelKind;
import io.github.cleave.segment.SegmentationSettings;

/**
 * What the seed brush panel is set to: what a stroke paints and the settings of the cut. Immutable;
 * the panel replaces it on every change.
 *
 * @param paint what a stroke does: the class it paints (1 foreground, 2 background, 3..{@value
 *     PaintClasses#MAX} further classes), or {@link #ERASER}
 * @param width brush width in pixels (at least 1)
 * @param boundaryPenalty λ
 * @param contrastScale σ, or NaN for the estimate
 * @param neighborhood 4, 8, 16, 6, 18 or 26, or 0 for the default
 * @param likelihood the likelihood model kind
 * @param volume whether a stack is cut as one volume (3D) instead of plane by plane
 */
record BrushSettings(
    int paint,
    float width,
    double boundaryPenalty,
    double contrastScale,
    int neighborhood,
    ModelKind likelihood,
    boolean volume) {

  /** The {@code paint} value of the eraser: a stroke removes the strokes it touches. */
  static final int ERASER = 0;

  /**
   * @throws IllegalArgumentException if {@code paint} is neither the eraser nor a class 1..{@value
   *     PaintClasses#MAX}
   */
  BrushSettings {
    if (paint < ERASER || paint > PaintClasses.MAX) {
      throw new IllegalArgumentException(
          "paint " + paint + ": give 0 (eraser) or a class 1 to " + PaintClasses.MAX);
    }
  }

  static BrushSettings defaults() {
    return new BrushSettings(
        1, 8, SegmentationSettings.DEFAULT_BOUNDARY_PENALTY, Double.NaN, 0, ModelKind.AUTO, false);
  }

  /** Whether strokes erase. */
  boolean erasing() {
    return paint == ERASER;
  }

  BrushSettings withPaint(int p) {
    return new BrushSettings(
        p, width, boundaryPenalty, contrastScale, neighborhood, likelihood, volume);
  }

  BrushSettings withWidth(float w) {
    return new BrushSettings(
        paint, w, boundaryPenalty, contrastScale, neighborhood, likelihood, volume);
  }

  BrushSettings withBoundaryPenalty(double l) {
    return new BrushSettings(paint, width, l, contrastScale, neighborhood, likelihood, volume);
  }

  BrushSettings withCut(double sigma, int nb, ModelKind kind, boolean vol) {
    return new BrushSettings(paint, width, boundaryPenalty, sigma, nb, kind, vol);
  }

  /** The pipeline settings for the panel's actions: the defaults with the panel's values. */
  SegmentationSettings segmentation() {
    return SegmentationSettings.defaults().toBuilder()
        .boundaryPenalty(boundaryPenalty)
        .contrastScale(contrastScale)
        .neighborhood(neighborhood)
        .modelKind(likelihood)
        .perPlane(!volume)
        .build();
  }
}
