package io.github.cleave.segment;

import java.util.List;

/**
 * The segmentation of every frame of a time-lapse with tracked object numbers ({@link
 * TimeLapseFrame}), made by {@link TimeLapseSegmenter}. Immutable by convention.
 *
 * @param frames one entry per frame, in time order ({@code frames.get(t).index() == t})
 * @param seedFrame the frame whose seeds taught the model, 0-based
 * @param model the model learned on the seeded frame and applied to all others
 * @param nextNumber a number above every tracked number used: the number of tracks is at most
 *     {@code nextNumber - 1}
 */
public record TimeLapseResult(
    List<TimeLapseFrame> frames, int seedFrame, SegmentationModel model, int nextNumber) {

  public TimeLapseResult {
    frames = List.copyOf(frames);
    for (int t = 0; t < frames.size(); t++) {
      if (frames.get(t).index() != t) {
        throw new IllegalArgumentException(
            "frame list entry " + t + " holds frame " + frames.get(t).index());
      }
    }
  }

  /** Frame {@code t} (0-based). */
  public TimeLapseFrame frame(int t) {
    return frames.get(t);
  }

  public int frameCount() {
    return frames.size();
  }
}
