package io.github.cleave.objects;

import ij.plugin.filter.EDM;
import ij.plugin.filter.MaximumFinder;
import ij.process.ByteProcessor;
import ij.process.FloatProcessor;
import ij.process.ImageProcessor;

/**
 * ImageJ's EDM watershed of a single plane ({@code EDM#toWatershed}: {@code makeFloatEDM}, then
 * {@code MaximumFinder#findMaxima} with tolerance 0.5, segmented output, EDM mode, then AND with
 * the mask), run on each 8-connected component of the mask separately, on a crop, with the same
 * result as one run on the whole plane.
 *
 * <p>Why a crop gives the same answer (checked voxel for voxel against the whole-plane run by
 * {@code ObjectsCrossCheckTest}): the crop is the component's bounding box grown by one pixel
 * except on sides where the component touches the image edge (so the image edge stays the edge),
 * with every pixel outside the component set to background. ImageJ's distance map propagates
 * nearest-background candidates between 8-neighbours only, and the 8-neighbours of a component
 * pixel are in the component or background; so the component's distances are the same. The maxima
 * search floods only within tolerance 0.5 of a maximum of height at least 1 and never crosses
 * background; the watershed dilates level by level with decisions taken from 3×3 neighbourhoods,
 * and a component's pixels converge in the same passes (a level ends only after eight idle passes,
 * and pixels handed down to a lower level stay idle until a level where the component has pixels of
 * its own). What is global in ImageJ's method is the range of the map: the 8-bit levels and the
 * sorting keys of the maxima are scaled by the plane's largest distance. So that value is put into
 * each crop as one isolated pixel beyond a margin (its own maximum, removed by the AND), unless the
 * crop already holds it. A component touching all four edges with a smaller maximum has no room for
 * that pixel; then, and when there are so many components that crops would cost more, the whole
 * plane is processed at once.
 *
 * <p>Cost: ImageJ's O(N) passes over the crops instead of the plane, i.e. over about the
 * foreground's bounding boxes. Stateless and thread-safe.
 */
final class PlaneWatershed {
  private static final double TOLERANCE = 0.5; // ImageJ's EDM watershed tolerance

  private PlaneWatershed() {}

  /**
   * Object labels covering the mask, in first-pixel order: the basins of the watershed, each
   * dividing-line pixel given to the basin nearest in breadth-first steps ({@link SeededGrowth}); a
   * component without a basin is one object.
   */
  static int[] split(byte[] mask, int w, int h) {
    ForegroundRuns runs = ForegroundRuns.of(mask, null, w, h, 1);
    int k = runs.components;
    int[] x0 = new int[k + 1];
    int[] x1 = new int[k + 1];
    int[] y0 = new int[k + 1];
    int[] y1 = new int[k + 1];
    java.util.Arrays.fill(x0, Integer.MAX_VALUE);
    java.util.Arrays.fill(y0, Integer.MAX_VALUE);
    java.util.Arrays.fill(x1, -1);
    java.util.Arrays.fill(y1, -1);
    for (int i = 0; i < runs.count; i++) {
      int c = runs.component[i];
      x0[c] = Math.min(x0[c], runs.start[i]);
      x1[c] = Math.max(x1[c], runs.end[i]);
      y0[c] = Math.min(y0[c], runs.row[i]);
      y1[c] = Math.max(y1[c], runs.row[i]);
    }
    long area = 0;
    for (int c = 1; c <= k; c++) { // crops: bounding box plus a margin where not at the edge
      x0[c] = Math.max(0, x0[c] - 1);
      y0[c] = Math.max(0, y0[c] - 1);
      x1[c] = Math.min(w - 1, x1[c] + 1);
      y1[c] = Math.min(h - 1, y1[c] + 1);
      area += (long) (x1[c] - x0[c] + 1) * (y1[c] - y0[c] + 1) + 64;
    }
    if (k == 0) {
      return new int[w * h];
    }
    if (area >= (long) w * h) {
      return whole(mask, w, h);
    }
    int[] order = runsByComponent(runs);
    int[] firstRun = new int[k + 2];
    for (int i = 0; i < runs.count; i++) {
      firstRun[runs.component[i] + 1]++;
    }
    for (int c = 1; c <= k + 1; c++) {
      firstRun[c] += firstRun[c - 1];
    }
    FloatProcessor[] maps = new FloatProcessor[k + 1];
    float top = 0;
    for (int c = 1; c <= k; c++) {
      int cw = x1[c] - x0[c] + 1;
      ByteProcessor crop = new ByteProcessor(cw, y1[c] - y0[c] + 1);
      byte[] px = (byte[]) crop.getPixels();
      for (int j = firstRun[c]; j < firstRun[c + 1]; j++) {
        int i = order[j];
        int base = (runs.row[i] - y0[c]) * cw - x0[c];
        java.util.Arrays.fill(px, base + runs.start[i], base + runs.end[i] + 1, (byte) 255);
      }
      maps[c] = new EDM().makeFloatEDM(crop, 0, false);
      top = Math.max(top, max((float[]) maps[c].getPixels()));
    }
    int[] labels = new int[w * h];
    int objects = 0;
    for (int c = 1; c <= k; c++) {
      FloatProcessor map = maps[c];
      int cw = map.getWidth();
      int ch = map.getHeight();
      int dx = 0; // where the crop sits in the image handed to ImageJ
      int dy = 0;
      if (max((float[]) map.getPixels()) < top) {
        boolean bottom = y1[c] < h - 1 && isBackgroundRow(map, ch - 1);
        boolean upper = y0[c] > 0;
        boolean right = x1[c] < w - 1;
        boolean left = x0[c] > 0;
        if (!(bottom || upper || right || left)) {
          return whole(mask, w, h); // touches all four edges: no room for the range pixel
        }
        int ew = bottom || upper ? cw : cw + 1;
        int eh = bottom || upper ? ch + 1 : ch;
        dx = !(bottom || upper) && left ? 1 : 0;
        dy = !bottom && upper ? 1 : 0;
        FloatProcessor extended = new FloatProcessor(ew, eh);
        float[] src = (float[]) map.getPixels();
        float[] dst = (float[]) extended.getPixels();
        for (int y = 0; y < ch; y++) {
          System.arraycopy(src, y * cw, dst, (y + dy) * ew + dx, cw);
        }
        int spot = bottom ? (eh - 1) * ew : upper ? 0 : right ? ew - 1 : 0;
        dst[spot] = top; // beyond the margin: its 8-neighbours are background
        map = extended;
      }
      ByteProcessor basins =
          new MaximumFinder()
              .findMaxima(
                  map,
                  TOLERANCE,
                  ImageProcessor.NO_THRESHOLD,
                  MaximumFinder.SEGMENTED,
                  false,
                  true);
      byte[] b = basins == null ? null : (byte[]) basins.getPixels();
      int ew = map.getWidth();
      byte[] inside = new byte[cw * ch]; // the component in the crop
      byte[] seeds = new byte[cw * ch]; // its basins
      for (int j = firstRun[c]; j < firstRun[c + 1]; j++) {
        int i = order[j];
        int yc = runs.row[i] - y0[c];
        for (int x = runs.start[i] - x0[c], e = runs.end[i] - x0[c]; x <= e; x++) {
          inside[yc * cw + x] = 1;
          if (b == null || b[(yc + dy) * ew + x + dx] != 0) {
            seeds[yc * cw + x] = 1;
          }
        }
      }
      int[] local = ConnectedComponents.label(seeds, cw, ch, 1, null, 0);
      local = SeededGrowth.grow(inside, cw, ch, 1, local);
      int most = 0;
      for (int j = firstRun[c]; j < firstRun[c + 1]; j++) {
        int i = order[j];
        int y = runs.row[i];
        int from = (y - y0[c]) * cw - x0[c];
        for (int x = runs.start[i]; x <= runs.end[i]; x++) {
          int l = local[from + x];
          most = Math.max(most, l);
          labels[y * w + x] = objects + l;
        }
      }
      objects += most;
    }
    renumber(labels, runs, objects);
    return labels;
  }

  /** Renumbers the labels on the runs in first-pixel order (the runs are in row-major order). */
  private static void renumber(int[] labels, ForegroundRuns runs, int objects) {
    int[] map = new int[objects + 1];
    int next = 0;
    int w = runs.w;
    for (int i = 0; i < runs.count; i++) {
      int base = runs.row[i] * w;
      for (int p = base + runs.start[i], e = base + runs.end[i]; p <= e; p++) {
        int l = labels[p];
        if (map[l] == 0) {
          map[l] = ++next;
        }
        labels[p] = map[l];
      }
    }
  }

  /** The same on the whole plane at once. */
  private static int[] whole(byte[] mask, int w, int h) {
    ByteProcessor bp = new ByteProcessor(w, h);
    byte[] px = (byte[]) bp.getPixels();
    for (int i = 0; i < px.length; i++) {
      px[i] = mask[i] != 0 ? (byte) 255 : 0;
    }
    new EDM().toWatershed(bp);
    int[] seeds = ConnectedComponents.label(px, w, h, 1, null, 0);
    int[] labels = SeededGrowth.grow(mask, w, h, 1, seeds);
    ObjectLabels.adopt(w, h, 1, labels);
    return labels;
  }

  private static boolean isBackgroundRow(FloatProcessor map, int y) {
    float[] p = (float[]) map.getPixels();
    int cw = map.getWidth();
    for (int x = 0; x < cw; x++) {
      if (p[y * cw + x] != 0) {
        return false;
      }
    }
    return true;
  }

  private static float max(float[] values) {
    float m = 0;
    for (float v : values) {
      m = Math.max(m, v);
    }
    return m;
  }

  /** Run indices grouped by component (counting sort), row-major within each component. */
  private static int[] runsByComponent(ForegroundRuns runs) {
    int k = runs.components;
    int[] next = new int[k + 2];
    for (int i = 0; i < runs.count; i++) {
      next[runs.component[i] + 1]++;
    }
    for (int c = 1; c <= k + 1; c++) {
      next[c] += next[c - 1];
    }
    int[] order = new int[runs.count];
    for (int i = 0; i < runs.count; i++) {
      order[next[runs.component[i]]++] = i;
    }
    return order;
  }
}
