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
 * is lost. Deterministic; O(N log N).
 *
 * <p>Each resulting object is connected. Stateless and thread-safe.
 */
final class DistanceWatershed {
  private DistanceWatershed() {}

  /** Object labels covering the whole mask, numbered in first-voxel order. */
  static int[] split(byte[] mask, int w, int h, int d, double sx, double sy, double sz) {
    if (d == 1) {
      return PlaneWatershed.split(mask, w, h);
    }
    int[] labels = splitStack(mask, w, h, d, sx, sy, sz);
    ObjectLabels.adopt(w, h, d, labels);
    return labels;
  }

  private static int[] splitStack(
      byte[] mask, int w, int h, int d, double sx, double sy, double sz) {
    float[] dist = DistanceMap.distance(mask, w, h, d, sx, sy, sz);
    float tolerance = (float) (0.5 * Math.min(sx, Math.min(sy, sz)));
    int[] labels = DistanceMarkers.markers(dist, w, h, d, tolerance);
    Grids grid = new Grids(w, h, d, true);
    int[] nb = grid.buffer;
    FloodQueue queue = new FloodQueue();
    int n = mask.length;
    boolean[] marker = new boolean[n];
    for (int i = 0; i < n; i++) {
      marker[i] = labels[i] != 0;
    }
    for (int p = 0; p < n; p++) {
      if (marker[p]) {
        visit(p, labels, dist, mask, grid, nb, queue);
      }
    }
    while (!queue.isEmpty()) {
      visit(queue.pop(), labels, dist, mask, grid, nb, queue);
    }
    return SeededGrowth.grow(mask, w, h, d, labels); // components without a marker, if any
  }

  /** Gives {@code p}'s label to its unlabelled foreground neighbours and queues them. */
  private static void visit(
      int p, int[] labels, float[] dist, byte[] mask, Grids grid, int[] nb, FloodQueue queue) {
    int m = grid.neighbours(p);
    for (int j = 0; j < m; j++) {
      int q = nb[j];
      if (mask[q] != 0 && labels[q] == 0) {
        labels[q] = labels[p];
        queue.push(q, dist[q]);
      }
    }
  }
}
