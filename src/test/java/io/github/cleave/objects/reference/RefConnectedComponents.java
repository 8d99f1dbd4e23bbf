package io.github.cleave.objects.reference;

/**
 * Connected components of a binary mask: foreground voxels (nonzero) that touch along a face, an
 * edge or a corner are one object, i.e. 8-connectivity in a single plane and 26-connectivity in a
 * stack. (Background is then 4-, resp. 6-connected, the complementary pair that makes a closed
 * boundary separate inside from outside; see {@link RefHoleFilling}.)
 *
 * <p>Method: one row-major scan; each unlabelled foreground voxel starts a breadth-first flood with
 * an explicit queue (no recursion, so no stack overflow on large objects). Objects are thus
 * numbered in the order of their first voxel, which is the label-image invariant. Time O(N) for N
 * voxels (every voxel enters the queue at most once, 26 neighbour checks each), memory one {@code
 * int} label and at most one queue entry per voxel. Stateless and thread-safe.
 */
final class RefConnectedComponents {
  private RefConnectedComponents() {}

  /**
   * Labels the foreground components of {@code mask} that are not yet labelled in {@code into}
   * (null: a new array), numbering them from {@code first + 1} in first-voxel order. Returns the
   * label array.
   */
  static int[] label(byte[] mask, int w, int h, int d, int[] into, int first) {
    int n = mask.length;
    int[] labels = into != null ? into : new int[n];
    int[] queue = new int[n];
    RefGrids grid = new RefGrids(w, h, d, true);
    int[] nb = grid.buffer;
    int next = first;
    for (int start = 0; start < n; start++) {
      if (mask[start] == 0 || labels[start] != 0) {
        continue;
      }
      int label = ++next;
      labels[start] = label;
      int head = 0;
      int tail = 0;
      queue[tail++] = start;
      while (head < tail) {
        int p = queue[head++];
        int m = grid.neighbours(p);
        for (int j = 0; j < m; j++) {
          int q = nb[j];
          if (mask[q] != 0 && labels[q] == 0) {
            labels[q] = label;
            queue[tail++] = q;
          }
        }
      }
    }
    return labels;
  }
}
