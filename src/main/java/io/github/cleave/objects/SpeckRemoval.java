package io.github.cleave.objects;

/**
 * Removes small connected pieces from a mask: the components (8-connected in a plane, 26 in a
 * stack, as {@link ConnectedComponents}) with fewer than a given number of voxels, except those
 * holding a marked voxel. Works on runs of foreground ({@link ForegroundRuns}): one scan of the
 * mask, sizes summed per run, the seeds looked at only under the runs, the output written run by
 * run. O(N). Stateless and thread-safe.
 */
public final class SpeckRemoval {
  private SpeckRemoval() {}

  /**
   * A new mask, 255 on the components of {@code mask} (nonzero = foreground) with at least {@code
   * minVoxels} voxels or with a voxel where {@code marks} equals {@code 1} (a foreground seed), 0
   * elsewhere.
   *
   * @throws IllegalArgumentException if an array does not match the dimensions
   */
  public static byte[] withoutSpecks(
      byte[] mask, int w, int h, int d, int minVoxels, byte[] marks) {
    Grids.check(mask.length, w, h, d, "mask");
    Grids.check(marks.length, w, h, d, "seed labels");
    ForegroundRuns runs = ForegroundRuns.of(mask, null, w, h, d);
    long[] sizes = runs.sizes();
    for (int i = 0; i < runs.count; i++) {
      int base = runs.row[i] * w;
      for (int p = base + runs.start[i], e = base + runs.end[i]; p <= e; p++) {
        if (marks[p] == 1) {
          sizes[runs.component[i]] = Long.MAX_VALUE; // a piece the user marked is never a speck
          break;
        }
      }
    }
    byte[] out = new byte[mask.length];
    for (int i = 0; i < runs.count; i++) {
      if (sizes[runs.component[i]] >= minVoxels) {
        int base = runs.row[i] * w;
        java.util.Arrays.fill(out, base + runs.start[i], base + runs.end[i] + 1, (byte) 255);
      }
    }
    return out;
  }
}
