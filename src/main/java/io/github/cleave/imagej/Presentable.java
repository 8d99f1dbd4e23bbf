package io.github.cleave.imagej;

/**
 * Results made by a command and not yet shown: the images, the table and the ROIs of one image
 * ({@link ResultImages}) or of a time-lapse ({@link TimeLapseImages}). Nothing is shown until
 * {@link #show} is called, so a stopped or failed run shows nothing at all.
 */
interface Presentable {
  /**
   * Shows the images and the Results table and, if asked, adds the ROIs to the ROI Manager; with no
   * display only batch-mode images are kept (nothing is shown).
   */
  void show(boolean roisToManager);

  /** One line for the status bar: what was made. */
  String summary();

  /** Notes for the user (time axis decisions, calibration), each one sentence; may be empty. */
  java.util.List<String> notes();
}
