package io.github.cleave.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;

/** The output folder of the commands that write segmentation outputs. */
final class OutputFolderOption {
  @Option(
      names = "--out",
      required = true,
      paramLabel = "FOLDER",
      description = "Output folder, created if missing; must not be the image's folder.")
  Path out;
}
