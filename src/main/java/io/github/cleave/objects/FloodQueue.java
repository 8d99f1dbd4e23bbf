package io.github.cleave.objects;

import java.util.Arrays;

/**
 * A binary max-heap of voxel indices keyed by a {@code float} priority, ties broken by insertion
 * order (first in, first out), so that floods are deterministic. Primitive arrays, grows by
 * doubling; push and pop O(log size).
 */
final class FloodQueue {
  private float[] priority;
  private long[] order; // insertion number, for FIFO among equal priorities
  private int[] node;
  private int size;
  private long pushed;

  FloodQueue() {
    this(64);
  }

  /** A queue with room for {@code capacity} entries before it grows. */
  FloodQueue(int capacity) {
    int c = Math.max(1, capacity);
    priority = new float[c];
    order = new long[c];
    node = new int[c];
  }

  /**
   * A queue holding {@code voxels[i]} with priority {@code priorities[i]} for {@code i < count}, as
   * if pushed in that order (insertion numbers 0..count−1), with room for {@code capacity} entries.
   * Built bottom-up in O(count) (R. W. Floyd, "Algorithm 245: Treesort 3", Comm. ACM 7(12):701,
   * 1964) instead of O(count·log count) for the pushes.
   *
   * <p>Pops and later pushes behave exactly as after the {@code count} pushes: the keys (priority,
   * insertion number) are pairwise distinct, because insertion numbers are, and {@code before} is a
   * strict total order on them (no priority is NaN); so each pop removes the unique greatest key
   * present, which depends on the keys pushed and popped so far and not on the layout of the heap
   * array. Later pushes continue the insertion numbers at {@code count}.
   */
  static FloodQueue heapOf(int[] voxels, float[] priorities, int count, int capacity) {
    FloodQueue q = new FloodQueue(Math.max(count, capacity));
    System.arraycopy(voxels, 0, q.node, 0, count);
    System.arraycopy(priorities, 0, q.priority, 0, count);
    for (int i = 0; i < count; i++) {
      assert !Float.isNaN(priorities[i]);
      q.order[i] = i;
    }
    q.size = count;
    q.pushed = count;
    for (int i = count / 2 - 1; i >= 0; i--) {
      q.siftDown(i, q.priority[i], q.order[i], q.node[i]);
    }
    return q;
  }

  boolean isEmpty() {
    return size == 0;
  }

  void push(int voxel, float p) {
    if (size == node.length) {
      int cap = size * 2;
      priority = Arrays.copyOf(priority, cap);
      order = Arrays.copyOf(order, cap);
      node = Arrays.copyOf(node, cap);
    }
    int i = size++;
    long o = pushed++;
    while (i > 0) {
      int parent = (i - 1) >>> 1;
      if (!before(p, o, priority[parent], order[parent])) {
        break;
      }
      set(i, priority[parent], order[parent], node[parent]);
      i = parent;
    }
    set(i, p, o, voxel);
  }

  /** Priority of the top element. */
  float topPriority() {
    return priority[0];
  }

  /** Removes and returns the voxel with the highest priority (earliest pushed among equals). */
  int pop() {
    int top = node[0];
    size--;
    if (size > 0) {
      siftDown(0, priority[size], order[size], node[size]);
    }
    return top;
  }

  /** Places the entry (p, o, v) at slot {@code i} or below, moving greater children up. */
  private void siftDown(int i, float p, long o, int v) {
    while (true) {
      int c = 2 * i + 1;
      if (c >= size) {
        break;
      }
      if (c + 1 < size && before(priority[c + 1], order[c + 1], priority[c], order[c])) {
        c++;
      }
      if (!before(priority[c], order[c], p, o)) {
        break;
      }
      set(i, priority[c], order[c], node[c]);
      i = c;
    }
    set(i, p, o, v);
  }

  private static boolean before(float pa, long oa, float pb, long ob) {
    return pa > pb || (pa == pb && oa < ob);
  }

  private void set(int i, float p, long o, int v) {
    priority[i] = p;
    order[i] = o;
    node[i] = v;
  }
}
