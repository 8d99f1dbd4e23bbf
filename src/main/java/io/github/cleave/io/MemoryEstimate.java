package io.github.cleave.io;

import io.github.cleave.image.BadInputException;
import java.util.Locale;

/**
 * The heap an image will need once read and segmented, estimated from its header before any pixel
 * is allocated, and the check against the heap still free. The estimate is deliberately generous:
 * ImageJ's own copy of the pixels, the {@code float} copy of every channel that Cleave works on,
 * and {@link #SOLVER_BYTES_PER_VOXEL} for the max-flow grid, the cut and the label images.
 */
final class MemoryEstimate {
  /**
   * Heap per voxel (one position in x, y, z, all channels together) for the segmentation after
   * reading: the max-flow state of the grid solver (about 26 to 54 bytes per node, see the
   * benchmark table in DEVELOPERS.md), the terminal costs and the mask and label outputs. A round
   * upper figure, common practice, no source.
   */
  static final long SOLVER_BYTES_PER_VOXEL = 60;

  private MemoryEstimate() {}

  /**
   * Bytes needed for an image of {@code planes} stored planes ({@code channels} of them per z
   * position) of {@code bytesPerPixel} bytes each, holding {@code samplesPerPixel} values per pixel
   * (3 for RGB).
   */
  static long bytesNeeded(
      long width, long height, long planes, int channels, int bytesPerPixel, int samplesPerPixel) {
    long pixels = width * height * planes;
    long voxels = pixels / Math.max(1, channels);
    return pixels * bytesPerPixel
        + pixels * samplesPerPixel * (long) Float.BYTES
        + voxels * SOLVER_BYTES_PER_VOXEL;
  }

  /** Heap not yet used, as far as the JVM may still grow it. */
  static long available() {
    Runtime rt = Runtime.getRuntime();
    return rt.maxMemory() - (rt.totalMemory() - rt.freeMemory());
  }

  /**
   * Heap not yet used; if that is less than {@code needed}, after one request to collect garbage
   * first, so that garbage left by other threads (a folder run reads images in parallel) does not
   * make an image that fits look too large.
   */
  static long availableFor(long needed) {
    long free = available();
    if (free >= needed) {
      return free;
    }
    System.gc();
    return available();
  }

  /**
   * @throws BadInputException if {@code needed} exceeds {@code available}, saying how much is
   *     needed and which {@code -Xmx} would do
   */
  static void check(String file, String size, long needed, long available) {
    if (needed <= available) {
      return;
    }
    long usedNow = Runtime.getRuntime().totalMemory() - Runtime.getRuntime().freeMemory();
    long suggestGiB = Math.max(1, (needed + usedNow + (1L << 30) - 1) >> 30);
    throw new BadInputException(
        String.format(
            Locale.ROOT,
            "%s (%s) is too large for the heap: reading and segmenting it needs about %d MiB, only"
                + " %d MiB are free; start Java with a larger heap, e.g. -Xmx%dg, or crop or"
                + " bin the image",
            file,
            size,
            needed >> 20,
            Math.max(0, available) >> 20,
            suggestGiB + 1));
  }
}
