package io.github.cleave.cli;

import io.github.cleave.io.Hyperstacks;
import io.github.cleave.io.ModelFiles;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.io.SegmentationFiles;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.Segmenter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code cleave apply}: segments one image with a saved model. */
@Command(
    name = "apply",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Segments one image with a model saved by 'learn' (or 'segment --save-model'), writing the"
          + " same outputs as 'segment'. Seeds are optional and act as fixed marks.",
      "Exit codes: 0 done; 2 bad arguments or unusable input (for example an image with other"
          + " channels than the model's); 130 interrupted."
    })
final class ApplyCommand implements Callable<Integer> {
  @Option(
      names = "--model",
      required = true,
      paramLabel = "MODEL.json",
      description = "Model file.")
  Path model;

  @Mixin ImageAndSeedOptions input;

  @Mixin OutputFolderOption output;

  @Mixin TimeOptions time;

  @Spec CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    SegmentationModel m = ModelFiles.read(model);
    OpenedSeries series = Hyperstacks.openSeries(input.image, time.axis());
    TimeLapseRun.notes(spec, series);
    if (series.frameCount() > 1) {
      return TimeLapseRun.apply(spec, series, input, output, time, m, model);
    }
    ImageInputs.ImageWithSeeds in =
        input.seeds == null
            ? new ImageInputs.ImageWithSeeds(
                io.github.cleave.io.ImageFiles.read(input.image), null, null)
            : ImageInputs.read(input.image, input.seeds, true);
    SegmentationFiles.Inputs inputs =
        new SegmentationFiles.Inputs(input.image, in.seedFile(), model);
    SegmentationFiles.prepareOutputFolder(output.out, inputs);
    Progress.say(spec, "segmenting " + input.image.getFileName() + " with " + model.getFileName());
    Segmentation result = Segmenter.apply(m, in.image().raster(), in.seeds());
    String name = SegmentationFiles.baseName(input.image);
    SegmentationFiles.write(output.out, name, in.image(), in.seeds(), result, inputs, "apply");
    Summary.print(name, result, spec.commandLine().getOut(), spec.commandLine().getErr());
    return ExitCodes.OK;
  }
}
