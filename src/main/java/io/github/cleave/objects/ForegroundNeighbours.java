package io.github.cleave.objects;

/**
 * The foreground voxels of a mask, numbered 0..F−1 in row-major order ("slots", see {@link
 * ForegroundRuns#slotStarts()}), and their foreground neighbours: 26 in a stack, 8 in a plane,
 * listed in the order of {@link Grids#neighbours(int)} with the background left out. A flood over
 * the foreground that works on slots thus visits voxels in the same order as one on the whole grid
 * that skips background neighbours, while its state needs one entry per foreground voxel only.
 *
 * <p>Two layouts, same answers: when the foreground is sparse ({@code K·F ≤ 2·N} for K neighbours
 * and N voxels) a table of K slots per foreground voxel (−1 for background or outside the image),
 * built from the runs by pairing each run with the runs of its K/3 neighbouring rows, so that a
 * lookup reads K consecutive ints; otherwise a voxel → slot map of N ints from which a row of K
 * entries is filled per lookup. Building either is O(N / 8 + K·F) after the runs. Not thread-safe
 * (one scratch row); one instance per operation.
 */
final class ForegroundNeighbours {
  final ForegroundRuns runs;
  final int[] slots; // slots[r]: the first slot of run r; slots[runs.count] = size
  final int size; // F, the number of foreground voxels
  final int k; // neighbours per voxel in the full neighbourhood: 26 (stack) or 8 (plane)
  final int[] entries; // the table, or a scratch row of k entries (map layout); see at()
  private final int[] table; // table[k·s + e]: slot of the e-th neighbour of s, −1 if none; or null
  private final int[] slotOf; // map layout: slotOf[voxel] = slot + 1, 0 for background; or null
  private final int[] voxel; // map layout: voxel index of each slot; or null

  private ForegroundNeighbours(ForegroundRuns runs, int[] slots, boolean asTable) {
    this.runs = runs;
    this.slots = slots;
    this.size = slots[runs.count];
    this.k = runs.d > 1 ? 26 : 8;
    if (asTable) {
      table = table(runs, slots, size, k);
      slotOf = null;
      voxel = null;
      entries = table;
    } else {
      slotOf = new int[runs.w * runs.h * runs.d];
      voxel = new int[size];
      for (int r = 0, s = 0; r < runs.count; r++) {
        int base = runs.row[r] * runs.w;
        for (int x = runs.start[r]; x <= runs.end[r]; x++, s++) {
          slotOf[base + x] = s + 1;
          voxel[s] = base + x;
        }
      }
      entries = new int[k];
      table = null;
    }
  }

  /** The neighbours of the foreground of {@code runs}, in the layout that suits its density. */
  static ForegroundNeighbours of(ForegroundRuns runs) {
    long n = (long) runs.w * runs.h * runs.d;
    int[] slots = runs.slotStarts();
    long f = slots[runs.count];
    return new ForegroundNeighbours(runs, slots, (runs.d > 1 ? 26 : 8) * f <= 2 * n);
  }

  /** As {@link #of(ForegroundRuns)} with the layout chosen by the caller (both give one answer). */
  static ForegroundNeighbours of(ForegroundRuns runs, boolean asTable) {
    return new ForegroundNeighbours(runs, runs.slotStarts(), asTable);
  }

  /**
   * The neighbours of slot {@code s}: returns {@code e} such that {@link #entries}{@code [e ..
   * e+k)} hold the slots of its K full-neighbourhood neighbours in the order of {@link
   * Grids#neighbours(int)}, −1 for background or outside the image. The table layout returns a
   * place in the table; the map layout fills a scratch row, valid until the next call.
   */
  int at(int s) {
    if (table != null) {
      return k * s;
    }
    int v = voxel[s];
    int w = runs.w;
    int h = runs.h;
    int x = v % w;
    int y = (v / w) % h;
    int z = v / (w * h);
    int e = 0;
    for (int dz = k == 26 ? -1 : 0; dz <= (k == 26 ? 1 : 0); dz++) {
      for (int dy = -1; dy <= 1; dy++) {
        for (int dx = -1; dx <= 1; dx++) {
          if (dx == 0 && dy == 0 && dz == 0) {
            continue;
          }
          int xx = x + dx;
          int yy = y + dy;
          int zz = z + dz;
          boolean inside = xx >= 0 && xx < w && yy >= 0 && yy < h && zz >= 0 && zz < runs.d;
          entries[e++] = inside ? slotOf[v + dx + w * (dy + h * dz)] - 1 : -1;
        }
      }
    }
    return 0;
  }

  /** Writes {@code values[s]} at the voxel of every slot {@code s} of {@code into}. */
  void scatter(int[] values, int[] into) {
    int w = runs.w;
    for (int r = 0, s = 0; r < runs.count; r++) {
      int base = runs.row[r] * w;
      for (int x = runs.start[r]; x <= runs.end[r]; x++) {
        into[base + x] = values[s++];
      }
    }
  }

  /**
   * The table layout: for each run and each neighbouring row (z, then y ascending, as in {@link
   * Grids}), the entries are set to −1 and each run of that row writes its slots into the entries
   * of the run's voxels next to it.
   */
  private static int[] table(ForegroundRuns runs, int[] slots, int size, int k) {
    int w = runs.w;
    int h = runs.h;
    int d = runs.d;
    int[] table = new int[k * size];
    int dz0 = d > 1 ? -1 : 0;
    int dz1 = d > 1 ? 1 : 0;
    for (int r = 0; r < runs.count; r++) {
      int row = runs.row[r];
      int y = row % h;
      int z = row / h;
      int s0 = runs.start[r];
      int s1 = runs.end[r];
      int slot0 = slots[r];
      int col = 0; // index of the (dz, dy, −1) entry in the table row of a slot
      for (int dz = dz0; dz <= dz1; dz++) {
        for (int dy = -1; dy <= 1; dy++) {
          boolean centre = dz == 0 && dy == 0; // the voxel itself is not its neighbour
          int y2 = y + dy;
          int z2 = z + dz;
          boolean inside = y2 >= 0 && y2 < h && z2 >= 0 && z2 < d;
          for (int x = s0, e = k * slot0 + col; x <= s1; x++, e += k) {
            table[e] = -1;
            table[e + 1] = -1;
            if (!centre) {
              table[e + 2] = -1;
            }
          }
          if (!inside) {
            col += centre ? 2 : 3;
            continue;
          }
          int other = y2 + h * z2;
          for (int j = runs.first[other]; j < runs.first[other + 1]; j++) {
            int lo = Math.max(runs.start[j], s0 - 1); // the run's voxels next to this run
            int hi = Math.min(runs.end[j], s1 + 1);
            for (int xx = lo; xx <= hi; xx++) {
              int q = slots[j] + xx - runs.start[j];
              for (int dx = -1; dx <= 1; dx++) { // xx is the (dx)-neighbour of x = xx − dx
                int x = xx - dx;
                if (x < s0 || x > s1 || (centre && dx == 0)) {
                  continue;
                }
                int entry = centre && dx == 1 ? 1 : dx + 1; // the centre row has no dx = 0 entry
                table[k * (slot0 + x - s0) + col + entry] = q;
              }
            }
          }
          col += centre ? 2 : 3;
        }
      }
    }
    return table;
  }
}
