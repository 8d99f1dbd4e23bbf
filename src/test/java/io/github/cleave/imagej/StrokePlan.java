package io.github.cleave.imagej;

import ij.IJ;
import ij.ImagePlus;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.Arrays;

/**
 * Two strokes to paint on a sample image, following its bundled seed strokes (sample-images/
 * README.md: at most two straight strokes per class, one pixel wide, generated from the ground
 * truth): the largest 8-connected component of foreground seed pixels and the largest of background
 * seed pixels, each as a polyline through its own pixels ({@link #of(Path)}), and optionally
 * lengthened along its own line inside its class of the ground truth ({@link #of(Path, Path)}),
 * since a foreground seed stroke covers at most 2 % of its nucleus, a few pixels.
 *
 * <p>A component's pixels are ordered by their projection on the component's principal axis (the
 * major eigenvector of the covariance of their coordinates), which for a straight digital line is
 * the order along the line; the polyline keeps the first pixel, then every pixel at least {@link
 * #SPACING} pixels further along the axis than the last one kept, and the last pixel, so its points
 * lie 2 to 3 pixels apart. Every point is a seed pixel of the class, so a brush no wider than the
 * generator's margin (foreground strokes lie more than 2 pixels inside their object, background
 * strokes more than 8 pixels from any object) paints only pixels of that class. O(n log n) in the
 * component's size.
 *
 * @param foreground the foreground stroke, in image pixel coordinates
 * @param background the background stroke, in image pixel coordinates
 */
record StrokePlan(Polyline foreground, Polyline background) {
  /** Smallest distance along the principal axis between consecutive points of a polyline. */
  static final double SPACING = 2;

  /** Length below which {@link #extend} lengthens a stroke, in pixels. */
  static final double MIN_LENGTH = 20;

  /**
   * Half side of the box around an added point that must lie in the stroke's class: a brush of
   * width 3 along segments between such points stays in the class (checked by StrokePlanTest).
   */
  static final int MARGIN = 3;

  /**
   * Pixel positions in drawing order (pixel (x, y) covers [x, x + 1) × [y, y + 1)); at least one.
   */
  record Polyline(int[] xs, int[] ys) {
    Polyline {
      if (xs.length == 0 || xs.length != ys.length) {
        throw new IllegalArgumentException(
            "polyline: "
                + xs.length
                + " x and "
                + ys.length
                + " y values, give as many, at least 1");
      }
    }

    int size() {
      return xs.length;
    }

    @Override
    public String toString() {
      StringBuilder b = new StringBuilder();
      for (int i = 0; i < xs.length; i++) {
        b.append(i == 0 ? "" : " ").append(xs[i]).append(',').append(ys[i]);
      }
      return b.toString();
    }

    /** The length from first to last point, in pixels. */
    double length() {
      double l = 0;
      for (int i = 1; i < xs.length; i++) {
        l += Math.hypot(xs[i] - xs[i - 1], ys[i] - ys[i - 1]);
      }
      return l;
    }

    /**
     * The polyline as a brush stroke on plane 0 through the points shifted by {@code offset} (0.5:
     * the pixel centres; 0: the corners a drag at magnification 1 reports).
     */
    SeedStrokes.Stroke stroke(float width, int label, float offset) {
      float[] x = new float[xs.length];
      float[] y = new float[ys.length];
      for (int i = 0; i < x.length; i++) {
        x[i] = xs[i] + offset;
        y[i] = ys[i] + offset;
      }
      return new SeedStrokes.Stroke(x, y, width, label, 0);
    }
  }

  static StrokePlan of(Path seedImage) {
    ImagePlus seeds = IJ.openImage(seedImage.toString());
    byte[] p = (byte[]) seeds.getProcessor().getPixels();
    int w = seeds.getWidth();
    int h = seeds.getHeight();
    return new StrokePlan(follow(p, w, h, 1), follow(p, w, h, 2));
  }

  /**
   * As {@link #of(Path)}, each stroke then extended along its own line ({@link #extend}) inside its
   * class of the ground-truth mask {@code truthImage} (non-zero foreground) until it is at least
   * {@link #MIN_LENGTH} pixels long or meets the edge of its class.
   */
  static StrokePlan of(Path seedImage, Path truthImage) {
    StrokePlan seeds = of(seedImage);
    ImagePlus truth = IJ.openImage(truthImage.toString());
    byte[] t = (byte[]) truth.getProcessor().getPixels();
    int w = truth.getWidth();
    int h = truth.getHeight();
    return new StrokePlan(
        extend(seeds.foreground, t, w, h, true), extend(seeds.background, t, w, h, false));
  }

  /**
   * Extends a straight polyline at both ends, a point at a time and the ends in turn, by steps of
   * {@link #SPACING} along the line from its first to its last point, while it is shorter than
   * {@link #MIN_LENGTH}; an end stops growing at the first point whose box of half side {@link
   * #MARGIN} (chessboard distance) is not all of the class ({@code truth} non-zero when {@code
   * foreground}, zero otherwise) or leaves the image. A one-point polyline has no line and stays.
   */
  static Polyline extend(Polyline line, byte[] truth, int w, int h, boolean foreground) {
    int n = line.size();
    double len = Math.hypot(line.xs[n - 1] - line.xs[0], line.ys[n - 1] - line.ys[0]);
    if (n < 2 || len == 0) {
      return line;
    }
    double ux = (line.xs[n - 1] - line.xs[0]) / len;
    double uy = (line.ys[n - 1] - line.ys[0]) / len;
    ArrayDeque<int[]> points = new ArrayDeque<>();
    for (int i = 0; i < n; i++) {
      points.add(new int[] {line.xs[i], line.ys[i]});
    }
    double length = line.length();
    int[] step = {1, 1}; // next step at the start (0) and at the end (1); 0 once blocked
    while (length < MIN_LENGTH && (step[0] > 0 || step[1] > 0)) {
      for (int e = 0; e < 2 && length < MIN_LENGTH; e++) {
        if (step[e] == 0) {
          continue;
        }
        int[] from =
            e == 0
                ? new int[] {line.xs[0], line.ys[0]}
                : new int[] {line.xs[n - 1], line.ys[n - 1]};
        double sign = e == 0 ? -1 : 1;
        int x = (int) Math.round(from[0] + sign * step[e] * SPACING * ux);
        int y = (int) Math.round(from[1] + sign * step[e] * SPACING * uy);
        if (!inside(truth, w, h, x, y, foreground)) {
          step[e] = 0;
          continue;
        }
        int[] last = e == 0 ? points.getFirst() : points.getLast();
        length += Math.hypot(x - last[0], y - last[1]);
        if (e == 0) {
          points.addFirst(new int[] {x, y});
        } else {
          points.addLast(new int[] {x, y});
        }
        step[e]++;
      }
    }
    int[] xs = new int[points.size()];
    int[] ys = new int[points.size()];
    int k = 0;
    for (int[] p : points) {
      xs[k] = p[0];
      ys[k++] = p[1];
    }
    return new Polyline(xs, ys);
  }

  /** Whether the box of half side {@link #MARGIN} around (x, y) lies in the image and the class. */
  private static boolean inside(byte[] truth, int w, int h, int x, int y, boolean foreground) {
    if (x < MARGIN || y < MARGIN || x + MARGIN >= w || y + MARGIN >= h) {
      return false;
    }
    for (int dy = -MARGIN; dy <= MARGIN; dy++) {
      for (int dx = -MARGIN; dx <= MARGIN; dx++) {
        if ((truth[(y + dy) * w + x + dx] != 0) != foreground) {
          return false;
        }
      }
    }
    return true;
  }

  /** The polyline along the largest 8-connected component of {@code label} pixels. */
  static Polyline follow(byte[] p, int w, int h, int label) {
    int[] component = largestComponent(p, w, h, label);
    if (component.length == 0) {
      throw new IllegalArgumentException(
          "seed image " + w + "x" + h + " has no pixel of label " + label + ": give one with both");
    }
    double mx = 0;
    double my = 0;
    for (int i : component) {
      mx += i % w;
      my += i / w;
    }
    mx /= component.length;
    my /= component.length;
    double sxx = 0;
    double syy = 0;
    double sxy = 0;
    for (int i : component) {
      double dx = i % w - mx;
      double dy = i / w - my;
      sxx += dx * dx;
      syy += dy * dy;
      sxy += dx * dy;
    }
    // major axis of the 2x2 covariance: angle 0.5 atan2(2 sxy, sxx - syy) (common practice)
    double angle = 0.5 * Math.atan2(2 * sxy, sxx - syy);
    double cos = Math.cos(angle);
    double sin = Math.sin(angle);
    int n = component.length;
    double[] along = new double[n];
    Integer[] order = new Integer[n];
    for (int k = 0; k < n; k++) {
      along[k] = (component[k] % w - mx) * cos + (component[k] / w - my) * sin;
      order[k] = k;
    }
    Arrays.sort(order, (a, b) -> Double.compare(along[a], along[b]));
    int[] kept = new int[n];
    int m = 0;
    kept[m++] = order[0];
    for (int k = 1; k < n; k++) {
      if (along[order[k]] - along[kept[m - 1]] >= SPACING || k == n - 1) {
        kept[m++] = order[k];
      }
    }
    int[] xs = new int[m];
    int[] ys = new int[m];
    for (int k = 0; k < m; k++) {
      xs[k] = component[kept[k]] % w;
      ys[k] = component[kept[k]] / w;
    }
    return new Polyline(xs, ys);
  }

  /**
   * The pixel indices of the largest 8-connected component of {@code label} pixels (the first in
   * raster order among equals), by breadth-first search; empty if there is none. O(w h).
   */
  static int[] largestComponent(byte[] p, int w, int h, int label) {
    int[] comp = new int[p.length]; // component number + 1 of each visited pixel, 0 unvisited
    int[] queue = new int[p.length];
    int best = 0;
    int bestSize = 0;
    int bestStart = 0;
    int next = 0;
    for (int s = 0; s < p.length; s++) {
      if (p[s] != label || comp[s] != 0) {
        continue;
      }
      next++;
      int head = 0;
      int tail = 0;
      queue[tail++] = s;
      comp[s] = next;
      while (head < tail) {
        int i = queue[head++];
        int x = i % w;
        int y = i / w;
        for (int dy = -1; dy <= 1; dy++) {
          for (int dx = -1; dx <= 1; dx++) {
            int nx = x + dx;
            int ny = y + dy;
            if (nx >= 0 && nx < w && ny >= 0 && ny < h) {
              int j = ny * w + nx;
              if (p[j] == label && comp[j] == 0) {
                comp[j] = next;
                queue[tail++] = j;
              }
            }
          }
        }
      }
      if (tail > bestSize) {
        best = next;
        bestSize = tail;
        bestStart = s;
      }
    }
    int[] out = new int[bestSize];
    int k = 0;
    for (int i = bestStart; k < bestSize; i++) {
      if (comp[i] == best) {
        out[k++] = i;
      }
    }
    return out;
  }

  /** The longest horizontal run {x0, y, x1} of {@code label} pixels, or null if there is none. */
  static int[] longestRun(byte[] p, int w, int h, int label) {
    int[] best = null;
    for (int y = 0; y < h; y++) {
      int start = -1;
      for (int x = 0; x <= w; x++) {
        boolean in = x < w && p[y * w + x] == label;
        if (in && start < 0) {
          start = x;
        } else if (!in && start >= 0) {
          if (best == null || x - 1 - start > best[2] - best[0]) {
            best = new int[] {start, y, x - 1};
          }
          start = -1;
        }
      }
    }
    return best;
  }

  /** The strokes as brush strokes of {@code width} on plane 0, through the pixel centres. */
  SeedStrokes strokes(int w, int h, float width) {
    SeedStrokes s = new SeedStrokes(w, h, 1);
    s.add(foreground.stroke(width, 1, 0.5f));
    s.add(background.stroke(width, 2, 0.5f));
    return s;
  }
}
