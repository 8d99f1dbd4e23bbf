package io.github.cleave.objects.reference;

import java.util.Arrays;

/**
 * A binary max-heap of voxel indices keyed by a {@code float} priority, ties broken by insertion
 * order (first in, first out), so that floods are deterministic. Primitive arrays, grows by
 * doubling; push and pop O(log size).
 */
final class RefFloodQueue {
  private float[] priority = new float[64];
  private long[] order = new long[64]; // insertion number, for FIFO among equal priorities
  private int[] node = new int[64];
  private int size;
  private long pushed;

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
      float p = priority[size];
      long o = order[size];
      int v = node[size];
      int i = 0;
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
    return top;
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
