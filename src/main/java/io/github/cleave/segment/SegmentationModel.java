package io.github.cleave.segment;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.model.LikelihoodModel;

/**
 * What is learned once and applied to many images: the likelihood model, every setting, and the
 * values resolved while learning (contrast scale, whether and how illumination was flattened, the
 * image's channel count and pixel kind, the calibration). Applying it to an image with another
 * channel count fails; another calibration gives a warning. Immutable.
 *
 * @param likelihood the regional term, learned from the seeds of the learning image
 * @param settings every setting, as given (channels resolved)
 * @param contrastScale σ used by the boundary term (estimated on the learning image unless set)
 * @param flatten whether illumination is flattened before the likelihoods
 * @param lightBackground whether flattening treats the background as the brighter side
 * @param imageChannels the channel count of the learning image
 * @param pixelKind the pixel kind of the learning image
 * @param voxelSize the calibration of the learning image
 * @param softwareVersion the version of Cleave that learned it
 */
public record SegmentationModel(
    LikelihoodModel likelihood,
    SegmentationSettings settings,
    double contrastScale,
    boolean flatten,
    boolean lightBackground,
    int imageChannels,
    PixelKind pixelKind,
    VoxelSize voxelSize,
    String softwareVersion) {

  /**
   * @throws IllegalArgumentException naming the value if σ is not positive and finite, the channel
   *     count is below 1, or the driving channels do not match the likelihood's channel count
   */
  public SegmentationModel {
    if (!(contrastScale > 0) || Double.isInfinite(contrastScale)) {
      throw new IllegalArgumentException(
          "contrast scale " + contrastScale + " must be a positive number");
    }
    if (imageChannels < 1) {
      throw new IllegalArgumentException("image channel count " + imageChannels + " must be >= 1");
    }
    int[] driving = settings.drivingChannels();
    if (driving != null && driving.length != likelihood.channelCount()) {
      throw new IllegalArgumentException(
          driving.length
              + " driving channel(s) but the likelihood model has "
              + likelihood.channelCount());
    }
    if (driving != null) {
      for (int c : driving) {
        if (c >= imageChannels) {
          throw new IllegalArgumentException(
              "driving channel " + (c + 1) + " but the image has " + imageChannels + " channel(s)");
        }
      }
    }
  }

  /** Format version of model files written by this version. */
  public static final int FORMAT_VERSION = 1;

  /** The same model with another likelihood (after refinement rounds). */
  public SegmentationModel withLikelihood(LikelihoodModel refined) {
    return new SegmentationModel(
        refined,
        settings,
        contrastScale,
        flatten,
        lightBackground,
        imageChannels,
        pixelKind,
        voxelSize,
        softwareVersion);
  }
}
