package io.github.cleave.imagej;

import io.github.cleave.segment.TimeLapseListener;
import java.util.Locale;

/**
 * Per-frame progress of a time-lapse run on a {@link WorkProgress}: the band {@code [0, share)} of
 * the bar is cut into one equal part per time point, and after each time point the next part
 * begins, with a status line saying how many time points are done. Called on the segmenting thread
 * ({@link TimeLapseListener}); returns at once.
 */
final class FrameProgress implements TimeLapseListener {
  private final WorkProgress progress;
  private final int frames;
  private final double share;
  private final long voxelsPerFrame;

  /**
   * @param frames the number of time points, at least 1
   * @param share the end of the band the time points share, in (0, 1]
   * @param voxelsPerFrame voxels of one time point (for the expected length of a part)
   */
  FrameProgress(WorkProgress progress, int frames, double share, long voxelsPerFrame) {
    if (frames < 1 || !(share > 0 && share <= 1)) {
      throw new IllegalArgumentException(
          "frame progress over " + frames + " time point(s) in [0, " + share + ")");
    }
    this.progress = progress;
    this.frames = frames;
    this.share = share;
    this.voxelsPerFrame = voxelsPerFrame;
  }

  /** Starts the first time point's part (the seeded one, {@code seedFrame} 0-based). */
  void begin(int seedFrame) {
    progress.phase(line(0, seedFrame), 0, share / frames, voxelsPerFrame);
  }

  @Override
  public void frameDone(int t, int count) {
    if (count < frames) {
      progress.phase(
          line(count, -1), share * count / frames, share * (count + 1) / frames, voxelsPerFrame);
    }
  }

  /** The status line while {@code done} time points are finished. */
  String line(int done, int seedFrame) {
    String what =
        seedFrame >= 0
            ? String.format(Locale.ROOT, "time point %d (the seeds' one)", seedFrame + 1)
            : "time point";
    return String.format(
        Locale.ROOT, "segmenting %s, %d of %d done (Esc stops)", what, done, frames);
  }
}
