package io.github.cleave.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;

/** The input image and its seed file, shared by the commands that read one image. */
final class ImageAndSeedOptions {
  @Option(names = "--image", required = true, paramLabel = "IMAGE", description = "TIFF or PNG.")
  Path image;

  @Option(
      names = "--seeds",
      paramLabel = "SEEDS",
      description =
          "Seed label image or ROI zip (default: NAME.seeds.tif|png|zip beside IMAGE where"
              + " seeds are needed).")
  Path seeds;
}
