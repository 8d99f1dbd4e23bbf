package io.github.cleave.objects;

import java.util.Arrays;

/**
 * Markers for a distance watershed: the regional maxima of the h-maxima transform of the distance
 * map, i.e. the peaks that rise more than {@code h} above the saddle joining them to any higher
 * peak (their dynamic exceeds {@code h}); lower bumps merge into their neighbour.
 *
 * <p>The h-maxima transform is the morphological reconstruction by dilation of {@code g = f − h}
 * under {@code f} (P. Soille, <i>Morphological Image Analysis</i>, 2nd ed., Springer 2003, §6.3.4;
 * from memory): {@code R(p) = max over voxels q and paths from q to p of min(g(q), min of f along
 * the path)}, taken over the voxels with {@code f > 0}, 26-connected in 3D, 8 in 2D. Writing {@code
 * C_t(p)} for the connected component of {@code {f ≥ t}} holding p and {@code G(C)} for the largest
 * g in C, this is {@code R(p) = max over levels t ≤ f(p) of min(t, G(C_t(p)))} (a path whose lowest
 * value is t stays in {@code C_t}). Computed by growing the components in decreasing order of f
 * with a union–find structure (the construction of the component tree, L. Najman and M. Couprie,
 * "Building the component tree in quasi-linear time", IEEE Trans. Image Processing
 * 15(11):3531–3539, 2006, doi:10.1109/TIP.2006.877518): when, after adding all voxels of level t, a
 * component first satisfies {@code G ≥ t}, each of its voxels gets {@code max(t, G of the part it
 * was in just above t)} (t for voxels of level t); voxels of a component that never does get its G.
 * Every R is a copy of an f or a g value, so the result is the same float for float as any other
 * exact method (for instance the queue of L. Vincent, IEEE Trans. Image Processing 2(2):176–201,
 * 1993). Regional maxima are then plateaus (same connectivity, equal value) with no higher
 * neighbour.
 *
 * <p>Works on the foreground voxels only ({@link ForegroundNeighbours}): a radix sort of the F
 * foreground voxels by distance, O(F), then near-linear union–find work; a few arrays of F entries.
 */
final class DistanceMarkers {
  private DistanceMarkers() {}

  /**
   * Marker labels 1..m (0 elsewhere) for the foreground voxels with {@code dist > 0}, by slot of
   * {@code grid}, numbered in row-major order of their first voxel.
   */
  static int[] markers(float[] dist, ForegroundNeighbours grid, float tolerance) {
    return regionalMaxima(reconstruction(dist, grid, tolerance), dist, grid);
  }

  /** The h-maxima transform {@code R} by slot; −∞ where {@code dist ≤ 0}. */
  static float[] reconstruction(float[] dist, ForegroundNeighbours grid, float tolerance) {
    int n = dist.length;
    float[] rec = new float[n];
    long[] keys = new long[n]; // (bits of dist) · 2³² + slot: ascending dist (dist > 0)
    int m = 0;
    for (int s = 0; s < n; s++) {
      if (dist[s] > 0) {
        keys[m++] = ((long) Float.floatToRawIntBits(dist[s]) << 32) | s;
      } else {
        rec[s] = Float.NEGATIVE_INFINITY;
      }
    }
    sortByDistance(keys, m);
    int[] parent = new int[n]; // union–find forest; −1: not yet added
    Arrays.fill(parent, -1);
    int[] size = new int[n]; // at a root: the number of voxels of its component
    float[] top = new float[n]; // at a root: the largest g of its component
    int[] head = new int[n]; // at a root: first voxel of its pending list, −1 if empty
    int[] tail = new int[n]; // at a root: last voxel of its pending list
    int[] next = new int[n]; // pending list links, −1 at the end
    float[] above = new float[n]; // at a touched root: its top before this level's unions
    int[] touched = new int[n]; // roots of earlier levels merged at this level
    boolean[] isTouched = new boolean[n];
    int[] nb = grid.entries;
    for (int i = m - 1; i >= 0; ) {
      float t = dist[(int) keys[i]];
      int j = i;
      while (j >= 0 && dist[(int) keys[j]] == t) {
        int p = (int) keys[j--];
        parent[p] = p;
        size[p] = 1;
        top[p] = dist[p] - tolerance;
        head[p] = -1;
      }
      int touchedCount = 0;
      for (int k = i; k > j; k--) { // join the level's voxels with their added neighbours
        int p = (int) keys[k];
        int rp = find(parent, p);
        for (int e = grid.at(p), end = e + grid.k; e < end; e++) {
          int q = nb[e];
          if (q < 0 || parent[q] < 0) {
            continue;
          }
          int rq = find(parent, q);
          if (rp == rq) {
            continue;
          }
          if (head[rp] >= 0 && !isTouched[rp]) { // an earlier level's root with pending voxels
            isTouched[rp] = true;
            above[rp] = top[rp];
            touched[touchedCount++] = rp;
          }
          if (head[rq] >= 0 && !isTouched[rq]) {
            isTouched[rq] = true;
            above[rq] = top[rq];
            touched[touchedCount++] = rq;
          }
          int root = size[rp] >= size[rq] ? rp : rq; // union by size (any root gives one answer)
          int child = root == rp ? rq : rp;
          parent[child] = root;
          size[root] += size[child];
          top[root] = Math.max(top[rp], top[rq]);
          rp = root;
        }
      }
      for (int k = 0; k < touchedCount; k++) { // settle or pass on the earlier levels' voxels
        int r = touched[k];
        isTouched[r] = false;
        int root = find(parent, r);
        if (top[root] >= t) {
          float value = Math.max(t, above[r]);
          for (int p = head[r]; p >= 0; p = next[p]) {
            rec[p] = value;
          }
          head[r] = -1;
        } else if (root != r) {
          append(head, tail, next, root, head[r], tail[r]);
          head[r] = -1;
        }
      }
      for (int k = i; k > j; k--) { // the level's own voxels
        int p = (int) keys[k];
        int root = find(parent, p);
        if (top[root] >= t) {
          rec[p] = t;
        } else {
          next[p] = -1;
          append(head, tail, next, root, p, p);
        }
      }
      i = j;
    }
    for (int r = 0; r < n; r++) { // components that never reach G ≥ t: their G
      if (parent[r] == r) {
        for (int p = head[r]; p >= 0; p = next[p]) {
          rec[p] = top[r];
        }
      }
    }
    return rec;
  }

  /**
   * Sorts {@code keys[0..m)} by their upper 32 bits (the bits of a positive float, whose order as
   * ints is the float order): a stable least-significant-digit radix sort, three passes of 11 bits
   * (O(m)); keys built in slot order stay in slot order among equal distances.
   */
  private static void sortByDistance(long[] keys, int m) {
    long[] other = new long[m];
    int[] count = new int[1 << 11];
    long[] from = keys;
    long[] to = other;
    for (int shift = 32; shift < 64; shift += 11) {
      Arrays.fill(count, 0);
      for (int i = 0; i < m; i++) {
        count[(int) (from[i] >>> shift) & 0x7FF]++;
      }
      for (int b = 0, sum = 0; b < count.length; b++) {
        int c = count[b];
        count[b] = sum;
        sum += c;
      }
      for (int i = 0; i < m; i++) {
        to[count[(int) (from[i] >>> shift) & 0x7FF]++] = from[i];
      }
      long[] t = from;
      from = to;
      to = t;
    }
    if (from != keys) {
      System.arraycopy(from, 0, keys, 0, m);
    }
  }

  /** Appends the list {@code first..last} to the pending list of {@code root}. */
  private static void append(int[] head, int[] tail, int[] next, int root, int first, int last) {
    if (head[root] < 0) {
      head[root] = first;
    } else {
      next[tail[root]] = first;
    }
    tail[root] = last;
  }

  private static int find(int[] parent, int i) {
    while (parent[i] != i) {
      parent[i] = parent[parent[i]]; // path halving
      i = parent[i];
    }
    return i;
  }

  /**
   * Plateaus of {@code rec} (voxels with {@code dist > 0}) without a higher neighbour, numbered in
   * order of their first voxel. A voxel with a higher neighbour starts no search (its plateau is no
   * maximum, and a maximum plateau is still found from its first voxel).
   */
  private static int[] regionalMaxima(float[] rec, float[] dist, ForegroundNeighbours grid) {
    int n = rec.length;
    int[] labels = new int[n];
    byte[] seen = new byte[n];
    int[] plateau = new int[n];
    int[] nb = grid.entries;
    int count = 0;
    for (int start = 0; start < n; start++) {
      if (dist[start] <= 0 || seen[start] != 0 || hasHigher(start, rec, dist, grid)) {
        continue;
      }
      float v = rec[start];
      boolean maximum = true;
      int size = 0;
      seen[start] = 1;
      plateau[size++] = start;
      for (int head = 0; head < size; head++) {
        int p = plateau[head];
        for (int e = grid.at(p), end = e + grid.k; e < end; e++) {
          int q = nb[e];
          if (q < 0 || dist[q] <= 0) {
            continue;
          }
          if (rec[q] > v) {
            maximum = false;
          } else if (rec[q] == v && seen[q] == 0) {
            seen[q] = 1;
            plateau[size++] = q;
          }
        }
      }
      if (maximum) {
        count++;
        for (int k = 0; k < size; k++) {
          labels[plateau[k]] = count;
        }
      }
    }
    return labels;
  }

  private static boolean hasHigher(int p, float[] rec, float[] dist, ForegroundNeighbours grid) {
    int[] nb = grid.entries;
    float v = rec[p];
    for (int e = grid.at(p), end = e + grid.k; e < end; e++) {
      int q = nb[e];
      if (q >= 0 && dist[q] > 0 && rec[q] > v) {
        return true;
      }
    }
    return false;
  }
}
