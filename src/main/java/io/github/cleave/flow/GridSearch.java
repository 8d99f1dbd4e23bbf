package io.github.cleave.flow;

import java.util.Arrays;
import java.util.BitSet;

/**
 * The search state and the three stages (growth, augmentation, adoption) of the Boykov–Kolmogorov
 * method on a padded grid; see {@link GridMaxFlow} for the method and {@link GridLayout} for the
 * indexing. This class also repairs the trees after capacity changes so that a solve can continue
 * from the previous flow and trees (Kohli and Torr, "Efficiently solving dynamic Markov random
 * fields using graph cuts", ICCV 2005, doi:10.1109/ICCV.2005.81).
 *
 * <p>Invariants between the stages: every node of S has an unsaturated path from the source along
 * its parent arcs (residual of parent -> child > 0, a root has terminal residual > 0), every node
 * of T one to the sink; a node's parent is in its own tree; orphans (parent == ORPHAN) are queued;
 * every tree node that may have a free or opposite-tree neighbour over an unsaturated arc is active
 * (queued for its tree). A solve ends when no node of S is active; T may keep active nodes, which a
 * later re-solve grows first.
 */
final class GridSearch {
  static final byte FREE = 0;
  static final byte SOURCE_TREE = 1;
  static final byte SINK_TREE = 2;
  static final byte NO_PARENT = -1;
  static final byte TERMINAL_PARENT = -2;
  static final byte ORPHAN = -3;
  private static final int INFINITE_DISTANCE = Integer.MAX_VALUE;
  private static final int INTERRUPT_CHECK_MASK = 0xFFF;

  /**
   * Share of nodes without terminal residual from which the trees take turns ({@link
   * #chooseOrder}): our choice between the measured cases, 1 to 4 % ties (one queue faster) and 39
   * % (turns twice as fast).
   */
  static final double TURNS_TIE_SHARE = 0.1;

  final GridLayout layout;
  private final int directions; // K
  private final int[] offset; // offset[k]: padded index difference to the neighbour in direction k

  // Network state, indexed by padded node p (arcs by p * K + k).
  Residuals residual; // >= 0; residual of arc p -> p + offset[k]; 0 on arcs touching the border
  final int[] terminal; // > 0 residual source->p, < 0 minus residual p->sink; 0 on the border
  long flow; // flow value of the network the caller sees (see GridMaxFlow on reparametrisation)

  // Search state, indexed by padded node.
  final byte[] tree; // FREE, SOURCE_TREE or SINK_TREE; border nodes stay FREE
  final byte[] parent; // direction k towards the parent, TERMINAL_PARENT, ORPHAN, or NO_PARENT
  private final int[] mark; // time at which dist was last known exact; <= time
  private final int[] dist; // distance (arcs) to the tree's terminal, valid if mark == time
  private final ActiveQueue active; // nodes whose growth must scan; only those of S if taking turns
  private ActiveQueue sinkActive; // taking turns: the nodes of T whose growth must scan; else null
  private boolean sinkTurn; // taking turns: whether the next growth is T's
  private final IntFifo orphans; // nodes whose parent arc was saturated, parent == ORPHAN
  private int time; // incremented at every augmentation
  private boolean pristine = true; // tree, mark, dist and active as constructed: never searched
  private boolean terminalsZero = true; // no terminal residual was ever changed

  // Path found by the growth stage: arc pathTail -> pathTail + offset[pathDirection], S to T.
  private int pathTail;
  private int pathDirection;

  long augmentations; // counters since construction
  long orphansAdopted;
  long orphansFreed;

  GridSearch(GridLayout layout, boolean narrow) {
    this.layout = layout;
    this.directions = layout.directions;
    this.offset = layout.offset;
    int n = layout.paddedCount;
    this.residual = Residuals.create(n * directions, narrow);
    this.terminal = new int[n];
    this.tree = new byte[n];
    this.parent = new byte[n];
    this.mark = new int[n];
    this.dist = new int[n];
    this.active = new ActiveQueue(n);
    this.orphans = new IntFifo(1024);
  }

  /** Width of the stored residuals, 16 or 32 bits. */
  int residualWidth() {
    return residual.width();
  }

  /** Switches to 32-bit residuals (a no-op if they are already). */
  void widenResiduals() {
    residual = residual.widened();
  }

  /**
   * Changes the terminal residuals of node {@code p} by {@code dSource} (source side) and {@code
   * dSink} (sink side), then removes the common part {@code m = min} of the two new residuals: a
   * reparametrisation that shifts every cut by {@code m}, so the flow value moves by {@code m}.
   *
   * @return {@code m}, negative when a residual would have become negative (the caller keeps it as
   *     an equal amount added to both terminal capacities)
   * @throws IllegalArgumentException if the net residual leaves the int range
   */
  long changeTerminal(int p, long dSource, long dSink) {
    terminalsZero = false;
    int t = terminal[p];
    long rs = Math.max(t, 0) + dSource;
    long rt = Math.max(-(long) t, 0) + dSink;
    long m = Math.min(rs, rt);
    long net = rs - rt;
    if (net > Integer.MAX_VALUE || net < -Integer.MAX_VALUE) {
      throw new IllegalArgumentException(
          "terminal capacities of node "
              + layout.unpadded(p)
              + " differ by "
              + net
              + ", more than "
              + Integer.MAX_VALUE);
    }
    terminal[p] = (int) net;
    flow += m;
    return m;
  }

  /** Whether every terminal residual is still 0, as in a new network. */
  boolean terminalsZero() {
    return terminalsZero;
  }

  /**
   * {@link #changeTerminal} for the {@code count} nodes from padded node {@code p} on, with {@code
   * dSource = sourceCaps[from + i]} and {@code dSink = sinkCaps[from + i]}, while every terminal
   * residual of these nodes is 0 (true of every row while {@link #terminalsZero} was true at the
   * start of a pass that sets each row once): then the residual is the difference and the flow
   * grows by the smaller, with no overflow possible. One plain loop over the row.
   *
   * @return false, with nothing changed, if a capacity of the row is negative
   */
  boolean setInitialTerminals(int p, int[] sourceCaps, int[] sinkCaps, int from, int count) {
    int signs = 0;
    for (int i = from; i < from + count; i++) {
      signs |= sourceCaps[i] | sinkCaps[i];
    }
    if (signs < 0) {
      return false;
    }
    long common = 0;
    for (int i = 0; i < count; i++) {
      int cs = sourceCaps[from + i];
      int ct = sinkCaps[from + i];
      terminal[p + i] = cs - ct;
      common += Math.min(cs, ct);
    }
    flow += common;
    terminalsZero = false; // the rows not set yet are still 0: the caller may go on row by row
    return true;
  }

  /**
   * Restores the tree invariants at node {@code p} after its terminal residual or the residuals of
   * its arcs changed: a node with terminal residual becomes a root of that terminal's tree (leaving
   * the other tree, whose children of it become orphans); a node whose parent arc is saturated
   * becomes an orphan; tree nodes are activated so that growth rescans them.
   */
  void repair(int p) {
    // (The caller has called beginRepairs(), so that no distance mark predates the changes.)
    int t = terminal[p];
    if (t != 0) {
      byte wanted = t > 0 ? SOURCE_TREE : SINK_TREE;
      if (tree[p] != wanted) {
        if (tree[p] != FREE) {
          // Leaving a tree: its children there are orphaned, and its neighbours there, passive
          // until now, may have open arcs to p that now lead to the other tree.
          orphanChildren(p);
          activateTreeNeighbours(p);
        }
        tree[p] = wanted;
      }
      parent[p] = TERMINAL_PARENT;
      mark[p] = time;
      dist[p] = 1;
      activate(p);
      return;
    }
    if (tree[p] == FREE) {
      return;
    }
    byte d = parent[p];
    if (d != ORPHAN && (d == TERMINAL_PARENT || d == NO_PARENT || !parentArcOpen(p, d))) {
      makeOrphan(p);
    }
    activate(p);
  }

  /**
   * Starts a batch of repairs: advances the clock, so that no node's distance mark counts as
   * verified (a mark equal to the current time means "origin checked since the last change").
   */
  void beginRepairs() {
    time++;
  }

  private boolean parentArcOpen(int p, int d) {
    if (tree[p] == SOURCE_TREE) {
      return residual.get((p + offset[d]) * directions + (d ^ 1)) > 0;
    }
    return residual.get(p * directions + d) > 0;
  }

  private void activateTreeNeighbours(int p) {
    for (int k = 0; k < directions; k++) {
      int q = p + offset[k];
      if (tree[q] != FREE) {
        activate(q);
      }
    }
  }

  private void orphanChildren(int p) {
    byte own = tree[p];
    for (int k = 0; k < directions; k++) {
      int q = p + offset[k];
      if (tree[q] == own && parent[q] == (byte) (k ^ 1)) {
        makeOrphan(q);
      }
    }
  }

  /**
   * Starts a solve from the present residuals: first saturates the paths source -> p -> q -> sink
   * between neighbours, then makes every node with terminal residual a child of its terminal,
   * active if it has a neighbour that is not a child of the same terminal.
   */
  void initialiseTrees() {
    if (!pristine) { // a new search state is already so, as Java zeroes arrays
      Arrays.fill(tree, FREE);
      Arrays.fill(mark, 0);
      Arrays.fill(dist, 0);
      active.clear();
    }
    pristine = false;
    Arrays.fill(parent, NO_PARENT);
    orphans.clear();
    time = 0;
    chooseOrder();
    pushToNeighbours();
    for (int p = 0; p < terminal.length; p++) {
      int t = terminal[p];
      if (t != 0) {
        tree[p] = t > 0 ? SOURCE_TREE : SINK_TREE;
        parent[p] = TERMINAL_PARENT;
        dist[p] = 1;
        if (onFront(p, t)) {
          activate(p); // roots whose neighbours are all roots of the same tree cannot grow
        }
      }
    }
  }

  /**
   * The order of growth for this solve: one queue, first in first out, as in the paper; or, where
   * at least {@link #TURNS_TIE_SHARE} of the nodes have no terminal residual (ties: voxels whose
   * regional costs are equal, which the boundary term alone decides), a queue per tree, the trees
   * taking turns, ending as soon as no node of S is active. With one queue, S's last growth waits
   * behind T's growth over wide tie regions that S never reaches; with turns it does not, and the
   * solve ends without T's remaining growth, which only shortens the paths S finds (S is then
   * closed under unsaturated arcs: the flow is maximal and S the reachable set). Where ties are
   * few, one queue was faster (measured below, {@code GridMaxFlow}).
   */
  private void chooseOrder() {
    long zeros = 0;
    for (int t : terminal) {
      zeros += t == 0 ? 1 : 0;
    }
    long ties = zeros - (layout.paddedCount - layout.nodeCount()); // the padding is all zeros
    boolean turns = ties >= TURNS_TIE_SHARE * layout.nodeCount();
    if (turns && sinkActive == null) {
      sinkActive = new ActiveQueue(terminal.length);
    } else if (!turns && sinkActive != null) {
      sinkActive = null;
    }
    if (sinkActive != null) {
      sinkActive.clear();
    }
    sinkTurn = false; // every solve from scratch takes the same turns: the same arc flows
  }

  /** Whether the trees take turns in this solve ({@link #chooseOrder}). */
  boolean treesTakeTurns() {
    return sinkActive != null;
  }

  /** True if a neighbour of root p is not a root of the same tree. */
  private boolean onFront(int p, int t) {
    for (int k = 0; k < directions; k++) {
      int tq = terminal[p + offset[k]];
      if (t > 0 ? tq <= 0 : tq >= 0) {
        return true;
      }
    }
    return false;
  }

  /**
   * Pushes terminal excess straight to neighbours with the opposite excess: the augmenting paths
   * source -> p -> q -> sink of length three, found without search trees.
   */
  private void pushToNeighbours() {
    Residuals res = residual;
    int[] term = terminal;
    int kk = directions;
    long pushed = 0;
    for (int p = 0; p < term.length; p++) {
      int tp = term[p];
      if (tp <= 0) {
        continue;
      }
      int base = p * kk;
      for (int k = 0; k < kk && tp > 0; k++) {
        int r = res.get(base + k);
        if (r > 0) {
          int q = p + offset[k];
          int tq = term[q];
          if (tq < 0) {
            int m = Math.min(Math.min(tp, -tq), r);
            tp -= m;
            term[q] = tq + m;
            res.set(base + k, r - m);
            int b = q * kk + (k ^ 1);
            res.set(b, res.get(b) + m);
            pushed += m;
          }
        }
      }
      term[p] = tp;
    }
    flow += pushed;
  }

  /** The main loop: growth, augmentation, adoption, until no active node is left. */
  SolveStatus maxFlow() {
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
      if (residual.get(base + k) > 0) {
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
        } else if (dist[q] > dist[p] + 1 && mark[q] <= mark[p]) { // only when strictly closer
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
      if (residual.get(q * directions + (k ^ 1)) > 0) {
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
        } else if (dist[q] > dist[p] + 1 && mark[q] <= mark[p]) {
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
    Residuals res = residual;
    int first = tail * directions + pathDirection;
    int bottleneck = res.get(first);
    for (int i = tail; ; ) {
      byte d = parent[i];
      if (d == TERMINAL_PARENT) {
        bottleneck = Math.min(bottleneck, terminal[i]);
        break;
      }
      int j = i + offset[d];
      bottleneck = Math.min(bottleneck, res.get(j * directions + (d ^ 1)));
      i = j;
    }
    for (int i = head; ; ) {
      byte d = parent[i];
      if (d == TERMINAL_PARENT) {
        bottleneck = Math.min(bottleneck, -terminal[i]);
        break;
      }
      bottleneck = Math.min(bottleneck, res.get(i * directions + d));
      i += offset[d];
    }
    res.set(first, res.get(first) - bottleneck);
    int back = head * directions + (pathDirection ^ 1);
    res.set(back, res.get(back) + bottleneck);
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
      int up = i * directions + d;
      int down = j * directions + (d ^ 1);
      res.set(up, res.get(up) + bottleneck);
      int left = res.get(down) - bottleneck;
      res.set(down, left);
      if (left == 0) {
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
      int up = j * directions + (d ^ 1);
      int down = i * directions + d;
      res.set(up, res.get(up) + bottleneck);
      int left = res.get(down) - bottleneck;
      res.set(down, left);
      if (left == 0) {
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

  void adoptOrphans() {
    while (!orphans.isEmpty()) {
      int p = orphans.poll();
      if (parent[p] != ORPHAN) {
        continue; // re-rooted by a capacity change after it was queued
      }
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
      if (tree[q] == SOURCE_TREE && residual.get(q * directions + (k ^ 1)) > 0) {
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
        if (residual.get(q * directions + (k ^ 1)) > 0) {
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
      if (tree[q] == SINK_TREE && residual.get(base + k) > 0) {
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
        if (residual.get(base + k) > 0) {
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
    (sinkActive != null && tree[p] == SINK_TREE ? sinkActive : active).add(p);
  }

  /**
   * Removes and returns the next active node still in a tree, or -1 if none is left; when the trees
   * take turns ({@link #chooseOrder}), -1 as soon as no node of S is active. Entries whose node has
   * since left that tree are skipped (a node that joins a tree is queued for it then).
   */
  private int nextActiveNode() {
    if (sinkActive == null) {
      for (int p = active.poll(); p >= 0; p = active.poll()) {
        if (tree[p] != FREE) {
          return p;
        }
      }
      return -1;
    }
    sinkTurn = !sinkTurn;
    if (sinkTurn) {
      for (int p = sinkActive.poll(); p >= 0; p = sinkActive.poll()) {
        if (tree[p] == SINK_TREE) {
          return p;
        }
      }
    }
    for (int p = active.poll(); p >= 0; p = active.poll()) {
      if (tree[p] == SOURCE_TREE) {
        return p;
      }
    }
    return -1;
  }

  /** Bytes held by the arrays of the residual network and the search state. */
  long stateBytes() {
    long n = terminal.length;
    return residual.bytes()
        + n * (4 + 1 + 1 + 4 + 4 + 4)
        + (sinkActive != null ? sinkActive.bytes() : 0)
        + 4L * orphans.capacity();
  }

  /** Source side of the cut: the nodes of S, in public numbering. */
  BitSet sourceSide() {
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
}
