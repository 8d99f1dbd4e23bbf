package io.github.cleave.objects;

import java.util.Arrays;
import java.util.BitSet;

/**
 * Grows seed labels over a mask: every foreground voxel gets the label of the nearest seeded voxel
 * of its own mask component, nearest by breadth-first (chessboard) steps inside the mask with the
 * 8- (2D) or 26-neighbourhood (3D); ties go to the seed whose front arrives first in the queue,
 * which starts with all seeds in row-major order, so the result is deterministic. Mask components
 * with no seed become objects of their own. No foreground voxel is left unlabelled.
 *
 * <p>Multi-source breadth-first search from the seeds next to an unseeded voxel: O(N) for one pass
 * over the voxels, then O(U) for U unseeded voxels (the watershed's dividing lines, mostly).
 */
final class SeededGrowth {
  private SeededGrowth() {}

  /**
   * Returns labels (in {@code seeds}, which is overwritten) covering the whole mask. {@code
   * seeds[i] > 0} only where {@code mask[i] != 0}.
   */
  static int[] grow(byte[] mask, int w, int h, int d, int[] seeds) {
    int n = mask.length;
    int max = 0;
    int[] unseeded = new int[64]; // the foreground voxels still to label
    int count = 0;
    for (int i = 0; i < n; i++) {
      max = Math.max(max, seeds[i]);
      if (mask[i] != 0 && seeds[i] == 0) {
        if (count == unseeded.length) {
          unseeded = Arrays.copyOf(unseeded, (int) Math.min(n, 2L * count));
        }
        unseeded[count++] = i;
      }
    }
    Grids grid = new Grids(w, h, d, true);
    int[] nb = grid.buffer;
    // Only the seeds next to an unseeded voxel can grow (voxels never lose a label), so the search
    // starts from those alone, in the same row-major order: the same labels, without a scan of
    // every seeded voxel's neighbours.
    BitSet growing = new BitSet(n);
    for (int i = 0; i < count; i++) {
      int m = grid.neighbours(unseeded[i]);
      for (int j = 0; j < m; j++) {
        if (seeds[nb[j]] != 0) {
          growing.set(nb[j]);
        }
      }
    }
    int[] queue = new int[growing.cardinality() + count];
    int tail = 0;
    for (int p = growing.nextSetBit(0); p >= 0; p = growing.nextSetBit(p + 1)) {
      queue[tail++] = p;
    }
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
    return ConnectedComponents.label(mask, w, h, d, seeds, max); // components without a seed
  }
}
