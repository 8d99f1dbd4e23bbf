package io.github.cleave.segment;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.model.ModelKind;
import io.github.cleave.objects.ObjectSettings;
import io.github.cleave.objects.ObjectSplit;
import java.util.Arrays;
import java.util.Locale;

/**
 * Every setting of a segmentation, with the defaults a microscopist can start from. Immutable; the
 * {@code with...} methods return changed copies, {@link #toBuilder()} changes several at once.
 * Channel numbers are 0-based here (the command line and the plugin show them 1-based).
 *
 * @param boundaryPenalty λ ≥ 0, the weight of the boundary term: larger gives smoother, shorter
 *     boundaries (default {@value #DEFAULT_BOUNDARY_PENALTY})
 * @param contrastScale σ in the units of the pixel values, or {@code NaN} to estimate it from the
 *     image (default)
 * @param neighborhood 4, 8 or 16 for planes, 6, 18 or 26 for stacks cut as volumes, or 0 for the
 *     default (8 for planes, 6 for stacks)
 * @param modelKind which likelihood model to learn
 * @param refinementRounds how often the likelihoods are learned again from the cut and the image
 *     cut again (0 to use the seeds' likelihoods only; default {@value
 *     #DEFAULT_REFINEMENT_ROUNDS}); see {@code RefinedCut}
 * @param drivingChannels the channels whose values drive the cut, or {@code null}: all three of an
 *     RGB image, the first channel otherwise
 * @param measuredChannels the channels measured per object, or {@code null} for all
 * @param illumination whether to flatten uneven illumination first
 * @param flattenRadius rolling-ball radius in pixels, larger than the largest object
 * @param perPlane whether a stack is cut plane by plane instead of as one volume
 * @param assumedVoxelSize the pixel size to use when the image file has no calibration, or {@code
 *     null} for 1 pixel
 * @param objects how objects are formed, split and filtered from the mask
 */
public record SegmentationSettings(
    double boundaryPenalty,
    double contrastScale,
    int neighborhood,
    ModelKind modelKind,
    int refinementRounds,
    int[] drivingChannels,
    int[] measuredChannels,
    IlluminationMode illumination,
    double flattenRadius,
    boolean perPlane,
    VoxelSize assumedVoxelSize,
    ObjectSettings objects) {

  /** Default λ. */
  public static final double DEFAULT_BOUNDARY_PENALTY = 2.0;

  /** Default number of refinement rounds. */
  public static final int DEFAULT_REFINEMENT_ROUNDS = 3;

  /** Largest rolling-ball radius accepted, in pixels. */
  public static final double MAX_FLATTEN_RADIUS = 5000;

  /** Default rolling-ball radius in pixels. */
  public static final double DEFAULT_FLATTEN_RADIUS = 50;

  /**
   * Connected pieces of the cut with fewer voxels than this are noise and are removed from the mask
   * before objects are formed (see {@code MaskCleaning}).
   */
  public static final int SPECK_VOXELS = 9;

  /**
   * Default object rules: fill holes, split touching objects at the necks of the distance map
   * ({@link ObjectSplit#DISTANCE_WATERSHED}), no size or edge filter. Touching nuclei are common in
   * fluorescence images and a hole inside an object is almost always an unstained part of it
   * (nucleolus, vacuole); both choices measured on {@code SamplePhantoms}: without splitting, every
   * touching pair counts as one wrong object (common practice, no source).
   */
  public static final ObjectSettings DEFAULT_OBJECTS =
      new ObjectSettings(true, ObjectSplit.DISTANCE_WATERSHED, 0, 0, false);

  /**
   * @throws IllegalArgumentException naming the value and what is accepted
   */
  public SegmentationSettings {
    if (!(boundaryPenalty >= 0) || Double.isInfinite(boundaryPenalty)) {
      throw new IllegalArgumentException(
          "boundary penalty "
              + boundaryPenalty
              + ": use a number of 0 or more (typical 0.5 to 20)");
    }
    if (!Double.isNaN(contrastScale)
        && (!(contrastScale > 0) || Double.isInfinite(contrastScale))) {
      throw new IllegalArgumentException(
          "contrast scale " + contrastScale + ": use a positive number, or 'auto'");
    }
    if (neighborhood != 0) {
      Neighborhood.of(neighborhood); // throws naming the accepted values
    }
    if (refinementRounds < 0 || refinementRounds > 20) {
      throw new IllegalArgumentException(
          "refinement rounds " + refinementRounds + ": use a whole number from 0 to 20");
    }
    if (!(flattenRadius > 0) || flattenRadius > MAX_FLATTEN_RADIUS) {
      throw new IllegalArgumentException(
          "flattening radius "
              + flattenRadius
              + " pixels: use a positive number up to "
              + MAX_FLATTEN_RADIUS);
    }
    drivingChannels = checkChannels(drivingChannels, "driving");
    measuredChannels = checkChannels(measuredChannels, "measured");
  }

  /** The defaults. */
  public static SegmentationSettings defaults() {
    return new SegmentationSettings(
        DEFAULT_BOUNDARY_PENALTY,
        Double.NaN,
        0,
        ModelKind.AUTO,
        DEFAULT_REFINEMENT_ROUNDS,
        null,
        null,
        IlluminationMode.AUTO,
        DEFAULT_FLATTEN_RADIUS,
        false,
        null,
        DEFAULT_OBJECTS);
  }

  /** A builder holding these settings, to change several at once. */
  public Builder toBuilder() {
    return new Builder(this);
  }

  public SegmentationSettings withBoundaryPenalty(double lambda) {
    return toBuilder().boundaryPenalty(lambda).build();
  }

  public SegmentationSettings withRefinementRounds(int rounds) {
    return toBuilder().refinementRounds(rounds).build();
  }

  public SegmentationSettings withContrastScale(double sigma) {
    return toBuilder().contrastScale(sigma).build();
  }

  public SegmentationSettings withNeighborhood(int n) {
    return toBuilder().neighborhood(n).build();
  }

  public SegmentationSettings withModelKind(ModelKind kind) {
    return toBuilder().modelKind(kind).build();
  }

  public SegmentationSettings withDrivingChannels(int[] channels) {
    return toBuilder().drivingChannels(channels).build();
  }

  public SegmentationSettings withMeasuredChannels(int[] channels) {
    return toBuilder().measuredChannels(channels).build();
  }

  public SegmentationSettings withIllumination(IlluminationMode mode, double radius) {
    return toBuilder().illumination(mode).flattenRadius(radius).build();
  }

  public SegmentationSettings withPerPlane(boolean planes) {
    return toBuilder().perPlane(planes).build();
  }

  public SegmentationSettings withAssumedVoxelSize(VoxelSize size) {
    return toBuilder().assumedVoxelSize(size).build();
  }

  public SegmentationSettings withObjects(ObjectSettings o) {
    return toBuilder().objects(o).build();
  }

  /** Mutable holder of settings; {@link #build()} checks them. Not thread-safe. */
  public static final class Builder {
    private double boundaryPenalty;
    private double contrastScale;
    private int neighborhood;
    private ModelKind modelKind;
    private int refinementRounds;
    private int[] drivingChannels;
    private int[] measuredChannels;
    private IlluminationMode illumination;
    private double flattenRadius;
    private boolean perPlane;
    private VoxelSize assumedVoxelSize;
    private ObjectSettings objects;

    private Builder(SegmentationSettings s) {
      boundaryPenalty = s.boundaryPenalty;
      contrastScale = s.contrastScale;
      neighborhood = s.neighborhood;
      modelKind = s.modelKind;
      refinementRounds = s.refinementRounds;
      drivingChannels = s.drivingChannels;
      measuredChannels = s.measuredChannels;
      illumination = s.illumination;
      flattenRadius = s.flattenRadius;
      perPlane = s.perPlane;
      assumedVoxelSize = s.assumedVoxelSize;
      objects = s.objects;
    }

    public Builder boundaryPenalty(double v) {
      boundaryPenalty = v;
      return this;
    }

    public Builder contrastScale(double v) {
      contrastScale = v;
      return this;
    }

    public Builder neighborhood(int v) {
      neighborhood = v;
      return this;
    }

    public Builder modelKind(ModelKind v) {
      modelKind = v;
      return this;
    }

    public Builder refinementRounds(int v) {
      refinementRounds = v;
      return this;
    }

    public Builder drivingChannels(int[] v) {
      drivingChannels = v;
      return this;
    }

    public Builder measuredChannels(int[] v) {
      measuredChannels = v;
      return this;
    }

    public Builder illumination(IlluminationMode v) {
      illumination = v;
      return this;
    }

    public Builder flattenRadius(double v) {
      flattenRadius = v;
      return this;
    }

    public Builder perPlane(boolean v) {
      perPlane = v;
      return this;
    }

    public Builder assumedVoxelSize(VoxelSize v) {
      assumedVoxelSize = v;
      return this;
    }

    public Builder objects(ObjectSettings v) {
      objects = v;
      return this;
    }

    /**
     * @throws IllegalArgumentException naming the value and what is accepted
     */
    public SegmentationSettings build() {
      return new SegmentationSettings(
          boundaryPenalty,
          contrastScale,
          neighborhood,
          modelKind,
          refinementRounds,
          drivingChannels,
          measuredChannels,
          illumination,
          flattenRadius,
          perPlane,
          assumedVoxelSize,
          objects);
    }
  }

  /** A copy of the driving channels, or null. */
  @Override
  public int[] drivingChannels() {
    return drivingChannels == null ? null : drivingChannels.clone();
  }

  /** A copy of the measured channels, or null. */
  @Override
  public int[] measuredChannels() {
    return measuredChannels == null ? null : measuredChannels.clone();
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof SegmentationSettings s
        && Double.compare(boundaryPenalty, s.boundaryPenalty) == 0
        && Double.compare(contrastScale, s.contrastScale) == 0
        && neighborhood == s.neighborhood
        && modelKind == s.modelKind
        && refinementRounds == s.refinementRounds
        && Arrays.equals(drivingChannels, s.drivingChannels)
        && Arrays.equals(measuredChannels, s.measuredChannels)
        && illumination == s.illumination
        && Double.compare(flattenRadius, s.flattenRadius) == 0
        && perPlane == s.perPlane
        && java.util.Objects.equals(assumedVoxelSize, s.assumedVoxelSize)
        && java.util.Objects.equals(objects, s.objects);
  }

  @Override
  public int hashCode() {
    return java.util.Objects.hash(
        boundaryPenalty,
        contrastScale,
        neighborhood,
        modelKind,
        refinementRounds,
        Arrays.hashCode(drivingChannels),
        Arrays.hashCode(measuredChannels),
        illumination,
        flattenRadius,
        perPlane,
        assumedVoxelSize,
        objects);
  }

  @Override
  public String toString() {
    return String.format(
        Locale.ROOT,
        "boundary penalty %s, contrast scale %s, neighborhood %s, model %s, illumination %s",
        boundaryPenalty,
        Double.isNaN(contrastScale) ? "auto" : contrastScale,
        neighborhood == 0 ? "default" : neighborhood,
        modelKind,
        illumination);
  }

  private static int[] checkChannels(int[] channels, String what) {
    if (channels == null) {
      return null;
    }
    if (channels.length == 0) {
      throw new IllegalArgumentException("no " + what + " channel given: name at least one");
    }
    for (int c : channels) {
      if (c < 0) {
        throw new IllegalArgumentException(
            what + " channel " + (c + 1) + ": channels are numbered from 1");
      }
    }
    return channels.clone();
  }
}
