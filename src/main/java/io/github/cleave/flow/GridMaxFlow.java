package io.github.cleave.flow;

import java.util.BitSet;
import java.util.Locale;

/**
 * Maximum flow and minimum cut on a 2D or 3D pixel grid by the augmenting-path method of Boykov and
 * Kolmogorov, specialised for grids.
 *
 * <h2>Problem</h2>
 *
 * Every pixel (node) {@code p} has a capacity from the source {@code cs(p)}, a capacity to the sink
 * {@code ct(p)}, and for every direction {@code k} of the {@link Neighborhood} a capacity {@code
 * c(p, k)} of the arc to its neighbour {@code p + e_k}. The solver finds a maximum flow from the
 * source to the sink and the minimum cut whose source side is the set of nodes reachable from the
 * source in the residual graph (the smallest minimum-cut source set, which is unique).
 *
 * <h2>Method</h2>
 *
 * Y. Boykov and V. Kolmogorov, "An experimental comparison of min-cut/max-flow algorithms for
 * energy minimization in vision", IEEE TPAMI 26(9):1124–1137, 2004, doi:10.1109/TPAMI.2004.60. Two
 * search trees, S rooted at the source and T rooted at the sink, are grown over non-saturated arcs
 * (growth stage) until they touch; the path found is saturated (augmentation stage), which cuts the
 * trees into pieces whose roots, the orphans, either find a new parent in their own tree or leave
 * it (adoption stage). The trees are reused from one augmentation to the next instead of being
 * rebuilt, which is what makes the method fast on the short paths of vision graphs. Two heuristics
 * of the paper are used: every node keeps its distance to its terminal and the time at which that
 * distance was last known to be right; an orphan adopts the valid parent that is closest to the
 * terminal, and growth re-hangs a tree neighbour under the node being grown when that brings it
 * closer to the terminal. Only strictly closer: re-hanging a neighbour at an unchanged distance
 * (which the reference implementation also does, to refresh its time) cost about a quarter of a
 * solve from scratch on segmentation grids, where tree growth crosses wide regions of voxels with
 * equal regional costs, and gained nothing measurable on the strong-boundary benchmark grids.
 *
 * <p>Three steps of our own make a solve cheaper on segmentation grids, where most flow is local:
 *
 * <ul>
 *   <li>before the trees are built, every path source → p → q → sink between two neighbours is
 *       saturated in one sweep (plain augmentations, so the flow stays valid);
 *   <li>only the roots on the front of their tree (with a neighbour that is not a root of the same
 *       terminal) start active, since a root surrounded by roots of its own tree cannot grow; a
 *       node that later gains a free or opposite neighbour is activated when that neighbour leaves
 *       its tree, as in the paper;
 *   <li>the order of growth depends on the ties, the nodes without terminal residual (voxels whose
 *       regional costs are equal, decided by the boundary term alone). Where they are fewer than a
 *       tenth of the nodes, the active nodes wait in one queue, first in first out, as in the
 *       paper. Where they are more, S and T have a queue each and take turns, and the solve ends as
 *       soon as no node of S is active, since S is then closed under unsaturated arcs: the flow is
 *       maximal and S is the reachable set, whatever T had still to grow (T's growth only shortens
 *       the paths S finds). With one queue, S's last growth waits behind T's growth over wide tie
 *       regions that S never reaches. Measured in one JVM: the 1-megapixel pipeline benchmark's
 *       main cut (39 % ties) 48 to 24 ms; the evenly lit phantom (4 % ties) 35 ms with one queue,
 *       37 with turns; the engine benchmark's grids (at most 1 % ties) 20-25 % slower with turns on
 *       the boundary-dominated flavour, the same on the ordinary one.
 * </ul>
 *
 * <p>Terminal arcs are kept as one signed residual per node ({@code cs - ct} with {@code min(cs,
 * ct)} pushed straight from source to sink when the capacities are set), as in the paper.
 *
 * <h2>Grid specialisation</h2>
 *
 * Neighbours and reverse arcs are computed, not stored: the neighbour in direction {@code k} is
 * {@code p + offset[k]} in a grid padded with dead border nodes ({@link GridLayout}), and the
 * reverse of arc {@code (p, k)} is {@code (p + offset[k], k ^ 1)}. Residuals live in one
 * interleaved array ({@code residual[p * K + k]}), so all arcs of a node share a cache line; the
 * parent of a node is the one-byte direction towards it. Capacities are {@code int}, sums {@code
 * long}. Besides the one-arc setters, bulk setters fill the network in memory order: one direction
 * for every node, both arcs of every symmetric pair of one direction (for the whole grid or one row
 * at a time), every arc of one row or of listed nodes (a graph over part of the grid), and terminal
 * capacities or their changes for every node.
 *
 * <h2>Complexity</h2>
 *
 * O(m n² |C|) in the worst case, with n nodes, m arcs and |C| the cost of the minimum cut, since
 * the number of augmentations is bounded by the flow value; in practice close to linear on
 * segmentation grids dominated by terminal costs. Memory per node for K neighbours: 2K + 18 bytes
 * while every neighbour capacity is at most 32767 (residuals are then stored 16 bits wide, see
 * {@link #capacityWidth()}), 4K + 18 bytes otherwise, 4 bytes more in either case while the trees
 * take turns (the second queue), plus 4K + 8 bytes when capacities are retained; the dead padding
 * adds a few percent on small grids. Long augmenting paths (strong boundary weights, weak
 * terminals) are this method's weak spot; push-relabel solvers are then sometimes faster.
 *
 * <h2>Capacities, retained or not</h2>
 *
 * When constructed with {@code retainCapacities} (the default when Java assertions are enabled),
 * the solver keeps the capacities apart from the residuals: every {@link #solve()} starts from zero
 * flow, capacities may be changed between solves, and {@link #checkCertificate()} and {@link
 * MaxFlowResult#visitArcFlows} are available. Otherwise only residuals are stored (the memory
 * floor): neighbour capacities can be set only before the first solve, terminal capacities are
 * changed by signed amounts, and a further {@code solve()} continues from the present flow.
 *
 * <h2>Dynamic re-solve</h2>
 *
 * After a solve, capacity changes are applied to the present flow and search trees, and {@link
 * #resolve()} continues from them instead of starting over (P. Kohli and P. H. S. Torr,
 * "Efficiently solving dynamic Markov random fields using graph cuts", ICCV 2005,
 * doi:10.1109/ICCV.2005.81). A terminal change is absorbed by the signed terminal residual; a
 * neighbour capacity lowered below its present flow sends the excess to the terminals. Both may add
 * an equal amount to the two terminal arcs of a node, a reparametrisation that shifts every cut by
 * that amount and is subtracted from the reported flow value. The re-solve costs time in proportion
 * to the part of the trees the change invalidates, not to the grid size. The result equals that of
 * a solve from scratch: same flow value, same minimal source set.
 *
 * <p>Not thread-safe.
 */
public final class GridMaxFlow implements MaxFlowSolver {
  /** Node id of the source terminal in {@link MaxFlowResult#visitArcFlows}. */
  public static final int SOURCE = -1;

  /** Node id of the sink terminal in {@link MaxFlowResult#visitArcFlows}. */
  public static final int SINK = -2;

  final GridLayout layout;
  final GridSearch search; // residuals, flow and trees
  private final int directions; // K
  private final int[] offset; // offset[k]: padded index difference to the neighbour in direction k

  // Retained capacities (null unless retaining), indexed by padded node / arc; the network the
  // caller built. The solver's flow is one of the reparametrised network: both terminal
  // capacities of node p raised by shift[p].
  final int[] capacity; // c(p, k) >= 0, c(p, k) + c(p + offset[k], k ^ 1) <= Integer.MAX_VALUE
  final int[] sourceCapacity; // cs(p) >= 0
  final int[] sinkCapacity; // ct(p) >= 0
  long[] shift; // >= 0, added to both terminal capacities by dynamic changes; null if none yet
  long sourceSinkCapacity; // capacity of direct source -> sink arcs, always carrying full flow

  private final IntFifo changed = new IntFifo(64); // padded nodes to repair, each once
  private final BitSet pending = new BitSet(); // the nodes in `changed`
  private boolean repairAll; // too many changes to list: repair every node instead
  private long generation; // incremented at every change and every solve
  private boolean solved; // the search holds the flow and trees of a solve

  /**
   * A solver for a {@code width × height × depth} grid, retaining capacities when Java assertions
   * are enabled.
   */
  public GridMaxFlow(int width, int height, int depth, Neighborhood neighborhood) {
    this(width, height, depth, neighborhood, assertionsEnabled());
  }

  /**
   * A solver for a {@code width × height × depth} grid ({@code depth == 1} for 2D neighbourhoods)
   * with all capacities zero.
   *
   * @param retainCapacities keep the capacities apart from the residuals (see the class comment)
   * @throws IllegalArgumentException if a dimension is below 1, a 2D neighbourhood is given a depth
   *     other than 1, or the grid is too large for Java arrays
   */
  public GridMaxFlow(
      int width, int height, int depth, Neighborhood neighborhood, boolean retainCapacities) {
    this.layout = new GridLayout(width, height, depth, neighborhood);
    this.search = new GridSearch(layout, true);
    this.directions = layout.directions;
    this.offset = layout.offset;
    int n = layout.paddedCount;
    this.capacity = retainCapacities ? new int[n * directions] : null;
    this.sourceCapacity = retainCapacities ? new int[n] : null;
    this.sinkCapacity = retainCapacities ? new int[n] : null;
  }

  @SuppressWarnings("AssertWithSideEffects")
  private static boolean assertionsEnabled() {
    boolean enabled = false;
    assert enabled = true;
    return enabled;
  }

  /** Grid width (x). */
  public int width() {
    return layout.width;
  }

  /** Grid height (y). */
  public int height() {
    return layout.height;
  }

  /** Grid depth (z); 1 for 2D grids. */
  public int depth() {
    return layout.depth;
  }

  /** The neighbourhood. */
  public Neighborhood neighborhood() {
    return layout.neighborhood;
  }

  /** True if capacities are kept apart from residuals (see the class comment). */
  public boolean retainsCapacities() {
    return capacity != null;
  }

  /** {@code width * height * depth}; node {@code x + width * (y + height * z)} is pixel (x,y,z). */
  @Override
  public int nodeCount() {
    return layout.nodeCount();
  }

  /** The neighbour of {@code node} in direction {@code k}, or -1 if it falls outside the grid. */
  public int neighbor(int node, int k) {
    layout.checkNode(node);
    layout.checkDirection(k);
    return layout.neighbor(node, k);
  }

  /** The direction from {@code from} to {@code to}, or -1 if they are not neighbours. */
  public int directionTo(int from, int to) {
    layout.checkNode(from);
    layout.checkNode(to);
    return layout.directionTo(from, to);
  }

  /**
   * Adds {@code sourceDelta} to the capacity of the arc from the source to {@code node} and {@code
   * sinkDelta} to that of the arc to the sink. Deltas may be negative as long as the capacities
   * stay non-negative (checked when capacities are retained; the caller's duty otherwise). After a
   * solve the change is applied to the present flow for {@link #resolve()}.
   *
   * @throws IllegalArgumentException if a capacity would leave {@code 0 .. Integer.MAX_VALUE}
   */
  public void addTerminalCapacities(int node, long sourceDelta, long sinkDelta) {
    layout.checkNode(node);
    int p = layout.padded(node);
    if (capacity != null) {
      long cs = sourceCapacity[p] + sourceDelta;
      long ct = sinkCapacity[p] + sinkDelta;
      checkCapacity(cs, "source capacity of node " + node);
      checkCapacity(ct, "sink capacity of node " + node);
      sourceCapacity[p] = (int) cs;
      sinkCapacity[p] = (int) ct;
    }
    if (capacity == null || solved) {
      absorbTerminalChange(p, sourceDelta, sinkDelta);
    }
    generation++;
  }

  /**
   * {@link #addTerminalCapacities(int, long, long)} for every node at once, in node order: adds
   * {@code sourceDelta[node]} and {@code sinkDelta[node]}; nodes with both deltas 0 are skipped.
   * The same result as the calls one by one, without their per-call index arithmetic.
   *
   * @throws IllegalArgumentException if an array has the wrong length or a capacity would leave
   *     {@code 0 .. Integer.MAX_VALUE} (nodes before the offending one keep their change)
   */
  public void addTerminalCapacities(int[] sourceDelta, int[] sinkDelta) {
    checkLength(sourceDelta, "source capacity changes");
    checkLength(sinkDelta, "sink capacity changes");
    GridLayout g = layout;
    int node = 0;
    for (int z = 0; z < g.depth; z++) {
      for (int y = 0; y < g.height; y++) {
        int p = g.padded(0, y, z);
        for (int x = 0; x < g.width; x++, p++, node++) {
          int ds = sourceDelta[node];
          int dt = sinkDelta[node];
          if ((ds | dt) == 0) {
            continue;
          }
          if (capacity != null) {
            long cs = sourceCapacity[p] + (long) ds;
            long ct = sinkCapacity[p] + (long) dt;
            checkCapacity(cs, "source capacity of node " + node);
            checkCapacity(ct, "sink capacity of node " + node);
            sourceCapacity[p] = (int) cs;
            sinkCapacity[p] = (int) ct;
          }
          if (capacity == null || solved) {
            absorbTerminalChange(p, ds, dt);
          }
        }
      }
    }
    generation++;
  }

  /**
   * Sets the terminal capacities of a node, replacing earlier ones (retained capacities only).
   * After a solve the change is applied to the present flow for {@link #resolve()}.
   */
  public void setTerminalCapacities(int node, int sourceCap, int sinkCap) {
    requireRetained("setTerminalCapacities");
    layout.checkNode(node);
    checkCapacity(sourceCap, "source capacity of node " + node);
    checkCapacity(sinkCap, "sink capacity of node " + node);
    int p = layout.padded(node);
    addTerminalCapacities(
        node, (long) sourceCap - sourceCapacity[p], (long) sinkCap - sinkCapacity[p]);
  }

  private void absorbTerminalChange(int p, long dSource, long dSink) {
    long m = search.changeTerminal(p, dSource, dSink);
    if (m < 0 && capacity != null) {
      addShift(p, -m);
    }
    if (solved) {
      markChanged(p);
    }
  }

  /** Queues node p for repair before the next resolve, once; a sweep replaces long lists. */
  private void markChanged(int p) {
    if (repairAll || pending.get(p)) {
      return;
    }
    pending.set(p);
    changed.add(p);
    if (changed.size() > layout.paddedCount / 8) {
      repairAll = true;
      changed.clear();
      pending.clear();
    }
  }

  private void addShift(int p, long amount) {
    if (shift == null) {
      shift = new long[layout.paddedCount];
    }
    shift[p] += amount;
  }

  /**
   * Sets the capacity of the arc from {@code node} to its neighbour in direction {@code k}. After a
   * solve (retained capacities only) the change is applied to the present flow for {@link
   * #resolve()}.
   *
   * @throws IllegalArgumentException if the neighbour is outside the grid, the capacity is
   *     negative, or it plus the capacity of the reverse arc exceeds {@code Integer.MAX_VALUE}
   * @throws IllegalStateException if capacities are not retained and a solve has run
   */
  public void setNeighborCapacity(int node, int k, int cap) {
    layout.checkNode(node);
    layout.checkDirection(k);
    checkCapacity(cap, "capacity of arc (" + node + ", " + k + ")");
    int q = layout.neighbor(node, k);
    if (q < 0) {
      throw new IllegalArgumentException(
          "node " + node + " has no neighbour in direction " + k + " (it lies on the border)");
    }
    if (capacity == null) {
      checkNotSolved();
    }
    int p = layout.padded(node);
    int a = p * directions + k;
    int b = (p + offset[k]) * directions + (k ^ 1);
    int reverse = stored(b);
    if ((long) cap + reverse > Integer.MAX_VALUE) {
      throw new IllegalArgumentException(
          "arcs between node "
              + node
              + " and node "
              + q
              + " have capacities "
              + cap
              + " and "
              + reverse
              + "; their sum must not exceed "
              + Integer.MAX_VALUE);
    }
    if (capacity == null) {
      fitResiduals(cap);
    }
    int old = stored(a);
    store(a, cap);
    if (capacity != null && solved) {
      absorbNeighborChange(p, k, (long) cap - old);
    }
    generation++;
  }

  /**
   * Applies a change {@code delta} of the capacity of arc a = (p, k) to the present flow. Raising
   * it raises the residual. Lowering it below the present flow on the arc cancels the excess e of
   * flow: p is left with e more inflow than outflow, its neighbour q with e less; both imbalances
   * go to the terminals by raising both terminal capacities of p and q by e (the shift), routing
   * p's excess to the sink and q's shortfall from the source.
   */
  private void absorbNeighborChange(int p, int k, long delta) {
    int q = p + offset[k];
    int a = p * directions + k;
    int b = q * directions + (k ^ 1);
    fitResiduals(Math.max(capacity[a], capacity[b]));
    Residuals residual = search.residual;
    long r = residual.get(a) + delta;
    if (r >= 0) {
      residual.set(a, (int) r);
    } else {
      long excess = -r;
      residual.set(a, 0);
      residual.set(b, residual.get(b) - (int) excess);
      addShift(p, excess);
      search.flow -= excess;
      absorbTerminalChange(p, excess, 0);
      addShift(q, excess);
      absorbTerminalChange(q, 0, excess);
    }
    markChanged(p);
    markChanged(q);
  }

  /** Adds {@code cap} to the arc from {@code node} in direction {@code k}; limits as in set. */
  public void addNeighborCapacity(int node, int k, long cap) {
    layout.checkNode(node);
    layout.checkDirection(k);
    checkCapacity(cap, "capacity of arc (" + node + ", " + k + ")");
    long sum = stored(layout.padded(node) * directions + k) + cap;
    if (sum > Integer.MAX_VALUE) {
      throw new IllegalArgumentException(
          "arcs from node "
              + node
              + " in direction "
              + k
              + " add up to "
              + sum
              + ", more than "
              + Integer.MAX_VALUE);
    }
    setNeighborCapacity(node, k, (int) sum);
  }

  /**
   * Sets the terminal capacities of every node at once, the fast way to build: {@code
   * sourceCaps[node]} and {@code sinkCaps[node]} in public node order. Replaces earlier terminal
   * capacities when capacities are retained, adds to them otherwise. Only before the first solve.
   *
   * @throws IllegalArgumentException if an array has the wrong length or holds a negative value
   */
  public void setTerminalCapacities(int[] sourceCaps, int[] sinkCaps) {
    checkLength(sourceCaps, "source capacities");
    checkLength(sinkCaps, "sink capacities");
    checkNotSolved();
    GridLayout g = layout;
    boolean initial = capacity == null && search.terminalsZero(); // a row at a time
    int node = 0;
    for (int z = 0; z < g.depth; z++) {
      for (int y = 0; y < g.height; y++) {
        int p = g.padded(0, y, z);
        if (initial && search.setInitialTerminals(p, sourceCaps, sinkCaps, node, g.width)) {
          node += g.width;
          continue;
        }
        for (int x = 0; x < g.width; x++, p++, node++) { // throws at a negative capacity
          storeTerminals(node, p, sourceCaps[node], sinkCaps[node]);
        }
      }
    }
    generation++;
  }

  /**
   * Sets the terminal capacities of the listed nodes: {@code sourceCaps[i]} and {@code sinkCaps[i]}
   * for {@code nodes[i]}, {@code i < count}; other nodes keep theirs (zero on a new solver), so a
   * graph over part of the grid is built in time proportional to that part. Replaces earlier
   * terminal capacities when capacities are retained, adds to them otherwise. Only before the first
   * solve.
   *
   * @throws IllegalArgumentException if a node is outside the grid, an array is shorter than {@code
   *     count}, or a capacity is negative
   */
  public void setTerminalCapacitiesOf(int[] nodes, int count, int[] sourceCaps, int[] sinkCaps) {
    if (count < 0 || count > nodes.length || count > sourceCaps.length || count > sinkCaps.length) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "terminal capacities of %d nodes: %d nodes, %d source and %d sink values given",
              count,
              nodes.length,
              sourceCaps.length,
              sinkCaps.length));
    }
    checkNotSolved();
    for (int i = 0; i < count; i++) {
      int node = nodes[i];
      layout.checkNode(node);
      storeTerminals(node, layout.padded(node), sourceCaps[i], sinkCaps[i]);
    }
    generation++;
  }

  /**
   * The terminal capacities of a node (padded index p) before the first solve: stored when
   * capacities are retained, added to the residuals otherwise.
   */
  private void storeTerminals(int node, int p, int cs, int ct) {
    if ((cs | ct) < 0) {
      checkCapacity(Math.min(cs, ct), "terminal capacity of node " + node);
    }
    if (capacity != null) {
      sourceCapacity[p] = cs;
      sinkCapacity[p] = ct;
    } else {
      search.changeTerminal(p, cs, ct);
    }
  }

  /**
   * Sets the capacity of the arc in direction {@code k} of every node at once: {@code caps[node]}
   * in public node order. Entries of nodes whose neighbour in direction {@code k} lies outside the
   * grid are ignored. Only before the first solve.
   *
   * @throws IllegalArgumentException if the array has the wrong length, holds a negative value, or
   *     an arc and its reverse add up to more than {@code Integer.MAX_VALUE}
   */
  public void setNeighborCapacities(int k, int[] caps) {
    layout.checkDirection(k);
    checkLength(caps, "capacities of direction " + k);
    checkNotSolved();
    GridLayout g = layout;
    int dx = g.neighborhood.dx(k);
    int dy = g.neighborhood.dy(k);
    int dz = g.neighborhood.dz(k);
    int reverse = k ^ 1;
    int step = offset[k];
    for (int z = Math.max(0, -dz); z < Math.min(g.depth, g.depth - dz); z++) {
      for (int y = Math.max(0, -dy); y < Math.min(g.height, g.height - dy); y++) {
        int x0 = Math.max(0, -dx);
        int x1 = Math.min(g.width, g.width - dx);
        int node = x0 + g.width * (y + g.height * z);
        int p = g.padded(x0, y, z);
        for (int x = x0; x < x1; x++, p++, node++) {
          int c = caps[node];
          int back = stored((p + step) * directions + reverse);
          if (c < 0 || (long) c + back > Integer.MAX_VALUE) {
            setNeighborCapacity(node, k, c); // throws with the full message
          }
          if (capacity == null) {
            fitResiduals(c);
          }
          store(p * directions + k, c);
        }
      }
    }
    generation++;
  }

  /**
   * Sets both arcs between every node and its neighbour in direction {@code k} to {@code
   * caps[node]} (public node order): the arc in direction {@code k} and its reverse, the fast way
   * to build a symmetric boundary term. Entries of nodes whose neighbour in direction {@code k}
   * lies outside the grid are ignored. Only before the first solve. O(n), in memory order.
   *
   * @throws IllegalArgumentException if the array has the wrong length, or holds a negative value
   *     or one above {@code Integer.MAX_VALUE / 2} (an arc and its reverse must fit the int range)
   */
  public void setSymmetricNeighborCapacities(int k, int[] caps) {
    layout.checkDirection(k);
    checkLength(caps, "capacities of direction " + k);
    checkNotSolved();
    GridLayout g = layout;
    int dx = g.neighborhood.dx(k);
    int dy = g.neighborhood.dy(k);
    int dz = g.neighborhood.dz(k);
    int x0 = Math.max(0, -dx);
    int x1 = Math.min(g.width, g.width - dx);
    int y0 = Math.max(0, -dy);
    int y1 = Math.min(g.height, g.height - dy);
    int z0 = Math.max(0, -dz);
    int z1 = Math.min(g.depth, g.depth - dz);
    int largest = 0;
    for (int z = z0; z < z1; z++) {
      for (int y = y0; y < y1; y++) {
        int node = x0 + g.width * (y + g.height * z);
        for (int x = x0; x < x1; x++, node++) {
          int c = caps[node];
          if (c < 0 || c > Integer.MAX_VALUE / 2) {
            throw new IllegalArgumentException(
                "capacity "
                    + c
                    + " of the arcs between node "
                    + node
                    + " and its neighbour in direction "
                    + k
                    + " must be between 0 and "
                    + Integer.MAX_VALUE / 2);
          }
          largest = Math.max(largest, c);
        }
      }
    }
    if (capacity == null) {
      fitResiduals(largest);
    }
    for (int z = z0; z < z1; z++) {
      for (int y = y0; y < y1; y++) {
        storePairs(y, z, k, x0, x1 - x0, caps, x0 + g.width * (y + g.height * z));
      }
    }
    generation++;
  }

  /**
   * Stores {@code caps[from + i]} on the arc from (x0 + i, y, z) in direction k and on its reverse,
   * for i below {@code count}; the caller has checked the values and the grid.
   */
  private void storePairs(int y, int z, int k, int x0, int count, int[] caps, int from) {
    int a = layout.padded(x0, y, z) * directions + k;
    int backward = offset[k] * directions + (k ^ 1) - k; // from arc (p, k) to (p + offset, k ^ 1)
    if (capacity != null) {
      for (int i = 0; i < count; i++, a += directions) {
        capacity[a] = caps[from + i];
        capacity[a + backward] = caps[from + i];
      }
    } else {
      search.residual.setPairs(a, directions, backward, caps, from, count);
    }
  }

  /**
   * Sets both arcs between each node of row (y, z) and its neighbour in direction {@code k}: for x
   * from {@code x0} to {@code x0 + count − 1}, {@code caps[x − x0]} becomes the capacity of the arc
   * from (x, y, z) in direction {@code k} and of its reverse. The whole row range must have its
   * neighbours inside the grid. A symmetric boundary term is built this way row by row, one
   * direction of each opposite pair at a time, while the rows it touches are in cache. Only before
   * the first solve. O(count).
   *
   * @throws IllegalArgumentException if the row range or a neighbour lies outside the grid, {@code
   *     caps} is shorter than {@code count}, or a capacity is negative or above {@code
   *     Integer.MAX_VALUE / 2} (an arc and its reverse must fit the int range)
   */
  public void setSymmetricRowCapacities(int y, int z, int k, int x0, int count, int[] caps) {
    layout.checkDirection(k);
    GridLayout g = layout;
    Neighborhood nb = g.neighborhood;
    int x1 = x0 + count;
    if (count < 0
        || caps.length < count
        || x0 < 0
        || x1 > g.width
        || (count > 0
            && !(inside(x0, y, z)
                && inside(x0 + nb.dx(k), y + nb.dy(k), z + nb.dz(k))
                && inside(x1 - 1 + nb.dx(k), y + nb.dy(k), z + nb.dz(k))))) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "pairs of x %d to %d in row (y %d, z %d) along direction %d: not all inside a %d x %d"
                  + " x %d grid, or fewer than %d values (%d)",
              x0,
              x1 - 1,
              y,
              z,
              k,
              g.width,
              g.height,
              g.depth,
              count,
              caps.length));
    }
    checkNotSolved();
    int bits = 0; // the union of all bits: negative if any value is, else >= every value
    for (int i = 0; i < count; i++) {
      bits |= caps[i];
    }
    if (bits < 0 || bits > Integer.MAX_VALUE / 2) {
      for (int i = 0; i < count; i++) {
        if (caps[i] < 0 || caps[i] > Integer.MAX_VALUE / 2) {
          throw new IllegalArgumentException(
              String.format(
                  Locale.ROOT,
                  "capacity %d of the arcs between (x %d, y %d, z %d) and its neighbour in"
                      + " direction %d must be between 0 and %d",
                  caps[i],
                  x0 + i,
                  y,
                  z,
                  k,
                  Integer.MAX_VALUE / 2));
        }
      }
    }
    if (capacity == null) {
      fitResiduals(bits);
    }
    storePairs(y, z, k, x0, count, caps, 0);
    generation++;
  }

  /**
   * Sets every neighbour arc leaving the listed nodes at once: {@code caps[i * K + k]} is the
   * capacity of the arc from {@code nodes[i]} in direction {@code k}, for {@code i < count}. Arcs
   * of other nodes keep their capacities (zero on a new solver), so a graph over part of the grid
   * is built in time proportional to that part. Entries of arcs leaving the grid are ignored. Only
   * before the first solve.
   *
   * @throws IllegalArgumentException if a node is outside the grid, {@code caps} is shorter than
   *     {@code count * K}, or a capacity is negative or above {@code Integer.MAX_VALUE / 2} (an arc
   *     and its reverse must fit the int range)
   */
  public void setNeighborCapacitiesOf(int[] nodes, int count, int[] caps) {
    if (count < 0 || count > nodes.length || caps.length < (long) count * directions) {
      throw new IllegalArgumentException(
          "neighbour capacities of "
              + count
              + " nodes need "
              + (long) count * directions
              + " values; got "
              + caps.length
              + " (and "
              + nodes.length
              + " nodes)");
    }
    checkNotSolved();
    int largest = 0;
    for (int i = 0; i < count * directions; i++) {
      int c = caps[i];
      if (c < 0 || c > Integer.MAX_VALUE / 2) {
        throw new IllegalArgumentException(
            "capacity "
                + c
                + " of arc ("
                + nodes[i / directions]
                + ", "
                + i % directions
                + ") must be between 0 and "
                + Integer.MAX_VALUE / 2);
      }
      largest = Math.max(largest, c);
    }
    if (capacity == null) {
      fitResiduals(largest);
    }
    GridLayout g = layout;
    Neighborhood nb = g.neighborhood;
    for (int i = 0; i < count; i++) {
      int node = nodes[i];
      g.checkNode(node);
      int x = node % g.width;
      int rest = node / g.width;
      int y = rest % g.height;
      int z = rest / g.height;
      int a = g.padded(x, y, z) * directions;
      boolean interior =
          x >= g.reach
              && x < g.width - g.reach
              && y >= g.reach
              && y < g.height - g.reach
              && z >= g.reachZ
              && z < g.depth - g.reachZ;
      for (int k = 0; k < directions; k++) {
        if (interior || inside(x + nb.dx(k), y + nb.dy(k), z + nb.dz(k))) {
          store(a + k, caps[i * directions + k]);
        }
      }
    }
    generation++;
  }

  /**
   * Sets the capacities of every neighbour arc at once from an interleaved array: {@code caps[node
   * * K + k]} is the capacity of the arc from {@code node} in direction {@code k}, in public node
   * order. Entries of arcs leaving the grid are ignored. Only before the first solve.
   *
   * @throws IllegalArgumentException if the array has the wrong length, holds a negative value, or
   *     an arc and its reverse add up to more than {@code Integer.MAX_VALUE}
   */
  public void setNeighborCapacities(int[] caps) {
    if (caps.length != (long) nodeCount() * directions) {
      throw new IllegalArgumentException(
          "neighbour capacities: "
              + caps.length
              + " values for "
              + nodeCount()
              + " nodes with "
              + directions
              + " directions");
    }
    checkNotSolved();
    GridLayout g = layout;
    // Check every arc against its reverse on the caller's array, before anything is stored.
    Neighborhood nb = g.neighborhood;
    int[] nodeStep = new int[directions];
    for (int k = 0; k < directions; k++) {
      nodeStep[k] = nb.dx(k) + g.width * (nb.dy(k) + g.height * nb.dz(k));
    }
    int bits = 0; // the union of all bits: negative if any value is, else >= every value
    for (int i = 0; i < caps.length; i++) {
      bits |= caps[i];
    }
    if (bits < 0 || 2L * bits > Integer.MAX_VALUE) {
      checkPairs(caps, nodeStep); // a negative value or an arc pair beyond the int range
    }
    if (capacity == null && bits > Residuals.NARROW_CAPACITY) {
      fitResiduals(largestInside(caps)); // the entries of arcs leaving the grid do not count
    }
    int node = 0;
    for (int z = 0; z < g.depth; z++) {
      for (int y = 0; y < g.height; y++) {
        storeRow(caps, node * directions, y, z);
        node += g.width;
      }
    }
    generation++;
  }

  /**
   * Sets every neighbour arc leaving the nodes of one row, those at {@code (x, y, z)} for x from 0
   * to width − 1: {@code caps[x * K + k]} is the capacity of the arc from x in direction {@code k}.
   * Entries of arcs leaving the grid are ignored. A graph is built row by row in one sequential
   * pass over the solver's arrays. Only before the first solve.
   *
   * @throws IllegalArgumentException if the row is outside the grid, {@code caps} is shorter than
   *     {@code width * K}, or a capacity is negative or above {@code Integer.MAX_VALUE / 2}
   */
  public void setRowNeighborCapacities(int y, int z, int[] caps) {
    GridLayout g = layout;
    int length = g.width * directions;
    if (y < 0 || y >= g.height || z < 0 || z >= g.depth || caps.length < length) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "row (y %d, z %d) of a %d x %d x %d grid with %d values (need %d)",
              y,
              z,
              g.width,
              g.height,
              g.depth,
              caps.length,
              length));
    }
    checkNotSolved();
    int bits = 0; // the union of all bits: negative if any value is, else >= every value
    for (int i = 0; i < length; i++) {
      bits |= caps[i];
    }
    if (bits < 0 || bits > Integer.MAX_VALUE / 2) {
      for (int i = 0; i < length; i++) {
        if (caps[i] < 0 || caps[i] > Integer.MAX_VALUE / 2) {
          throw new IllegalArgumentException(
              String.format(
                  Locale.ROOT,
                  "capacity %d of arc (x %d, y %d, z %d, direction %d) must be between 0 and %d",
                  caps[i],
                  i / directions,
                  y,
                  z,
                  i % directions,
                  Integer.MAX_VALUE / 2));
        }
      }
    }
    if (capacity == null
        && bits > Residuals.NARROW_CAPACITY
        && search.residual instanceof Residuals.Narrow) { // once widened, rows need no check
      int largest = 0;
      for (int i = 0; i < length; i++) {
        largest = Math.max(largest, caps[i]);
      }
      fitResiduals(largest);
    }
    storeRow(caps, 0, y, z);
    generation++;
  }

  /**
   * Copies the interleaved capacities of row (y, z), starting at {@code caps[from]}, into the
   * network, then closes the arcs of the row that leave the grid.
   */
  private void storeRow(int[] caps, int from, int y, int z) {
    GridLayout g = layout;
    Neighborhood nb = g.neighborhood;
    int p = g.padded(0, y, z);
    if (capacity != null) {
      System.arraycopy(caps, from, capacity, p * directions, g.width * directions);
    } else {
      search.residual.copyFrom(caps, from, p * directions, g.width * directions);
    }
    // Arcs that leave the grid stay closed; only nodes within reach of the border have any.
    boolean borderRow =
        y < g.reach || y >= g.height - g.reach || z < g.reachZ || z >= g.depth - g.reachZ;
    for (int x = 0; x < g.width; x++) {
      if (!borderRow && x == g.reach && g.width - g.reach > x) {
        x = g.width - g.reach; // skip the interior of the row
      }
      for (int k = 0; k < directions; k++) {
        if (!inside(x + nb.dx(k), y + nb.dy(k), z + nb.dz(k))) {
          store((p + x) * directions + k, 0);
        }
      }
    }
  }

  /**
   * Checks every arc of an interleaved capacity array and its reverse: non-negative, with a sum
   * within the int range.
   */
  private void checkPairs(int[] caps, int[] nodeStep) {
    GridLayout g = layout;
    Neighborhood nb = g.neighborhood;
    int node = 0;
    for (int z = 0; z < g.depth; z++) {
      for (int y = 0; y < g.height; y++) {
        for (int x = 0; x < g.width; x++, node++) {
          int base = node * directions;
          for (int k = 0; k < directions; k++) {
            int c = caps[base + k];
            if (c == 0 || !inside(x + nb.dx(k), y + nb.dy(k), z + nb.dz(k))) {
              continue;
            }
            checkCapacity(c, "capacity of arc (" + node + ", " + k + ")");
            int back = caps[(node + nodeStep[k]) * directions + (k ^ 1)];
            long pair = (long) c + Math.max(back, 0);
            if (pair > Integer.MAX_VALUE) {
              throw new IllegalArgumentException(
                  "arcs between node "
                      + node
                      + " and node "
                      + (node + nodeStep[k])
                      + " have capacities "
                      + c
                      + " and "
                      + back
                      + "; their sum must not exceed "
                      + Integer.MAX_VALUE);
            }
          }
        }
      }
    }
  }

  /** The largest entry of an interleaved capacity array among arcs that stay inside the grid. */
  private int largestInside(int[] caps) {
    GridLayout g = layout;
    Neighborhood nb = g.neighborhood;
    int largest = 0;
    int node = 0;
    for (int z = 0; z < g.depth; z++) {
      for (int y = 0; y < g.height; y++) {
        boolean borderRow =
            y < g.reach || y >= g.height - g.reach || z < g.reachZ || z >= g.depth - g.reachZ;
        for (int x = 0; x < g.width; x++, node++) {
          if (!borderRow && x >= g.reach && x < g.width - g.reach) {
            int end = (node + g.width - g.reach - x) * directions; // the row's interior at once
            for (int i = node * directions; i < end; i++) {
              largest = Math.max(largest, caps[i]);
            }
            node += g.width - g.reach - x - 1;
            x = g.width - g.reach - 1;
            continue;
          }
          for (int k = 0; k < directions; k++) {
            if (inside(x + nb.dx(k), y + nb.dy(k), z + nb.dz(k))) {
              largest = Math.max(largest, caps[node * directions + k]);
            }
          }
        }
      }
    }
    return largest;
  }

  private boolean inside(int x, int y, int z) {
    return x >= 0 && x < layout.width && y >= 0 && y < layout.height && z >= 0 && z < layout.depth;
  }

  /** Capacity of arc a as the caller set it: retained, or the residual before the first solve. */
  private int stored(int a) {
    return capacity != null ? capacity[a] : search.residual.get(a);
  }

  private void store(int a, int value) {
    if (capacity != null) {
      capacity[a] = value;
    } else {
      search.residual.set(a, value);
    }
  }

  /** Widens the residuals to 32 bits unless {@code largest}, a capacity, fits the 16-bit form. */
  private void fitResiduals(int largest) {
    if (largest > Residuals.NARROW_CAPACITY) {
      search.widenResiduals();
    }
  }

  private void checkLength(int[] values, String what) {
    if (values.length != nodeCount()) {
      throw new IllegalArgumentException(
          what + ": " + values.length + " values for " + nodeCount() + " nodes");
    }
  }

  /** Adds capacity on a direct arc from the source to the sink: it always carries full flow. */
  public void addSourceSinkCapacity(long cap) {
    checkCapacity(cap, "source-to-sink capacity");
    checkNotSolved();
    if (capacity == null) {
      search.flow += cap;
    }
    sourceSinkCapacity += cap;
    generation++;
  }

  /** Capacity of the arc from the source to {@code node} (retained capacities only). */
  public int sourceCapacity(int node) {
    requireRetained("sourceCapacity");
    layout.checkNode(node);
    return sourceCapacity[layout.padded(node)];
  }

  /** Capacity of the arc from {@code node} to the sink (retained capacities only). */
  public int sinkCapacity(int node) {
    requireRetained("sinkCapacity");
    layout.checkNode(node);
    return sinkCapacity[layout.padded(node)];
  }

  /** Capacity of the arc from {@code node} in direction {@code k} (retained capacities only). */
  public int neighborCapacity(int node, int k) {
    requireRetained("neighborCapacity");
    layout.checkNode(node);
    layout.checkDirection(k);
    if (layout.neighbor(node, k) < 0) {
      return 0;
    }
    return capacity[layout.padded(node) * directions + k];
  }

  /**
   * Bytes of solver state: the residual network and search state, and the retained capacities if
   * any. Divided by {@link #nodeCount()} this is the memory per node that benchmarks report.
   */
  public long stateBytes() {
    long retained =
        capacity == null ? 0 : 4L * (capacity.length + sourceCapacity.length + sinkCapacity.length);
    return search.stateBytes() + retained;
  }

  /**
   * Width in bits of the stored residuals: 16 while every neighbour capacity is at most 32767 (with
   * retained capacities, decided at each solve), 32 from the first capacity beyond that.
   */
  public int capacityWidth() {
    return search.residualWidth();
  }

  /** Bytes of the retained capacities alone (0 when not retaining). */
  public long retainedBytes() {
    return capacity == null
        ? 0
        : 4L * (capacity.length + sourceCapacity.length + sinkCapacity.length);
  }

  @Override
  public MaxFlowResult solve() {
    long start = System.nanoTime();
    if (capacity != null) {
      loadCapacities();
    }
    changed.clear();
    pending.clear();
    repairAll = false;
    search.initialiseTrees();
    return run(start);
  }

  /**
   * Continues from the present flow and search trees after capacity changes (dynamic re-solve); the
   * same as {@link #solve()} if no solve has run yet.
   */
  public MaxFlowResult resolve() {
    if (!solved) {
      return solve();
    }
    long start = System.nanoTime();
    search.beginRepairs();
    if (repairAll) {
      for (int p = 0; p < layout.paddedCount; p++) {
        search.repair(p);
      }
      repairAll = false;
    }
    while (!changed.isEmpty()) {
      search.repair(changed.poll());
    }
    pending.clear();
    search.adoptOrphans();
    return run(start);
  }

  private MaxFlowResult run(long start) {
    generation++;
    long augmentations = search.augmentations;
    long adopted = search.orphansAdopted;
    long freed = search.orphansFreed;
    SolveStatus status = search.maxFlow();
    solved = true;
    long nanos = System.nanoTime() - start;
    BitSet cut = search.sourceSide();
    if (status == SolveStatus.OPTIMAL) {
      assert capacity == null || checkCertificate();
    }
    SolveStatistics stats =
        new SolveStatistics(
            search.augmentations - augmentations,
            search.orphansAdopted - adopted,
            search.orphansFreed - freed);
    return new MaxFlowResult(search.flow, status, cut, nodeCount(), nanos, stats, new ArcFlows());
  }

  @Override
  public boolean checkCertificate() {
    requireRetained("checkCertificate");
    if (!solved) {
      throw new IllegalStateException("checkCertificate() needs a solve first");
    }
    new GridCertificate(this).check();
    return true;
  }

  /** Residuals from the retained capacities, zero flow. */
  private void loadCapacities() {
    int bits = 0; // >= every capacity, all of which are >= 0
    for (int i = 0; i < capacity.length; i++) {
      bits |= capacity[i];
    }
    fitResiduals(bits);
    int[] terminal = search.terminal;
    search.residual.copyFrom(capacity, 0, 0, capacity.length);
    shift = null;
    long f = sourceSinkCapacity;
    for (int p = 0; p < terminal.length; p++) {
      int cs = sourceCapacity[p];
      int ct = sinkCapacity[p];
      terminal[p] = cs - ct;
      f += Math.min(cs, ct);
    }
    search.flow = f;
  }

  private void checkNotSolved() {
    if (solved) {
      throw new IllegalStateException(
          "this change is not supported after a solve: construct the solver with"
              + " retainCapacities = true and use the per-node setters, or build a new one");
    }
  }

  private void requireRetained(String operation) {
    if (capacity == null) {
      throw new IllegalStateException(
          operation + " needs the capacities kept: construct with retainCapacities = true");
    }
  }

  private static void checkCapacity(long cap, String what) {
    if (cap < 0 || cap > Integer.MAX_VALUE) {
      throw new IllegalArgumentException(
          what + " is " + cap + "; capacities must lie in 0.." + Integer.MAX_VALUE);
    }
  }

  /** The flows of the present state, read by {@link MaxFlowResult#visitArcFlows}. */
  private final class ArcFlows implements MaxFlowResult.FlowView {
    @Override
    public long generation() {
      return generation;
    }

    @Override
    public void visitArcFlows(ArcFlowVisitor visitor) {
      requireRetained("visitArcFlows");
      if (shift != null) {
        throw new IllegalStateException(
            "arc flows after a dynamic re-solve that lowered capacities belong to a"
                + " reparametrised network; call solve() for the flows of this one");
      }
      new GridCertificate(GridMaxFlow.this).visitArcFlows(visitor);
    }
  }
}
