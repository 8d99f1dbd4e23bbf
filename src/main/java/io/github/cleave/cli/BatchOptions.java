package io.github.cleave.cli;

import io.github.cleave.batch.BatchSettings;
import java.nio.file.Path;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/**
 * The options of a folder run shared by {@code batch} and the cluster job: model, input, output and
 * seeds folders, pattern, subfolders, overwrite and the time-lapse settings. A picocli mixin: the
 * command that embeds it parses them; {@link #settings} turns them into {@link BatchSettings}.
 */
public final class BatchOptions {
  @Option(
      names = "--model",
      required = true,
      paramLabel = "MODEL.json",
      description = "Model file.")
  Path model;

  @Option(names = "--in", required = true, paramLabel = "FOLDER", description = "Input folder.")
  Path in;

  @Option(
      names = "--out",
      required = true,
      paramLabel = "FOLDER",
      description = "Output folder, created if missing; must not be the input folder.")
  Path out;

  @Option(
      names = "--seeds",
      paramLabel = "FOLDER",
      description = "Folder of per-image seed files NAME.seeds.tif|png|zip (optional).")
  Path seeds;

  @Option(
      names = "--pattern",
      paramLabel = "GLOB",
      description =
          "Files to segment, matched case-insensitively against the file name (default:"
              + " '"
              + BatchSettings.DEFAULT_PATTERN
              + "').")
  String pattern;

  @Option(
      names = "--recursive",
      description = "Search subfolders too; outputs go to the same subfolders below --out.")
  boolean recursive;

  @Option(
      names = "--overwrite",
      description = "Segment every file again, even where complete outputs exist.")
  boolean overwrite;

  @Mixin TimeOptions time;

  /**
   * The settings these options describe, with {@code threads} images at a time.
   *
   * @throws InputException for an unusable time option
   */
  public BatchSettings settings(int threads) {
    return new BatchSettings(model, in, out, seeds, threads, pattern, recursive, overwrite, 0)
        .withTime(time.axis(), time.seedFrame(), time.options().seedsFromNeighbour());
  }

  /** The model file as given. */
  public Path model() {
    return model;
  }

  /** The input folder as given. */
  public Path in() {
    return in;
  }

  /** The output folder as given. */
  public Path out() {
    return out;
  }
}
