package io.github.cleave.objects;

/**
 * Connected components of a binary mask: foreground voxels (nonzero) that touch along a face, an
 * edge or a corner are one object, i.e. 8-connectivity in a single plane and 26-connectivity in a
 * stack. (Background is then 4-, resp. 6-connected, the complementary pair that makes a closed
 * boundary separate inside from outside; see {@link HoleFilling}.)
 *
 * <p>Method: runs of foreground along x joined by union–find ({@link ForegroundRuns}); objects are
 * numbered in the order of their first voxel, which is the {@link ObjectLabels} invariant. Time
 * O(N) for N voxels (one sequential scan) plus near-linear work in the number of runs; memory a few
 * ints per run besides the label image. Stateless and thread-safe.
 */
public final class ConnectedComponents {
  private ConnectedComponents() {}

  /**
   * The objects of {@code mask} ({@code w·h·d} values, row-major, nonzero = foreground).
   *
   * @throws IllegalArgumentException if the length does not match the dimensions
   */
  public static ObjectLabels of(byte[] mask, int w, int h, int d) {
    Grids.check(mask.length, w, h, d, "mask");
    return ObjectLabels.adopt(w, h, d, label(mask, w, h, d, null, 0));
  }

  /**
   * Labels the foreground components of {@code mask} that are not yet labelled in {@code into}
   * (null: a new array), numbering them from {@code first + 1} in first-voxel order. Returns the
   * label array.
   */
  static int[] label(byte[] mask, int w, int h, int d, int[] into, int first) {
    int[] labels = into != null ? into : new int[mask.length];
    ForegroundRuns.of(mask, into, w, h, d).write(labels, first);
    return labels;
  }
}
