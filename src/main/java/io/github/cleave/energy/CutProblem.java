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
 * source → p = K} and {@code p → sink = 0}, a background seed the reverse, with {@code K = 1 +
 * max_p Σ_q B_pq}: moving a seed across the cut would always cost more than any boundary it could
 * save, so seeds are never cut off (Boykov and Jolly, ICCV 2001, doi:10.1109/ICCV.2001.937505).
 * Neighbour arcs in both directions carry {@code B_pq = λ · w_k · exp(−‖I_p − I_q‖² / 2σ²)} with
 * the Cauchy–Crofton weight {@code w_k} (which already contains {@code 1/|e_k|}; not divided by the
 * distance again). All values are converted to integers by {@link CapacityScale}, so the flow value
 * equals the minimum energy in capacity units exactly, seeds contributing nothing.
 *
 * <h2>Cost</h2>
 *
 * Building is O(n · K) for n voxels and K neighbours, with {@code K/2} boundary weights per voxel
 * (each unordered pair once, by table look-up where the image allows: see {@code BoundaryArcs});
 * the solver's memory is that of {@link GridMaxFlow} plus four temporary int arrays of n entries
 * during the build, and two kept for {@link #changeRegionalCosts}. Not thread-safe.
 */
public final class CutProblem {
  private final GridMaxFlow solver;
  private final int hardCapacity;
  private final int[] source; // present capacity source -> p, in node order
  private final int[] sink; // present capacity p -> sink
  private final byte[] seedLabels; // the seeds, shared with the caller's SeedLabels

  private CutProblem(
      GridMaxFlow solver, int hardCapacity, int[] source, int[] sink, byte[] seedLabels) {
    this.solver = solver;
    this.hardCapacity = hardCapacity;
    this.source = source;
    this.sink = sink;
    this.seedLabels = seedLabels;
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
    int[] source = new int[n];
    int[] sink = new int[n];
    byte[] labels = seeds.labels();
    for (int p = 0; p < n; p++) {
      int label = labels[p];
      if (label == SeedLabels.FOREGROUND) {
        source[p] = hard;
        sink[p] = 0;
      } else if (label == SeedLabels.BACKGROUND) {
        source[p] = 0;
        sink[p] = hard;
      } else {
        source[p] = CapacityScale.toCapacity(backgroundCost[p]);
        sink[p] = CapacityScale.toCapacity(foregroundCost[p]);
      }
    }
    solver.setTerminalCapacities(source, sink);
    return new CutProblem(solver, hard, source, sink, labels); // the solver copied the values
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
    int[] sourceDelta = new int[n];
    int[] sinkDelta = new int[n];
    for (int p = 0; p < n; p++) {
      if (seedLabels[p] == SeedLabels.FOREGROUND || seedLabels[p] == SeedLabels.BACKGROUND) {
        continue;
      }
      int cs = CapacityScale.toCapacity(backgroundCost[p]);
      int ct = CapacityScale.toCapacity(foregroundCost[p]);
      sourceDelta[p] = cs - source[p]; // both within 0 .. Integer.MAX_VALUE: no overflow
      sinkDelta[p] = ct - sink[p];
      source[p] = cs;
      sink[p] = ct;
    }
    solver.addTerminalCapacities(sourceDelta, sinkDelta);
  }

  /**
   * Continues from the flow of the last solve after {@link #changeRegionalCosts}; the result equals
   * that of a solve from scratch (same flow value, same minimal source set).
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
