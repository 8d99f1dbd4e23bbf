package io.github.cleave.batch;

import io.github.cleave.io.TimeAxis;
import java.nio.file.Path;
import java.util.Objects;

/**
 * What a folder run does: which model to apply to which files, where to write, how many threads.
 * Immutable.
 *
 * @param model the model file (JSON written by {@code learn} or {@code segment --save-model})
 * @param in the input folder
 * @param out the output folder, created if missing; must not be {@code in}
 * @param seeds a folder of per-image seed files {@code NAME.seeds.tif|png|zip} (with {@code
 *     recursive}, in the same subfolder as the image below {@code in}), or {@code null}; seed files
 *     beside an image are used too, a file in this folder wins
 * @param threads number of images segmented at the same time, at least 1
 * @param pattern glob matched case-insensitively against each file name (or, if it contains a
 *     {@code /}, against the path relative to {@code in}), e.g. {@code *.tif}; {@code null} for
 *     {@link #DEFAULT_PATTERN}
 * @param recursive whether subfolders of {@code in} are searched too (their outputs go to the same
 *     subfolder below {@code out})
 * @param overwrite whether files with complete outputs are segmented again instead of kept, and a
 *     folder of another model's run may be replaced
 * @param heapBudgetBytes heap the run may plan for when it lets several images into memory at once;
 *     0 for what the JVM has free at the start
 * @param timeAxis how the slices of a file without time points are read ({@link TimeAxis}); a file
 *     with several time points is cut one time point at a time ({@code TimeLapseSegmenter})
 * @param seedFrame the time point (0-based) that a time-lapse's seed file belongs to
 * @param seedsFromNeighbour whether each other time point is seeded from its neighbour's objects
 */
public record BatchSettings(
    Path model,
    Path in,
    Path out,
    Path seeds,
    int threads,
    String pattern,
    boolean recursive,
    boolean overwrite,
    long heapBudgetBytes,
    TimeAxis timeAxis,
    int seedFrame,
    boolean seedsFromNeighbour) {

  /** The files matched when no pattern is given: TIFF and PNG, in any letter case. */
  public static final String DEFAULT_PATTERN = "*.{tif,tiff,png}";

  /**
   * @throws IllegalArgumentException if a path is missing, {@code threads < 1}, or the budget is
   *     negative
   */
  public BatchSettings {
    Objects.requireNonNull(model, "model");
    Objects.requireNonNull(in, "in");
    Objects.requireNonNull(out, "out");
    if (threads < 1) {
      throw new IllegalArgumentException("threads " + threads + ": need at least 1");
    }
    if (heapBudgetBytes < 0) {
      throw new IllegalArgumentException("heap budget " + heapBudgetBytes + ": need 0 or more");
    }
    pattern = pattern == null || pattern.isBlank() ? DEFAULT_PATTERN : pattern;
    Objects.requireNonNull(timeAxis, "timeAxis");
    if (seedFrame < 0) {
      throw new IllegalArgumentException("seed time point " + seedFrame + ": need 0 or more");
    }
  }

  /**
   * Settings with the default time handling (automatic time axis, seeds on the first time point).
   */
  public BatchSettings(
      Path model,
      Path in,
      Path out,
      Path seeds,
      int threads,
      String pattern,
      boolean recursive,
      boolean overwrite,
      long heapBudgetBytes) {
    this(
        model,
        in,
        out,
        seeds,
        threads,
        pattern,
        recursive,
        overwrite,
        heapBudgetBytes,
        TimeAxis.AUTO,
        0,
        true);
  }

  /** Every file of the default pattern in {@code in}, no seeds folder, one thread per core. */
  public static BatchSettings defaults(Path model, Path in, Path out) {
    return new BatchSettings(
        model, in, out, null, Runtime.getRuntime().availableProcessors(), null, false, false, 0);
  }

  /** The same settings with another thread count. */
  public BatchSettings withThreads(int n) {
    return new BatchSettings(
        model,
        in,
        out,
        seeds,
        n,
        pattern,
        recursive,
        overwrite,
        heapBudgetBytes,
        timeAxis,
        seedFrame,
        seedsFromNeighbour);
  }

  /** The same settings with another time handling. */
  public BatchSettings withTime(TimeAxis axis, int frame, boolean fromNeighbour) {
    return new BatchSettings(
        model,
        in,
        out,
        seeds,
        threads,
        pattern,
        recursive,
        overwrite,
        heapBudgetBytes,
        axis,
        frame,
        fromNeighbour);
  }
}
