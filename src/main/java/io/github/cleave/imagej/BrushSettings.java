package io.github.cleave.imagej;

import io.github.cleave.model.ModelKind;
import io.github.cleave.segment.SegmentationSettings;

/**
 * What the seed brush panel is set to: the painting mode and the settings of the cut. Immutable;
 * the panel replaces it on every change.
 *
 * @param mode what a stroke does
 * @param width brush width in pixels (at least 1)
 * @param boundaryPenalty λ
 * @param contrastScale σ, or NaN for the estimate
 * @param neighborhood 4, 8, 16, 6, 18 or 26, or 0 for the default
 * @param likelihood the likelihood model kind
 * @param volume whether a stack is cut as one volume (3D) instead of plane by plane
 */
record BrushSettings(
    Mode mode,
    float width,
    double boundaryPenalty,
    double contrastScale,
    int neighborhood,
    ModelKind likelihood,
    boolean volume) {

  /** What a stroke does. */
  enum Mode {
    FOREGROUND,
    BACKGROUND,
    ERASER
  }

  static BrushSettings defaults() {
    return new BrushSettings(
        Mode.FOREGROUND,
        8,
        SegmentationSettings.DEFAULT_BOUNDARY_PENALTY,
        Double.NaN,
        0,
        ModelKind.AUTO,
        false);
  }

  BrushSettings withMode(Mode m) {
    return new BrushSettings(
        m, width, boundaryPenalty, contrastScale, neighborhood, likelihood, volume);
  }

  BrushSettings withWidth(float w) {
    return new BrushSettings(
        mode, w, boundaryPenalty, contrastScale, neighborhood, likelihood, volume);
  }

  BrushSettings withBoundaryPenalty(double l) {
    return new BrushSettings(mode, width, l, contrastScale, neighborhood, likelihood, volume);
  }

  BrushSettings withCut(double sigma, int nb, ModelKind kind, boolean vol) {
    return new BrushSettings(mode, width, boundaryPenalty, sigma, nb, kind, vol);
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
