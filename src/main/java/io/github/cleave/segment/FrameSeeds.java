package io.github.cleave.segment;

import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.objects.ObjectDistances;
import io.github.cleave.objects.ObjectLabels;
import java.util.Locale;

/**
 * Seeds for the next frame of a time-lapse from the objects found in the frame before, on the
 * assumption that no object boundary moves farther than a margin between two frames.
 *
 * <ul>
 *   <li><b>Foreground seeds</b>: the voxels of each previous object farther than {@code
 *       foregroundMargin} from every voxel that is not of that object (background or another
 *       object), i.e. each object eroded on its own: two touching objects stay two separate seed
 *       regions with a gap of at least twice the margin between them. An object too thin to keep a
 *       voxel under this erosion gives <em>no</em> seed: a forced voxel where a small object was
 *       would become a false one-voxel object once it has moved away; the likelihood model alone
 *       decides there.
 *   <li><b>Background seeds</b>: the voxels farther than {@code backgroundMargin} and at most
 *       {@code backgroundReach} from the nearest previous foreground voxel: a band around the
 *       previous objects that stops the cut from leaking out of them, while a cell appearing
 *       farther away (entering the field of view, drifting into focus) can still be found by the
 *       model. An infinite reach makes every voxel beyond the margin background. A previous frame
 *       without objects gives no seeds at all.
 * </ul>
 *
 * <p>Distances are exact Euclidean distances between voxel centres in calibrated units ({@link
 * ObjectDistances}, honouring anisotropic voxels of a z-stack); the margins are given in pixels of
 * the in-plane x size: a margin m means a distance of {@code m · voxelSize.x()} in every direction,
 * so in z it spans {@code m · x / z} planes. Voxels outside the image count neither as background
 * nor as objects.
 *
 * <p>Defaults ({@link #defaults()}): foreground margin {@value #DEFAULT_FOREGROUND_MARGIN} px,
 * background margin {@value #DEFAULT_BACKGROUND_MARGIN} px, reach {@value
 * #DEFAULT_BACKGROUND_REACH} px. A time-lapse of cells or nuclei is usually sampled so that an
 * object moves by a small part of its own radius between frames, a few pixels at most (otherwise no
 * overlap-based tracking could follow it); the margins add about a pixel for a change of size or
 * shape and a pixel for the uncertainty of the previous boundary itself. The background margin is
 * the larger because cells more often grow than shrink between frames. Objects narrower than about
 * twice the foreground margin (8 px) give no foreground seed. These are common practice, no source;
 * set larger margins for faster motion.
 *
 * <p>O(N) time and memory plus the bounding boxes of the objects. Immutable, thread-safe.
 *
 * <p>After a segmentation into several classes, each object's seeds take the object's class ({@link
 * #from(Segmentation)}).
 *
 * @param foregroundMargin erosion of each previous object, in pixels (x size), ≥ 0
 * @param backgroundMargin distance from the previous foreground below which no background seed is
 *     set, in pixels, ≥ 0
 * @param backgroundReach distance beyond which no background seed is set, in pixels, ≥ {@code
 *     backgroundMargin}; {@link Double#POSITIVE_INFINITY} for no limit
 */
public record FrameSeeds(double foregroundMargin, double backgroundMargin, double backgroundReach) {

  /** Default erosion of the previous objects for foreground seeds, pixels. */
  public static final double DEFAULT_FOREGROUND_MARGIN = 4;

  /** Default gap between the previous objects and the background seeds, pixels. */
  public static final double DEFAULT_BACKGROUND_MARGIN = 6;

  /** Default outer limit of the background seeds, pixels from the previous objects. */
  public static final double DEFAULT_BACKGROUND_REACH = 20;

  /**
   * @throws IllegalArgumentException naming the value if a margin is negative or not a number, or
   *     the reach is below the background margin
   */
  public FrameSeeds {
    if (!(foregroundMargin >= 0) || Double.isInfinite(foregroundMargin)) {
      throw new IllegalArgumentException(
          "foreground margin " + foregroundMargin + " px: use a finite number of 0 or more");
    }
    if (!(backgroundMargin >= 0) || Double.isInfinite(backgroundMargin)) {
      throw new IllegalArgumentException(
          "background margin " + backgroundMargin + " px: use a finite number of 0 or more");
    }
    if (!(backgroundReach >= backgroundMargin)) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "background reach %s px: use a number of at least the background margin (%s px),"
                  + " or infinity for no limit",
              backgroundReach,
              backgroundMargin));
    }
  }

  /** The defaults stated in the class comment. */
  public static FrameSeeds defaults() {
    return new FrameSeeds(
        DEFAULT_FOREGROUND_MARGIN, DEFAULT_BACKGROUND_MARGIN, DEFAULT_BACKGROUND_REACH);
  }

  /** Seeds (1 foreground, 2 background) from the objects of the previous frame. */
  public SeedLabels from(ObjectLabels previous, VoxelSize size) {
    return from(previous.labels(), previous.width(), previous.height(), previous.depth(), size);
  }

  /**
   * Seeds from the previous frame's segmentation: each object's seed voxels take its class (1 for a
   * two-class segmentation, {@link ClassMap#classOf} otherwise), the background band 2.
   */
  public SeedLabels from(Segmentation previous) {
    ObjectLabels objects = previous.objects();
    SeedLabels seeds = from(objects, previous.voxelSize());
    if (!previous.isMultiClass()) {
      return seeds;
    }
    byte[] labels = seeds.labels();
    int[] numbers = objects.labels();
    for (int i = 0; i < labels.length; i++) {
      if (labels[i] == SeedLabels.FOREGROUND) {
        labels[i] = (byte) previous.classes().classOf(numbers[i]);
      }
    }
    return seeds;
  }

  /**
   * Seeds (1 foreground, 2 background) from a label image of the previous frame (0 background, any
   * positive numbers; equal numbers are one object).
   *
   * @throws IllegalArgumentException if the array does not have {@code w·h·d} values or a label is
   *     negative
   */
  public SeedLabels from(int[] previous, int w, int h, int d, VoxelSize size) {
    float[] inside = ObjectDistances.toOtherLabels(previous, w, h, d, size);
    byte[] background = new byte[previous.length];
    boolean any = false;
    for (int i = 0; i < previous.length; i++) {
      if (previous[i] == 0) {
        background[i] = (byte) 255;
      } else {
        any = true;
      }
    }
    byte[] seeds = new byte[previous.length];
    if (!any) {
      return new SeedLabels(w, h, d, seeds);
    }
    float[] outside = ObjectDistances.toBackground(background, w, h, d, size);
    double fg = foregroundMargin * size.x();
    double near = backgroundMargin * size.x();
    double far = backgroundReach * size.x();
    for (int i = 0; i < seeds.length; i++) {
      if (previous[i] != 0) {
        if (inside[i] > fg) {
          seeds[i] = SeedLabels.FOREGROUND;
        }
      } else if (outside[i] > near && outside[i] <= far) {
        seeds[i] = SeedLabels.BACKGROUND;
      }
    }
    return new SeedLabels(w, h, d, seeds);
  }
}
