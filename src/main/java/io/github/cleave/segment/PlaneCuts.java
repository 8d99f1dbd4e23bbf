package io.github.cleave.segment;

import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.Arrays;

/**
 * Cuts a stack plane by plane with a 2D neighbourhood: each plane is an independent graph with the
 * plane's regional costs and seeds; the masks are stacked and the flows summed. Used when the
 * planes of a stack are not a volume (or when the user asks for it).
 */
final class PlaneCuts {
  private PlaneCuts() {}

  /** How one plane (or a whole volume) is cut. */
  interface Cutter {
    Segmenter.CutOutcome cut(Raster features, float[][] costs, SeedLabels seeds);
  }

  static Segmenter.CutOutcome cutEachPlane(
      Raster features, float[][] costs, SeedLabels seeds, EnergyParameters parameters) {
    return cutEachPlane(
        features, costs, seeds, (f, c, s) -> Segmenter.cutVolume(f, c, s, parameters));
  }

  /** Each plane cut by {@code cutter}, with the plane's features, costs and labels. */
  static Segmenter.CutOutcome cutEachPlane(
      Raster features, float[][] costs, SeedLabels seeds, Cutter cutter) {
    int w = features.width();
    int h = features.height();
    int plane = w * h;
    byte[] mask = new byte[features.size()];
    long flow = 0;
    double buildMs = 0;
    double solveMs = 0;
    for (int z = 0; z < features.depth(); z++) {
      int from = z * plane;
      int to = from + plane;
      float[][] channels = new float[features.channelCount()][];
      for (int c = 0; c < channels.length; c++) {
        channels[c] = Arrays.copyOfRange(features.channel(c), from, to);
      }
      Raster planeFeatures = new Raster(w, h, 1, channels, features.voxelSize(), features.kind());
      float[][] planeCosts = new float[costs.length][];
      for (int k = 0; k < costs.length; k++) {
        planeCosts[k] = Arrays.copyOfRange(costs[k], from, to);
      }
      SeedLabels planeSeeds = new SeedLabels(w, h, 1, Arrays.copyOfRange(seeds.labels(), from, to));
      Segmenter.CutOutcome cut = cutter.cut(planeFeatures, planeCosts, planeSeeds);
      System.arraycopy(cut.mask(), 0, mask, from, plane);
      flow += cut.flow();
      buildMs += cut.buildMs();
      solveMs += cut.solveMs();
    }
    return new Segmenter.CutOutcome(mask, flow, buildMs, solveMs);
  }
}
