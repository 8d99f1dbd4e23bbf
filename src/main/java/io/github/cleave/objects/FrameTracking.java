package io.github.cleave.objects;

import java.util.Locale;

/**
 * Gives the objects of one frame of a time-lapse the numbers of the objects of the frame before
 * them that they overlap most, so that one cell keeps one number over time.
 *
 * <p>The rule (ours; common practice, no source), for the objects c of frame t and the numbered
 * objects p of frame t−1, with {@code overlap(c, p)} the number of voxels labelled c in frame t and
 * p in frame t−1:
 *
 * <ol>
 *   <li>Each object c names its <em>choice</em>: the previous object p with the largest {@code
 *       overlap(c, p) > 0}, ties to the lower number p. An object that overlaps no previous object
 *       has no choice.
 *   <li>A previous object p chosen by several objects goes to the one with the largest overlap with
 *       it, ties to the object with the lower input number c; that object takes the number p.
 *   <li>Every other object (no choice, or outbid) gets a new number: {@code firstNewNumber}, {@code
 *       firstNewNumber + 1}, ... in the order of their input numbers c. A losing object does not
 *       fall back on its second choice.
 * </ol>
 *
 * Consequences: no two objects of a frame share a number; a previous object that nothing overlaps
 * ends its track (its number is not used again when {@code firstNewNumber} is above every number
 * used so far, as the caller must ensure); when a cell divides, the larger overlapping part keeps
 * the number and the other part gets a new one; when two cells merge, the merged object takes the
 * number of the one it overlaps most. The output numbers are positive but need not be consecutive
 * within a frame (tracks that ended leave gaps); 0 stays background.
 *
 * <p>O(N + largest label of either frame) time: one pass over the voxels counting overlaps in a
 * small open-addressing table keyed by (c, p), then work per overlapping pair. Stateless and
 * thread-safe.
 */
public final class FrameTracking {
  private FrameTracking() {}

  /**
   * The tracked number of each object of a frame, as found by {@link FrameTracking}.
   *
   * @param numberOf {@code numberOf[c]} is the tracked number of input object c, 0 for input
   *     numbers that do not occur (and for c = 0); shared, do not modify
   * @param nextNumber a number above every number handed out so far: the {@code firstNewNumber} for
   *     the next frame
   */
  public record Renumbering(int[] numberOf, int nextNumber) {

    /** {@code labels} with every input number c replaced by {@code numberOf[c]} (a new array). */
    public int[] relabel(int[] labels) {
      int[] out = new int[labels.length];
      for (int i = 0; i < labels.length; i++) {
        int c = labels[i];
        if (c < 0 || c >= numberOf.length || (c != 0 && numberOf[c] == 0)) {
          throw new IllegalArgumentException(
              "label " + c + " at index " + i + " is not an object of the tracked frame");
        }
        out[i] = numberOf[c];
      }
      return out;
    }
  }

  /**
   * The current frame's labels renumbered by the rule above.
   *
   * @param previous the tracked label image of the frame before (0 background, any positive
   *     numbers)
   * @param current the label image of this frame (0 background, any positive numbers)
   * @param firstNewNumber the first number for objects that continue no track; must be above every
   *     number of {@code previous} (and should be above every number used in earlier frames)
   * @throws IllegalArgumentException if the lengths differ, a label is negative, or {@code
   *     firstNewNumber} is not above every previous number
   */
  public static int[] track(int[] previous, int[] current, int firstNewNumber) {
    return match(previous, current, firstNewNumber).relabel(current);
  }

  /** The numbers for the objects of {@code current}, as {@link #track}. */
  public static Renumbering match(int[] previous, ObjectLabels current, int firstNewNumber) {
    return match(previous, current.raw(), firstNewNumber);
  }

  /**
   * The numbers for the objects of {@code current}, by the rule above; see {@link #track} for the
   * arguments.
   */
  public static Renumbering match(int[] previous, int[] current, int firstNewNumber) {
    if (previous.length != current.length) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "tracking: the previous frame has %d voxels and this one %d; frames must have the"
                  + " same size",
              previous.length,
              current.length));
    }
    int maxPrevious = maxLabel(previous, "previous frame");
    int maxCurrent = maxLabel(current, "current frame");
    if (firstNewNumber <= maxPrevious || firstNewNumber < 1) {
      throw new IllegalArgumentException(
          "tracking: first new number "
              + firstNewNumber
              + " must be above every number of the previous frame (largest "
              + maxPrevious
              + ") and at least 1");
    }
    boolean[] present = new boolean[maxCurrent + 1];
    PairCounts pairs = new PairCounts();
    int lastC = 0;
    int lastP = 0;
    int run = 0;
    for (int i = 0; i < current.length; i++) {
      int c = current[i];
      present[c] = true;
      int p = previous[i];
      if (c == 0 || p == 0) {
        continue;
      }
      if (c == lastC && p == lastP) {
        run++;
      } else {
        if (run > 0) {
          pairs.add(lastC, lastP, run);
        }
        lastC = c;
        lastP = p;
        run = 1;
      }
    }
    if (run > 0) {
      pairs.add(lastC, lastP, run);
    }
    // 1. each object's choice: largest overlap, ties to the lower previous number
    int[] choice = new int[maxCurrent + 1];
    long[] choiceOverlap = new long[maxCurrent + 1];
    for (int e = 0; e < pairs.slots(); e++) {
      if (!pairs.used(e)) {
        continue;
      }
      int c = pairs.c(e);
      int p = pairs.p(e);
      long n = pairs.count(e);
      if (n > choiceOverlap[c] || (n == choiceOverlap[c] && p < choice[c])) {
        choice[c] = p;
        choiceOverlap[c] = n;
      }
    }
    // 2. each chosen previous object goes to its largest claim, ties to the lower input number
    int[] winner = new int[maxPrevious + 1];
    for (int c = 1; c <= maxCurrent; c++) { // ascending c: a tie keeps the earlier (lower) c
      int p = choice[c];
      if (p != 0 && (winner[p] == 0 || choiceOverlap[c] > choiceOverlap[winner[p]])) {
        winner[p] = c;
      }
    }
    // 3. numbers: the won previous number, or new numbers in input order
    int[] numberOf = new int[maxCurrent + 1];
    int next = firstNewNumber;
    for (int c = 1; c <= maxCurrent; c++) {
      if (!present[c]) {
        continue;
      }
      int p = choice[c];
      if (p != 0 && winner[p] == c) {
        numberOf[c] = p;
      } else {
        if (next == Integer.MAX_VALUE) {
          throw new IllegalArgumentException("tracking: object numbers exhausted");
        }
        numberOf[c] = next++;
      }
    }
    return new Renumbering(numberOf, next);
  }

  private static int maxLabel(int[] labels, String what) {
    int max = 0;
    for (int i = 0; i < labels.length; i++) {
      if (labels[i] < 0) {
        throw new IllegalArgumentException(
            what + ": label " + labels[i] + " at index " + i + ": labels must be 0 or positive");
      }
      max = Math.max(max, labels[i]);
    }
    return max;
  }

  /** Voxel counts per (c, p) pair: open addressing with linear probing, doubling at half load. */
  private static final class PairCounts {
    private long[] keys = new long[64]; // (c << 32) | p, 0 = empty (c and p are positive)
    private long[] counts = new long[64];
    private int size;

    void add(int c, int p, int n) {
      if (2 * (size + 1) > keys.length) {
        long[] oldKeys = keys;
        long[] oldCounts = counts;
        keys = new long[2 * oldKeys.length];
        counts = new long[2 * oldKeys.length];
        for (int e = 0; e < oldKeys.length; e++) {
          if (oldKeys[e] != 0) {
            counts[slot(oldKeys[e])] = oldCounts[e];
          }
        }
      }
      int e = slot(((long) c << 32) | p);
      if (counts[e] == 0) {
        size++;
      }
      counts[e] += n;
    }

    /** The slot of {@code key}, claimed for it if it was absent. */
    private int slot(long key) {
      int mask = keys.length - 1;
      int e = Long.hashCode(key * 0x9E3779B97F4A7C15L) & mask;
      while (keys[e] != 0 && keys[e] != key) {
        e = (e + 1) & mask;
      }
      keys[e] = key;
      return e;
    }

    int slots() {
      return keys.length;
    }

    boolean used(int e) {
      return keys[e] != 0;
    }

    int c(int e) {
      return (int) (keys[e] >>> 32);
    }

    int p(int e) {
      return (int) keys[e];
    }

    long count(int e) {
      return counts[e];
    }
  }
}
