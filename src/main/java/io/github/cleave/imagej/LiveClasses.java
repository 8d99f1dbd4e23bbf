package io.github.cleave.imagej;

import io.github.cleave.energy.AlphaExpansion;
import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.energy.PottsEnergy;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.model.LikelihoodModel;
import java.util.concurrent.CancellationException;

/**
 * The preview shown while the user paints three or more classes: the K-class Potts energy of
 * DESIGN.md ({@link PottsEnergy}: the same regional and boundary terms as the two-class cut) on one
 * plane (or one volume) of features, minimised by alpha-expansion ({@link AlphaExpansion}; Boykov,
 * Veksler and Zabih, "Fast approximate energy minimization via graph cuts", IEEE TPAMI
 * 23(11):1222–1239, 2001, doi:10.1109/34.969114), from the background everywhere with the seeds in
 * their classes, for at most {@value AlphaExpansion#DEFAULT_MAX_CYCLES} cycles over the classes:
 * the plain expansion that the pipeline's multi-class cut starts every round with, without its
 * refinement rounds.
 *
 * <p><b>No dynamic re-solve.</b> Every update builds the energy anew and runs the whole expansion:
 * O(n · K_nb) to build plus at most {@code DEFAULT_MAX_CYCLES · K} minimum cuts. What is kept
 * between updates is what does not depend on the seeds: the regional costs of the model (O(n · K)
 * to compute once per model) and the contrast-scale estimate. The result is a local minimum within
 * twice the global one (BVZ 2001, Theorem 6.1).
 *
 * <p><b>Stopping.</b> The calling thread's interrupt is checked after the energy is built and
 * before every expansion move (and inside every solve); an interrupted update throws {@link
 * CancellationException} and leaves nothing half done: the next update starts afresh.
 *
 * <p>Not thread-safe: one worker thread owns an instance.
 */
final class LiveClasses {
  private final Raster features;
  private final Neighborhood neighborhood;
  private float[][] costs; // costs[c - 1][p] = D_p(c) of the model in use
  private final ContrastScaleOnce sigma;
  private PottsEnergy kept; // the last energy, whose boundary weights later updates reuse
  private EnergyParameters keptParameters; // the parameters it was built with

  /**
   * The outcome of one update.
   *
   * @param classes the class of every voxel, 1..K (unsigned bytes)
   * @param classCount K
   * @param energy the energy of {@code classes} in capacity units
   * @param cycles expansion cycles begun
   * @param moves expansion moves solved
   * @param solveNanos time spent building and solving the moves
   */
  record Outcome(
      byte[] classes, int classCount, long energy, int cycles, int moves, long solveNanos) {}

  /**
   * @param features the driving channels of the plane or volume being cut
   * @param neighborhood a 2D neighbourhood for a plane, 3D for a volume
   */
  LiveClasses(Raster features, Neighborhood neighborhood) {
    this.features = features;
    this.neighborhood = neighborhood;
    this.sigma = new ContrastScaleOnce(features, neighborhood);
  }

  /** Takes the K-class likelihoods of {@code learned} (K ≥ 2) for the regional term. */
  void useModel(LikelihoodModel learned) {
    float[][] c = new float[learned.classCount()][features.size()];
    learned.costs(features, c);
    costs = c;
  }

  /** The number of classes of the model in use, or 0 before {@link #useModel}. */
  int classCount() {
    return costs == null ? 0 : costs.length;
  }

  /**
   * Expands with these seeds and parameters.
   *
   * @param seeds labels 0..K of the features' voxels (hard constraints)
   * @param lambda the boundary penalty
   * @param contrastScale σ, or NaN to estimate it from the features
   * @throws IllegalStateException if no model was given
   * @throws CancellationException if the thread is interrupted (the flag stays set)
   */
  Outcome update(SeedLabels seeds, double lambda, double contrastScale) {
    if (costs == null) {
      throw new IllegalStateException("no likelihood model yet: call useModel first");
    }
    double s = sigma.resolve(contrastScale);
    long start = System.nanoTime();
    EnergyParameters p = new EnergyParameters(lambda, s, neighborhood, features.voxelSize());
    // the boundary weights depend on the parameters only: kept while they stay
    PottsEnergy energy =
        kept != null && p.equals(keptParameters)
            ? kept.withCostsAndSeeds(costs, seeds)
            : PottsEnergy.build(features, costs, seeds, p);
    kept = energy;
    keptParameters = p;
    if (Thread.currentThread().isInterrupted()) {
      throw new CancellationException("stopped");
    }
    AlphaExpansion.Outcome o =
        AlphaExpansion.run(
            energy, AlphaExpansion.backgroundStart(seeds), AlphaExpansion.DEFAULT_MAX_CYCLES);
    return new Outcome(
        o.labels(), costs.length, o.energy(), o.cycles(), o.moves(), System.nanoTime() - start);
  }
}
