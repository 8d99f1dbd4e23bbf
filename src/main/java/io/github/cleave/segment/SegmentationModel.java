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
 * @param likelihoodRefined whether {@code likelihood} is the one the refinement rounds learned
 *     again from the cut of the learning image (a model saved after segmenting); such a model is
 *     applied as it is, without running the rounds again on each image (see {@link
 *     #roundsWhenApplied}). False for a model learned from the seeds alone, and for model files
 *     written before this field existed.
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
    String softwareVersion,
    boolean likelihoodRefined) {

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

  /**
   * The model after the refinement rounds of its learning image: {@code refined} as its likelihood,
   * marked as refined.
   */
  public SegmentationModel withLikelihood(LikelihoodModel refined) {
    return with(refined, true);
  }

  /**
   * The refinement rounds to run when this model is applied to an image: none when the likelihood
   * is already refined (re-learning it on each image was measured to change Dice by at most 0.001
   * on the sample phantoms while costing a model fit and a re-solve per round), else the setting's.
   */
  public int roundsWhenApplied() {
    return likelihoodRefined ? 0 : settings.refinementRounds();
  }

  /**
   * The same model, its likelihood to be re-estimated on each image it is applied to for the
   * setting's refinement rounds (time-lapses: each time point follows slow changes such as
   * bleaching).
   */
  public SegmentationModel relearnedOnEachImage() {
    return with(likelihood, false);
  }

  private SegmentationModel with(LikelihoodModel model, boolean refined) {
    return new SegmentationModel(
        model,
        settings,
        contrastScale,
        flatten,
        lightBackground,
        imageChannels,
        pixelKind,
        voxelSize,
        softwareVersion,
        refined);
  }
}
