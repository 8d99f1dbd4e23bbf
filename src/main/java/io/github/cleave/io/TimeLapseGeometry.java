package io.github.cleave.io;

import io.github.cleave.image.VoxelSize;
import java.util.Locale;
import java.util.Objects;

/**
 * The shape and timing of a time-lapse's results: {@code frames} time points of {@code width x
 * height x depth} voxels each, the voxel size, and the time between frames. Immutable value type.
 *
 * @param frameInterval time between frames in {@code timeUnit}, or NaN when unknown
 * @param timeUnit unit of the frame interval ("s", "min", ...; "frame" when unknown)
 */
public record TimeLapseGeometry(
    int width,
    int height,
    int depth,
    int frames,
    VoxelSize voxelSize,
    double frameInterval,
    String timeUnit) {

  /**
   * @throws IllegalArgumentException if a count is below 1, a frame holds more than {@code
   *     Integer.MAX_VALUE - 64} voxels, or the frame interval is neither NaN nor positive and
   *     finite
   */
  public TimeLapseGeometry {
    Objects.requireNonNull(voxelSize, "voxelSize");
    if (width < 1 || height < 1 || depth < 1 || frames < 1) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "time-lapse of %d frames of %d x %d x %d: every count must be at least 1",
              frames,
              width,
              height,
              depth));
    }
    if ((long) width * height * depth > Integer.MAX_VALUE - 64) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "frames of %d x %d x %d voxels; at most %d voxels per frame are supported",
              width,
              height,
              depth,
              Integer.MAX_VALUE - 64));
    }
    if (!Double.isNaN(frameInterval) && !(frameInterval > 0 && frameInterval < Double.MAX_VALUE)) {
      throw new IllegalArgumentException(
          "frame interval " + frameInterval + "; give a positive finite number, or NaN if unknown");
    }
    if (timeUnit == null || timeUnit.isBlank()) {
      throw new IllegalArgumentException("time unit must not be empty; use \"frame\" if unknown");
    }
  }

  /** Voxels per frame, {@code width * height * depth}. */
  public int frameSize() {
    return width * height * depth;
  }
}
