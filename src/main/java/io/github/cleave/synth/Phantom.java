package io.github.cleave.synth;

import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.Locale;

/**
 * An invented test image with its ground truth, made by {@link SamplePhantoms}. Never real data.
 *
 * <p>All arrays have the image's voxel count and node order ({@code x + width * (y + height * z)}).
 * They are shared, not copied: a phantom is immutable by convention, and nobody may write into its
 * arrays. Record equality compares the arrays by reference; compare contents with {@link
 * java.util.Arrays#equals}.
 *
 * @param name short name of the recipe ({@code nuclei}, {@code stained}, {@code two-channel},
 *     {@code stack}), used as the file name stem by {@link SampleWriter}
 * @param image the pixels, whole numbers in the range of {@link Raster#kind()}
 * @param truth ground-truth foreground mask: 1 foreground, 0 background
 * @param truthLabels ground-truth objects: 0 background, 1..objectCount objects
 * @param seeds strokes made by {@link StrokeGenerator#strokes} from the truth: 1 foreground, 2
 *     background
 * @param objectCount number of objects in {@code truthLabels}
 * @param touchingPairs number of object pairs placed so that they touch (share a boundary)
 * @param drivingChannel 0-based channel that shows the objects to segment
 */
public record Phantom(
    String name,
    Raster image,
    byte[] truth,
    int[] truthLabels,
    SeedLabels seeds,
    int objectCount,
    int touchingPairs,
    int drivingChannel) {

  /**
   * @throws IllegalArgumentException if an array or the seeds do not fit the image
   */
  public Phantom {
    int n = image.size();
    if (truth.length != n || truthLabels.length != n || !seeds.fits(image)) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "phantom %s: truth (%d), labels (%d) and seeds (%d) must all have the image's %d"
                  + " voxels",
              name,
              truth.length,
              truthLabels.length,
              seeds.size(),
              n));
    }
    if (drivingChannel < 0 || drivingChannel >= image.channelCount()) {
      throw new IllegalArgumentException(
          "phantom " + name + ": driving channel " + drivingChannel + " does not exist");
    }
  }
}
