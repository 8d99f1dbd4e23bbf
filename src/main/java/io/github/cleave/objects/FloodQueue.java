package io.github.cleave.objects;

import java.util.Arrays;

/**
 * A binary max-heap of voxel indices keyed by a {@code float} priority, ties broken by insertion
 * order (first in, first out), so that floods are deterministic. Each entry is one {@code long}:
 * the priority's bits, turned so that signed order follows float order ({@code −0} counted as
 * {@code +0}, NaN not allowed), above the complement of the insertion number; larger keys come
 * first, and no two keys are equal. The voxel is looked up by insertion number, so a queue takes at
 * most {@link #MAX_PUSHES} pushes in all; push and pop O(log size), grows by doubling.
 */
final class FloodQueue {
  static final int MAX_PUSHES = Integer.MAX_VALUE - 8; // the largest array Java allocates
  private static final long LOW = 0xFFFF_FFFFL;
  private long[] heap; // heap[0..size): keys, heap order (a parent's key exceeds its children's)
  private int[] voxel; // voxel[i]: the voxel of the i-th push
  private int size;
  private long pushed; // insertion numbers used so far

  FloodQueue() {
    this(64);
  }

  /** A queue with room for {@code capacity} pushes before it grows. */
  FloodQueue(int capacity) {
    int c = Math.max(1, capacity);
    heap = new long[c];
    voxel = new int[c];
  }

  boolean isEmpty() {
    return size == 0;
  }

  void push(int v, float p) {
    if (pushed == voxel.length) {
      if (pushed == MAX_PUSHES) {
        throw new IllegalStateException("flood queue: more than " + MAX_PUSHES + " pushes");
      }
      voxel = Arrays.copyOf(voxel, (int) Math.min(MAX_PUSHES, 2L * pushed));
    }
    if (size == heap.length) {
      heap = Arrays.copyOf(heap, (int) Math.min(MAX_PUSHES, 2L * size));
    }
    voxel[(int) pushed] = v;
    long key = ((long) sortable(p) << 32) | (LOW - pushed++);
    int i = size++;
    while (i > 0) {
      int parent = (i - 1) >>> 1;
      if (heap[parent] >= key) {
        break;
      }
      heap[i] = heap[parent];
      i = parent;
    }
    heap[i] = key;
  }

  /** Priority of the top element ({@code +0} for a pushed {@code −0}). */
  float topPriority() {
    return Float.intBitsToFloat(flip((int) (heap[0] >> 32)));
  }

  /** Removes and returns the voxel with the highest priority (earliest pushed among equals). */
  int pop() {
    long top = heap[0];
    size--;
    if (size > 0) {
      long key = heap[size];
      int i = 0;
      while (true) {
        int c = 2 * i + 1;
        if (c >= size) {
          break;
        }
        if (c + 1 < size && heap[c + 1] > heap[c]) {
          c++;
        }
        if (heap[c] <= key) {
          break;
        }
        heap[i] = heap[c];
        i = c;
      }
      heap[i] = key;
    }
    return voxel[(int) (LOW - (top & LOW))];
  }

  /**
   * Float bits as an int whose signed order is the float order: non-negative floats keep their
   * bits, negative ones have all but the sign bit flipped; the map is its own inverse.
   */
  private static int sortable(float p) {
    assert !Float.isNaN(p);
    return flip(Float.floatToRawIntBits(p + 0.0f)); // −0 + 0 = +0
  }

  private static int flip(int bits) {
    return bits >= 0 ? bits : bits ^ 0x7FFF_FFFF;
  }
}
