package io.github.cleave.objects;

import java.util.Arrays;

/**
 * A label image: one object number per voxel of a {@code width × height × depth} grid, stored
 * row-major ({@code index = x + width·(y + height·z)}), 0 for background and {@code 1..count()} for
 * objects.
 *
 * <p>Invariant: objects are numbered consecutively in the order of their first voxel in row-major
 * order, so the numbering depends only on the partition, never on how it was computed. This number
 * is the one used in the label image, the measurements table and the ROI zip (DESIGN.md). Every
 * operation of this package that returns labels restores the invariant (renumbers).
 *
 * <p>Immutable: the array is copied on the way in and on the way out. Thread-safe.
 */
public final class ObjectLabels {
  private final int width;
  private final int height;
  private final int depth;
  private final int[] labels; // labels[x + width * (y + height * z)], 0..count, first-voxel order
  private final int count;

  private ObjectLabels(int width, int height, int depth, int[] labels, int count) {
    this.width = width;
    this.height = height;
    this.depth = depth;
    this.labels = labels;
    this.count = count;
  }

  /**
   * The labels of {@code labels} (any non-negative numbers; equal numbers are one object, 0 is
   * background), renumbered 1..n in first-voxel order. The array is copied.
   *
   * @throws IllegalArgumentException if the array length is not {@code width·height·depth} or a
   *     label is negative
   */
  public static ObjectLabels renumbered(int width, int height, int depth, int[] labels) {
    Grids.check(labels.length, width, height, depth, "label image");
    return adopt(width, height, depth, labels.clone());
  }

  /** Like {@link #renumbered} but takes ownership of {@code labels} and renumbers it in place. */
  static ObjectLabels adopt(int width, int height, int depth, int[] labels) {
    int max = 0;
    for (int i = 0; i < labels.length; i++) {
      if (labels[i] < 0) {
        throw new IllegalArgumentException(
            "label " + labels[i] + " at index " + i + ": labels must be 0 or positive");
      }
      max = Math.max(max, labels[i]);
    }
    int[] map = new int[max + 1]; // old number -> new number, 0 = not yet seen
    int next = 0;
    for (int i = 0; i < labels.length; i++) {
      int old = labels[i];
      if (old != 0) {
        if (map[old] == 0) {
          map[old] = ++next;
        }
        labels[i] = map[old];
      }
    }
    return new ObjectLabels(width, height, depth, labels, next);
  }

  /**
   * Takes ownership of {@code labels}, which must already hold 0..count in first-voxel order (not
   * checked except under {@code assert}).
   */
  static ObjectLabels ordered(int width, int height, int depth, int[] labels, int count) {
    assert Arrays.equals(adopt(width, height, depth, labels.clone()).labels, labels);
    return new ObjectLabels(width, height, depth, labels, count);
  }

  /** No objects. */
  public static ObjectLabels empty(int width, int height, int depth) {
    long n = (long) width * height * depth;
    Grids.check(n > Integer.MAX_VALUE ? -1 : (int) n, width, height, depth, "label image");
    return new ObjectLabels(width, height, depth, new int[width * height * depth], 0);
  }

  public int width() {
    return width;
  }

  public int height() {
    return height;
  }

  /** Number of planes; 1 for a single plane. */
  public int depth() {
    return depth;
  }

  /** True for a stack of more than one plane: sizes are volumes, boundaries are surfaces. */
  public boolean isStack() {
    return depth > 1;
  }

  /** Voxel count {@code width·height·depth}. */
  public int size() {
    return labels.length;
  }

  /** Number of objects n; labels run 1..n. */
  public int count() {
    return count;
  }

  /** The object number at voxel index {@code i} (0 = background). */
  public int labelAt(int i) {
    return labels[i];
  }

  /** The object number at (x, y, z). */
  public int label(int x, int y, int z) {
    return labels[x + width * (y + height * z)];
  }

  /** A copy of the label array. */
  public int[] labels() {
    return labels.clone();
  }

  /** The shared array, for this package's read-only use. */
  int[] raw() {
    return labels;
  }

  /** Voxels per object, indexed by object number (index 0: background). */
  public long[] voxelCounts() {
    long[] c = new long[count + 1];
    for (int l : labels) {
      c[l]++;
    }
    return c;
  }

  /** The binary mask of all objects: 255 foreground, 0 background (ImageJ's convention). */
  public byte[] toMask() {
    byte[] m = new byte[labels.length];
    for (int i = 0; i < m.length; i++) {
      if (labels[i] != 0) {
        m[i] = (byte) 255;
      }
    }
    return m;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof ObjectLabels other
        && width == other.width
        && height == other.height
        && depth == other.depth
        && Arrays.equals(labels, other.labels);
  }

  @Override
  public int hashCode() {
    return 31 * (31 * (31 * width + height) + depth) + Arrays.hashCode(labels);
  }

  @Override
  public String toString() {
    return count + " object(s) in " + width + " x " + height + " x " + depth;
  }
}
