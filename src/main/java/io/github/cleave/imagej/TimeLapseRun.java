package io.github.cleave.imagej;

import ij.IJ;
import ij.ImagePlus;
import io.github.cleave.io.Hyperstacks;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.segment.FrameSeeds;
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.TimeLapseOptions;
import io.github.cleave.segment.TimeLapseResult;
import io.github.cleave.segment.TimeLapseSegmenter;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CancellationException;

/**
 * The time-lapse path of {@code Segment Current Image...} and {@code Apply Model...}: every time
 * point of the current image is segmented by {@link TimeLapseSegmenter} (the seeds' time point
 * first, then forward and backward, each from its neighbour's objects when the settings say so),
 * with ImageJ's progress bar moving per time point ({@link FrameProgress}) and Esc stopping the run
 * ({@link CancellationException}; nothing is made then). The results are built only after the last
 * time point ({@link TimeLapseImages}) and are not shown here.
 *
 * <p>Which axis is time is decided by {@link Hyperstacks#of} from {@link TimeSettings#axis()}; its
 * reason and warnings are the first notes of the result, and are logged by the command, so a
 * detected time-lapse is never cut as one volume without a word. Stateless.
 */
final class TimeLapseRun {
  private TimeLapseRun() {}

  /** The share of the progress bar the time points use; the rest is for building the images. */
  static final double SEGMENTING_SHARE = 0.9;

  /** The time-lapse of {@code imp} under {@code time}'s axis (reads no time point yet). */
  static OpenedSeries series(ImagePlus imp, TimeSettings time) {
    return Hyperstacks.of(imp, time.axis());
  }

  /** The notes of a series: what was read as time and why, then its warnings. */
  static List<String> notes(OpenedSeries series) {
    List<String> notes = new ArrayList<>();
    notes.add(series.reason());
    notes.addAll(series.warnings());
    return notes;
  }

  /** Learns from {@code seeds} on their time point and segments every time point. */
  static TimeLapseImages segment(
      ImagePlus imp,
      OpenedSeries series,
      TimeSeeds seeds,
      SegmentationSettings settings,
      TimeSettings time,
      String command,
      List<String> inputs) {
    return run(
        imp,
        series,
        seeds,
        time,
        command,
        inputs,
        options ->
            TimeLapseSegmenter.segment(series, seeds.seeds(), seeds.frame(), settings, options));
  }

  /** Applies {@code model} from the seeds' time point (seeds optional) to every time point. */
  static TimeLapseImages apply(
      ImagePlus imp,
      OpenedSeries series,
      SegmentationModel model,
      TimeSeeds seeds,
      TimeSettings time,
      String command,
      List<String> inputs) {
    return run(
        imp,
        series,
        seeds,
        time,
        command,
        inputs,
        options -> TimeLapseSegmenter.apply(model, series, seeds.seeds(), seeds.frame(), options));
  }

  private interface Work {
    TimeLapseResult run(TimeLapseOptions options);
  }

  private static TimeLapseImages run(
      ImagePlus imp,
      OpenedSeries series,
      TimeSeeds seeds,
      TimeSettings time,
      String command,
      List<String> inputs,
      Work work) {
    long voxels = (long) series.width() * series.height() * series.depth();
    IJ.showStatus(
        "Cleave: segmenting "
            + series.frameCount()
            + " time points of "
            + imp.getTitle()
            + " (Esc stops)");
    TimeLapseResult result;
    try (EscapeWatch esc = EscapeWatch.interrupting(Thread.currentThread());
        WorkProgress progress = WorkProgress.start()) {
      FrameProgress frames =
          new FrameProgress(progress, series.frameCount(), SEGMENTING_SHARE, voxels);
      frames.begin(seeds.frame());
      TimeLapseOptions options =
          new TimeLapseOptions(time.seedsFromNeighbour(), FrameSeeds.defaults(), frames);
      result = work.run(options);
      progress.phase("making the result images", SEGMENTING_SHARE, 0.99, voxels);
      List<String> lines = new ArrayList<>(inputs);
      lines.add("seeds: " + seeds.from());
      lines.add("time: " + series.reason());
      lines.add(
          "time points: "
              + series.frameCount()
              + ", seeds from the neighbouring time point: "
              + (time.seedsFromNeighbour() ? "yes" : "no")
              + ", tracks: "
              + (result.nextNumber() - 1));
      for (String w : series.warnings()) {
        lines.add("note: " + w);
      }
      lines.add("the cut values and object count below are those of the seeds' time point");
      String info =
          ResultImages.info(imp, result.frame(result.seedFrame()).segmentation(), command, lines);
      return TimeLapseImages.of(imp, series, result, info, notes(series));
    } finally {
      Thread.interrupted(); // a late Esc must not reach the caller's next wait
    }
  }
}
