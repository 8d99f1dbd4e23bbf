package io.github.cleave.imagej;

import io.github.cleave.io.TimeAxis;

/**
 * The time-lapse settings of a dialog ({@link SettingsFields#timeFields()}): which axis is time,
 * whether each time point gets seeds from the one segmented before it, and the time point of seeds
 * that do not carry one. Immutable value type.
 *
 * @param axis how slices of an image without frames are read ({@link TimeAxis})
 * @param seedsFromNeighbour whether every time point but the seeded one gets hard seeds from the
 *     objects of its neighbour ({@link io.github.cleave.segment.TimeLapseOptions})
 * @param seedFrame the 1-based time point of seeds without a time position (a seed image of one
 *     time point, ROIs without a T position, or no seeds at all), or 0 for the image's current one
 */
record TimeSettings(TimeAxis axis, boolean seedsFromNeighbour, int seedFrame) {
  /**
   * @throws IllegalArgumentException if {@code axis} is null or {@code seedFrame} is negative
   */
  TimeSettings {
    if (axis == null || seedFrame < 0) {
      throw new IllegalArgumentException(
          "time settings need an axis and a seed frame of 0 or more, not "
              + axis
              + ", "
              + seedFrame);
    }
  }

  /** The dialog's defaults: axis auto, seeds from the neighbour, the current time point. */
  static TimeSettings defaults() {
    return new TimeSettings(TimeAxis.AUTO, true, 0);
  }
}
