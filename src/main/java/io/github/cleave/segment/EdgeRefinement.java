package io.github.cleave.segment;

import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;

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

  /** Half-width of the window of the local levels, in pixel widths (our choice, no source). */
  static final int WINDOW = 2;

  static float[] debugT, debugO, debugB;

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
    int B = Integer.getInteger("edge.band", BAND);
    int R = Integer.getInteger("edge.ring", RING);
    int W = Integer.getInteger("edge.window", WINDOW);
    int bandZ = zReach(B, features, planes);
    int outerZ = zReach(B + R, features, planes) + Integer.getInteger("edge.ringz", 0);
    int windowZ = zReach(W, features, planes);
    boolean[] boundary = boundary(mask, w, h, d, planes);
    boolean[] band = dilate(boundary, w, h, d, B, bandZ);
    boolean[] outer = dilate(boundary, w, h, d, B + R, outerZ);
    double lf = Double.parseDouble(System.getProperty("edge.lambda", "1"));
    parameters =
        new EnergyParameters(
            parameters.boundaryPenalty() * lf,
            parameters.contrastScale(),
            parameters.neighborhood(),
            parameters.voxelSize());
    double frac = Double.parseDouble(System.getProperty("edge.frac", "0.5"));
    float[] inside = new float[n];
    float[] ring = new float[n];
    for (int p = 0; p < n; p++) {
      if (!band[p]) {
        if (mask[p] != 0) {
          inside[p] = 1;
        } else if (outer[p]) {
          ring[p] = 1;
        }
      }
    }
    BoxSums box = new BoxSums(w, h, d, W, W, windowZ);
    float[] insideCount = box.sum(inside, null);
    float[] ringCount = box.sum(ring, null);
    int[] objectSource = nearest(inside, band, w, h, d, planes);
    int[] backgroundSource = nearest(ring, band, w, h, d, planes);
    int channels = features.channelCount();
    float[][] objectLevel = new float[channels][];
    float[][] backgroundLevel = new float[channels][];
    double[] variance = new double[channels];
    for (int c = 0; c < channels; c++) {
      float[] v = features.channel(c);
      objectLevel[c] = box.sum(v, inside);
      backgroundLevel[c] = box.sum(v, ring);
      double ss = 0;
      long m = 0;
      for (int p = 0; p < n; p++) {
        if (inside[p] != 0) {
          objectLevel[c][p] /= insideCount[p];
          double e = v[p] - objectLevel[c][p];
          ss += e * e;
          m++;
        } else if (ring[p] != 0) {
          backgroundLevel[c][p] /= ringCount[p];
          double e = v[p] - backgroundLevel[c][p];
          ss += e * e;
          m++;
        }
      }
      variance[c] = m > 0 ? ss / m : 0;
    }
    if (System.getProperty("edge.debug") != null) {
      debugT = new float[n];
      debugO = new float[n];
      debugB = new float[n];
      java.util.Arrays.fill(debugT, Float.NaN);
    }
    float[][] costs = new float[2][n];
    byte[] hard = seeds.labels().clone();
    for (int p = 0; p < n; p++) {
      if (hard[p] != 0) {
        continue;
      }
      int so = objectSource[p];
      int sb = backgroundSource[p];
      boolean free = band[p] && so >= 0 && sb >= 0;
      double fg = 0;
      double bg = 0;
      for (int c = 0; c < channels && free; c++) {
        if (!(variance[c] > 0)) {
          free = false;
          break;
        }
        double v = features.channel(c)[p];
        double mo = objectLevel[c][so];
        double mb = backgroundLevel[c][sb];
        double shift = (frac - 0.5) * (mo - mb);
        double a = v - mo - shift;
        double b = v - mb - shift;
        fg += a * a / (2 * variance[c]);
        bg += b * b / (2 * variance[c]);
      }
      if (!free) {
        hard[p] = (byte) (mask[p] != 0 ? SeedLabels.FOREGROUND : SeedLabels.BACKGROUND);
        continue;
      }
      if (debugT != null) {
        float[] v0 = features.channel(0);
        debugT[p] =
            (v0[p] - backgroundLevel[0][sb]) / (objectLevel[0][so] - backgroundLevel[0][sb]);
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
   * For every voxel of {@code band}, the nearest voxel with a nonzero {@code source} value reached
   * through the band (breadth-first, axial steps, ties to the one reached first); -1 elsewhere.
   */
  private static int[] nearest(
      float[] source, boolean[] band, int w, int h, int d, boolean planes) {
    int n = source.length;
    int plane = w * h;
    int[] from = new int[n];
    java.util.Arrays.fill(from, -1);
    int[] queue = new int[n];
    int tail = 0;
    for (int p = 0; p < n; p++) {
      if (source[p] != 0) {
        from[p] = p;
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
        if (q >= 0 && from[q] < 0 && band[q]) {
          from[q] = from[p];
          queue[tail++] = q;
        }
      }
    }
    for (int p = 0; p < n; p++) {
      if (!band[p]) {
        from[p] = -1;
      }
    }
    return from;
  }
}
