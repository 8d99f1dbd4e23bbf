package io.github.cleave.energy;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.Locale;

/**
 * The two-class segmentation energy of DESIGN.md as a grid max-flow problem, ready to solve.
 *
 * <h2>Graph</h2>
 *
 * One node per voxel, in the raster's order; the source side of the minimum cut is the foreground.
 * Terminal arcs carry the regional term: {@code source → p} the cost of calling {@code p}
 * background ({@code D_p(bg)}), {@code p → sink} the cost of calling it foreground ({@code
 * D_p(fg)}); a cut pays the arc of the class it does not choose. A foreground seed gets {@code
 * source → p = K} and {@code p → sink = 0}, a background seed the reverse, with {@code K = 1 + Σ_k
 * λ · w_k} in capacity units (the boundary weights of a voxel among equal neighbours, at least
 * {@code max_p Σ_q B_pq}): moving a seed across the cut would always cost more than any boundary it
 * could save, so seeds are never cut off (Boykov and Jolly, ICCV 2001,
 * doi:10.1109/ICCV.2001.937505). Neighbour arcs in both directions carry {@code B_pq = λ · w_k ·
 * exp(−‖I_p − I_q‖² / 2σ²)} with the Cauchy–Crofton weight {@code w_k} (which already contains
 * {@code 1/|e_k|}; not divided by the distance again). All values are converted to integers by
 * {@link CapacityScale}, so the flow value equals the minimum energy in capacity units exactly,
 * seeds contributing nothing.
 *
 * <h2>Cost</h2>
 *
 * Building is O(n · K) for n voxels and K neighbours, with {@code K/2} boundary weights per voxel
 * (each unordered pair once, by table look-up where the image allows: see {@code BoundaryArcs});
 * the solver's memory is that of {@link GridMaxFlow} plus three temporary int arrays of n entries
 * during the build, and two int arrays and a copy of the seeds kept for {@link
 * #changeRegionalCosts} and {@link #changeSeeds}. Not thread-safe.
 */
public final class CutProblem {
  private final GridMaxFlow solver;
  private final int hardCapacity;
  private final int[] source; // present capacity source -> p, in node order
  private final int[] sink; // present capacity p -> sink
  private final byte[] seedLabels; // the present seeds, our own copy
  private float[] foregroundCost; // the present regional costs, the caller's arrays
  private float[] backgroundCost;

  private CutProblem(
      GridMaxFlow solver,
      int hardCapacity,
      byte[] seedLabels,
      float[] foregroundCost,
      float[] backgroundCost) {
    this.solver = solver;
    this.hardCapacity = hardCapacity;
    this.seedLabels = seedLabels;
    this.foregroundCost = foregroundCost;
    this.backgroundCost = backgroundCost;
    this.source = new int[seedLabels.length];
    this.sink = new int[seedLabels.length];
    for (int p = 0; p < seedLabels.length; p++) { // what setTerminals gives, in two plain passes
      source[p] = CapacityScale.toCapacity(backgroundCost[p]);
      sink[p] = CapacityScale.toCapacity(foregroundCost[p]);
    }
    for (int p = SeedLabels.nextLabelled(seedLabels, 0);
        p < seedLabels.length;
        p = SeedLabels.nextLabelled(seedLabels, p + 1)) {
      if (seedLabels[p] == SeedLabels.FOREGROUND || seedLabels[p] == SeedLabels.BACKGROUND) {
        setTerminals(p);
      }
    }
  }

  /**
   * The terminal capacities of voxel p from its seed label and regional costs: a foreground seed
   * {@code source → p = K, p → sink = 0}, a background seed the reverse, any other voxel {@code
   * D_p(bg)} and {@code D_p(fg)}.
   */
  private void setTerminals(int p) {
    int label = seedLabels[p];
    if (label == SeedLabels.FOREGROUND) {
      source[p] = hardCapacity;
      sink[p] = 0;
    } else if (label == SeedLabels.BACKGROUND) {
      source[p] = 0;
      sink[p] = hardCapacity;
    } else {
      source[p] = CapacityScale.toCapacity(backgroundCost[p]);
      sink[p] = CapacityScale.toCapacity(foregroundCost[p]);
    }
  }

  /**
   * Builds the graph.
   *
   * @param features the values the boundary term compares (the driving channels)
   * @param foregroundCost {@code D_p(fg)} in nats per voxel, finite and ≥ 0
   * @param backgroundCost {@code D_p(bg)} in nats per voxel, finite and ≥ 0
   * @param seeds labels 1 (foreground) and 2 (background); others are ignored here
   * @param retainCapacities whether the solver keeps its capacities (certificate, re-solves)
   * @throws IllegalArgumentException if sizes differ or the neighbourhood does not fit the image
   */
  public static CutProblem build(
      Raster features,
      float[] foregroundCost,
      float[] backgroundCost,
      SeedLabels seeds,
      EnergyParameters parameters,
      boolean retainCapacities) {
    int n = features.size();
    if (foregroundCost.length != n || backgroundCost.length != n || seeds.size() != n) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "energy: %d voxels, %d and %d regional costs, %d seed labels",
              n,
              foregroundCost.length,
              backgroundCost.length,
              seeds.size()));
    }
    Neighborhood nb = parameters.neighborhood();
    checkFits(features, nb);
    GridMaxFlow solver =
        new GridMaxFlow(
            features.width(), features.height(), features.depth(), nb, retainCapacities);
    int hard = BoundaryArcs.set(solver, features, parameters) + 1;
    CutProblem problem =
        new CutProblem(solver, hard, seeds.labels().clone(), foregroundCost, backgroundCost);
    solver.setTerminalCapacities(problem.source, problem.sink);
    return problem; // the solver copied the values
  }

  /** Throws unless {@code nb} is a 2D neighbourhood for a plane or a 3D one for a stack. */
  static void checkFits(Raster features, Neighborhood nb) {
    if (nb.isThreeDimensional() != (features.depth() > 1)) {
      throw new IllegalArgumentException(
          "neighborhood "
              + nb.size()
              + " does not fit an image of "
              + features.depth()
              + " plane(s): use 4, 8 or 16 for a plane, 6, 18 or 26 for a stack");
    }
  }

  /**
   * Replaces the regional costs of every voxel that is not a seed, keeping the boundary arcs and
   * the seeds; after a solve the change is applied to the present flow and search trees, so that
   * {@link #resolve()} continues from them (dynamic re-solve) instead of building and solving
   * again. O(n) plus the re-solve.
   *
   * @param foregroundCost {@code D_p(fg)} in nats per voxel, finite and ≥ 0
   * @param backgroundCost {@code D_p(bg)} in nats per voxel, finite and ≥ 0
   */
  public void changeRegionalCosts(float[] foregroundCost, float[] backgroundCost) {
    int n = source.length;
    if (foregroundCost.length != n || backgroundCost.length != n) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "regional costs: %d and %d values for %d voxels",
              foregroundCost.length,
              backgroundCost.length,
              n));
    }
    this.foregroundCost = foregroundCost;
    this.backgroundCost = backgroundCost;
    int[] sourceDelta = new int[n];
    int[] sinkDelta = new int[n];
    for (int p = 0; p < n; p++) {
      if (seedLabels[p] != SeedLabels.FOREGROUND && seedLabels[p] != SeedLabels.BACKGROUND) {
        retarget(p, sourceDelta, sinkDelta);
      }
    }
    solver.addTerminalCapacities(sourceDelta, sinkDelta);
  }

  /**
   * Replaces the seeds, keeping the boundary arcs and the regional costs: every voxel whose label
   * changed gets the terminal capacities of its new label (a hard constraint, or its regional costs
   * again when it is no longer a seed). After a solve the change is applied to the present flow and
   * search trees for {@link #resolve()} (a new stroke is the dynamic re-solve's typical case). O(n)
   * plus the re-solve.
   *
   * @throws IllegalArgumentException if the size differs
   */
  public void changeSeeds(SeedLabels seeds) {
    byte[] labels = seeds.labels();
    int n = source.length;
    if (labels.length != n) {
      throw new IllegalArgumentException(
          String.format(Locale.ROOT, "seeds: %d labels for %d voxels", labels.length, n));
    }
    for (int p = 0; p < n; p++) { // few voxels change: one call each, no arrays of n deltas
      if (labels[p] != seedLabels[p]) {
        int cs = source[p];
        int ct = sink[p];
        seedLabels[p] = labels[p];
        setTerminals(p);
        solver.addTerminalCapacities(p, source[p] - cs, sink[p] - ct);
      }
    }
  }

  /** Sets voxel p's terminals anew and records the change (both within 0 .. MAX: no overflow). */
  private void retarget(int p, int[] sourceDelta, int[] sinkDelta) {
    int cs = source[p];
    int ct = sink[p];
    setTerminals(p);
    sourceDelta[p] = source[p] - cs;
    sinkDelta[p] = sink[p] - ct;
  }

  /**
   * Continues from the flow of the last solve after {@link #changeRegionalCosts} or {@link
   * #changeSeeds}; the result equals that of a solve from scratch (same flow value, same minimal
   * source set).
   */
  public MaxFlowResult resolve() {
    return solver.resolve();
  }

  /** Solves from scratch (or continues after capacity changes, see {@link GridMaxFlow}). */
  public MaxFlowResult solve() {
    return solver.solve();
  }

  /** The capacity {@code K} that makes a seed a hard constraint. */
  public int hardCapacity() {
    return hardCapacity;
  }

  /** The underlying solver, for dynamic re-solves and diagnostics. */
  public GridMaxFlow solver() {
    return solver;
  }

  /** The foreground mask of a cut: 255 on the source side, 0 elsewhere (ImageJ's binary). */
  public static byte[] mask(MaxFlowResult result) {
    byte[] mask = new byte[result.nodeCount()];
    var side = result.sourceSide();
    for (int p = side.nextSetBit(0); p >= 0; p = side.nextSetBit(p + 1)) {
      mask[p] = (byte) 255;
    }
    return mask;
  }
}
