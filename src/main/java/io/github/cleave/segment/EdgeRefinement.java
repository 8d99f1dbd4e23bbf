package io.github.cleave.segment;

import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.objects.ConnectedComponents;

/**
 * Places the edges of a finished cut at half maximum: one more cut in a thin band around the cut's
 * boundary, with regional costs from a two-class model of each object's own level and the level of
 * the background right around it.
 *
 * <p><b>Why.</b> The likelihoods learned from the whole image describe a narrow background class
 * and a broad object class (objects differ in brightness, and their texture widens the class).
 * Where a blurred edge passes from one to the other, the two likelihoods cross well outside the
 * middle of the edge, so the cut takes in about one voxel of halo all round; the contrast term
 * cannot help, since a blurred edge has no strong step between neighbours anywhere across it. The
 * edge of an object blurred by a symmetric point-spread function passes through the middle between
 * the object level and the background level (the half-maximum edge: common practice in microscopy,
 * no source), and that is where a two-class Gaussian model with one shared variance and equal
 * priors puts its decision boundary (R. O. Duda, P. E. Hart and D. G. Stork, <i>Pattern
 * Classification</i>, 2nd ed., Wiley 2001, ch. 2, from memory).
 *
 * <p><b>Method.</b> The cut's boundary voxels (those with an axial neighbour of the other class)
 * are dilated by {@link #BAND} pixel widths in x and y and by the same physical distance in z, at
 * least one plane (none when the planes are cut one by one): the band. Each connected object of the
 * cut gets its own model: the object level is the mean of its voxels outside the band, the
 * background level the mean of the background voxels in a ring {@link #RING} widths beyond the band
 * that are nearer to this object than to any other (geodesic nearest object); the variance, per
 * channel, is the pooled variance of both samples. In the band, {@code D_p(c) = Σ_channels (I_p −
 * μ_c)² / 2s²}, minus the smaller of the two (only differences matter); outside it the labels of
 * the cut are hard constraints, and so are the seeds. Objects without voxels outside the band or
 * without a ring keep their cut. The cut is then made once more with the same boundary term ({@code
 * CutProblem}), so the new edges stay smooth.
 *
 * <p>Cost: O(n · (BAND + RING)) for the band and ring, plus one build and solve of the grid graph.
 * Stateless and thread-safe.
 */
final class EdgeRefinement {
  /** Half-width of the band re-decided, in pixel widths (our choice, no source). */
  static final int BAND = 3;

  /** Width of the background ring beyond the band, in pixel widths (our choice, no source). */
  static final int RING = 3;

  /** Fewest voxels in an object's interior and in its ring for its own model. */
  static final int MIN_SAMPLES = 8;

  private EdgeRefinement() {}

  /**
   * The cut with its edges re-decided; the flow of the returned outcome is that of the edge cut
   * (hard constraints outside the band contribute nothing to it).
   */
  static Segmenter.CutOutcome refine(
      Raster features,
      byte[] mask,
      SeedLabels seeds,
      EnergyParameters parameters,
      boolean perPlane) {
    int w = features.width();
    int h = features.height();
    int d = features.depth();
    int n = mask.length;
    boolean planes = perPlane && d > 1;
    int bandZ = zReach(BAND, features, planes);
    int outerZ = zReach(BAND + RING, features, planes);
    boolean[] boundary = boundary(mask, w, h, d, planes);
    boolean[] band = dilate(boundary, w, h, d, BAND, bandZ);
    boolean[] outer = dilate(boundary, w, h, d, BAND + RING, outerZ);
    int[] object = ConnectedComponents.of(mask, w, h, d).labels().clone();
    int count = 0;
    for (int k : object) {
      count = Math.max(count, k);
    }
    nearestObject(object, outer, w, h, d, planes);
    Levels levels = Levels.measure(features, mask, band, outer, object, count);
    float[][] costs = new float[2][n];
    byte[] hard = seeds.labels().clone();
    for (int p = 0; p < n; p++) {
      int k = object[p];
      boolean free = band[p] && k > 0 && levels.usable(k);
      if (hard[p] != 0) {
        continue;
      }
      if (!free) {
        hard[p] = (byte) (mask[p] != 0 ? SeedLabels.FOREGROUND : SeedLabels.BACKGROUND);
        continue;
      }
      double fg = 0;
      double bg = 0;
      for (int c = 0; c < features.channelCount(); c++) {
        double v = features.channel(c)[p];
        double s2 = 2 * levels.variance[c][k];
        double a = v - levels.object[c][k];
        double b = v - levels.background[c][k];
        fg += a * a / s2;
        bg += b * b / s2;
      }
      double min = Math.min(fg, bg);
      costs[0][p] = (float) (fg - min);
      costs[1][p] = (float) (bg - min);
    }
    SeedLabels constraints = new SeedLabels(w, h, d, hard);
    return planes
        ? PlaneCuts.cutEachPlane(features, costs, constraints, parameters)
        : Segmenter.cutVolume(features, costs, constraints, parameters);
  }

  /** The band's reach along z in planes: the same physical distance, at least one plane. */
  private static int zReach(int widths, Raster features, boolean planes) {
    if (features.depth() == 1 || planes) {
      return 0;
    }
    double ratio = features.voxelSize().x() / features.voxelSize().z();
    return Math.max(1, (int) Math.round(widths * ratio));
  }

  /** Voxels with an axial neighbour of the other class (in the plane only when cut per plane). */
  private static boolean[] boundary(byte[] mask, int w, int h, int d, boolean planes) {
    boolean[] out = new boolean[mask.length];
    int plane = w * h;
    for (int p = 0; p < mask.length; p++) {
      boolean fg = mask[p] != 0;
      int x = p % w;
      int y = p / w % h;
      int z = p / plane;
      out[p] =
          x > 0 && (mask[p - 1] != 0) != fg
              || x < w - 1 && (mask[p + 1] != 0) != fg
              || y > 0 && (mask[p - w] != 0) != fg
              || y < h - 1 && (mask[p + w] != 0) != fg
              || !planes && z > 0 && (mask[p - plane] != 0) != fg
              || !planes && z < d - 1 && (mask[p + plane] != 0) != fg;
    }
    return out;
  }

  /**
   * Dilation by a city-block diamond of radius {@code rxy} in each plane followed by a segment of
   * ±{@code rz} planes: the product structuring element, so that x, y and z keep their own reach.
   */
  static boolean[] dilate(boolean[] set, int w, int h, int d, int rxy, int rz) {
    int n = set.length;
    boolean[] in = set.clone();
    int[] front = new int[n];
    int size = 0;
    for (int p = 0; p < n; p++) {
      if (in[p]) {
        front[size++] = p;
      }
    }
    int[] next = new int[n];
    for (int step = 0; step < rxy && size > 0; step++) {
      int nextSize = 0;
      for (int i = 0; i < size; i++) {
        int p = front[i];
        int x = p % w;
        int y = p / w % h;
        int[] around = {
          x > 0 ? p - 1 : -1, x < w - 1 ? p + 1 : -1, y > 0 ? p - w : -1, y < h - 1 ? p + w : -1
        };
        for (int q : around) {
          if (q >= 0 && !in[q]) {
            in[q] = true;
            next[nextSize++] = q;
          }
        }
      }
      int[] t = front;
      front = next;
      next = t;
      size = nextSize;
    }
    if (rz == 0) {
      return in;
    }
    boolean[] out = new boolean[n];
    int plane = w * h;
    for (int p = 0; p < n; p++) {
      if (in[p]) {
        int z = p / plane;
        for (int z2 = Math.max(0, z - rz); z2 <= Math.min(d - 1, z + rz); z2++) {
          out[p + (z2 - z) * plane] = true;
        }
      }
    }
    return out;
  }

  /**
   * Gives every unlabelled voxel of {@code region} the label of the nearest object reachable
   * through {@code region} (breadth-first, axial steps, ties to the object reached first).
   */
  private static void nearestObject(
      int[] object, boolean[] region, int w, int h, int d, boolean planes) {
    int n = object.length;
    int plane = w * h;
    int[] queue = new int[n];
    int tail = 0;
    for (int p = 0; p < n; p++) {
      if (object[p] != 0) {
        queue[tail++] = p;
      }
    }
    for (int head = 0; head < tail; head++) {
      int p = queue[head];
      int x = p % w;
      int y = p / w % h;
      int z = p / plane;
      int[] around = {
        x > 0 ? p - 1 : -1,
        x < w - 1 ? p + 1 : -1,
        y > 0 ? p - w : -1,
        y < h - 1 ? p + w : -1,
        !planes && z > 0 ? p - plane : -1,
        !planes && z < d - 1 ? p + plane : -1
      };
      for (int q : around) {
        if (q >= 0 && object[q] == 0 && region[q]) {
          object[q] = object[p];
          queue[tail++] = q;
        }
      }
    }
  }

  /** Per object and channel: object level, background level, pooled variance. */
  private static final class Levels {
    final double[][] object;
    final double[][] background;
    final double[][] variance;
    final long[] inside;
    final long[] ring;

    private Levels(int channels, int count) {
      object = new double[channels][count + 1];
      background = new double[channels][count + 1];
      variance = new double[channels][count + 1];
      inside = new long[count + 1];
      ring = new long[count + 1];
    }

    boolean usable(int k) {
      if (inside[k] < MIN_SAMPLES || ring[k] < MIN_SAMPLES) {
        return false;
      }
      for (double[] v : variance) {
        if (!(v[k] > 0)) {
          return false;
        }
      }
      return true;
    }

    static Levels measure(
        Raster features, byte[] mask, boolean[] band, boolean[] outer, int[] object, int count) {
      int channels = features.channelCount();
      Levels l = new Levels(channels, count);
      int n = mask.length;
      for (int p = 0; p < n; p++) {
        int k = object[p];
        if (k == 0) {
          continue;
        }
        if (mask[p] != 0 && !band[p]) {
          l.inside[k]++;
        } else if (mask[p] == 0 && outer[p] && !band[p]) {
          l.ring[k]++;
        }
      }
      for (int c = 0; c < channels; c++) {
        float[] v = features.channel(c);
        double[] so = new double[count + 1];
        double[] sb = new double[count + 1];
        for (int p = 0; p < n; p++) {
          int k = object[p];
          if (k != 0 && !band[p]) {
            if (mask[p] != 0) {
              so[k] += v[p];
            } else if (outer[p]) {
              sb[k] += v[p];
            }
          }
        }
        for (int k = 1; k <= count; k++) {
          l.object[c][k] = l.inside[k] > 0 ? so[k] / l.inside[k] : 0;
          l.background[c][k] = l.ring[k] > 0 ? sb[k] / l.ring[k] : 0;
        }
        double[] ss = new double[count + 1];
        for (int p = 0; p < n; p++) {
          int k = object[p];
          if (k != 0 && !band[p]) {
            if (mask[p] != 0) {
              double e = v[p] - l.object[c][k];
              ss[k] += e * e;
            } else if (outer[p]) {
              double e = v[p] - l.background[c][k];
              ss[k] += e * e;
            }
          }
        }
        for (int k = 1; k <= count; k++) {
          long m = l.inside[k] + l.ring[k];
          l.variance[c][k] = m > 2 ? ss[k] / (m - 2) : 0;
        }
      }
      return l;
    }
  }
}
