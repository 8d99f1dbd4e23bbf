package io.github.cleave.cli;

import io.github.cleave.io.Hyperstacks;
import io.github.cleave.io.ModelFiles;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.io.SegmentationFiles;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.Segmenter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code cleave segment}: learns the likelihoods from an image's seeds, cuts it, and writes the
 * outputs of {@link SegmentationFiles}.
 */
@Command(
    name = "segment",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Segments one image from its seeds: learns what foreground and background look like from"
          + " the seed strokes, computes the minimum cut, forms and measures objects, and writes"
          + " NAME.mask.tif, NAME.labels.tif, NAME.objects.csv, NAME.rois.zip, NAME.overlay.png"
          + " and NAME.record.json into the output folder.",
      "Seeds: a seed label image (0 none, 1 foreground, 2 background, 3.. further classes) or an"
          + " ImageJ ROI zip whose ROI names start with 'foreground'/'fg', 'background'/'bg' or"
          + " 'classN'. Seeds of three or more classes segment every class (alpha-expansion) and"
          + " add NAME.classes.tif and a class column.",
      "Exit codes: 0 done; 2 bad arguments or unusable input; 130 interrupted."
    })
final class SegmentCommand implements Callable<Integer> {
  @Option(
      names = "--save-model",
      paramLabel = "MODEL.json",
      description = "Also save the learned model, for 'apply' and folder runs.")
  Path saveModel;

  @Mixin SegmentationOptions options;

  @Mixin ImageAndSeedOptions input;

  @Mixin OutputFolderOption output;

  @Mixin TimeOptions time;

  @Spec CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    var settings = options.settings();
    OpenedSeries series = Hyperstacks.openSeries(input.image, time.axis());
    TimeLapseRun.notes(spec, series);
    if (series.frameCount() > 1) {
      return TimeLapseRun.segment(spec, series, input, output, time, settings, saveModel);
    }
    ImageInputs.ImageWithSeeds in = ImageInputs.read(input.image, input.seeds, true);
    SegmentationFiles.Inputs inputs =
        new SegmentationFiles.Inputs(input.image, in.seedFile(), null);
    SegmentationFiles.prepareOutputFolder(output.out, inputs);
    if (saveModel != null) {
      ModelOutput.check(saveModel, "--save-model", false);
    }
    Progress.say(spec, "segmenting " + input.image.getFileName());
    Segmentation result = Segmenter.segment(in.image().raster(), in.seeds(), settings);
    String name = SegmentationFiles.baseName(input.image);
    if (saveModel != null) {
      ModelFiles.write(saveModel, result.model());
    }
    SegmentationFiles.write(output.out, name, in.image(), in.seeds(), result, inputs, "segment");
    Summary.print(name, result, spec.commandLine().getOut(), spec.commandLine().getErr());
    return ExitCodes.OK;
  }
}
