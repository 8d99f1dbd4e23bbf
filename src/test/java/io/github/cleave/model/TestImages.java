package io.github.cleave.model;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;

/** Small rasters and seed images for the model tests. */
final class TestImages {
  private TestImages() {}

  /** A one-row image of the given channels (each of the same length). */
  static Raster row(PixelKind kind, float[]... channels) {
    return new Raster(channels[0].length, 1, 1, channels, VoxelSize.PIXELS, kind);
  }

  /** One-row seed labels. */
  static SeedLabels seeds(byte[] labels) {
    return new SeedLabels(labels.length, 1, 1, labels);
  }

  /** Costs of every voxel of {@code r}: {@code out[class][voxel]}. */
  static float[][] costs(LikelihoodModel m, Raster r) {
    float[][] out = new float[m.classCount()][r.size()];
    m.costs(r, out);
    return out;
  }
}
