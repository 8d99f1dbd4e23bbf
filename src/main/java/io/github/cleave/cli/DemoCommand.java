package io.github.cleave.cli;

import io.github.cleave.image.BadInputException;
import io.github.cleave.io.ImageFiles;
import io.github.cleave.io.ImageOutputs;
import io.github.cleave.io.SegmentationFiles;
import io.github.cleave.quality.Agreement;
import io.github.cleave.render.ContactSheet;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.Segmenter;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code cleave demo}: segments every sample image with its bundled seeds and default settings,
 * writes all outputs and one contact sheet, and scores each against its ground truth where there is
 * one.
 */
@Command(
    name = "demo",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Segments every image in the samples folder (NAME.tif with NAME.seeds.tif beside it) with"
          + " default settings, writes each image's outputs and contact-sheet.png (every image"
          + " with its cut) into the output folder, and prints the Dice coefficient against"
          + " NAME.truth.tif where present.",
      "Exit codes: 0 done; 2 bad arguments or no sample found; 3 some images failed."
    })
final class DemoCommand implements Callable<Integer> {
  @Option(
      names = "--samples",
      paramLabel = "FOLDER",
      defaultValue = "sample-images",
      description = "Folder of sample images (default: ${DEFAULT-VALUE}).")
  Path samples;

  @Option(
      names = "--out",
      paramLabel = "FOLDER",
      defaultValue = "demo-output",
      description = "Output folder, created if missing (default: ${DEFAULT-VALUE}).")
  Path out;

  @Spec CommandSpec spec;

  @Override
  public Integer call() throws IOException {
    List<Path> images = sampleImages(samples);
    if (images.isEmpty()) {
      throw new InputException(
          "no sample image (NAME.tif with NAME.seeds.tif) in "
              + samples
              + ": give --samples FOLDER, or run make-samples first");
    }
    SegmentationFiles.prepareOutputFolder(
        out, new SegmentationFiles.Inputs(images.get(0), null, null));
    PrintWriter stdout = spec.commandLine().getOut();
    List<ContactSheet.Tile> tiles = new ArrayList<>();
    boolean failures = false;
    for (Path image : images) {
      String name = SegmentationFiles.baseName(image);
      try {
        Progress.say(spec, "segmenting " + image.getFileName());
        ImageInputs.ImageWithSeeds in = ImageInputs.read(image, null, true);
        SegmentationFiles.Inputs inputs = new SegmentationFiles.Inputs(image, in.seedFile(), null);
        SegmentationFiles.prepareOutputFolder(out, inputs);
        Segmentation result =
            Segmenter.segment(in.image().raster(), in.seeds(), SegmentationSettings.defaults());
        BufferedImage picture =
            SegmentationFiles.write(out, name, in.image(), in.seeds(), result, inputs, "demo");
        Summary.print(name, result, stdout, spec.commandLine().getErr());
        double dice = dice(image.resolveSibling(name + ".truth.tif"), result);
        if (!Double.isNaN(dice)) {
          stdout.println(String.format(Locale.ROOT, "%s: Dice against the truth %.4f", name, dice));
        }
        tiles.add(
            ContactSheet.Tile.done(
                image.getFileName().toString(), picture, result.objects().count(), dice));
      } catch (BadInputException | InputException | IOException | IllegalArgumentException e) {
        failures = true;
        spec.commandLine()
            .getErr()
            .println("cleave: " + image.getFileName() + ": " + e.getMessage());
        tiles.add(ContactSheet.Tile.failed(image.getFileName().toString(), e.getMessage()));
      }
    }
    Path sheet = out.resolve("contact-sheet.png");
    Files.createDirectories(out);
    ImageOutputs.writePng(sheet, ContactSheet.render(tiles));
    stdout.println("contact sheet: " + sheet);
    stdout.flush();
    return failures ? ExitCodes.SOME_FILES_FAILED : ExitCodes.OK;
  }

  private static double dice(Path truthFile, Segmentation result) {
    if (!Files.exists(truthFile)) {
      return Double.NaN;
    }
    float[] truth = ImageFiles.read(truthFile).raster().channel(0);
    byte[] reference = new byte[truth.length];
    for (int i = 0; i < truth.length; i++) {
      reference[i] = (byte) (truth[i] != 0 ? 255 : 0);
    }
    return Agreement.dice(reference, result.mask());
  }

  /** {@code NAME.tif} files with a {@code NAME.seeds.*} beside them, sorted by name. */
  static List<Path> sampleImages(Path folder) throws IOException {
    if (!Files.isDirectory(folder)) {
      throw new InputException("the samples folder " + folder + " does not exist");
    }
    List<Path> images = new ArrayList<>();
    try (Stream<Path> files = Files.list(folder)) {
      files
          .filter(Files::isRegularFile)
          .filter(p -> p.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".tif"))
          .filter(p -> !isSideFile(p.getFileName().toString()))
          .filter(p -> hasSeeds(p))
          .sorted()
          .forEach(images::add);
    }
    return images;
  }

  private static boolean isSideFile(String name) {
    String n = name.toLowerCase(Locale.ROOT);
    return n.contains(".seeds.")
        || n.contains(".truth.")
        || n.contains(".mask.")
        || n.contains(".labels.")
        || n.startsWith(".");
  }

  private static boolean hasSeeds(Path image) {
    String base = SegmentationFiles.baseName(image);
    for (String suffix : io.github.cleave.io.SeedFiles.SUFFIXES) {
      if (Files.exists(image.resolveSibling(base + suffix))) {
        return true;
      }
    }
    return false;
  }
}
