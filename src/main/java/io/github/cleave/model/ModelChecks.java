package io.github.cleave.model;

import io.github.cleave.image.Raster;
import java.util.Locale;

/** Argument checks shared by the models' {@code costs} methods. */
final class ModelChecks {
  private ModelChecks() {}

  static void checkCostArguments(LikelihoodModel m, Raster features, float[][] out) {
    if (features.channelCount() != m.channelCount()) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "the image has %d channel(s) but the likelihood model was learned on %d",
              features.channelCount(),
              m.channelCount()));
    }
    if (out.length != m.classCount()) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "%d output arrays for a model of %d classes",
              out.length,
              m.classCount()));
    }
    for (int c = 0; c < out.length; c++) {
      if (out[c].length != features.size()) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "output array %d has length %d; the image has %d voxels",
                c + 1,
                out[c].length,
                features.size()));
      }
    }
  }
}
