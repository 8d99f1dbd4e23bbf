package io.github.cleave.flow;

import java.util.Arrays;

/** A growable first-in first-out queue of {@code int}s on a ring buffer. Not thread-safe. */
final class IntFifo {
  private int[] items;
  private int head; // index of the oldest item
  private int size; // number of items, 0 <= size <= items.length

  IntFifo(int initialCapacity) {
    items = new int[Math.max(16, initialCapacity)];
  }

  int capacity() {
    return items.length;
  }

  int size() {
    return size;
  }

  boolean isEmpty() {
    return size == 0;
  }

  void add(int value) {
    if (size == items.length) {
      grow();
    }
    int tail = head + size;
    if (tail >= items.length) {
      tail -= items.length;
    }
    items[tail] = value;
    size++;
  }

  int poll() {
    int value = items[head];
    head++;
    if (head == items.length) {
      head = 0;
    }
    size--;
    return value;
  }

  void clear() {
    head = 0;
    size = 0;
  }

  private void grow() {
    int[] bigger = Arrays.copyOf(items, items.length * 2);
    // The items that wrapped around to the front now follow the others.
    System.arraycopy(items, 0, bigger, items.length, head);
    items = bigger;
  }
}
