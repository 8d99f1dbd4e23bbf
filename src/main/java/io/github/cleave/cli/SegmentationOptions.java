package io.github.cleave.cli;

import io.github.cleave.image.VoxelSize;
import io.github.cleave.model.ModelKind;
import io.github.cleave.objects.ObjectSettings;
import io.github.cleave.objects.ObjectSplit;
import io.github.cleave.segment.IlluminationMode;
import io.github.cleave.segment.SegmentationSettings;
import java.util.Locale;
import picocli.CommandLine.Option;

/**
 * The segmentation settings shared by {@code segment} and {@code learn}, with their defaults and
 * units in the help text. Channel numbers are 1-based on the command line.
 */
final class SegmentationOptions {

  @Option(
      names = "--boundary-penalty",
      paramLabel = "LAMBDA",
      defaultValue = "" + SegmentationSettings.DEFAULT_BOUNDARY_PENALTY,
      description =
          "Weight of the boundary term (a number >= 0, no unit; default ${DEFAULT-VALUE}). Larger"
              + " gives smoother, shorter boundaries; smaller follows the likelihoods more"
              + " closely. Measured per pixel width of boundary.")
  double boundaryPenalty;

  @Option(
      names = "--contrast-scale",
      paramLabel = "SIGMA|auto",
      defaultValue = "auto",
      description =
          "Intensity difference (in pixel-value units) at which a boundary between neighbours"
              + " becomes cheap; 'auto' (default) estimates it from the image as the root of half"
              + " the mean squared neighbour difference.")
  String contrastScale;

  @Option(
      names = "--neighborhood",
      paramLabel = "K",
      description =
          "Pixel neighbourhood: 4, 8 or 16 for planes (default 8), 6, 18 or 26 for stacks cut"
              + " as volumes (default 6). Larger measures boundary length more faithfully and"
              + " costs more time.")
  Integer neighborhood;

  @Option(
      names = "--likelihood",
      paramLabel = "auto|histogram|mixture",
      defaultValue = "auto",
      description =
          "How class likelihoods are learned from the seeds: 'histogram' (smoothed intensity"
              + " histograms, one channel), 'mixture' (Gaussian mixtures, several channels);"
              + " 'auto' (default) picks histogram for one driving channel, mixture otherwise.")
  String likelihood;

  @Option(
      names = "--refine-rounds",
      paramLabel = "N",
      defaultValue = "" + SegmentationSettings.DEFAULT_REFINEMENT_ROUNDS,
      description =
          "Rounds of learning the likelihoods again from the cut and cutting again (0 to 20,"
              + " default ${DEFAULT-VALUE}); lets a few strokes stand for objects of every"
              + " brightness. Stops early when the cut no longer changes.")
  int refineRounds;

  @Option(
      names = "--channels",
      paramLabel = "C",
      split = ",",
      splitSynopsisLabel = ",",
      description =
          "Channels (numbered from 1) whose values drive the cut. Default: all three of an RGB"
              + " image, channel 1 otherwise.")
  int[] drivingChannels;

  @Option(
      names = "--measure-channels",
      paramLabel = "C",
      split = ",",
      splitSynopsisLabel = ",",
      description = "Channels (numbered from 1) measured per object. Default: all channels.")
  int[] measuredChannels;

  @Option(
      names = "--illumination",
      paramLabel = "auto|flatten|keep",
      defaultValue = "auto",
      description =
          "Flatten uneven illumination with a rolling-ball background before learning:"
              + " 'flatten', 'keep' (never flatten), or 'auto' (default): flatten when the"
              + " background's spread is at least 0.2 times the seed contrast.")
  String illumination;

  @Option(
      names = "--flatten-radius",
      paramLabel = "PIXELS",
      defaultValue = "" + SegmentationSettings.DEFAULT_FLATTEN_RADIUS,
      description =
          "Rolling-ball radius in pixels for flattening (default ${DEFAULT-VALUE}); make it"
              + " larger than the largest object.")
  double flattenRadius;

  @Option(
      names = "--per-plane",
      description = "Cut a stack plane by plane instead of as one volume.")
  boolean perPlane;

  @Option(
      names = "--pixel-size",
      paramLabel = "SIZE",
      split = ",",
      splitSynopsisLabel = ",",
      description =
          "Pixel width, height and voxel depth (X[,Y[,Z]]) to assume when the image file has no"
              + " calibration (Y defaults to X, Z to 1); the outputs say it was assumed.")
  double[] pixelSize;

  @Option(
      names = "--unit",
      paramLabel = "UNIT",
      defaultValue = "pixel",
      description = "Unit of --pixel-size, for example um (default ${DEFAULT-VALUE}).")
  String unit;

  @Option(
      names = "--holes",
      paramLabel = "fill|keep",
      defaultValue = "fill",
      description = "Fill holes inside objects (default) or keep them.")
  String holes;

  @Option(
      names = "--split",
      paramLabel = "shape|strokes|none",
      defaultValue = "shape",
      description =
          "How touching objects are separated: 'shape' (default) by a watershed of the distance"
              + " to the background, 'strokes' one object per separate foreground stroke, 'none'"
              + " one object per connected piece.")
  String split;

  @Option(
      names = "--min-size",
      paramLabel = "SIZE",
      defaultValue = "0",
      description =
          "Smallest object kept: area (planes) or volume (stacks) in calibrated units squared"
              + " or cubed (default 0: keep all).")
  double minSize;

  @Option(
      names = "--max-size",
      paramLabel = "SIZE",
      description = "Largest object kept, in the same units as --min-size (default: no limit).")
  Double maxSize;

  @Option(
      names = "--exclude-edges",
      description = "Drop objects that touch the image's edge (cut off, so not measurable).")
  boolean excludeEdges;

  @Option(
      names = "--exclude-edge-planes",
      description =
          "With --exclude-edges on a stack, also drop objects that touch the first or last"
              + " plane.")
  boolean excludeEdgePlanes;

  /** The settings these options describe. */
  SegmentationSettings settings() {
    try {
      return new SegmentationSettings(
          boundaryPenalty,
          parseContrastScale(),
          neighborhood == null ? 0 : neighborhood,
          parseLikelihood(),
          refineRounds,
          zeroBased(drivingChannels, "--channels"),
          zeroBased(measuredChannels, "--measure-channels"),
          parseIllumination(),
          flattenRadius,
          perPlane,
          assumedVoxelSize(),
          new ObjectSettings(
              parseHoles(),
              parseSplit(),
              minSize,
              maxSize == null ? Double.POSITIVE_INFINITY : maxSize,
              excludeEdges,
              excludeEdgePlanes));
    } catch (IllegalArgumentException e) {
      throw new InputException(e.getMessage());
    }
  }

  private double parseContrastScale() {
    if (contrastScale.equalsIgnoreCase("auto")) {
      return Double.NaN;
    }
    try {
      double sigma = Double.parseDouble(contrastScale);
      if (!(sigma > 0) || Double.isInfinite(sigma)) {
        throw new NumberFormatException();
      }
      return sigma;
    } catch (NumberFormatException e) {
      throw new InputException(
          "--contrast-scale " + contrastScale + ": give a positive number or 'auto'");
    }
  }

  private ModelKind parseLikelihood() {
    return switch (likelihood.toLowerCase(Locale.ROOT)) {
      case "auto" -> ModelKind.AUTO;
      case "histogram" -> ModelKind.HISTOGRAM;
      case "mixture" -> ModelKind.GAUSSIAN_MIXTURE;
      default ->
          throw new InputException(
              "--likelihood " + likelihood + ": use auto, histogram or mixture");
    };
  }

  private IlluminationMode parseIllumination() {
    return switch (illumination.toLowerCase(Locale.ROOT)) {
      case "auto" -> IlluminationMode.AUTO;
      case "flatten" -> IlluminationMode.ON;
      case "keep" -> IlluminationMode.OFF;
      default ->
          throw new InputException(
              "--illumination " + illumination + ": use auto, flatten or keep");
    };
  }

  private boolean parseHoles() {
    return switch (holes.toLowerCase(Locale.ROOT)) {
      case "fill" -> true;
      case "keep" -> false;
      default -> throw new InputException("--holes " + holes + ": use fill or keep");
    };
  }

  private ObjectSplit parseSplit() {
    return switch (split.toLowerCase(Locale.ROOT)) {
      case "shape" -> ObjectSplit.DISTANCE_WATERSHED;
      case "strokes" -> ObjectSplit.PER_STROKE;
      case "none" -> ObjectSplit.NONE;
      default -> throw new InputException("--split " + split + ": use shape, strokes or none");
    };
  }

  private VoxelSize assumedVoxelSize() {
    if (pixelSize == null) {
      return null;
    }
    if (pixelSize.length > 3) {
      throw new InputException(
          "--pixel-size takes one to three numbers (X[,Y[,Z]]), not " + pixelSize.length);
    }
    double x = pixelSize[0];
    double y = pixelSize.length > 1 ? pixelSize[1] : x;
    double z = pixelSize.length > 2 ? pixelSize[2] : 1;
    return new VoxelSize(x, y, z, unit, true);
  }

  private static int[] zeroBased(int[] oneBased, String option) {
    if (oneBased == null) {
      return null;
    }
    int[] out = new int[oneBased.length];
    for (int i = 0; i < out.length; i++) {
      if (oneBased[i] < 1) {
        throw new InputException(option + " " + oneBased[i] + ": channels are numbered from 1");
      }
      out[i] = oneBased[i] - 1;
    }
    return out;
  }
}
