package io.github.cleave.flow;

import java.util.Arrays;

/**
 * The active nodes of a Boykov–Kolmogorov search: a first-in first-out queue of node indices in
 * which each node stands at most once, linked through one {@code int} per node (no allocation per
 * operation). Not thread-safe.
 */
final class ActiveQueue {
  private static final int NOT_QUEUED = 0; // what Java puts in a new array: no fill needed

  // NOT_QUEUED, or 1 + the next queued node, or 1 + the node itself if it is last
  private final int[] next;
  private int first = -1;
  private int last = -1;

  ActiveQueue(int nodes) {
    next = new int[nodes];
  }

  /** Empties the queue. */
  void clear() {
    Arrays.fill(next, NOT_QUEUED);
    first = -1;
    last = -1;
  }

  /** Appends {@code p} unless it is queued already. */
  void add(int p) {
    if (next[p] == NOT_QUEUED) {
      if (last < 0) {
        first = p;
      } else {
        next[last] = p + 1;
      }
      next[p] = p + 1;
      last = p;
    }
  }

  /** Removes and returns the oldest node, or -1 if the queue is empty. */
  int poll() {
    int p = first;
    if (p >= 0) {
      int after = next[p] - 1;
      next[p] = NOT_QUEUED;
      if (after == p) {
        first = -1;
        last = -1;
      } else {
        first = after;
      }
    }
    return p;
  }

  long bytes() {
    return 4L * next.length;
  }
}
