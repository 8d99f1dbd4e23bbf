package io.github.cleave.segment;

/**
 * Told by {@link TimeLapseSegmenter} after each frame of a time-lapse, on the segmenting thread, in
 * the order the frames are done (the seeded frame first, then forward, then backward). A listener
 * must return quickly and must not throw; to stop the run, interrupt the segmenting thread.
 */
@FunctionalInterface
public interface TimeLapseListener {
  /** A listener that does nothing. */
  TimeLapseListener NONE = (t, count) -> {};

  /**
   * Frame {@code t} (0-based) is segmented and numbered; {@code count} frames are done so far
   * (1..frame count), for a progress display of {@code count / frameCount}.
   */
  void frameDone(int t, int count);
}
