package io.github.cleave.imagej;

import io.github.cleave.energy.CutProblem;
import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.flow.SolveStatus;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.model.LikelihoodModel;

/**
 * The minimum cut shown while the user paints: the energy of DESIGN.md on one plane (or one volume)
 * of features, with the likelihoods learned from the seeds, kept between strokes so that a new
 * stroke costs only a dynamic re-solve.
 *
 * <p><b>Fast path.</b> A stroke, an erased stroke or an undo changes only hard constraints: each
 * voxel whose seed label changed gets the terminal capacities of its new label ({@code
 * CutProblem.changeSeeds}: a hard constraint, or its regional costs again), applied to the kept
 * flow and search trees, then {@code resolve()} continues from them (Kohli and Torr, "Dynamic graph
 * cuts for efficient inference in Markov random fields", IEEE TPAMI 29(12), 2007,
 * doi:10.1109/TPAMI.2007.1128). The result equals a solve from scratch of the same capacities.
 *
 * <p><b>Slow path.</b> New likelihoods ({@link #useModel}, after a pause in painting), a new
 * boundary penalty or contrast scale rebuilds the graph and solves it from scratch: O(n · K) to
 * build plus the solve.
 *
 * <p>This is the plain minimum cut of the features it is given (the brush session gives it the
 * features flattened when the pipeline's AUTO rule would flatten them; there are no refinement
 * rounds, edge placement or object rules); the commands that make masks run the whole pipeline.
 * Labels above 2 count as no seed here (the brush session gives seeds of three or more classes to
 * {@link LiveClasses} instead). Not thread-safe: one worker thread owns an instance.
 *
 * <p><b>Stopping.</b> If the calling thread is interrupted while the engine solves, {@link #update}
 * returns at once with {@link Outcome#stopped()} (no mask; the interrupt flag stays set, as the
 * engine leaves it). The kept cut then holds a flow that is not maximal; it is marked stale, and
 * the next update applies its seeds to the kept graph and solves it from zero flow instead of
 * continuing (the capacities are kept apart from the flow, so this costs a solve, not a rebuild).
 * Either way the next complete outcome equals a cut built and solved from scratch.
 */
final class LiveCut {
  private final Raster features;
  private final Neighborhood neighborhood;
  private final int n;

  private LikelihoodModel model;
  private float[] foregroundCost;
  private float[] backgroundCost;
  private final ContrastScaleOnce sigma;
  private CutProblem cut;
  private double builtLambda = Double.NaN;
  private double builtSigma = Double.NaN;
  private boolean stale; // the kept cut's last solve was interrupted: its flow is not maximal

  /**
   * The outcome of one update.
   *
   * @param mask the foreground mask (255 foreground, 0 background), or null if stopped
   * @param flowValue the maximum flow (= minimum cut value), or -1 if stopped
   * @param certified whether the certificate of optimality was checked
   * @param solveNanos time spent in the solver
   * @param dynamic whether the kept flow was re-used (dynamic re-solve)
   */
  record Outcome(byte[] mask, long flowValue, boolean certified, long solveNanos, boolean dynamic) {
    /** Whether the solve was interrupted before it finished (there is then no mask). */
    boolean stopped() {
      return mask == null;
    }
  }

  /**
   * @param features the driving channels of the plane or volume being cut
   * @param neighborhood a 2D neighbourhood for a plane, 3D for a volume
   */
  LiveCut(Raster features, Neighborhood neighborhood) {
    this.features = features;
    this.neighborhood = neighborhood;
    this.sigma = new ContrastScaleOnce(features, neighborhood);
    this.n = features.size();
  }

  /** Whether the seeds hold both a foreground and a background voxel (learning needs both). */
  static boolean hasBothClasses(SeedLabels seeds) {
    long[] counts = seeds.countsPerLabel();
    return counts.length > 2 && counts[1] > 0 && counts[2] > 0;
  }

  /** Whether a model has been given; {@link #update} needs one. */
  boolean hasModel() {
    return model != null;
  }

  /**
   * Takes the likelihoods of {@code learned} (learned from the seeds of this plane, or of every
   * plane of a stack) for the regional term; the next {@link #update} rebuilds the graph.
   */
  void useModel(LikelihoodModel learned) {
    model = learned;
    float[][] costs = new float[learned.classCount()][n];
    learned.costs(features, costs);
    foregroundCost = costs[0];
    backgroundCost = costs[1];
    cut = null;
  }

  /**
   * Cuts with these seeds and parameters, re-using the kept cut where only seeds changed.
   *
   * @param seeds labels of the features' voxels (hard constraints; may be empty)
   * @param lambda the boundary penalty
   * @param contrastScale σ, or NaN to estimate it from the features
   * @return the cut, or an outcome that {@link Outcome#stopped()} if the thread was interrupted
   * @throws IllegalStateException if no model was given
   */
  Outcome update(SeedLabels seeds, double lambda, double contrastScale) {
    if (model == null) {
      throw new IllegalStateException("no likelihood model yet: call useModel first");
    }
    double s = sigma.resolve(contrastScale);
    SeedLabels labels =
        new SeedLabels(
            features.width(), features.height(), features.depth(), twoClass(seeds.labels()));
    MaxFlowResult result;
    boolean reuse = cut != null && lambda == builtLambda && s == builtSigma;
    boolean dynamic = reuse && !stale;
    if (reuse) {
      cut.changeSeeds(labels);
      result = stale ? cut.solve() : cut.resolve(); // solve(): from zero flow, same graph
    } else {
      build(labels, lambda, s);
      result = cut.solve();
    }
    if (result.status() == SolveStatus.INTERRUPTED) {
      stale = true;
      return new Outcome(null, -1, false, result.solveNanos(), dynamic);
    }
    stale = false;
    boolean certified = cut.solver().checkCertificate();
    return new Outcome(
        CutProblem.mask(result), result.flowValue(), certified, result.solveNanos(), dynamic);
  }

  /**
   * Whether {@link #update} with these parameters would continue from the kept flow (a dynamic
   * re-solve) rather than build or solve from zero flow.
   */
  boolean wouldContinue(double lambda, double contrastScale) {
    double s = sigma.known(contrastScale);
    return cut != null && !stale && lambda == builtLambda && s == builtSigma;
  }

  /** Whether the kept cut's last solve was interrupted (the next update solves from zero flow). */
  boolean isStale() {
    return stale;
  }

  private void build(SeedLabels seeds, double lambda, double s) {
    EnergyParameters p = new EnergyParameters(lambda, s, neighborhood, features.voxelSize());
    cut = CutProblem.build(features, foregroundCost, backgroundCost, seeds, p, true);
    stale = false;
    builtLambda = lambda;
    builtSigma = s;
  }

  private static byte[] twoClass(byte[] labels) {
    byte[] out = new byte[labels.length];
    for (int i = 0; i < labels.length; i++) {
      int l = labels[i];
      out[i] = l == 1 || l == 2 ? (byte) l : 0;
    }
    return out;
  }
}
