package io.github.cleave.segment;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.List;
import java.util.Locale;

/**
 * What the pipeline resolves from its inputs before it computes anything: seeds that fit the image
 * (any number of classes; the learner checks that none is missing), the calibration to use (the
 * file's, or the assumed one, with a warning), the driving and measured channels, and the
 * neighbourhood. Every refusal is a {@link BadInputException} with a message for the user.
 * Stateless.
 */
final class SegmentInputs {
  private SegmentInputs() {}

  static SeedLabels checkSeeds(Raster image, SeedLabels seeds) {
    if (!seeds.fits(image)) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "the seeds are %d x %d x %d but the image is %d x %d x %d: draw the seeds on this"
                  + " image, or give the seed file made for it",
              seeds.width(),
              seeds.height(),
              seeds.depth(),
              image.width(),
              image.height(),
              image.depth()));
    }
    return seeds;
  }

  /** The seeds, after checking that they use no class the model does not know. */
  static SeedLabels checkSeedClasses(SeedLabels seeds, int modelClasses) {
    int max = seeds.maxLabel();
    if (max > modelClasses) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "the seeds use class label %d but the model knows classes 1 to %d: use seed labels"
                  + " of the model's classes, or learn a model with %d classes",
              max,
              modelClasses,
              max));
    }
    return seeds;
  }

  static VoxelSize resolveVoxelSize(
      Raster image, SegmentationSettings settings, List<String> warnings) {
    VoxelSize size = image.voxelSize();
    if (size.assumed()) {
      VoxelSize assumed =
          settings.assumedVoxelSize() != null ? settings.assumedVoxelSize() : VoxelSize.PIXELS;
      size = new VoxelSize(assumed.x(), assumed.y(), assumed.z(), assumed.unit(), true);
      warnings.add(
          String.format(
              Locale.ROOT,
              "the image has no spatial calibration: assumed %s x %s x %s %s per voxel",
              size.x(),
              size.y(),
              size.z(),
              size.unit()));
    }
    return size;
  }

  static int[] drivingChannels(Raster image, SegmentationSettings settings) {
    int[] chosen = settings.drivingChannels();
    if (chosen == null) {
      if (image.kind() == PixelKind.RGB) {
        return new int[] {0, 1, 2};
      }
      return new int[] {0};
    }
    checkChannelsExist(image, chosen, "driving");
    return chosen;
  }

  static int[] measuredChannels(Raster image, SegmentationSettings settings) {
    int[] chosen = settings.measuredChannels();
    if (chosen == null) {
      int[] all = new int[image.channelCount()];
      for (int c = 0; c < all.length; c++) {
        all[c] = c;
      }
      return all;
    }
    checkChannelsExist(image, chosen, "measured");
    return chosen;
  }

  static void checkChannelsExist(Raster image, int[] channels, String what) {
    for (int c : channels) {
      if (c >= image.channelCount()) {
        throw new BadInputException(
            String.format(
                Locale.ROOT,
                "%s channel %d does not exist: the image has channels 1 to %d",
                what,
                c + 1,
                image.channelCount()));
      }
    }
  }

  static Raster features(Raster image, SegmentationSettings settings) {
    return image.selectChannels(drivingChannels(image, settings));
  }

  static Neighborhood neighborhood(Raster image, SegmentationSettings settings) {
    boolean volume = image.depth() > 1 && !settings.perPlane();
    int n = settings.neighborhood() != 0 ? settings.neighborhood() : volume ? 6 : 8;
    Neighborhood nb = Neighborhood.of(n);
    if (nb.isThreeDimensional() != volume) {
      throw new BadInputException(
          volume
              ? "neighborhood "
                  + n
                  + " is for single planes; a stack cut as a volume takes 6,"
                  + " 18 or 26 (or cut it plane by plane)"
              : "neighborhood " + n + " is for stacks cut as volumes; a plane takes 4, 8 or 16");
    }
    return nb;
  }
}
