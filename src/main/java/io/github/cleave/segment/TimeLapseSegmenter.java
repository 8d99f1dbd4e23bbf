package io.github.cleave.segment;

import io.github.cleave.image.BadInputException;
import io.github.cleave.image.FrameSeries;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.objects.FrameTracking;
import java.util.Arrays;
import java.util.Locale;
import java.util.concurrent.CancellationException;

/**
 * Segments every frame of a time-lapse from the seeds of one frame and numbers the objects so that
 * a cell keeps its number from frame to frame.
 *
 * <ol>
 *   <li>The seeded frame s is segmented with its seeds ({@link Segmenter#segment}); the model
 *       learned there (likelihoods after its refinement rounds, contrast scale, illumination
 *       decision) is applied to every other frame ({@link Segmenter#apply}), re-estimating the
 *       likelihoods on each frame for the model's refinement rounds ({@link
 *       SegmentationModel#relearnedOnEachImage}), so slow bleaching is followed without the model
 *       drifting away from the seeds' frame.
 *   <li>Frames are done forward s+1, s+2, ..., last, then backward s−1, ..., 0. Each gets hard
 *       seeds made from the objects of the frame done just before it (t−1 forward, t+1 backward) by
 *       {@link FrameSeeds}, unless the options turn this off; the seeded frame keeps its own seeds
 *       only.
 *   <li>Numbers: the seeded frame's objects keep their numbers 1..n; every other frame is numbered
 *       against the frame it was seeded from by {@link FrameTracking}, new tracks taking numbers
 *       above every number used so far (so forward frames get theirs before backward frames).
 * </ol>
 *
 * <p>One frame's raster is held at a time (read from the series when its turn comes); the result
 * keeps each frame's segmentation (mask, label image, measurements). After each frame the options'
 * {@link TimeLapseListener} is told. Interrupting the calling thread stops the run with a {@link
 * CancellationException}, between frames or within a cut. Stateless; separate calls may run in
 * parallel on separate series.
 */
public final class TimeLapseSegmenter {
  private TimeLapseSegmenter() {}

  /**
   * Segments and tracks every frame.
   *
   * @param frames the time-lapse; every frame of the size of the seeded one
   * @param seeds the seeds of frame {@code seedFrame}: at least one foreground and one background
   *     voxel, as {@link Segmenter#segment} needs
   * @param seedFrame the frame the seeds belong to, 0-based
   * @throws BadInputException if {@code seedFrame} is not a frame, the seeds do not fit the frame,
   *     or a frame differs in size or channels from the seeded one
   * @throws CancellationException if the thread is interrupted
   */
  public static TimeLapseResult segment(
      FrameSeries frames,
      SeedLabels seeds,
      int seedFrame,
      SegmentationSettings settings,
      TimeLapseOptions options) {
    checkFrame(seedFrame, frames.frameCount());
    checkInterrupt(seedFrame);
    Raster first = frames.frame(seedFrame);
    Segmentation seeded = Segmenter.segment(first, seeds, settings);
    return track(frames, seedFrame, new Shape(first), seeded, seeded.model(), options);
  }

  /**
   * Applies a saved model to every frame: frame {@code startFrame} with {@code seeds} (may be null)
   * as hard constraints, every other frame as in {@link #segment}, seeded from its neighbour.
   *
   * @throws BadInputException if {@code startFrame} is not a frame, the image does not fit the
   *     model (see {@link Segmenter#apply}), or a frame differs in size or channels from the first
   * @throws CancellationException if the thread is interrupted
   */
  public static TimeLapseResult apply(
      SegmentationModel model,
      FrameSeries frames,
      SeedLabels seeds,
      int startFrame,
      TimeLapseOptions options) {
    checkFrame(startFrame, frames.frameCount());
    checkInterrupt(startFrame);
    Raster first = frames.frame(startFrame);
    Segmentation start = Segmenter.apply(model.relearnedOnEachImage(), first, seeds);
    return track(frames, startFrame, new Shape(first), start, model, options);
  }

  /** Every frame after {@code first} (frame {@code s}, done), forward then backward. */
  private static TimeLapseResult track(
      FrameSeries frames,
      int s,
      Shape shape,
      Segmentation first,
      SegmentationModel model,
      TimeLapseOptions options) {
    int count = frames.frameCount();
    TimeLapseFrame[] done = new TimeLapseFrame[count];
    int n = first.objects().count();
    int[] identity = new int[n + 1];
    for (int k = 0; k <= n; k++) {
      identity[k] = k;
    }
    done[s] = TimeLapseFrame.of(s, first, identity);
    int finished = 1;
    options.listener().frameDone(s, finished);
    int next = n + 1;
    for (int t = s + 1; t < count; t++) {
      next = step(frames, t, done[t - 1], shape, model, options, done, next);
      options.listener().frameDone(t, ++finished);
    }
    for (int t = s - 1; t >= 0; t--) {
      next = step(frames, t, done[t + 1], shape, model, options, done, next);
      options.listener().frameDone(t, ++finished);
    }
    return new TimeLapseResult(Arrays.asList(done), s, model, next);
  }

  private static void checkFrame(int seedFrame, int count) {
    if (seedFrame < 0 || seedFrame >= count) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "seeds on frame %d, but the time-lapse has frames 1..%d: put the seeds on one of its"
                  + " frames",
              seedFrame + 1,
              count));
    }
  }

  /** Segments frame {@code t} from its neighbour {@code from}; returns the next free number. */
  private static int step(
      FrameSeries frames,
      int t,
      TimeLapseFrame from,
      Shape reference,
      SegmentationModel model,
      TimeLapseOptions options,
      TimeLapseFrame[] done,
      int next) {
    checkInterrupt(t);
    Raster image = frames.frame(t);
    reference.check(image, t);
    SeedLabels hard =
        options.seedsFromNeighbour() ? options.frameSeeds().from(from.segmentation()) : null;
    Segmentation result = Segmenter.apply(model.relearnedOnEachImage(), image, hard);
    FrameTracking.Renumbering numbers =
        FrameTracking.match(from.trackedLabels(), result.objects(), next);
    done[t] = TimeLapseFrame.of(t, result, numbers.numberOf());
    return numbers.nextNumber();
  }

  /** Size and channels of the seeded frame, which every frame must share. */
  private record Shape(int width, int height, int depth, int channels, String text) {
    Shape(Raster r) {
      this(r.width(), r.height(), r.depth(), r.channelCount(), r.toString());
    }

    void check(Raster image, int t) {
      if (image.width() != width
          || image.height() != height
          || image.depth() != depth
          || image.channelCount() != channels) {
        throw new BadInputException(
            String.format(
                Locale.ROOT,
                "frame %d is %s but the seeded frame is %s: every frame of a time-lapse must have"
                    + " the same size and channels",
                t + 1,
                image,
                text));
      }
    }
  }

  private static void checkInterrupt(int t) {
    if (Thread.currentThread().isInterrupted()) {
      throw new CancellationException(
          "time-lapse segmentation interrupted before frame " + (t + 1));
    }
  }
}
