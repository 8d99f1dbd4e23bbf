package io.github.cleave.segment;

import io.github.cleave.energy.CutProblem;
import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.SolveStatus;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.concurrent.CancellationException;

/**
 * The cut of one graph over several sets of regional costs: the first call builds the graph and
 * solves it; later calls change only the terminal capacities and re-solve from the present flow and
 * search trees (Kohli and Torr, ICCV 2005), which gives the same cut as building and solving again
 * (same flow value, same minimal source set) without rebuilding the boundary arcs. Not thread-safe.
 */
final class VolumeCut {
  private final Raster features;
  private final SeedLabels seeds;
  private final EnergyParameters parameters;
  private CutProblem problem; // null until the first cut

  VolumeCut(Raster features, SeedLabels seeds, EnergyParameters parameters) {
    this.features = features;
    this.seeds = seeds;
    this.parameters = parameters;
  }

  /** The cut for these costs ({@code costs[0]} foreground, {@code costs[1]} background). */
  Segmenter.CutOutcome cut(float[][] costs) {
    long start = System.nanoTime();
    MaxFlowResult result;
    double buildMs;
    if (problem == null) {
      problem =
          CutProblem.build(
              features, costs[0], costs[1], seeds, parameters, Segmenter.assertionsEnabled());
      buildMs = Segmenter.millisSince(start);
      result = problem.solve();
    } else {
      problem.changeRegionalCosts(costs[0], costs[1]);
      buildMs = Segmenter.millisSince(start);
      result = problem.resolve();
    }
    if (result.status() == SolveStatus.INTERRUPTED) {
      throw new CancellationException("segmentation interrupted");
    }
    return new Segmenter.CutOutcome(
        CutProblem.mask(result), result.flowValue(), buildMs, result.solveNanos() / 1e6);
  }
}
