package io.github.cleave.model;

import io.github.cleave.image.Raster;

/**
 * A likelihood model learned from seed pixels: for every class (index 0 = foreground, 1 =
 * background, 2.. further classes; seed label = index + 1) the regional cost {@code D(c) = −ln Pr(I
 * | c)} of a voxel with feature vector {@code I} (its values in the model's channels).
 *
 * <p>Contract: costs are finite, non-negative after the model's own shift (a constant per voxel
 * added to every class does not change a cut, so models may subtract the smallest possible cost),
 * and at most {@link #MAX_COST}; a value the seeds never showed gets a large but finite cost, never
 * infinity. Implementations are immutable and thread-safe.
 */
public interface LikelihoodModel {
  /** Upper bound of every regional cost, in nats (e^-30 ~ 1e-13: "never seen"). */
  double MAX_COST = 30.0;

  /** Number of classes (2 for foreground and background). */
  int classCount();

  /** Number of channels of the feature vector the model expects. */
  int channelCount();

  /**
   * Writes {@code out[c][i] = D(c)} of voxel {@code i} of {@code features} for every class {@code
   * c}.
   *
   * @param features an image with exactly {@link #channelCount()} channels
   * @param out {@code classCount()} arrays of length {@code features.size()}
   * @throws IllegalArgumentException if the channel count or array sizes differ
   */
  void costs(Raster features, float[][] out);
}
