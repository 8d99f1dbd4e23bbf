package io.github.cleave.synth;

import io.github.cleave.image.SeedLabels;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * Places seed strokes on a phantom from its ground truth, by a seeded generator, never by hand.
 *
 * <p>A stroke is a straight digital line one voxel wide (8-connected in its plane; in a stack it
 * lies in one plane), covering at most 2 % of the region it lies in ({@link #MAX_SHARE}) and never
 * more than {@link #MAX_LENGTH} voxels:
 *
 * <ul>
 *   <li>a foreground stroke lies in one object, every voxel at chessboard distance (within its
 *       plane) greater than {@link #OBJECT_MARGIN} from any voxel outside that object; it runs
 *       through the object's deepest voxel at a random angle;
 *   <li>a background stroke lies where every voxel is at chessboard distance (3D in a stack)
 *       greater than {@link #BACKGROUND_MARGIN} from any object, at a random angle.
 * </ul>
 *
 * <p>{@link #strokes} makes at most two strokes per class, chosen so that a likelihood learned from
 * them represents the whole image: foreground strokes in the two objects whose mean brightness is
 * nearest the median over objects (among those deep enough for a stroke), preferring a second
 * object far from the first; background strokes at the brightest and the darkest part of the
 * background (tiles of about 1/8 of the image side, ranked by mean brightness). {@link
 * #strokesPerObject} puts one foreground stroke in every object deep enough for one, plus the same
 * two background strokes, for object-splitting tests.
 *
 * <p>Distances are found by multi-source breadth-first search, O(N) per call. Deterministic for a
 * seed; stateless and thread-safe.
 */
public final class StrokeGenerator {
  /** Largest share of its region (object or whole background) that one stroke may cover. */
  public static final double MAX_SHARE = 0.02;

  /** Longest stroke, in voxels. */
  public static final int MAX_LENGTH = 40;

  /** Foreground stroke voxels are farther than this (chessboard voxels) from the object's edge. */
  public static final int OBJECT_MARGIN = 2;

  /** Background stroke voxels are farther than this (chessboard voxels) from every object. */
  public static final int BACKGROUND_MARGIN = 8;

  private StrokeGenerator() {}

  /**
   * At most two foreground and two background strokes.
   *
   * @param truthLabels 0 background, 1..n objects, node order of the image
   * @param brightness the channel that shows the objects (any polarity), same length
   * @throws IllegalArgumentException if the arrays do not fit the size
   */
  public static SeedLabels strokes(
      int[] truthLabels, float[] brightness, int width, int height, int depth, long seed) {
    return make(truthLabels, brightness, width, height, depth, seed, false);
  }

  /**
   * One foreground stroke in every object deep enough for a stroke of at least 3 voxels, and two
   * background strokes as in {@link #strokes}.
   */
  public static SeedLabels strokesPerObject(
      int[] truthLabels, float[] brightness, int width, int height, int depth, long seed) {
    return make(truthLabels, brightness, width, height, depth, seed, true);
  }

  private static SeedLabels make(
      int[] labels, float[] brightness, int w, int h, int d, long seed, boolean perObject) {
    int n = w * h * d;
    if (labels.length != n || brightness.length != n) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "strokes: labels (%d) and brightness (%d) must have %d x %d x %d = %d values",
              labels.length,
              brightness.length,
              w,
              h,
              d,
              n));
    }
    SplittableRandom random = new SplittableRandom(seed);
    byte[] seeds = new byte[n];
    int objects = 0;
    for (int v : labels) {
      objects = Math.max(objects, v);
    }
    int[] size = new int[objects + 1];
    double[] sum = new double[objects + 1];
    double[] sumX = new double[objects + 1];
    double[] sumY = new double[objects + 1];
    for (int i = 0; i < n; i++) {
      size[labels[i]]++;
      sum[labels[i]] += brightness[i];
      sumX[labels[i]] += i % w;
      sumY[labels[i]] += (i / w) % h;
    }
    int[] objectDepth = distance(labels, w, h, d, false);
    int[] deepest = new int[objects + 1];
    Arrays.fill(deepest, -1);
    for (int i = 0; i < n; i++) {
      int k = labels[i];
      if (k > 0 && objectDepth[i] > OBJECT_MARGIN) {
        if (deepest[k] < 0 || objectDepth[i] > objectDepth[deepest[k]]) {
          deepest[k] = i;
        }
      }
    }
    List<Integer> usable = new ArrayList<>();
    for (int k = 1; k <= objects; k++) {
      if (deepest[k] >= 0 && cap(size[k]) >= 3) {
        usable.add(k);
      }
    }
    if (perObject) {
      for (int k : usable) {
        draw(
            seeds,
            labels,
            objectDepth,
            OBJECT_MARGIN,
            k,
            deepest[k],
            cap(size[k]),
            1,
            w,
            h,
            random);
      }
    } else if (!usable.isEmpty()) {
      double[] means = usable.stream().mapToDouble(k -> sum[k] / size[k]).sorted().toArray();
      double median = means[means.length / 2];
      List<Integer> ranked = new ArrayList<>(usable);
      ranked.sort(
          (a, b) ->
              Double.compare(
                  Math.abs(sum[a] / size[a] - median), Math.abs(sum[b] / size[b] - median)));
      // first: a random one of the three most typical; second: the most typical far from it
      int first = ranked.get(random.nextInt(Math.min(3, ranked.size())));
      double far = 0.25 * Math.hypot(w, h);
      int second = -1;
      for (int k : ranked) {
        if (k != first
            && Math.hypot(
                    sumX[k] / size[k] - sumX[first] / size[first],
                    sumY[k] / size[k] - sumY[first] / size[first])
                >= far) {
          second = k;
          break;
        }
      }
      if (second < 0 && ranked.size() > 1) {
        second = ranked.get(ranked.get(0) == first ? 1 : 0);
      }
      draw(
          seeds,
          labels,
          objectDepth,
          OBJECT_MARGIN,
          first,
          deepest[first],
          cap(size[first]),
          1,
          w,
          h,
          random);
      if (second > 0) {
        draw(
            seeds,
            labels,
            objectDepth,
            OBJECT_MARGIN,
            second,
            deepest[second],
            cap(size[second]),
            1,
            w,
            h,
            random);
      }
    }
    backgroundStrokes(seeds, labels, brightness, size[0], w, h, d, random);
    return new SeedLabels(w, h, d, seeds);
  }

  /** Largest stroke length in a region of {@code size} voxels. */
  static int cap(int size) {
    return (int) Math.min(MAX_LENGTH, Math.floor(MAX_SHARE * size));
  }

  private static void backgroundStrokes(
      byte[] seeds,
      int[] labels,
      float[] brightness,
      int bgSize,
      int w,
      int h,
      int d,
      SplittableRandom random) {
    int[] bgDepth = distance(labels, w, h, d, true);
    int tile = Math.max(8, Math.max(w, h) / 8);
    int tileZ = Math.max(1, d / 2);
    int tx = (w + tile - 1) / tile;
    int ty = (h + tile - 1) / tile;
    int tz = (d + tileZ - 1) / tileZ;
    int tiles = tx * ty * tz;
    double[] sum = new double[tiles];
    int[] count = new int[tiles];
    int[] deepest = new int[tiles];
    int[] deepestDepth = new int[tiles];
    Arrays.fill(deepest, -1);
    for (int i = 0; i < labels.length; i++) {
      int x = i % w;
      int y = (i / w) % h;
      int z = i / (w * h);
      // away from objects, and the tile's deepest voxel away from the image border as well
      int border = Math.min(Math.min(x, y), Math.min(w - 1 - x, h - 1 - y)) + 1;
      if (labels[i] == 0 && bgDepth[i] > BACKGROUND_MARGIN) {
        int t = x / tile + tx * (y / tile + ty * (z / tileZ));
        sum[t] += brightness[i];
        count[t]++;
        int depth = Math.min(bgDepth[i], border);
        if (deepest[t] < 0 || depth > deepestDepth[t]) {
          deepest[t] = i;
          deepestDepth[t] = depth;
        }
      }
    }
    int minCount = Math.max(1, tile * tile / 8);
    int bright = -1;
    int dark = -1;
    for (int t = 0; t < tiles; t++) {
      if (count[t] < minCount) {
        continue;
      }
      double mean = sum[t] / count[t];
      if (bright < 0 || mean > sum[bright] / count[bright]) {
        bright = t;
      }
      if (dark < 0 || mean < sum[dark] / count[dark]) {
        dark = t;
      }
    }
    int length = cap(bgSize);
    if (bright >= 0 && length >= 3) {
      draw(seeds, labels, bgDepth, BACKGROUND_MARGIN, 0, deepest[bright], length, 2, w, h, random);
    }
    if (dark >= 0 && dark != bright && length >= 3) {
      draw(seeds, labels, bgDepth, BACKGROUND_MARGIN, 0, deepest[dark], length, 2, w, h, random);
    }
  }

  /**
   * Draws a line through {@code centre} in its plane at a random angle, growing alternately in both
   * directions while the next voxel has label {@code region}, depth above {@code margin} and the
   * stroke is shorter than {@code max}.
   */
  private static void draw(
      byte[] seeds,
      int[] labels,
      int[] depth,
      int margin,
      int region,
      int centre,
      int max,
      int value,
      int w,
      int h,
      SplittableRandom random) {
    double angle = random.nextDouble() * Math.PI;
    double dx = StrictMath.cos(angle);
    double dy = StrictMath.sin(angle);
    int cx = centre % w;
    int cy = (centre / w) % h;
    int plane = centre - cx - w * cy;
    seeds[centre] = (byte) value;
    int drawn = 1;
    boolean[] open = {true, true};
    for (int step = 1; drawn < max && (open[0] || open[1]); step++) {
      for (int side = 0; side < 2 && drawn < max; side++) {
        if (!open[side]) {
          continue;
        }
        double t = side == 0 ? step : -step;
        int x = (int) Math.rint(cx + t * dx);
        int y = (int) Math.rint(cy + t * dy);
        if (x < 0 || y < 0 || x >= w || y >= h) {
          open[side] = false;
          continue;
        }
        int i = plane + x + w * y;
        if (labels[i] != region || depth[i] <= margin) {
          open[side] = false;
        } else if (seeds[i] == 0) {
          seeds[i] = (byte) value;
          drawn++;
        }
      }
    }
  }

  /**
   * Chessboard distance within the voxel's plane (8-neighbourhood) to the nearest voxel of another
   * label, counting the outside of the image as another label; with {@code anyObject} instead the
   * chessboard distance in 3D (26-neighbourhood) of background voxels to the nearest object voxel
   * (image border not counted).
   */
  static int[] distance(int[] labels, int w, int h, int d, boolean anyObject) {
    int n = labels.length;
    int[] dist = new int[n];
    Arrays.fill(dist, Integer.MAX_VALUE);
    int[] queue = new int[n];
    int head = 0;
    int tail = 0;
    for (int i = 0; i < n; i++) {
      int x = i % w;
      int y = (i / w) % h;
      int z = i / (w * h);
      boolean seed;
      if (anyObject) {
        seed = labels[i] != 0;
      } else {
        seed = labels[i] != 0 && touchesOther(labels, i, x, y, z, w, h, d);
      }
      if (seed) {
        dist[i] = anyObject ? 0 : 1;
        queue[tail++] = i;
      }
    }
    while (head < tail) {
      int i = queue[head++];
      int x = i % w;
      int y = (i / w) % h;
      int z = i / (w * h);
      int zr = anyObject ? 1 : 0; // object depth is measured within the plane
      for (int oz = -zr; oz <= zr; oz++) {
        for (int oy = -1; oy <= 1; oy++) {
          for (int ox = -1; ox <= 1; ox++) {
            int nx = x + ox;
            int ny = y + oy;
            int nz = z + oz;
            if (nx < 0 || ny < 0 || nz < 0 || nx >= w || ny >= h || nz >= d) {
              continue;
            }
            int j = nx + w * (ny + h * nz);
            boolean same = anyObject ? labels[j] == 0 : labels[j] == labels[i];
            if (same && dist[j] == Integer.MAX_VALUE) {
              dist[j] = dist[i] + 1;
              queue[tail++] = j;
            }
          }
        }
      }
    }
    return dist;
  }

  /**
   * True if an in-plane neighbour of voxel i (8-neighbourhood), or the outside, has another label.
   */
  private static boolean touchesOther(
      int[] labels, int i, int x, int y, int z, int w, int h, int d) {
    for (int oy = -1; oy <= 1; oy++) {
      for (int ox = -1; ox <= 1; ox++) {
        {
          int nx = x + ox;
          int ny = y + oy;
          int nz = z;
          if (nx < 0 || ny < 0 || nz < 0 || nx >= w || ny >= h || nz >= d) {
            return true;
          }
          if (labels[nx + w * (ny + h * nz)] != labels[i]) {
            return true;
          }
        }
      }
    }
    return false;
  }
}
