package io.github.cleave.energy;

import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.flow.SparseGraphBuilder;
import io.github.cleave.flow.SparseMaxFlow;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.Locale;

/**
 * The energy of {@link CutProblem} when most voxels have fixed labels: a graph over the free voxels
 * only, for re-deciding a thin band around a finished cut.
 *
 * <p>Fixed voxels leave the graph; the boundary term between a free voxel {@code p} and a fixed
 * neighbour {@code q} becomes a terminal capacity of {@code p}: {@code B_pq} more on {@code source
 * → p} when {@code q} is fixed foreground (calling {@code p} background would pay it), on {@code p
 * → sink} when {@code q} is fixed background (V. Kolmogorov and R. Zabih, "What energy functions
 * can be minimized via graph cuts?", IEEE TPAMI 26(2), 2004, doi:10.1109/TPAMI.2004.1262177: a pair
 * term with one label known is a unary term). Boundary capacities are those of {@link CutProblem},
 * evaluated pair by pair by the same tables, and regional costs are quantised by {@link
 * CapacityScale} alike. So the energy of every labelling of the free voxels equals that of {@link
 * CutProblem} with the fixed voxels as hard seeds, less a constant (the boundary between fixed
 * voxels), and the minimal source set is the same: {@link #mask} returns the same mask.
 *
 * <p><b>Representation.</b> When the free voxels are few ({@link #prefersCompact}), the graph is
 * built on compressed adjacency ({@link SparseMaxFlow}: free voxel i is node i, then the source and
 * the sink), whose size and search follow the free voxels alone; otherwise on the grid solver,
 * whose arrays span the whole grid but cost less per voxel. Both give the same mask and flow.
 *
 * <p>Cost: O(n) to list the free voxels, O(f · K) for f free voxels and K neighbours to build, and
 * a solve whose search stays among the free voxels. Memory: compact, about {@value
 * #COMPACT_BYTES_PER_ARC} bytes per arc plus 4 per voxel for the node numbers; on the grid, the
 * grid solver plus {@code f · K} ints while building. Not thread-safe.
 */
public final class FixedLabelCut {
  /**
   * Bytes per arc of the compact graph while it is built and solved: the builder's three ints, the
   * solver's copy of them, its forward index, and two residual arcs of three ints each.
   */
  static final int COMPACT_BYTES_PER_ARC = 52;

  /** Bytes per voxel of the grid solver beyond its residual arcs (terminal and search state). */
  private static final int GRID_BYTES_PER_NODE = 22;

  private final byte[] fixed;
  private final GridMaxFlow grid; // exactly one of grid and compact is set
  private final SparseMaxFlow compact;
  private final int[] nodes; // compact: the voxel of node i
  private final int free;
  private final long constant; // compact: capacity taken off both terminal arcs of a voxel

  private FixedLabelCut(
      byte[] fixed, GridMaxFlow grid, SparseMaxFlow compact, int[] nodes, int free, long constant) {
    this.fixed = fixed;
    this.grid = grid;
    this.compact = compact;
    this.nodes = nodes;
    this.free = free;
    this.constant = constant;
  }

  /**
   * Whether a graph of {@code free} voxels with {@code directions} neighbours each is smaller on
   * compressed adjacency than a grid solver of {@code n} voxels (2 bytes per residual arc at the
   * least).
   */
  static boolean prefersCompact(long n, long free, int directions) {
    long compactBytes = free * (directions + 2) * COMPACT_BYTES_PER_ARC + 4 * n;
    long gridBytes = n * (2L * directions + GRID_BYTES_PER_NODE);
    return compactBytes <= gridBytes;
  }

  /**
   * Builds the graph of the free voxels.
   *
   * @param features the values the boundary term compares (the driving channels)
   * @param foregroundCost {@code D_p(fg)} in nats per voxel, finite and ≥ 0 where free
   * @param backgroundCost {@code D_p(bg)} in nats per voxel, finite and ≥ 0 where free
   * @param labels {@link SeedLabels#FOREGROUND} or {@link SeedLabels#BACKGROUND} where fixed, 0
   *     where free
   * @throws IllegalArgumentException if sizes differ or the neighbourhood does not fit the image
   */
  public static FixedLabelCut build(
      Raster features,
      float[] foregroundCost,
      float[] backgroundCost,
      SeedLabels labels,
      EnergyParameters parameters) {
    return build(features, foregroundCost, backgroundCost, labels, parameters, null);
  }

  /**
   * As {@link #build(Raster, float[], float[], SeedLabels, EnergyParameters)}, with the
   * representation forced ({@code compact} true or false) or chosen ({@code null}).
   */
  static FixedLabelCut build(
      Raster features,
      float[] foregroundCost,
      float[] backgroundCost,
      SeedLabels labels,
      EnergyParameters parameters,
      Boolean compact) {
    int n = features.size();
    if (foregroundCost.length != n || backgroundCost.length != n || labels.size() != n) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "energy: %d voxels, %d and %d regional costs, %d labels",
              n,
              foregroundCost.length,
              backgroundCost.length,
              labels.size()));
    }
    Neighborhood nb = parameters.neighborhood();
    CutProblem.checkFits(features, nb);
    int directions = nb.size();
    byte[] fixed = labels.labels();
    int free = 0;
    for (byte label : fixed) {
      if (label != SeedLabels.FOREGROUND && label != SeedLabels.BACKGROUND) {
        free++;
      }
    }
    int[] nodes = new int[free];
    for (int p = 0, i = 0; i < free; p++) {
      if (fixed[p] != SeedLabels.FOREGROUND && fixed[p] != SeedLabels.BACKGROUND) {
        nodes[i++] = p;
      }
    }
    Arcs arcs = new Arcs(features, parameters, fixed);
    boolean useCompact = compact != null ? compact : prefersCompact(n, free, directions);
    return useCompact
        ? buildCompact(fixed, nodes, free, foregroundCost, backgroundCost, false, arcs)
        : buildGrid(features, fixed, nodes, free, foregroundCost, backgroundCost, arcs);
  }

  /**
   * As {@link #build(Raster, float[], float[], SeedLabels, EnergyParameters)} when the free voxels
   * are already known: {@code free[i]} (ascending, each labelled 0 in {@code labels}) with regional
   * costs {@code foregroundCost[i]} and {@code backgroundCost[i]}; every other voxel must be fixed.
   * Gives the same graph, mask and flow as the full form without a pass over the image, always on
   * compressed adjacency; for a band around a cut, whose voxels are few.
   *
   * @throws IllegalArgumentException if the arrays' lengths differ, the neighbourhood does not fit
   *     the image, or a listed voxel is labelled or out of order (an unlisted voxel labelled 0 is
   *     not detected: that would take a pass over the image)
   */
  public static FixedLabelCut buildListed(
      Raster features,
      int[] free,
      float[] foregroundCost,
      float[] backgroundCost,
      SeedLabels labels,
      EnergyParameters parameters) {
    if (foregroundCost.length != free.length
        || backgroundCost.length != free.length
        || labels.size() != features.size()) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "energy: %d free voxels, %d and %d regional costs; %d voxels, %d labels",
              free.length,
              foregroundCost.length,
              backgroundCost.length,
              features.size(),
              labels.size()));
    }
    CutProblem.checkFits(features, parameters.neighborhood());
    byte[] fixed = labels.labels();
    for (int i = 0; i < free.length; i++) { // what can be checked without a pass over the image
      if (fixed[free[i]] != 0 || (i > 0 && free[i] <= free[i - 1])) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "free voxel %d (listed at %d) is %s: list the voxels labelled 0, ascending",
                free[i],
                i,
                fixed[free[i]] != 0 ? "labelled " + fixed[free[i]] : "out of order"));
      }
    }
    Arcs arcs = new Arcs(features, parameters, fixed);
    return buildCompact(fixed, free, free.length, foregroundCost, backgroundCost, true, arcs);
  }

  private static FixedLabelCut buildGrid(
      Raster features,
      byte[] fixed,
      int[] nodes,
      int free,
      float[] foregroundCost,
      float[] backgroundCost,
      Arcs arcs) {
    int directions = arcs.directions;
    int[] caps = new int[free * directions];
    int[] source = new int[free];
    int[] sink = new int[free];
    for (int i = 0; i < free; i++) {
      int p = nodes[i];
      long[] terminals = arcs.of(p, backgroundCost[p], foregroundCost[p], caps, i * directions);
      source[i] = (int) Math.min(Integer.MAX_VALUE, terminals[0]);
      sink[i] = (int) Math.min(Integer.MAX_VALUE, terminals[1]);
    }
    GridMaxFlow solver =
        new GridMaxFlow(features.width(), features.height(), features.depth(), arcs.neighborhood);
    solver.setNeighborCapacitiesOf(nodes, free, caps);
    solver.setTerminalCapacitiesOf(nodes, free, source, sink);
    return new FixedLabelCut(fixed, solver, null, nodes, free, 0);
  }

  /**
   * The graph on compressed adjacency: free voxel {@code nodes[i]} is node i, then the source and
   * the sink. The regional costs are indexed by node when {@code costPerNode}, else by voxel.
   */
  private static FixedLabelCut buildCompact(
      byte[] fixed,
      int[] nodes,
      int free,
      float[] foregroundCost,
      float[] backgroundCost,
      boolean costPerNode,
      Arcs arcs) {
    int directions = arcs.directions;
    int[] index = new int[fixed.length]; // node number of each free voxel
    for (int i = 0; i < free; i++) {
      index[nodes[i]] = i;
    }
    int sourceNode = free;
    int sinkNode = free + 1;
    SparseGraphBuilder graph =
        new SparseGraphBuilder(
            free + 2, (int) Math.min(Integer.MAX_VALUE / 2, free * (directions + 1L)));
    graph.setSource(sourceNode).setSink(sinkNode);
    int[] row = new int[directions];
    long constant = 0;
    for (int i = 0; i < free; i++) {
      int p = nodes[i];
      int c = costPerNode ? i : p;
      long[] terminals = arcs.of(p, backgroundCost[c], foregroundCost[c], row, 0);
      for (int k = 0; k < directions; k++) {
        if (row[k] > 0) {
          graph.addArc(i, index[p + arcs.step(k)], row[k]);
        }
      }
      // Only the difference of the two terminal arcs matters to the cut (the grid solver
      // likewise keeps the difference); the common part is a constant of every cut.
      long common = Math.min(terminals[0], terminals[1]);
      constant += common;
      if (terminals[0] > common) {
        graph.addArc(sourceNode, i, Math.min(Integer.MAX_VALUE, terminals[0] - common));
      } else if (terminals[1] > common) {
        graph.addArc(i, sinkNode, Math.min(Integer.MAX_VALUE, terminals[1] - common));
      }
    }
    return new FixedLabelCut(fixed, null, graph.build(), nodes, free, constant);
  }

  /** Solves the cut of the free voxels. */
  public MaxFlowResult solve() {
    return grid != null ? grid.solve() : compact.solve();
  }

  /**
   * The flow value of {@code result}, a result of {@link #solve}: the capacity of the minimum cut
   * of the free voxels (the same whatever the representation).
   */
  public long flowValue(MaxFlowResult result) {
    return result.flowValue() + constant;
  }

  /**
   * The foreground mask: 255 for fixed foreground and for free voxels on the source side of the
   * cut, 0 elsewhere.
   */
  public byte[] mask(MaxFlowResult result) {
    byte[] mask = new byte[fixed.length];
    for (int p = 0; p < mask.length; p++) {
      if (fixed[p] == SeedLabels.FOREGROUND) {
        mask[p] = (byte) 255;
      }
    }
    for (int i = 0; i < free; i++) {
      if (result.isSourceSide(grid != null ? nodes[i] : i)) {
        mask[nodes[i]] = (byte) 255;
      }
    }
    return mask;
  }

  /**
   * The arcs of one free voxel: boundary capacities towards free neighbours, and the terminal
   * capacities with the boundary towards fixed neighbours folded in.
   */
  private static final class Arcs {
    final Neighborhood neighborhood;
    final int directions;
    private final BoundaryArcs.PairCapacities pairs;
    private final byte[] fixed;
    private final int width;
    private final int height;
    private final int depth;
    private final int reach; // the neighbourhood's largest offset along an axis
    private final long[] terminals = new long[2];

    Arcs(Raster features, EnergyParameters parameters, byte[] fixed) {
      neighborhood = parameters.neighborhood();
      directions = neighborhood.size();
      pairs = new BoundaryArcs.PairCapacities(features, parameters);
      this.fixed = fixed;
      width = features.width();
      height = features.height();
      depth = features.depth();
      reach = neighborhood.reach();
    }

    /** Index offset of the neighbour in direction k. */
    int step(int k) {
      return pairs.step(k);
    }

    /**
     * Fills {@code out[offset + k]} with the capacity towards the free neighbour in direction k (0
     * when the neighbour is fixed or outside the grid) and returns {source, sink} capacities of
     * {@code p}, whose regional costs are given; the returned array is reused by the next call.
     */
    long[] of(int p, float backgroundCost, float foregroundCost, int[] out, int offset) {
      int row = p / width; // one division in a plane, two in a stack
      int x = p - row * width;
      int z = depth == 1 ? 0 : row / height;
      int y = row - z * height;
      boolean inside = // every neighbour inside the grid: no test per direction
          x >= reach
              && x < width - reach
              && y >= reach
              && y < height - reach
              && (depth == 1 || (z >= reach && z < depth - reach));
      long toSource = CapacityScale.toCapacity(backgroundCost);
      long toSink = CapacityScale.toCapacity(foregroundCost);
      for (int k = 0; k < directions; k++) {
        if (!inside && !neighbourInside(x, y, z, k)) {
          out[offset + k] = 0;
          continue;
        }
        int cap = pairs.between(p, k);
        byte label = fixed[p + pairs.step(k)];
        // selections, not branches: the labels around a band voxel follow no pattern
        toSource += label == SeedLabels.FOREGROUND ? cap : 0;
        toSink += label == SeedLabels.BACKGROUND ? cap : 0;
        out[offset + k] =
            label != SeedLabels.FOREGROUND && label != SeedLabels.BACKGROUND ? cap : 0;
      }
      terminals[0] = toSource;
      terminals[1] = toSink;
      return terminals;
    }

    private boolean neighbourInside(int x, int y, int z, int k) {
      int qx = x + neighborhood.dx(k);
      int qy = y + neighborhood.dy(k);
      int qz = z + neighborhood.dz(k);
      return qx >= 0 && qx < width && qy >= 0 && qy < height && qz >= 0 && qz < depth;
    }
  }
}
