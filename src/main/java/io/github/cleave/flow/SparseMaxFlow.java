package io.github.cleave.flow;

import java.util.Arrays;
import java.util.BitSet;

/**
 * Maximum flow and minimum cut on an arbitrary directed network by the augmenting-path method of
 * Boykov and Kolmogorov (IEEE TPAMI 26(9):1124–1137, 2004, doi:10.1109/TPAMI.2004.60), on
 * compressed adjacency arrays. Built by {@link SparseGraphBuilder}; used for DIMACS files that are
 * not grids and as the second, independent implementation that the grid solver is tested against.
 *
 * <h2>Method</h2>
 *
 * As in {@link GridMaxFlow}: a search tree S rooted at the source and T rooted at the sink grow
 * over unsaturated arcs until they touch; the path found is saturated; orphans (nodes whose parent
 * arc was saturated) adopt the valid parent closest to their terminal or leave their tree. Every
 * node keeps its distance to its terminal and the time at which that was last known exact (the
 * paper's timestamp and distance heuristics). Here the terminals are ordinary nodes, the roots of
 * the two trees.
 *
 * <h2>Representation</h2>
 *
 * Each input arc {@code u -> v} becomes two residual arcs in compressed adjacency (CSR) order, the
 * forward arc at {@code u} with the capacity and its sister at {@code v} with zero; the sister of
 * an arc is stored, the head of an arc is stored, the tail is the node whose range holds the arc.
 * Residuals are {@code int}, the flow value {@code long}. Memory: 12 bytes per residual arc (24 per
 * input arc), 12 more per input arc for the retained capacities and positions, and 22 bytes per
 * node.
 *
 * <h2>Invariants between stages</h2>
 *
 * Every node of S has an unsaturated path from the source along its parent arcs, every node of T
 * one to the sink; orphans are queued; every tree node that may have a free or opposite-tree
 * neighbour over an unsaturated arc is active. At termination no node is active, so S is exactly
 * the set of nodes reachable from the source in the residual graph.
 *
 * <h2>Complexity</h2>
 *
 * O(m n² |C|) in the worst case (n nodes, m arcs, |C| the minimum cut value); close to linear on
 * vision-style networks with short paths.
 *
 * <p>Every {@link #solve()} starts from zero flow. Not thread-safe.
 */
public final class SparseMaxFlow implements MaxFlowSolver {
  private static final byte FREE = 0;
  private static final byte SOURCE_TREE = 1;
  private static final byte SINK_TREE = 2;
  private static final int NO_PARENT = -1;
  private static final int TERMINAL = -2;
  private static final int ORPHAN = -3;
  private static final int INFINITE_DISTANCE = Integer.MAX_VALUE;
  private static final int INTERRUPT_CHECK_MASK = 0xFFF;

  private final int nodeCount;
  private final int source;
  private final int sink;

  // Input arcs, as given.
  private final int[] tails;
  private final int[] heads;
  private final int[] capacities;
  private final int arcs; // input arcs: the first entries of tails, heads and capacities
  private final int[] forward; // CSR position of input arc i's forward residual arc; -1 for a loop

  // Residual network in CSR order: arcs of node u at first[u] .. first[u + 1] - 1.
  private final int[] first;
  private final int[] arcHead;
  private final int[] sister;
  final int[] residual; // package-private for the tests that tamper with it

  // Search state.
  private final byte[] tree;
  private final int[] parentArc; // arc from the node to its parent, TERMINAL, ORPHAN or NO_PARENT
  private final int[] mark;
  private final int[] dist;
  private final ActiveQueue active; // nodes whose neighbourhood growth must scan
  private final IntFifo orphans = new IntFifo(1024);
  private int time;
  private long flow;
  private int pathArc; // arc from S to T found by growth
  private int pathArcAt; // position in the grown node's arc range where it was found

  private long augmentations;
  private long orphansAdopted;
  private long orphansFreed;
  private long generation;
  private boolean solved;

  /**
   * The network of the first {@code arcs} entries of {@code tails}, {@code heads} and {@code
   * capacities}, which the solver keeps (the arrays may be longer).
   */
  SparseMaxFlow(
      int nodeCount, int source, int sink, int[] tails, int[] heads, int[] capacities, int arcs) {
    this.nodeCount = nodeCount;
    this.source = source;
    this.sink = sink;
    this.tails = tails;
    this.heads = heads;
    this.capacities = capacities;
    this.arcs = arcs;
    int m = arcs;
    this.forward = new int[m];
    this.first = new int[nodeCount + 1];
    int loops = 0;
    for (int i = 0; i < m; i++) {
      if (tails[i] == heads[i]) {
        loops++;
        continue;
      }
      first[tails[i] + 1]++;
      first[heads[i] + 1]++;
    }
    for (int u = 0; u < nodeCount; u++) {
      first[u + 1] += first[u];
    }
    int residualArcs = 2 * (m - loops);
    this.arcHead = new int[residualArcs];
    this.sister = new int[residualArcs];
    this.residual = new int[residualArcs];
    int[] next = Arrays.copyOf(first, nodeCount);
    for (int i = 0; i < m; i++) {
      int u = tails[i];
      int v = heads[i];
      if (u == v) {
        forward[i] = -1;
        continue;
      }
      int a = next[u]++;
      int b = next[v]++;
      arcHead[a] = v;
      arcHead[b] = u;
      sister[a] = b;
      sister[b] = a;
      forward[i] = a;
    }
    this.tree = new byte[nodeCount];
    this.parentArc = new int[nodeCount];
    this.mark = new int[nodeCount];
    this.dist = new int[nodeCount];
    this.active = new ActiveQueue(nodeCount);
  }

  @Override
  public int nodeCount() {
    return nodeCount;
  }

  /** The source node. */
  public int source() {
    return source;
  }

  /** The sink node. */
  public int sink() {
    return sink;
  }

  /** Number of input arcs, self-loops included. */
  public int arcCount() {
    return arcs;
  }

  /** Bytes of solver state: residual network, retained input arcs and search state. */
  public long stateBytes() {
    return 4L * (arcHead.length + sister.length + residual.length)
        + 4L * (tails.length * 3L + arcs)
        + 4L * first.length
        + (long) nodeCount * (1 + 4 + 4 + 4 + 4)
        + 4L * orphans.capacity();
  }

  @Override
  public MaxFlowResult solve() {
    long start = System.nanoTime();
    generation++;
    for (int i = 0; i < arcs; i++) {
      int a = forward[i];
      if (a >= 0) {
        residual[a] = capacities[i];
        residual[sister[a]] = 0;
      }
    }
    flow = 0;
    initialiseTrees();
    long augmentations0 = augmentations;
    long adopted0 = orphansAdopted;
    long freed0 = orphansFreed;
    SolveStatus status = maxFlow();
    solved = true;
    long nanos = System.nanoTime() - start;
    BitSet side = new BitSet(nodeCount);
    for (int u = 0; u < nodeCount; u++) {
      if (tree[u] == SOURCE_TREE) {
        side.set(u);
      }
    }
    if (status == SolveStatus.OPTIMAL) {
      assert checkCertificate();
    }
    SolveStatistics stats =
        new SolveStatistics(
            augmentations - augmentations0, orphansAdopted - adopted0, orphansFreed - freed0);
    return new MaxFlowResult(flow, status, side, nodeCount, nanos, stats, new ArcFlows());
  }

  private void initialiseTrees() {
    Arrays.fill(tree, FREE);
    Arrays.fill(parentArc, NO_PARENT);
    Arrays.fill(mark, 0);
    Arrays.fill(dist, 0);
    active.clear();
    orphans.clear();
    time = 0;
    tree[source] = SOURCE_TREE;
    parentArc[source] = TERMINAL;
    tree[sink] = SINK_TREE;
    parentArc[sink] = TERMINAL;
    activate(source);
    activate(sink);
  }

  private SolveStatus maxFlow() {
    int current = -1;
    int iteration = 0;
    while (true) {
      if ((++iteration & INTERRUPT_CHECK_MASK) == 0 && Thread.currentThread().isInterrupted()) {
        return SolveStatus.INTERRUPTED;
      }
      int p;
      int from;
      if (current >= 0 && tree[current] != FREE) {
        // Continue where the last path was found: the arcs scanned before it still lead into the
        // node's own tree or are saturated, and a change there re-activates the node.
        p = current;
        from = pathArcAt;
      } else {
        p = nextActiveNode();
        if (p < 0) {
          return SolveStatus.OPTIMAL;
        }
        from = first[p];
      }
      current = -1;
      boolean found = tree[p] == SOURCE_TREE ? growSource(p, from) : growSink(p, from);
      if (found) {
        current = p;
        time++;
        augment();
        adoptOrphans();
      }
    }
  }

  private boolean growSource(int p, int from) {
    for (int a = from, end = first[p + 1]; a < end; a++) {
      if (residual[a] > 0) {
        int q = arcHead[a];
        byte tq = tree[q];
        if (tq == FREE) {
          tree[q] = SOURCE_TREE;
          parentArc[q] = sister[a];
          mark[q] = mark[p];
          dist[q] = dist[p] + 1;
          activate(q);
        } else if (tq == SINK_TREE) {
          pathArc = a;
          pathArcAt = a;
          return true;
        } else if (mark[q] <= mark[p] && dist[q] > dist[p] && parentArc[q] >= 0) {
          parentArc[q] = sister[a];
          mark[q] = mark[p];
          dist[q] = dist[p] + 1;
        }
      }
    }
    return false;
  }

  private boolean growSink(int p, int from) {
    for (int a = from, end = first[p + 1]; a < end; a++) {
      int back = sister[a];
      if (residual[back] > 0) {
        int q = arcHead[a];
        byte tq = tree[q];
        if (tq == FREE) {
          tree[q] = SINK_TREE;
          parentArc[q] = back;
          mark[q] = mark[p];
          dist[q] = dist[p] + 1;
          activate(q);
        } else if (tq == SOURCE_TREE) {
          pathArc = back;
          pathArcAt = a;
          return true;
        } else if (mark[q] <= mark[p] && dist[q] > dist[p] && parentArc[q] >= 0) {
          parentArc[q] = back;
          mark[q] = mark[p];
          dist[q] = dist[p] + 1;
        }
      }
    }
    return false;
  }

  /** Saturates source -> ... -> u -> v -> ... -> sink, where pathArc = (u, v). */
  private void augment() {
    int e = pathArc;
    int u = arcHead[sister[e]];
    int v = arcHead[e];
    int bottleneck = residual[e];
    for (int i = u; parentArc[i] != TERMINAL; ) {
      int a = parentArc[i]; // i -> parent; flow runs along its sister
      bottleneck = Math.min(bottleneck, residual[sister[a]]);
      i = arcHead[a];
    }
    for (int i = v; parentArc[i] != TERMINAL; ) {
      int a = parentArc[i]; // i -> parent, flow runs along it
      bottleneck = Math.min(bottleneck, residual[a]);
      i = arcHead[a];
    }
    residual[e] -= bottleneck;
    residual[sister[e]] += bottleneck;
    for (int i = u; parentArc[i] != TERMINAL; ) {
      int a = parentArc[i];
      int parent = arcHead[a];
      residual[a] += bottleneck;
      if ((residual[sister[a]] -= bottleneck) == 0) {
        makeOrphan(i);
      }
      i = parent;
    }
    for (int i = v; parentArc[i] != TERMINAL; ) {
      int a = parentArc[i];
      int parent = arcHead[a];
      residual[sister[a]] += bottleneck;
      if ((residual[a] -= bottleneck) == 0) {
        makeOrphan(i);
      }
      i = parent;
    }
    flow += bottleneck;
    augmentations++;
  }

  private void makeOrphan(int p) {
    parentArc[p] = ORPHAN;
    orphans.add(p);
  }

  private void adoptOrphans() {
    while (!orphans.isEmpty()) {
      int p = orphans.poll();
      if (tree[p] == SOURCE_TREE) {
        adopt(p, SOURCE_TREE);
      } else {
        adopt(p, SINK_TREE);
      }
    }
  }

  /**
   * Gives orphan {@code p} of {@code own} the valid parent closest to the terminal, or frees it. A
   * valid parent q of an S node has residual on q -> p; of a T node, on p -> q.
   */
  private void adopt(int p, byte own) {
    int bestArc = -1;
    int bestDistance = INFINITE_DISTANCE;
    for (int a = first[p], end = first[p + 1]; a < end; a++) {
      int q = arcHead[a];
      int open = own == SOURCE_TREE ? residual[sister[a]] : residual[a];
      if (tree[q] == own && open > 0) {
        int d = distanceToTerminal(q);
        if (d < bestDistance) {
          bestDistance = d;
          bestArc = a;
        }
      }
    }
    if (bestArc >= 0) {
      parentArc[p] = bestArc;
      mark[p] = time;
      dist[p] = bestDistance + 1;
      orphansAdopted++;
      return;
    }
    for (int a = first[p], end = first[p + 1]; a < end; a++) {
      int q = arcHead[a];
      if (tree[q] == own) {
        int open = own == SOURCE_TREE ? residual[sister[a]] : residual[a];
        if (open > 0) {
          activate(q);
        }
        int qa = parentArc[q];
        if (qa >= 0 && arcHead[qa] == p) {
          makeOrphan(q);
        }
      }
    }
    tree[p] = FREE;
    parentArc[p] = NO_PARENT;
    orphansFreed++;
  }

  /** Distance from q to its terminal along parent arcs, or INFINITE_DISTANCE via an orphan. */
  private int distanceToTerminal(int q) {
    int d = 0;
    int j = q;
    while (true) {
      if (mark[j] == time) {
        d += dist[j];
        break;
      }
      int a = parentArc[j];
      if (a == TERMINAL) {
        mark[j] = time;
        dist[j] = 0;
        break;
      }
      if (a < 0) {
        return INFINITE_DISTANCE; // an orphan (or a node just freed) on the way
      }
      d++;
      j = arcHead[a];
    }
    int dj = d;
    for (j = q; mark[j] != time; j = arcHead[parentArc[j]]) {
      mark[j] = time;
      dist[j] = dj--;
    }
    return d;
  }

  private void activate(int p) {
    active.add(p);
  }

  /** Removes and returns the next active node still in a tree, or -1 if none is left. */
  private int nextActiveNode() {
    for (int p = active.poll(); p >= 0; p = active.poll()) {
      if (tree[p] != FREE) {
        return p;
      }
    }
    return -1;
  }

  /** Flow on input arc {@code i} of the present state (0 for a self-loop). */
  long arcFlow(int i) {
    int a = forward[i];
    return a < 0 ? 0 : (long) capacities[i] - residual[a];
  }

  @Override
  public boolean checkCertificate() {
    if (!solved) {
      throw new IllegalStateException("checkCertificate() needs a solve first");
    }
    long[] net = new long[nodeCount]; // outflow minus inflow
    for (int i = 0; i < arcs; i++) {
      int a = forward[i];
      if (a < 0) {
        continue;
      }
      long f = (long) capacities[i] - residual[a];
      if (f < 0 || f > capacities[i] || residual[sister[a]] != f) {
        throw new CertificateViolation(
            "arc "
                + i
                + " ("
                + tails[i]
                + " -> "
                + heads[i]
                + ", capacity "
                + capacities[i]
                + ") has residuals "
                + residual[a]
                + " and "
                + residual[sister[a]]
                + ", not a flow within its capacity");
      }
      net[tails[i]] += f;
      net[heads[i]] -= f;
    }
    for (int u = 0; u < nodeCount; u++) {
      if (u != source && u != sink && net[u] != 0) {
        throw new CertificateViolation(
            "flow is not conserved at node " + u + ": outflow minus inflow is " + net[u]);
      }
    }
    if (net[source] != flow || -net[sink] != flow) {
      throw new CertificateViolation(
          "the flow value "
              + flow
              + " differs from the net outflow of the source "
              + net[source]
              + " or the net inflow of the sink "
              + -net[sink]);
    }
    BitSet reached = reachableFromSource();
    if (reached.get(sink)) {
      throw new CertificateViolation("the sink is reachable from the source in the residual graph");
    }
    for (int u = 0; u < nodeCount; u++) {
      if (reached.get(u) != (tree[u] == SOURCE_TREE)) {
        throw new CertificateViolation(
            "node "
                + u
                + (reached.get(u)
                    ? " is reachable from the source in the residual graph but not in the"
                        + " solver's source set"
                    : " is in the solver's source set but not reachable from the source"));
      }
    }
    long cut = 0;
    for (int i = 0; i < arcs; i++) {
      if (reached.get(tails[i]) && !reached.get(heads[i])) {
        cut += capacities[i];
      }
    }
    if (cut != flow) {
      throw new CertificateViolation(
          "the cut around the residual-reachable set has capacity " + cut + ", the flow " + flow);
    }
    return true;
  }

  private BitSet reachableFromSource() {
    BitSet reached = new BitSet(nodeCount);
    IntFifo queue = new IntFifo(64);
    reached.set(source);
    queue.add(source);
    while (!queue.isEmpty()) {
      int u = queue.poll();
      for (int a = first[u]; a < first[u + 1]; a++) {
        int v = arcHead[a];
        if (residual[a] > 0 && !reached.get(v)) {
          reached.set(v);
          queue.add(v);
        }
      }
    }
    return reached;
  }

  /** The flows of the present state, read by {@link MaxFlowResult#visitArcFlows}. */
  private final class ArcFlows implements MaxFlowResult.FlowView {
    @Override
    public long generation() {
      return generation;
    }

    @Override
    public void visitArcFlows(ArcFlowVisitor visitor) {
      for (int i = 0; i < arcs; i++) {
        int a = forward[i];
        if (a >= 0) {
          long f = (long) capacities[i] - residual[a];
          if (f > 0) {
            visitor.arc(tails[i], heads[i], f);
          }
        }
      }
    }
  }
}
