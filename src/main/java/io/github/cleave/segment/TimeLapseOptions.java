package io.github.cleave.segment;

import java.util.Objects;

/**
 * How {@link TimeLapseSegmenter} goes from frame to frame. Immutable value type.
 *
 * @param seedsFromNeighbour whether each frame other than the seeded one gets hard seeds made from
 *     the objects of the frame segmented just before it ({@link FrameSeeds}); when false, those
 *     frames are cut with the learned model alone (default true)
 * @param frameSeeds the margins of those seeds (default {@link FrameSeeds#defaults()})
 * @param listener told after each frame (default {@link TimeLapseListener#NONE})
 */
public record TimeLapseOptions(
    boolean seedsFromNeighbour, FrameSeeds frameSeeds, TimeLapseListener listener) {

  /**
   * @throws NullPointerException if {@code frameSeeds} or {@code listener} is null
   */
  public TimeLapseOptions {
    Objects.requireNonNull(frameSeeds, "frameSeeds");
    Objects.requireNonNull(listener, "listener");
  }

  /** Seeds from the neighbouring frame with the default margins, no listener. */
  public static TimeLapseOptions defaults() {
    return new TimeLapseOptions(true, FrameSeeds.defaults(), TimeLapseListener.NONE);
  }

  public TimeLapseOptions withSeedsFromNeighbour(boolean on) {
    return new TimeLapseOptions(on, frameSeeds, listener);
  }

  public TimeLapseOptions withFrameSeeds(FrameSeeds seeds) {
    return new TimeLapseOptions(seedsFromNeighbour, seeds, listener);
  }

  public TimeLapseOptions withListener(TimeLapseListener l) {
    return new TimeLapseOptions(seedsFromNeighbour, frameSeeds, l);
  }
}
