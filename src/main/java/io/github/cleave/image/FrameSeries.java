package io.github.cleave.image;

/**
 * The time points of a time-lapse, one {@link Raster} per frame, loaded when asked for: a frame
 * holds every channel and every z plane of its time point, in the same channel order and voxel size
 * for all frames. Implementations backed by a file or a virtual stack read only the planes of the
 * frame asked for, so a long time-lapse never has to fit in memory at once.
 *
 * <p>Contract: {@code frame(t)} returns a new raster (or a shared immutable one) of the same width,
 * height, depth, channel count, pixel kind and voxel size for every t in {@code 0..frameCount()-1};
 * it may be slow (file reads) and need not be thread-safe. It throws {@link BadInputException} when
 * the frame cannot be read.
 */
public interface FrameSeries {
  /** Number of time points, at least 1. */
  int frameCount();

  /** Time point {@code t} (0-based), every channel and plane. */
  Raster frame(int t);

  /** Time between frames in {@link #timeUnit()}, or NaN when the file does not say. */
  default double frameInterval() {
    return Double.NaN;
  }

  /** Unit of {@link #frameInterval()} ("s", "min", ...; "frame" when unknown). */
  default String timeUnit() {
    return "frame";
  }

  /** A series over rasters already in memory (all of the same shape). */
  static FrameSeries of(Raster... frames) {
    if (frames.length == 0) {
      throw new IllegalArgumentException("a time-lapse needs at least one frame");
    }
    Raster first = frames[0];
    for (int t = 1; t < frames.length; t++) {
      Raster r = frames[t];
      if (r.width() != first.width()
          || r.height() != first.height()
          || r.depth() != first.depth()
          || r.channelCount() != first.channelCount()
          || r.kind() != first.kind()) {
        throw new IllegalArgumentException(
            "frame " + (t + 1) + " differs in size, channels or pixel kind from frame 1");
      }
    }
    Raster[] copy = frames.clone();
    return new FrameSeries() {
      @Override
      public int frameCount() {
        return copy.length;
      }

      @Override
      public Raster frame(int t) {
        return copy[t];
      }
    };
  }
}
