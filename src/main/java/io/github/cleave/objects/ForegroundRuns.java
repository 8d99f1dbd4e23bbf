package io.github.cleave.objects;

import io.github.cleave.image.ByteWords;
import java.util.Arrays;

/**
 * The foreground of a mask as runs (maximal stretches of voxels along x, one row at a time, rows
 * ordered {@code row = y + h·z}), grouped into connected components: runs are joined with a
 * union–find structure (R. E. Tarjan, "Efficiency of a good but not linear set union algorithm", J.
 * ACM 22(2), 1975, doi:10.1145/321879.321884) wherever they touch along a face, an edge or a
 * corner, i.e. 8-connectivity in a plane and 26-connectivity in a stack: a run touches the runs of
 * the row above that overlap it extended by one voxel on each side, and in a stack also those of
 * the three neighbouring rows of the plane before. Components are numbered 1..k in the order of
 * their first voxel in row-major order (runs are in that order and every set's root is its first
 * run), the same numbering a row-major scan with a flood fill gives.
 *
 * <p>One sequential pass over the voxels plus near-linear work in the number of runs, which is much
 * smaller than the number of voxels; memory: a few ints per run. Not thread-safe; one instance per
 * call.
 */
final class ForegroundRuns {
  final int w;
  final int h;
  final int d;
  int count; // number of runs
  int[] start; // first x of run r
  int[] end; // last x of run r, inclusive
  int[] row; // y + h·z of run r
  int[] first; // first[row]: index of the row's first run; first[h·d] = count
  int[] component; // component of run r, 1..components
  int components;

  private ForegroundRuns(int w, int h, int d) {
    this.w = w;
    this.h = h;
    this.d = d;
  }

  /**
   * The runs of the voxels with {@code mask[i] != 0} and, when {@code skip} is not null, {@code
   * skip[i] == 0}, with their components.
   */
  static ForegroundRuns of(byte[] mask, int[] skip, int w, int h, int d) {
    ForegroundRuns r = new ForegroundRuns(w, h, d);
    int rows = h * d;
    int capacity = 64;
    r.start = new int[capacity];
    r.end = new int[capacity];
    r.row = new int[capacity];
    r.first = new int[rows + 1];
    for (int row = 0; row < rows; row++) {
      r.first[row] = r.count;
      int base = row * w;
      int x = 0;
      while (x < w) {
        if (skip == null) { // skip background eight voxels at a time
          x = ByteWords.nextNonZero(mask, base + x, base + w) - base;
        }
        while (x < w && (mask[base + x] == 0 || (skip != null && skip[base + x] != 0))) {
          x++;
        }
        if (x == w) {
          break;
        }
        int s = x;
        while (x < w && mask[base + x] != 0 && (skip == null || skip[base + x] == 0)) {
          x++;
        }
        r.add(s, x - 1, row);
      }
    }
    r.first[rows] = r.count;
    r.connect();
    return r;
  }

  private void add(int s, int e, int rowIndex) {
    if (count == start.length) {
      int grown = start.length * 2;
      start = Arrays.copyOf(start, grown);
      end = Arrays.copyOf(end, grown);
      row = Arrays.copyOf(row, grown);
    }
    start[count] = s;
    end[count] = e;
    row[count] = rowIndex;
    count++;
  }

  private void connect() {
    int[] parent = new int[count];
    for (int i = 0; i < count; i++) {
      parent[i] = i;
    }
    int rows = h * d;
    for (int rw = 0; rw < rows; rw++) {
      if (first[rw] == first[rw + 1]) {
        continue;
      }
      int y = rw % h;
      if (y > 0) {
        join(parent, rw, rw - 1);
      }
      if (rw >= h) {
        int below = rw - h; // same y, plane before
        join(parent, rw, below);
        if (y > 0) {
          join(parent, rw, below - 1);
        }
        if (y < h - 1) {
          join(parent, rw, below + 1);
        }
      }
    }
    component = new int[count];
    int next = 0;
    for (int i = 0; i < count; i++) {
      int root = find(parent, i);
      component[i] = root == i ? ++next : component[root]; // the root is the set's first run
    }
    components = next;
  }

  /** Joins every run of row {@code a} with the runs of row {@code b} it touches (x ± 1). */
  private void join(int[] parent, int a, int b) {
    int i = first[a];
    int iEnd = first[a + 1];
    int j = first[b];
    int jEnd = first[b + 1];
    while (i < iEnd && j < jEnd) {
      if (end[j] + 1 < start[i]) {
        j++;
      } else if (end[i] + 1 < start[j]) {
        i++;
      } else {
        union(parent, i, j);
        if (end[i] < end[j]) {
          i++;
        } else {
          j++;
        }
      }
    }
  }

  private static int find(int[] parent, int i) {
    while (parent[i] != i) {
      parent[i] = parent[parent[i]]; // path halving
      i = parent[i];
    }
    return i;
  }

  private static void union(int[] parent, int a, int b) {
    int ra = find(parent, a);
    int rb = find(parent, b);
    if (ra != rb) {
      parent[Math.max(ra, rb)] = Math.min(ra, rb);
    }
  }

  /** Writes {@code offset + component} over every run into {@code labels}. */
  void write(int[] labels, int offset) {
    for (int i = 0; i < count; i++) {
      int base = row[i] * w;
      Arrays.fill(labels, base + start[i], base + end[i] + 1, offset + component[i]);
    }
  }

  /**
   * Numbers the voxels of the runs 0..F−1 in row-major order ("slots"): run {@code r} holds slots
   * {@code slots[r] .. slots[r+1]−1}; {@code slots[count] = F}.
   */
  int[] slotStarts() {
    int[] slots = new int[count + 1];
    for (int i = 0; i < count; i++) {
      slots[i + 1] = slots[i] + end[i] - start[i] + 1;
    }
    return slots;
  }

  /** Voxels per component, indexed 1..components. */
  long[] sizes() {
    long[] s = new long[components + 1];
    for (int i = 0; i < count; i++) {
      s[component[i]] += end[i] - start[i] + 1;
    }
    return s;
  }
}
