package io.github.cleave.cli;

import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.Hyperstacks;
import io.github.cleave.io.ModelFiles;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.Segmenter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code cleave learn}: learns a model from one image's seeds and saves it as JSON. */
@Command(
    name = "learn",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Learns a model from one image and its seeds (the likelihoods of foreground and"
          + " background, refined by the cut, with every setting) and saves it as JSON, to segment"
          + " other images with 'apply' or a folder run.",
      "Exit codes: 0 done; 2 bad arguments or unusable input; 130 interrupted."
    })
final class LearnCommand implements Callable<Integer> {
  @Option(
      names = "--model",
      required = true,
      paramLabel = "MODEL.json",
      description = "The model file to write.")
  Path model;

  @Option(names = "--force", description = "Replace an existing model file.")
  boolean force;

  @Mixin SegmentationOptions options;

  @Mixin ImageAndSeedOptions input;

  @Mixin TimeOptions time;

  @Spec CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    var settings = options.settings();
    ModelOutput.check(model, "--model", force);
    OpenedSeries series = Hyperstacks.openSeries(input.image, time.axis());
    TimeLapseRun.notes(spec, series);
    Raster raster;
    SeedLabels seeds;
    Path seedFile;
    if (series.frameCount() > 1) { // learn from the time point the seeds were drawn on
      seedFile = TimeLapseRun.seedFile(input, true);
      seeds = TimeLapseRun.readSeeds(seedFile, series);
      raster = TimeLapseRun.seededTimePoint(series, time);
    } else {
      ImageInputs.ImageWithSeeds in = ImageInputs.read(input.image, input.seeds, true);
      seedFile = in.seedFile();
      seeds = in.seeds();
      raster = in.image().raster();
    }
    for (Path input : new Path[] {input.image, seedFile}) {
      if (Files.exists(model) && Files.isSameFile(model, input)) {
        throw new InputException("--model " + model + " is an input file: choose another name");
      }
    }
    Progress.say(spec, "learning from " + input.image.getFileName());
    Segmentation result = Segmenter.segment(raster, seeds, settings);
    ModelFiles.write(model, result.model());
    for (String w : result.warnings()) {
      spec.commandLine().getErr().println("cleave: note: " + w);
    }
    spec.commandLine()
        .getOut()
        .println(
            String.format(
                Locale.ROOT,
                "model written to %s (contrast scale %.4g, illumination %s)",
                model,
                result.model().contrastScale(),
                result.model().flatten() ? "flattened" : "kept"));
    return ExitCodes.OK;
  }
}
