package io.github.cleave.segment;

/**
 * Wall-clock milliseconds of each phase of one segmentation: flattening illumination, learning the
 * likelihoods (0 when a model was applied), computing regional costs, building the graph, solving,
 * forming objects, measuring.
 */
public record PhaseTimings(
    double flattenMs,
    double learnMs,
    double costsMs,
    double buildMs,
    double solveMs,
    double objectsMs,
    double measureMs) {

  /** The sum of all phases. */
  public double totalMs() {
    return flattenMs + learnMs + costsMs + buildMs + solveMs + objectsMs + measureMs;
  }
}
