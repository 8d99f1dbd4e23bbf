package io.github.cleave.objects;

/**
 * Markers for a distance watershed: the regional maxima of the h-maxima transform of the distance
 * map, i.e. the peaks that rise more than {@code h} above the saddle joining them to any higher
 * peak (their dynamic exceeds {@code h}); lower bumps merge into their neighbour.
 *
 * <p>The h-maxima transform is the morphological reconstruction by dilation of {@code f − h} under
 * {@code f} (P. Soille, <i>Morphological Image Analysis</i>, 2nd ed., Springer 2003, §6.3.4; from
 * memory), computed with a priority queue in decreasing order as in L. Vincent, "Morphological
 * grayscale reconstruction in image analysis", IEEE Trans. Image Processing 2(2):176–201, 1993: a
 * voxel popped from the queue is final, like a bottleneck-path Dijkstra search. Regional maxima are
 * then plateaus (26-connected in 3D, 8 in 2D, equal value) with no higher neighbour; their values
 * are exact copies of input values, so plateau equality is exact. Works on the foreground voxels
 * only ({@link ForegroundNeighbours}): O(F log F) time for F foreground voxels.
 */
final class DistanceMarkers {
  private DistanceMarkers() {}

  /**
   * Marker labels 1..m (0 elsewhere) for the foreground voxels with {@code dist > 0}, by slot of
   * {@code grid}, numbered in row-major order of their first voxel. The queue starts with every
   * such voxel in slot (row-major) order, built in one pass ({@link FloodQueue#heapOf}).
   */
  static int[] markers(float[] dist, ForegroundNeighbours grid, float tolerance) {
    int n = dist.length;
    float[] rec = new float[n]; // reconstruction; −inf where dist ≤ 0
    int[] start = new int[n];
    float[] startRec = new float[n];
    int foreground = 0;
    for (int i = 0; i < n; i++) {
      if (dist[i] > 0) {
        rec[i] = dist[i] - tolerance;
        start[foreground] = i;
        startRec[foreground++] = rec[i];
      } else {
        rec[i] = Float.NEGATIVE_INFINITY;
      }
    }
    FloodQueue queue = FloodQueue.heapOf(start, startRec, foreground, foreground + foreground / 4);
    int[] nb = grid.buffer;
    while (!queue.isEmpty()) {
      float v = queue.topPriority();
      int p = queue.pop();
      if (v < rec[p]) {
        continue; // stale entry: p was raised after this push
      }
      int m = grid.neighbours(p);
      for (int j = 0; j < m; j++) {
        int q = nb[j];
        if (dist[q] > 0) {
          float candidate = Math.min(v, dist[q]);
          if (candidate > rec[q]) {
            rec[q] = candidate;
            queue.push(q, candidate);
          }
        }
      }
    }
    return regionalMaxima(rec, dist, grid);
  }

  private static int[] regionalMaxima(float[] rec, float[] dist, ForegroundNeighbours grid) {
    int n = rec.length;
    int[] labels = new int[n];
    byte[] seen = new byte[n];
    int[] plateau = new int[n];
    int[] nb = grid.buffer;
    int count = 0;
    for (int start = 0; start < n; start++) {
      if (dist[start] <= 0 || seen[start] != 0) {
        continue;
      }
      float v = rec[start];
      boolean maximum = true;
      int size = 0;
      seen[start] = 1;
      plateau[size++] = start;
      for (int head = 0; head < size; head++) {
        int p = plateau[head];
        int m = grid.neighbours(p);
        for (int j = 0; j < m; j++) {
          int q = nb[j];
          if (dist[q] <= 0) {
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
}
