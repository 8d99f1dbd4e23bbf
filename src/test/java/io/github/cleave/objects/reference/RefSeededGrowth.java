package io.github.cleave.objects.reference;

/**
 * Grows seed labels over a mask: every foreground voxel gets the label of the nearest seeded voxel
 * of its own mask component, nearest by breadth-first (chessboard) steps inside the mask with the
 * 8- (2D) or 26-neighbourhood (3D); ties go to the seed whose front arrives first in the queue,
 * which starts with all seeds in row-major order, so the result is deterministic. Mask components
 * with no seed become objects of their own. No foreground voxel is left unlabelled.
 *
 * <p>Multi-source breadth-first search: O(N) time and memory.
 */
final class RefSeededGrowth {
  private RefSeededGrowth() {}

  /**
   * Returns labels (in {@code seeds}, which is overwritten) covering the whole mask. {@code
   * seeds[i] > 0} only where {@code mask[i] != 0}.
   */
  static int[] grow(byte[] mask, int w, int h, int d, int[] seeds) {
    int n = mask.length;
    int[] queue = new int[n];
    int tail = 0;
    int max = 0;
    for (int i = 0; i < n; i++) {
      if (seeds[i] != 0) {
        queue[tail++] = i;
        max = Math.max(max, seeds[i]);
      }
    }
    RefGrids grid = new RefGrids(w, h, d, true);
    int[] nb = grid.buffer;
    int head = 0;
    while (head < tail) {
      int p = queue[head++];
      int label = seeds[p];
      int m = grid.neighbours(p);
      for (int j = 0; j < m; j++) {
        int q = nb[j];
        if (mask[q] != 0 && seeds[q] == 0) {
          seeds[q] = label;
          queue[tail++] = q;
        }
      }
    }
    return RefConnectedComponents.label(mask, w, h, d, seeds, max); // components without a seed
  }
}
