package io.github.cleave.io;

/**
 * How to read the slices of an image that has a single time point but several slices: a file saved
 * without its time axis (a common mistake) looks like a z-stack. Only consulted when the image has
 * one frame; an image with real frames (ImageJ's T dimension above 1) is always read as a
 * time-lapse of those frames.
 */
public enum TimeAxis {
  /**
   * Decide from the calibration (the default): the slices are read as time points when the image
   * has a frame interval and no z spacing, or a frame interval and a description that names a
   * time-lapse; otherwise they are the z planes of one volume. See {@link Hyperstacks}.
   */
  AUTO,
  /** The slices are time points, each a single plane. */
  SLICES_ARE_FRAMES,
  /** The slices are the z planes of one volume (one time point). */
  SLICES_ARE_Z
}
