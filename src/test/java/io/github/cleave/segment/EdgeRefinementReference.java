package io.github.cleave.segment;

import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.energy.FixedLabelCut;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.SolveStatus;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.concurrent.CancellationException;

/**
 * The edge refinement as it was before its band preparation was rewritten in fewer passes
 * (2026-12-03), kept so that {@code EdgeRefinementRewriteTest} can check the new one against it
 * voxel for voxel. See {@link EdgeRefinement} for the method.
 */
final class EdgeRefinementReference {

  private EdgeRefinementReference() {}

  /**
   * The cut with its edges re-decided. The flow of the returned outcome is that of the edge cut
   * alone (the boundary between fixed voxels outside the band is not counted); its build time
   * includes finding the band and its levels.
   *
   * @param features the driving channels, as cut
   * @param mask the cut, 255 foreground, 0 background
   * @param seeds hard constraints that stay so
   * @param parameters the boundary term of the cut
   * @param perPlane whether the planes of a stack are cut one by one
   */
  static Segmenter.CutOutcome refine(
      Raster features,
      byte[] mask,
      SeedLabels seeds,
      EnergyParameters parameters,
      boolean perPlane) {
    long start = System.nanoTime();
    int w = features.width();
    int h = features.height();
    int d = features.depth();
    int n = mask.length;
    boolean planes = perPlane && d > 1;
    // the three distances from one search in the plane; each takes its own reach in z
    byte[] steps =
        BoundaryBand.steps(
            mask, w, h, d, planes, EdgeRefinement.BAND + EdgeRefinement.GAP + EdgeRefinement.RING);
    boolean[] band =
        within(steps, EdgeRefinement.BAND, w, h, d, zReach(EdgeRefinement.BAND, features, planes));
    boolean[] gap =
        within(
            steps,
            EdgeRefinement.BAND + EdgeRefinement.GAP,
            w,
            h,
            d,
            zReach(EdgeRefinement.BAND + EdgeRefinement.GAP, features, planes));
    boolean[] outer =
        within(
            steps,
            EdgeRefinement.BAND + EdgeRefinement.GAP + EdgeRefinement.RING,
            w,
            h,
            d,
            zReach(
                EdgeRefinement.BAND + EdgeRefinement.GAP + EdgeRefinement.RING, features, planes));
    byte[] inside = new byte[n];
    byte[] ring = new byte[n];
    boolean[] corridor = new boolean[n]; // band and the background of the gap
    for (int p = 0; p < n; p++) {
      if (band[p]) {
        corridor[p] = true;
      } else if (mask[p] != 0) {
        inside[p] = 1;
      } else if (gap[p]) {
        corridor[p] = true;
      } else if (outer[p]) {
        ring[p] = 1;
      }
    }
    int[] bandVoxels = NearestSourceReference.members(band);
    int[] corridorVoxels = NearestSourceReference.members(corridor);
    int[] rank = new int[n]; // 1 + the position in the list searched through, 0 elsewhere
    for (int i = 0; i < corridorVoxels.length; i++) {
      rank[corridorVoxels[i]] = i + 1;
    }
    int[] throughCorridor =
        NearestSourceReference.search(ring, corridorVoxels, rank, w, h, d, planes);
    int[] backgroundSource = new int[bandVoxels.length];
    for (int i = 0; i < bandVoxels.length; i++) {
      backgroundSource[i] = throughCorridor[rank[bandVoxels[i]] - 1];
    }
    for (int p : corridorVoxels) {
      rank[p] = 0;
    }
    for (int i = 0; i < bandVoxels.length; i++) {
      rank[bandVoxels[i]] = i + 1;
    }
    int[] objectSource = NearestSourceReference.search(inside, bandVoxels, rank, w, h, d, planes);
    Levels levels =
        Levels.measure(
            features,
            inside,
            ring,
            objectSource,
            backgroundSource,
            zReach(EdgeRefinement.WINDOW, features, planes));
    int channels = features.channelCount();
    float[][] costs = new float[2][n];
    byte[] seedLabels = seeds.labels();
    byte[] hard = new byte[n]; // seeds, and the cut's labels; band voxels freed below
    for (int p = 0; p < n; p++) {
      byte cut = (byte) (mask[p] != 0 ? SeedLabels.FOREGROUND : SeedLabels.BACKGROUND);
      hard[p] = seedLabels[p] != 0 ? seedLabels[p] : cut;
    }
    for (int i = 0; i < bandVoxels.length; i++) {
      int p = bandVoxels[i];
      int so = objectSource[i];
      int sb = backgroundSource[i];
      boolean free = seedLabels[p] == 0 && so >= 0 && sb >= 0;
      double fg = 0;
      double bg = 0;
      for (int c = 0; c < channels && free; c++) {
        double v = features.channel(c)[p];
        double a = v - levels.object[c][so];
        double b = v - levels.background[c][sb];
        double s2 = 2 * levels.variance[c];
        free = s2 > 0;
        fg += a * a / s2;
        bg += b * b / s2;
      }
      if (free) {
        double min = Math.min(fg, bg);
        costs[0][p] = (float) (fg - min);
        costs[1][p] = (float) (bg - min);
        hard[p] = 0;
      }
    }
    SeedLabels constraints = new SeedLabels(w, h, d, hard);
    double bandMs = Segmenter.millisSince(start);
    PlaneCuts.Cutter cutter = (f, c, fixed) -> cutFree(f, c, fixed, parameters);
    Segmenter.CutOutcome cut =
        planes
            ? PlaneCuts.cutEachPlane(features, costs, constraints, cutter)
            : cutter.cut(features, costs, constraints);
    return new Segmenter.CutOutcome(cut.mask(), cut.flow(), bandMs + cut.buildMs(), cut.solveMs());
  }

  /** The cut of the voxels that {@code fixed} leaves free (0), the others keeping their labels. */
  private static Segmenter.CutOutcome cutFree(
      Raster features, float[][] costs, SeedLabels fixed, EnergyParameters parameters) {
    long start = System.nanoTime();
    FixedLabelCut problem = FixedLabelCut.build(features, costs[0], costs[1], fixed, parameters);
    double buildMs = Segmenter.millisSince(start);
    MaxFlowResult result = problem.solve();
    if (result.status() == SolveStatus.INTERRUPTED) {
      throw new CancellationException("segmentation interrupted");
    }
    return new Segmenter.CutOutcome(
        problem.mask(result), problem.flowValue(result), buildMs, result.solveNanos() / 1e6);
  }

  /**
   * Local object and background levels per channel, at the interior and ring voxels that some band
   * voxel takes its levels from (elsewhere 0), and the shared variance per channel.
   */
  private record Levels(float[][] object, float[][] background, double[] variance) {
    static Levels measure(
        Raster features,
        byte[] inside,
        byte[] ring,
        int[] objectSource,
        int[] backgroundSource,
        int windowZ) {
      int[] objectSources = distinct(objectSource);
      int[] backgroundSources = distinct(backgroundSource);
      int channels = features.channelCount();
      float[][] object = new float[channels][];
      float[][] background = new float[channels][];
      double[] variance = new double[channels];
      for (int c = 0; c < channels; c++) {
        float[] v = features.channel(c);
        object[c] = new float[v.length];
        background[c] = new float[v.length];
        windowMeans(features, v, inside, objectSources, windowZ, object[c]);
        windowMeans(features, v, ring, backgroundSources, windowZ, background[c]);
        double ss = 0;
        long m = 0;
        for (int p = 0; p < v.length; p += EdgeRefinement.VARIANCE_STRIDE) {
          byte[] members = inside[p] != 0 ? inside : ring[p] != 0 ? ring : null;
          if (members != null) {
            double e = v[p] - windowMean(features, v, members, p, windowZ);
            ss += e * e;
            m++;
          }
        }
        variance[c] = m > 0 ? ss / m : 0;
      }
      return new Levels(object, background, variance);
    }

    /**
     * At each of {@code sources}, the mean of {@code v} over the voxels of {@code members} in the
     * window of ±{@link #EdgeRefinement.WINDOW} widths (±{@code windowZ} planes), stored in {@code
     * out}.
     */
    private static void windowMeans(
        Raster features, float[] v, byte[] members, int[] sources, int windowZ, float[] out) {
      for (int s : sources) {
        out[s] = (float) windowMean(features, v, members, s, windowZ);
      }
    }

    /** The mean of {@code v} over the members in the window around member {@code s}. */
    private static double windowMean(
        Raster features, float[] v, byte[] members, int s, int windowZ) {
      int w = features.width();
      int h = features.height();
      int d = features.depth();
      int x = s % w;
      int y = s / w % h;
      int z = s / (w * h);
      double sum = 0;
      int count = 0;
      for (int z2 = Math.max(0, z - windowZ); z2 <= Math.min(d - 1, z + windowZ); z2++) {
        for (int y2 = Math.max(0, y - EdgeRefinement.WINDOW);
            y2 <= Math.min(h - 1, y + EdgeRefinement.WINDOW);
            y2++) {
          int row = w * (y2 + h * z2);
          for (int x2 = Math.max(0, x - EdgeRefinement.WINDOW);
              x2 <= Math.min(w - 1, x + EdgeRefinement.WINDOW);
              x2++) {
            if (members[row + x2] != 0) {
              sum += v[row + x2];
              count++;
            }
          }
        }
      }
      return sum / count; // count >= 1: s itself is a member
    }

    /** The distinct non-negative values of {@code sources}, ascending. */
    private static int[] distinct(int[] sources) {
      java.util.BitSet seen = new java.util.BitSet(sources.length);
      for (int s : sources) {
        if (s >= 0) {
          seen.set(s);
        }
      }
      return seen.stream().toArray();
    }
  }

  /**
   * The reach along z in planes of a distance of {@code widths} pixel widths: the same physical
   * distance, rounded. (A floor of one plane was tried: on the anisotropic sample stack, 0.2 × 0.2
   * × 0.6 µm, it made the band three times deeper than wide and cost 0.004 to 0.008 in Dice.)
   */
  private static int zReach(int widths, Raster features, boolean planes) {
    if (features.depth() == 1 || planes) {
      return 0;
    }
    double ratio = features.voxelSize().x() / features.voxelSize().z();
    return (int) Math.round(widths * ratio);
  }

  /**
   * Dilation by a city-block diamond of radius {@code rxy} in each plane followed by a segment of
   * ±{@code rz} planes: the product structuring element, so that x, y and z keep their own reach.
   */
  static boolean[] dilate(boolean[] set, int w, int h, int d, int rxy, int rz) {
    return alongZ(BoundaryBand.grow(set, w, h, d, rxy, false), w, h, d, rz);
  }

  /**
   * The voxels within {@code r} steps in the plane of the boundary ({@code 1 ≤ steps ≤ r + 1}, see
   * {@code BoundaryBand.steps}), dilated by a segment of ±{@code rz} planes.
   */
  private static boolean[] within(byte[] steps, int r, int w, int h, int d, int rz) {
    boolean[] in = new boolean[steps.length];
    for (int p = 0; p < steps.length; p++) {
      in[p] = steps[p] != 0 && steps[p] <= r + 1;
    }
    return alongZ(in, w, h, d, rz);
  }

  /** {@code in} dilated by a segment of ±{@code rz} planes ({@code in} itself when rz is 0). */
  private static boolean[] alongZ(boolean[] in, int w, int h, int d, int rz) {
    if (rz == 0) {
      return in;
    }
    boolean[] out = new boolean[in.length];
    int plane = w * h;
    for (int z = 0; z < d; z++) {
      int to = z * plane;
      for (int z2 = Math.max(0, z - rz); z2 <= Math.min(d - 1, z + rz); z2++) {
        int from = z2 * plane;
        for (int i = 0; i < plane; i++) {
          out[to + i] |= in[from + i];
        }
      }
    }
    return out;
  }
}
