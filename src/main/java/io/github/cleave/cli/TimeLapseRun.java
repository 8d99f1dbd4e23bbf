package io.github.cleave.cli;

import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.ModelFiles;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.io.SeedFiles;
import io.github.cleave.io.SegmentationFiles;
import io.github.cleave.io.TimeLapseFiles;
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.TimeLapseFrame;
import io.github.cleave.segment.TimeLapseOptions;
import io.github.cleave.segment.TimeLapseResult;
import io.github.cleave.segment.TimeLapseSegmenter;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Optional;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code segment} and {@code apply} on a time-lapse: the seeds (one time point's worth) belong to
 * {@code --seed-time-point}; every time point is cut in turn ({@link TimeLapseSegmenter}), with a
 * progress line per time point, and the outputs hold all of them ({@link TimeLapseFiles}).
 */
final class TimeLapseRun {
  private TimeLapseRun() {}

  static int segment(
      CommandSpec spec,
      OpenedSeries series,
      ImageAndSeedOptions input,
      OutputFolderOption output,
      TimeOptions time,
      SegmentationSettings settings,
      Path saveModel)
      throws Exception {
    Path seedFile = seedFile(input, true);
    SegmentationFiles.Inputs inputs = new SegmentationFiles.Inputs(input.image, seedFile, null);
    SegmentationFiles.prepareOutputFolder(output.out, inputs);
    if (saveModel != null) {
      ModelOutput.check(saveModel, "--save-model", false);
    }
    SeedLabels seeds = readSeeds(seedFile, series);
    announce(spec, series);
    TimeLapseResult result =
        TimeLapseSegmenter.segment(
            series, seeds, time.seedFrame(), settings, withProgress(spec, time, series));
    if (saveModel != null) {
      ModelFiles.write(saveModel, result.model());
    }
    return finish(spec, series, seeds, result, inputs, output, time, "segment");
  }

  static int apply(
      CommandSpec spec,
      OpenedSeries series,
      ImageAndSeedOptions input,
      OutputFolderOption output,
      TimeOptions time,
      SegmentationModel model,
      Path modelFile)
      throws Exception {
    Path seedFile = seedFile(input, false);
    SegmentationFiles.Inputs inputs =
        new SegmentationFiles.Inputs(input.image, seedFile, modelFile);
    SegmentationFiles.prepareOutputFolder(output.out, inputs);
    SeedLabels seeds = seedFile == null ? null : readSeeds(seedFile, series);
    announce(spec, series);
    TimeLapseResult result =
        TimeLapseSegmenter.apply(
            model, series, seeds, time.seedFrame(), withProgress(spec, time, series));
    return finish(spec, series, seeds, result, inputs, output, time, "apply");
  }

  static Path seedFile(ImageAndSeedOptions input, boolean required) {
    if (input.seeds != null) {
      return input.seeds;
    }
    Optional<Path> found = SeedFiles.find(input.image, null);
    if (found.isEmpty() && required) {
      throw new InputException(
          "no seeds for "
              + input.image
              + ": give --seeds FILE (a seed label image of one time point, or a ROI zip), or"
              + " put "
              + SegmentationFiles.baseName(input.image)
              + ".seeds.tif next to the image");
    }
    return found.orElse(null);
  }

  static SeedLabels readSeeds(Path seedFile, OpenedSeries series) {
    return SeedFiles.read(seedFile, series.width(), series.height(), series.depth());
  }

  /** The seeded time point of {@code series}, after checking that it exists. */
  static Raster seededTimePoint(OpenedSeries series, TimeOptions time) {
    int t = time.seedFrame();
    if (t >= series.frameCount()) {
      throw new InputException(
          String.format(
              Locale.ROOT,
              "--seed-time-point %d, but %s has time points 1 to %d",
              t + 1,
              series.title(),
              series.frameCount()));
    }
    return series.frame(t);
  }

  /** Prints what opening the image decided about its time axis, where the user should know. */
  static void notes(CommandSpec spec, OpenedSeries series) {
    PrintWriter err = spec.commandLine().getErr();
    for (String w : series.warnings()) {
      err.println("cleave: note: " + w);
    }
    err.flush();
  }

  private static void announce(CommandSpec spec, OpenedSeries series) {
    Progress.say(
        spec,
        String.format(
            Locale.ROOT,
            "segmenting %s: %d time points (%s)",
            series.title(),
            series.frameCount(),
            series.reason()));
  }

  private static TimeLapseOptions withProgress(
      CommandSpec spec, TimeOptions time, OpenedSeries series) {
    int total = series.frameCount();
    return time.options()
        .withListener(
            (t, done) ->
                Progress.say(
                    spec,
                    String.format(
                        Locale.ROOT, "time point %d done (%d of %d)", t + 1, done, total)));
  }

  private static int finish(
      CommandSpec spec,
      OpenedSeries series,
      SeedLabels seeds,
      TimeLapseResult result,
      SegmentationFiles.Inputs inputs,
      OutputFolderOption output,
      TimeOptions time,
      String command)
      throws Exception {
    String name = SegmentationFiles.baseName(inputs.image());
    TimeLapseFiles.write(
        output.out,
        name,
        series,
        seeds,
        result,
        inputs,
        command,
        time.axis(),
        time.options().seedsFromNeighbour());
    PrintWriter out = spec.commandLine().getOut();
    double ms = 0;
    for (TimeLapseFrame f : result.frames()) {
      ms += f.segmentation().timings().totalMs();
      out.println(
          String.format(
              Locale.ROOT,
              "%s t%d: %d object(s), %d foreground voxel(s)",
              name,
              f.index() + 1,
              f.objectCount(),
              f.segmentation().foregroundCount()));
    }
    out.println(
        String.format(
            Locale.ROOT,
            "%s: %d time points, %d track number(s), %.0f ms",
            name,
            result.frameCount(),
            result.nextNumber() - 1,
            ms));
    PrintWriter err = spec.commandLine().getErr();
    for (String w : result.frame(result.seedFrame()).segmentation().warnings()) {
      err.println("cleave: note: " + name + ": " + w);
    }
    out.flush();
    err.flush();
    return ExitCodes.OK;
  }
}
