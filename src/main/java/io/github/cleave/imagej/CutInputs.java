package io.github.cleave.imagej;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.segment.Illumination;
import io.github.cleave.segment.SegmentationSettings;

/**
 * What the brush session's live cuts are given: the features (flattened as the pipeline would), the
 * neighbourhood, one plane of a stack, and the check that every class up to the highest painted has
 * a seed. Stateless.
 */
final class CutInputs {
  private CutInputs() {}

  /**
   * The features of the live cut: flattened by the rolling ball when the pipeline's AUTO rule would
   * flatten them for these seeds (so that the live contour and the created mask see the same
   * image), else as they are. Decided again at every re-learning, after a pause in painting.
   */
  static Raster liveFeatures(Raster features, SeedLabels seeds) {
    boolean light = Illumination.isLightBackground(features, seeds);
    Illumination.Flattening f =
        Illumination.flatten(features, seeds, SegmentationSettings.DEFAULT_FLATTEN_RADIUS, light);
    return Illumination.shouldFlatten(f) ? f.flattened() : features;
  }

  /** The neighbourhood to cut with: the chosen one if it fits, else the default. */
  static Neighborhood neighborhood(int chosen, boolean volume) {
    if (chosen != 0) {
      Neighborhood nb = Neighborhood.of(chosen);
      if (nb.isThreeDimensional() == volume) {
        return nb;
      }
    }
    return Neighborhood.of(volume ? 6 : 8);
  }

  /** The first class 1..K (K the largest label) that no seed marks, or 0 if every class has one. */
  static int missingClass(SeedLabels seeds) {
    long[] counts = seeds.countsPerLabel();
    for (int c = 1; c < counts.length; c++) {
      if (counts[c] == 0) {
        return c;
      }
    }
    return counts.length < 3 ? counts.length : 0;
  }

  static Raster plane(Raster r, int z) {
    int n = r.width() * r.height();
    float[][] out = new float[r.channelCount()][];
    for (int c = 0; c < out.length; c++) {
      out[c] = new float[n];
      System.arraycopy(r.channel(c), z * n, out[c], 0, n);
    }
    return new Raster(r.width(), r.height(), 1, out, r.voxelSize(), r.kind());
  }

  static SeedLabels plane(SeedLabels s, int z) {
    int n = s.width() * s.height();
    byte[] out = new byte[n];
    System.arraycopy(s.labels(), z * n, out, 0, n);
    return new SeedLabels(s.width(), s.height(), 1, out);
  }
}
