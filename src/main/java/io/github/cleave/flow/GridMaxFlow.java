package io.github.cleave.flow;

import java.util.Arrays;
import java.util.BitSet;

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
 * closer to the terminal.
 *
 * <p>Terminal arcs are kept as one signed residual per node ({@code cs - ct} with {@code min(cs,
 * ct)} pushed straight from source to sink when the capacities are set), as in the paper.
 *
 * <h2>Grid specialisation</h2>
 *
 * Neighbours and reverse arcs are computed, not stored: the neighbour in direction {@code k} is
 * {@code p + offset[k]} in a grid padded with dead border nodes ({@link GridLayout}), and the
 * reverse of arc {@code (p, k)} is {@code (p + offset[k], k ^ 1)}. Residuals live in one
 * interleaved {@code int} array ({@code residual[p * K + k]}), so all arcs of a node share a cache
 * line; the parent of a node is the one-byte direction towards it. Capacities are {@code int}, sums
 * {@code long}.
 *
 * <h2>Complexity</h2>
 *
 * O(m n² |C|) in the worst case, with n nodes, m arcs and |C| the cost of the minimum cut, since
 * the number of augmentations is bounded by the flow value; in practice close to linear on
 * segmentation grids dominated by terminal costs. Memory per node: 4K + 18 bytes for K neighbours,
 * plus 4K + 8 bytes when capacities are retained. Long augmenting paths (strong boundary weights,
 * weak terminals) are this method's weak spot; push-relabel solvers are then sometimes faster.
 *
 * <h2>Capacities, retained or not</h2>
 *
 * When constructed with {@code retainCapacities} (the default when Java assertions are enabled),
 * the solver keeps the capacities apart from the residuals: every {@link #solve()} starts from zero
 * flow, capacities may be changed between solves, and {@link #checkCertificate()} and {@link
 * MaxFlowResult#visitArcFlows} are available. Otherwise only residuals are stored (the memory
 * floor): capacities can be set only before the first solve, and a further {@code solve()}
 * continues from the present flow, which is already maximal.
 *
 * <p>Not thread-safe.
 */
public final class GridMaxFlow implements MaxFlowSolver {
  /** Node id of the source terminal in {@link MaxFlowResult#visitArcFlows}. */
  public static final int SOURCE = -1;

  /** Node id of the sink terminal in {@link MaxFlowResult#visitArcFlows}. */
  public static final int SINK = -2;

  static final byte FREE = 0;
  static final byte SOURCE_TREE = 1;
  static final byte SINK_TREE = 2;
  static final byte NO_PARENT = -1;
  static final byte TERMINAL_PARENT = -2;
  static final byte ORPHAN = -3;
  private static final int NOT_ACTIVE = -1;
  private static final int INFINITE_DISTANCE = Integer.MAX_VALUE;
  private static final int INTERRUPT_CHECK_MASK = 0xFFF;

  final GridLayout layout;
  private final int directions; // K
  private final int[] offset; // offset[k]: padded index difference to the neighbour in direction k

  // Network state, indexed by padded node p (arcs by p * K + k).
  final int[] residual; // >= 0; residual of arc p -> p + offset[k]; 0 on arcs touching the border
  final int[] terminal; // > 0 residual source->p, < 0 minus residual p->sink; 0 on the border
  long flow; // value of the current flow (terminal pre-pushes + augmentations + direct arcs)

  // Retained capacities (null unless retaining), same indexing; never changed by solving.
  final int[] capacity; // c(p, k) >= 0, c(p, k) + c(p + offset[k], k ^ 1) <= Integer.MAX_VALUE
  final int[] sourceCapacity; // cs(p) >= 0
  final int[] sinkCapacity; // ct(p) >= 0
  long sourceSinkCapacity; // capacity of direct source -> sink arcs, always carrying full flow

  // Search state, indexed by padded node.
  final byte[] tree; // FREE, SOURCE_TREE or SINK_TREE; border nodes stay FREE
  final byte[] parent; // direction k towards the parent, TERMINAL_PARENT, ORPHAN, or NO_PARENT
  private final int[] mark; // time at which dist was last known exact; <= time
  private final int[] dist; // distance (arcs) to the tree's terminal, valid if mark == time
  private final int[] nextActive; // active FIFO link; NOT_ACTIVE if not queued, itself if last
  private int firstActive = -1; // head of the active FIFO, -1 if empty
  private int lastActive = -1; // tail of the active FIFO, -1 if empty
  private final IntFifo orphans; // nodes whose parent arc was saturated, parent == ORPHAN
  private int time; // incremented at every augmentation

  // Path found by the growth stage: arc pathTail -> pathTail + offset[pathDirection], S to T.
  private int pathTail;
  private int pathDirection;

  private long augmentations;
  private long orphansAdopted;
  private long orphansFreed;
  private long generation; // incremented at every change and every solve
  private boolean solved; // at least one solve has run

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
    this.directions = layout.directions;
    this.offset = layout.offset;
    int n = layout.paddedCount;
    this.residual = new int[n * directions];
    this.terminal = new int[n];
    this.capacity = retainCapacities ? new int[n * directions] : null;
    this.sourceCapacity = retainCapacities ? new int[n] : null;
    this.sinkCapacity = retainCapacities ? new int[n] : null;
    this.tree = new byte[n];
    this.parent = new byte[n];
    this.mark = new int[n];
    this.dist = new int[n];
    this.nextActive = new int[n];
    this.orphans = new IntFifo(1024);
  }

  @SuppressWarnings({"AssertWithSideEffects", "java:S3346"})
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
   * Adds terminal capacities to a node: {@code sourceCap} to the arc from the source, {@code
   * sinkCap} to the arc to the sink.
   *
   * @throws IllegalArgumentException if a capacity is negative or a total exceeds {@code
   *     Integer.MAX_VALUE}
   * @throws IllegalStateException if capacities are not retained and a solve has run
   */
  public void addTerminalCapacities(int node, long sourceCap, long sinkCap) {
    layout.checkNode(node);
    checkCapacity(sourceCap, "source capacity of node " + node);
    checkCapacity(sinkCap, "sink capacity of node " + node);
    int p = layout.padded(node);
    if (capacity != null) {
      sourceCapacity[p] = checkedSum(sourceCapacity[p], sourceCap, "source capacity", node);
      sinkCapacity[p] = checkedSum(sinkCapacity[p], sinkCap, "sink capacity", node);
    } else {
      checkNotSolved();
      long rs = Math.max(terminal[p], 0) + sourceCap;
      long rt = Math.max(-terminal[p], 0) + sinkCap;
      long both = Math.min(rs, rt);
      checkedSum(0, rs - both, "source capacity", node);
      checkedSum(0, rt - both, "sink capacity", node);
      terminal[p] = (int) (rs - rt);
      flow += both;
    }
    generation++;
  }

  /**
   * Sets the terminal capacities of a node, replacing earlier ones.
   *
   * @throws IllegalStateException if capacities are not retained
   */
  public void setTerminalCapacities(int node, int sourceCap, int sinkCap) {
    requireRetained("setTerminalCapacities");
    layout.checkNode(node);
    checkCapacity(sourceCap, "source capacity of node " + node);
    checkCapacity(sinkCap, "sink capacity of node " + node);
    int p = layout.padded(node);
    sourceCapacity[p] = sourceCap;
    sinkCapacity[p] = sinkCap;
    generation++;
  }

  /**
   * Sets the capacity of the arc from {@code node} to its neighbour in direction {@code k}.
   *
   * @throws IllegalArgumentException if the neighbour is outside the grid, the capacity is
   *     negative, or it plus the capacity of the reverse arc exceeds {@code Integer.MAX_VALUE}
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
    int[] target = capacity != null ? capacity : residual;
    if (capacity == null) {
      checkNotSolved();
    }
    int p = layout.padded(node);
    int reverse = target[(p + offset[k]) * directions + (k ^ 1)];
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
    target[p * directions + k] = cap;
    generation++;
  }

  /** Adds {@code cap} to the arc from {@code node} in direction {@code k}; limits as in set. */
  public void addNeighborCapacity(int node, int k, long cap) {
    layout.checkNode(node);
    layout.checkDirection(k);
    checkCapacity(cap, "capacity of arc (" + node + ", " + k + ")");
    int[] target = capacity != null ? capacity : residual;
    long sum = target[layout.padded(node) * directions + k] + cap;
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
   * capacities when capacities are retained, adds to them otherwise.
   *
   * @throws IllegalArgumentException if an array has the wrong length or holds a negative value
   */
  public void setTerminalCapacities(int[] sourceCaps, int[] sinkCaps) {
    checkLength(sourceCaps, "source capacities");
    checkLength(sinkCaps, "sink capacities");
    if (capacity == null) {
      checkNotSolved();
    }
    GridLayout g = layout;
    long pushed = 0;
    int node = 0;
    for (int z = 0; z < g.depth; z++) {
      for (int y = 0; y < g.height; y++) {
        int p = g.padded(0, y, z);
        for (int x = 0; x < g.width; x++, p++, node++) {
          int cs = sourceCaps[node];
          int ct = sinkCaps[node];
          if ((cs | ct) < 0) {
            checkCapacity(Math.min(cs, ct), "terminal capacity of node " + node);
          }
          if (capacity != null) {
            sourceCapacity[p] = cs;
            sinkCapacity[p] = ct;
          } else {
            long rs = Math.max(terminal[p], 0) + (long) cs;
            long rt = Math.max(-terminal[p], 0) + (long) ct;
            long both = Math.min(rs, rt);
            checkedSum(0, Math.abs(rs - rt), "terminal capacity", node);
            terminal[p] = (int) (rs - rt);
            pushed += both;
          }
        }
      }
    }
    flow += pushed;
    generation++;
  }

  /**
   * Sets the capacity of the arc in direction {@code k} of every node at once: {@code caps[node]}
   * in public node order. Entries of nodes whose neighbour in direction {@code k} lies outside the
   * grid are ignored.
   *
   * @throws IllegalArgumentException if the array has the wrong length, holds a negative value, or
   *     an arc and its reverse add up to more than {@code Integer.MAX_VALUE}
   */
  public void setNeighborCapacities(int k, int[] caps) {
    layout.checkDirection(k);
    checkLength(caps, "capacities of direction " + k);
    if (capacity == null) {
      checkNotSolved();
    }
    int[] target = capacity != null ? capacity : residual;
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
          int back = target[(p + step) * directions + reverse];
          if (c < 0 || (long) c + back > Integer.MAX_VALUE) {
            setNeighborCapacity(node, k, c); // throws with the full message
          }
          target[p * directions + k] = c;
        }
      }
    }
    generation++;
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
    if (capacity == null) {
      checkNotSolved();
      flow += cap;
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

  @Override
  public MaxFlowResult solve() {
    long start = System.nanoTime();
    generation++;
    long adoptedBefore = orphansAdopted;
    long freedBefore = orphansFreed;
    long augmentationsBefore = augmentations;
    if (capacity != null) {
      loadCapacities();
    }
    initialiseTrees();
    SolveStatus status = maxFlow();
    solved = true;
    long nanos = System.nanoTime() - start;
    BitSet cut = sourceSide();
    if (status == SolveStatus.OPTIMAL) {
      assert capacity == null || checkCertificate();
    }
    SolveStatistics stats =
        new SolveStatistics(
            augmentations - augmentationsBefore,
            orphansAdopted - adoptedBefore,
            orphansFreed - freedBefore);
    return new MaxFlowResult(flow, status, cut, nodeCount(), nanos, stats, new ArcFlows());
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
    System.arraycopy(capacity, 0, residual, 0, capacity.length);
    long f = sourceSinkCapacity;
    for (int p = 0; p < terminal.length; p++) {
      int cs = sourceCapacity[p];
      int ct = sinkCapacity[p];
      terminal[p] = cs - ct;
      f += Math.min(cs, ct);
    }
    flow = f;
  }

  /** Every node with terminal residual becomes an active child of its terminal. */
  private void initialiseTrees() {
    Arrays.fill(tree, FREE);
    Arrays.fill(parent, NO_PARENT);
    Arrays.fill(mark, 0);
    Arrays.fill(dist, 0);
    Arrays.fill(nextActive, NOT_ACTIVE);
    firstActive = -1;
    lastActive = -1;
    orphans.clear();
    time = 0;
    for (int p = 0; p < terminal.length; p++) {
      int t = terminal[p];
      if (t != 0) {
        tree[p] = t > 0 ? SOURCE_TREE : SINK_TREE;
        parent[p] = TERMINAL_PARENT;
        dist[p] = 1;
        activate(p);
      }
    }
  }

  /** The main loop: growth, augmentation, adoption, until no active node is left. */
  private SolveStatus maxFlow() {
    int current = -1;
    int iteration = 0;
    while (true) {
      if ((++iteration & INTERRUPT_CHECK_MASK) == 0 && Thread.currentThread().isInterrupted()) {
        return SolveStatus.INTERRUPTED;
      }
      int p;
      if (current >= 0 && tree[current] != FREE) {
        p = current;
      } else {
        p = nextActiveNode();
        if (p < 0) {
          return SolveStatus.OPTIMAL;
        }
      }
      current = -1;
      boolean found = tree[p] == SOURCE_TREE ? growSource(p) : growSink(p);
      if (found) {
        current = p;
        time++;
        augment();
        adoptOrphans();
      }
    }
  }

  /** Grows S from {@code p}; returns true with the path arc set when it touches T. */
  private boolean growSource(int p) {
    int base = p * directions;
    for (int k = 0; k < directions; k++) {
      if (residual[base + k] > 0) {
        int q = p + offset[k];
        byte tq = tree[q];
        if (tq == FREE) {
          tree[q] = SOURCE_TREE;
          parent[q] = (byte) (k ^ 1);
          mark[q] = mark[p];
          dist[q] = dist[p] + 1;
          activate(q);
        } else if (tq == SINK_TREE) {
          pathTail = p;
          pathDirection = k;
          return true;
        } else if (mark[q] <= mark[p] && dist[q] > dist[p]) {
          parent[q] = (byte) (k ^ 1);
          mark[q] = mark[p];
          dist[q] = dist[p] + 1;
        }
      }
    }
    return false;
  }

  /** Grows T from {@code p} over arcs into {@code p}; returns true when it touches S. */
  private boolean growSink(int p) {
    for (int k = 0; k < directions; k++) {
      int q = p + offset[k];
      if (residual[q * directions + (k ^ 1)] > 0) {
        byte tq = tree[q];
        if (tq == FREE) {
          tree[q] = SINK_TREE;
          parent[q] = (byte) (k ^ 1);
          mark[q] = mark[p];
          dist[q] = dist[p] + 1;
          activate(q);
        } else if (tq == SOURCE_TREE) {
          pathTail = q;
          pathDirection = k ^ 1;
          return true;
        } else if (mark[q] <= mark[p] && dist[q] > dist[p]) {
          parent[q] = (byte) (k ^ 1);
          mark[q] = mark[p];
          dist[q] = dist[p] + 1;
        }
      }
    }
    return false;
  }

  /** Pushes the bottleneck along source -> ... -> pathTail -> pathHead -> ... -> sink. */
  private void augment() {
    int tail = pathTail;
    int head = tail + offset[pathDirection];
    int bottleneck = residual[tail * directions + pathDirection];
    for (int i = tail; ; ) {
      byte d = parent[i];
      if (d == TERMINAL_PARENT) {
        bottleneck = Math.min(bottleneck, terminal[i]);
        break;
      }
      int j = i + offset[d];
      bottleneck = Math.min(bottleneck, residual[j * directions + (d ^ 1)]);
      i = j;
    }
    for (int i = head; ; ) {
      byte d = parent[i];
      if (d == TERMINAL_PARENT) {
        bottleneck = Math.min(bottleneck, -terminal[i]);
        break;
      }
      bottleneck = Math.min(bottleneck, residual[i * directions + d]);
      i += offset[d];
    }
    residual[tail * directions + pathDirection] -= bottleneck;
    residual[head * directions + (pathDirection ^ 1)] += bottleneck;
    for (int i = tail; ; ) {
      byte d = parent[i];
      if (d == TERMINAL_PARENT) {
        terminal[i] -= bottleneck;
        if (terminal[i] == 0) {
          makeOrphan(i);
        }
        break;
      }
      int j = i + offset[d];
      residual[i * directions + d] += bottleneck;
      if ((residual[j * directions + (d ^ 1)] -= bottleneck) == 0) {
        makeOrphan(i);
      }
      i = j;
    }
    for (int i = head; ; ) {
      byte d = parent[i];
      if (d == TERMINAL_PARENT) {
        terminal[i] += bottleneck;
        if (terminal[i] == 0) {
          makeOrphan(i);
        }
        break;
      }
      int j = i + offset[d];
      residual[j * directions + (d ^ 1)] += bottleneck;
      if ((residual[i * directions + d] -= bottleneck) == 0) {
        makeOrphan(i);
      }
      i = j;
    }
    flow += bottleneck;
    augmentations++;
  }

  private void makeOrphan(int p) {
    parent[p] = ORPHAN;
    orphans.add(p);
  }

  private void adoptOrphans() {
    while (!orphans.isEmpty()) {
      int p = orphans.poll();
      if (tree[p] == SOURCE_TREE) {
        adoptIntoSource(p);
      } else {
        adoptIntoSink(p);
      }
    }
  }

  /**
   * Finds orphan {@code p} of S the closest valid parent q (arc q -> p unsaturated), or frees it.
   */
  private void adoptIntoSource(int p) {
    int bestDirection = -1;
    int bestDistance = INFINITE_DISTANCE;
    for (int k = 0; k < directions; k++) {
      int q = p + offset[k];
      if (tree[q] == SOURCE_TREE && residual[q * directions + (k ^ 1)] > 0) {
        int d = distanceToTerminal(q);
        if (d < bestDistance) {
          bestDistance = d;
          bestDirection = k;
        }
      }
    }
    if (bestDirection >= 0) {
      parent[p] = (byte) bestDirection;
      mark[p] = time;
      dist[p] = bestDistance + 1;
      orphansAdopted++;
      return;
    }
    for (int k = 0; k < directions; k++) {
      int q = p + offset[k];
      if (tree[q] == SOURCE_TREE) {
        if (residual[q * directions + (k ^ 1)] > 0) {
          activate(q);
        }
        if (parent[q] == (byte) (k ^ 1)) {
          makeOrphan(q);
        }
      }
    }
    tree[p] = FREE;
    parent[p] = NO_PARENT;
    orphansFreed++;
  }

  /**
   * Finds orphan {@code p} of T the closest valid parent q (arc p -> q unsaturated), or frees it.
   */
  private void adoptIntoSink(int p) {
    int base = p * directions;
    int bestDirection = -1;
    int bestDistance = INFINITE_DISTANCE;
    for (int k = 0; k < directions; k++) {
      int q = p + offset[k];
      if (tree[q] == SINK_TREE && residual[base + k] > 0) {
        int d = distanceToTerminal(q);
        if (d < bestDistance) {
          bestDistance = d;
          bestDirection = k;
        }
      }
    }
    if (bestDirection >= 0) {
      parent[p] = (byte) bestDirection;
      mark[p] = time;
      dist[p] = bestDistance + 1;
      orphansAdopted++;
      return;
    }
    for (int k = 0; k < directions; k++) {
      int q = p + offset[k];
      if (tree[q] == SINK_TREE) {
        if (residual[base + k] > 0) {
          activate(q);
        }
        if (parent[q] == (byte) (k ^ 1)) {
          makeOrphan(q);
        }
      }
    }
    tree[p] = FREE;
    parent[p] = NO_PARENT;
    orphansFreed++;
  }

  /**
   * Distance from {@code q} to its tree's terminal along parent arcs, or INFINITE_DISTANCE if the
   * walk meets an orphan (q's origin is no longer a terminal). Marks the walked nodes with the
   * current time and their exact distances, so later walks stop early.
   */
  private int distanceToTerminal(int q) {
    int d = 0;
    int j = q;
    while (true) {
      if (mark[j] == time) {
        d += dist[j];
        break;
      }
      byte a = parent[j];
      d++;
      if (a == TERMINAL_PARENT) {
        mark[j] = time;
        dist[j] = 1;
        break;
      }
      if (a == ORPHAN) {
        return INFINITE_DISTANCE;
      }
      j += offset[a];
    }
    int dj = d;
    for (j = q; mark[j] != time; j += offset[parent[j]]) {
      mark[j] = time;
      dist[j] = dj--;
    }
    return d;
  }

  private void activate(int p) {
    if (nextActive[p] == NOT_ACTIVE) {
      if (lastActive < 0) {
        firstActive = p;
      } else {
        nextActive[lastActive] = p;
      }
      nextActive[p] = p;
      lastActive = p;
    }
  }

  /** Removes and returns the next active node still in a tree, or -1 if none is left. */
  private int nextActiveNode() {
    while (firstActive >= 0) {
      int p = firstActive;
      int next = nextActive[p];
      nextActive[p] = NOT_ACTIVE;
      if (next == p) {
        firstActive = -1;
        lastActive = -1;
      } else {
        firstActive = next;
      }
      if (tree[p] != FREE) {
        return p;
      }
    }
    return -1;
  }

  /** Source side of the cut: the nodes of S, in public numbering. */
  private BitSet sourceSide() {
    GridLayout g = layout;
    BitSet side = new BitSet(g.nodeCount());
    int node = 0;
    for (int z = 0; z < g.depth; z++) {
      for (int y = 0; y < g.height; y++) {
        int p = g.padded(0, y, z);
        for (int x = 0; x < g.width; x++, p++, node++) {
          if (tree[p] == SOURCE_TREE) {
            side.set(node);
          }
        }
      }
    }
    return side;
  }

  private void checkNotSolved() {
    if (solved) {
      throw new IllegalStateException(
          "capacities cannot change after a solve unless the solver retains them"
              + " (construct it with retainCapacities = true)");
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

  private static int checkedSum(int current, long add, String what, int node) {
    long sum = current + add;
    if (sum > Integer.MAX_VALUE) {
      throw new IllegalArgumentException(
          what + " of node " + node + " adds up to " + sum + ", more than " + Integer.MAX_VALUE);
    }
    return (int) sum;
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
      new GridCertificate(GridMaxFlow.this).visitArcFlows(visitor);
    }
  }
}
