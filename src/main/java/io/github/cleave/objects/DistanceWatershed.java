package io.github.cleave.objects;

/**
 * Splits touching objects at the necks of the Euclidean distance map (EDM): a watershed of the
 * distance to the background, flooded from its maxima (L. Vincent and P. Soille, "Watersheds in
 * digital spaces: an efficient algorithm based on immersion simulations", IEEE Trans. PAMI
 * 13(6):583–598, 1991, doi:10.1109/34.87344; flooding from markers with a priority queue as in F.
 * Meyer, "Topographic distance and watershed lines", Signal Processing 38:113–125, 1994, from
 * memory).
 *
 * <p><b>Single plane</b>: ImageJ's own EDM watershed ({@code ij.plugin.filter.EDM#toWatershed}),
 * with its maxima tolerance of 0.5 pixel, on a 0/255 {@code ByteProcessor} (foreground 255; that
 * method always treats 0 as background, so the result does not depend on the user's
 * black-background or LUT preferences), run per 8-connected component on a crop with the same
 * result ({@link PlaneWatershed}). It measures distances in pixels (calibration is not used). Its
 * one-pixel separating lines are given back to the neighbouring object nearest in breadth-first
 * steps ({@link SeededGrowth}), so no foreground pixel is lost.
 *
 * <p><b>Stack</b> (ImageJ has no 3D EDM watershed): exact Euclidean distance in calibrated units
 * ({@link DistanceMap}, honouring anisotropic voxels); markers are the maxima that rise more than
 * half the smallest voxel side above their saddle ({@link DistanceMarkers}: the same 0.5 tolerance
 * as ImageJ's, in voxel units along the finest axis); then the flood: marker voxels label their
 * 26-neighbours, which enter a priority queue keyed by distance (highest first, FIFO among equal
 * distances); each popped voxel labels its unlabelled neighbours. A voxel takes the label of the
 * first labelled neighbour that reaches it, so the dividing surface goes to one side and no voxel
 * is lost. Deterministic. Everything after finding the foreground runs works on the F foreground
 * voxels only ({@link ForegroundNeighbours}), with the same pushes in the same order as a flood
 * over the whole grid: O(N / 8) to find the runs and O(N) to write the labels, O(F log F) for the
 * rest.
 *
 * <p>Each resulting object is connected. Stateless and thread-safe.
 */
final class DistanceWatershed {
  private DistanceWatershed() {}

  /** Object labels covering the whole mask, numbered in first-voxel order. */
  static ObjectLabels split(byte[] mask, int w, int h, int d, double sx, double sy, double sz) {
    if (d == 1) {
      int[] labels = PlaneWatershed.split(mask, w, h);
      int count = 0;
      for (int l : labels) {
        count = Math.max(count, l);
      }
      return ObjectLabels.ordered(w, h, d, labels, count);
    }
    return splitStack(mask, w, h, d, sx, sy, sz, null);
  }

  /**
   * The stack's flood, on the foreground voxels only ({@link ForegroundNeighbours}: slots in
   * row-major order, neighbours in grid order, so every queue sees the same pushes in the same
   * order as a flood over the whole grid). {@code asTable}: the neighbour layout, null to choose by
   * density (the labels do not depend on it).
   */
  static ObjectLabels splitStack(
      byte[] mask, int w, int h, int d, double sx, double sy, double sz, Boolean asTable) {
    ForegroundRuns runs = ForegroundRuns.of(mask, null, w, h, d);
    ForegroundNeighbours grid =
        asTable == null ? ForegroundNeighbours.of(runs) : ForegroundNeighbours.of(runs, asTable);
    float[] dist = DistanceMap.distance(runs, grid.slots, sx, sy, sz);
    float tolerance = (float) (0.5 * Math.min(sx, Math.min(sy, sz)));
    int[] labels = DistanceMarkers.markers(dist, grid, tolerance);
    int n = grid.size;
    int[] nb = grid.entries;
    FloodQueue queue = new FloodQueue(n);
    boolean[] marker = new boolean[n];
    for (int i = 0; i < n; i++) {
      marker[i] = labels[i] != 0;
    }
    for (int p = 0; p < n; p++) {
      if (marker[p]) {
        visit(p, labels, dist, grid, nb, queue);
      }
    }
    while (!queue.isEmpty()) {
      visit(queue.pop(), labels, dist, grid, nb, queue);
    }
    int count = unmarked(labels, grid);
    int[] out = new int[mask.length];
    grid.scatter(labels, out);
    return ObjectLabels.ordered(w, h, d, out, count);
  }

  /** Gives {@code p}'s label to its unlabelled foreground neighbours and queues them. */
  private static void visit(
      int p, int[] labels, float[] dist, ForegroundNeighbours grid, int[] nb, FloodQueue queue) {
    for (int e = grid.at(p), end = e + grid.k; e < end; e++) {
      int q = nb[e];
      if (q >= 0 && labels[q] == 0) {
        labels[q] = labels[p];
        queue.push(q, dist[q]);
      }
    }
  }

  /**
   * Labels the components the flood did not reach (those without a marker, possible only where
   * distances underflow to 0) as {@link SeededGrowth} does: they get the next numbers in order of
   * their first voxel (the flood already reached everything connected to a label). Then renumbers
   * all labels in first-voxel (slot) order and returns their count.
   */
  private static int unmarked(int[] labels, ForegroundNeighbours grid) {
    int n = labels.length;
    int max = 0;
    for (int l : labels) {
      max = Math.max(max, l);
    }
    int[] nb = grid.entries;
    int[] queue = null;
    for (int s = 0; s < n; s++) {
      if (labels[s] != 0) {
        continue;
      }
      queue = queue != null ? queue : new int[n];
      int label = ++max;
      labels[s] = label;
      queue[0] = s;
      for (int head = 0, tail = 1; head < tail; head++) {
        for (int e = grid.at(queue[head]), end = e + grid.k; e < end; e++) {
          int q = nb[e];
          if (q >= 0 && labels[q] == 0) {
            labels[q] = label;
            queue[tail++] = q;
          }
        }
      }
    }
    int[] map = new int[max + 1];
    int next = 0;
    for (int s = 0; s < n; s++) {
      int old = labels[s];
      if (map[old] == 0) {
        map[old] = ++next;
      }
      labels[s] = map[old];
    }
    return next;
  }
}
