package io.github.cleave.objects.reference;

/**
 * Fills holes: background regions that are not connected to the image border become foreground.
 *
 * <p>In a single plane ({@code d == 1}) background is 4-connected and the border is the outer row
 * and column of pixels; this is the complement of the 8-connected foreground used by {@link
 * RefConnectedComponents}, so a hole is exactly what an 8-connected closed outline encloses. In a
 * stack ({@code d > 1}) background is 6-connected in the volume and the border is all six faces,
 * the first and last plane included: a region open to the top or bottom plane is not a hole (a cell
 * cut by the stack's z range keeps its open side); only cavities closed in 3D are filled. To fill
 * plane by plane instead, call {@link #fill} on each plane with {@code d = 1}.
 *
 * <p>Method: the background is cut into runs (maximal stretches of background along x, one row at a
 * time), and runs are joined with a union–find structure (R. E. Tarjan, "Efficiency of a good but
 * not linear set union algorithm", J. ACM 22(2), 1975, doi:10.1145/321879.321884) wherever a run
 * overlaps a run of the row above (same plane) or of the same row in the plane before (stacks):
 * axial adjacency, i.e. 4- or 6-connectivity. A set holding a run on the border is outside; every
 * other set is a hole. One sequential pass over the voxels plus near-linear work in the number of
 * runs, which is much smaller than the number of voxels; memory: a few ints per run. Stateless and
 * thread-safe.
 */
final class RefHoleFilling {
  private RefHoleFilling() {}

  /**
   * A new mask, 255 on the foreground of {@code mask} and on its holes, 0 elsewhere.
   *
   * @throws IllegalArgumentException if the length does not match the dimensions
   */
  static byte[] fill(byte[] mask, int w, int h, int d) {
    RefGrids.check(mask.length, w, h, d, "mask");
    Runs runs = Runs.of(mask, w, h, d);
    int count = runs.count;
    int[] parent = new int[count];
    for (int i = 0; i < count; i++) {
      parent[i] = i;
    }
    int rows = h * d;
    for (int row = 0; row < rows; row++) {
      int y = row % h;
      if (y > 0) {
        joinOverlapping(runs, parent, row, row - 1);
      }
      if (row >= h) {
        joinOverlapping(runs, parent, row, row - h);
      }
    }
    boolean[] outside = new boolean[count];
    for (int i = 0; i < count; i++) {
      int row = runs.row[i];
      int y = row % h;
      int z = row / h;
      boolean border =
          runs.start[i] == 0
              || runs.end[i] == w - 1
              || y == 0
              || y == h - 1
              || (d > 1 && (z == 0 || z == d - 1));
      if (border) {
        outside[find(parent, i)] = true;
      }
    }
    byte[] out = new byte[mask.length];
    java.util.Arrays.fill(out, (byte) 255);
    for (int i = 0; i < count; i++) {
      if (outside[find(parent, i)]) {
        int base = runs.row[i] * w;
        java.util.Arrays.fill(out, base + runs.start[i], base + runs.end[i] + 1, (byte) 0);
      }
    }
    return out;
  }

  /** Joins every run of row {@code a} with the runs of row {@code b} that share an x with it. */
  private static void joinOverlapping(Runs runs, int[] parent, int a, int b) {
    int i = runs.first[a];
    int iEnd = runs.first[a + 1];
    int j = runs.first[b];
    int jEnd = runs.first[b + 1];
    while (i < iEnd && j < jEnd) {
      if (runs.end[j] < runs.start[i]) {
        j++;
      } else if (runs.end[i] < runs.start[j]) {
        i++;
      } else {
        union(parent, i, j);
        if (runs.end[i] < runs.end[j]) {
          i++;
        } else {
          j++;
        }
      }
    }
  }

  private static int find(int[] parent, int i) {
    int root = i;
    while (parent[root] != root) {
      root = parent[root];
    }
    while (parent[i] != root) { // path compression
      int next = parent[i];
      parent[i] = root;
      i = next;
    }
    return root;
  }

  private static void union(int[] parent, int a, int b) {
    int ra = find(parent, a);
    int rb = find(parent, b);
    if (ra != rb) {
      parent[Math.max(ra, rb)] = Math.min(ra, rb);
    }
  }

  /** The background runs of a mask, row by row ({@code row = y + h · z}), x ascending. */
  private static final class Runs {
    int count;
    int[] start;
    int[] end; // inclusive
    int[] row;
    int[] first; // first[row]: index of the row's first run; first[rows] = count

    static Runs of(byte[] mask, int w, int h, int d) {
      Runs r = new Runs();
      int rows = h * d;
      int capacity = Math.max(16, rows * 2);
      r.start = new int[capacity];
      r.end = new int[capacity];
      r.row = new int[capacity];
      r.first = new int[rows + 1];
      for (int row = 0; row < rows; row++) {
        r.first[row] = r.count;
        int base = row * w;
        int x = 0;
        while (x < w) {
          while (x < w && mask[base + x] != 0) {
            x++;
          }
          if (x == w) {
            break;
          }
          int s = x;
          while (x < w && mask[base + x] == 0) {
            x++;
          }
          r.add(s, x - 1, row);
        }
      }
      r.first[rows] = r.count;
      return r;
    }

    private void add(int s, int e, int rowIndex) {
      if (count == start.length) {
        int grown = start.length * 2;
        start = java.util.Arrays.copyOf(start, grown);
        end = java.util.Arrays.copyOf(end, grown);
        row = java.util.Arrays.copyOf(row, grown);
      }
      start[count] = s;
      end[count] = e;
      row[count] = rowIndex;
      count++;
    }
  }
}
