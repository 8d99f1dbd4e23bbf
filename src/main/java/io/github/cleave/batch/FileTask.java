package io.github.cleave.batch;

import io.github.cleave.segment.SegmentationModel;
import java.nio.file.Path;
import java.util.Objects;
import java.util.concurrent.CancellationException;
import java.util.function.BooleanSupplier;

/**
 * The per-file function of a folder run, the same for the local runner and a distributed engine:
 * for one input named by its path relative to the run's input folder, keeps complete outputs of an
 * earlier run (unless overwriting) or segments the file and writes its outputs, each atomically
 * (temporary file, then rename), and returns its {@link FileOutcome}. Every failure of the file
 * becomes a failed outcome; only cancellation propagates ({@link CancellationException}).
 *
 * <p>Holds the run's {@link RunSpec}, the parsed model and a heap budget, nothing else: no global
 * mutable state. Running a file again overwrites its own complete outputs with the same bytes
 * (except the timings of its record), so a retried task leaves no duplicate and no partial file.
 * Thread-safe: one instance may serve several threads, which then share its heap budget.
 */
public final class FileTask {
  private final RunSpec spec;
  private final SegmentationModel model;
  private final MemoryBudget budget;
  private final BooleanSupplier cancelled;
  private final FileJob.Context context;

  FileTask(RunSpec spec, SegmentationModel model, MemoryBudget budget, BooleanSupplier cancelled) {
    this.spec = Objects.requireNonNull(spec, "spec");
    this.model = Objects.requireNonNull(model, "model");
    this.budget = Objects.requireNonNull(budget, "budget");
    this.cancelled = Objects.requireNonNull(cancelled, "cancelled");
    this.context =
        new FileJob.Context(
            spec.settings(), model, spec.modelSha256(), spec.ranges(), budget, cancelled);
  }

  /**
   * Opens the function on a worker: parses the model carried by {@code spec} (once per call, so
   * call it once per batch of files).
   *
   * @param budget the heap the files of this worker may use at once, shared by its threads
   * @param cancelled polled between steps; when true, the file stops with {@link
   *     CancellationException}
   */
  public static FileTask open(RunSpec spec, MemoryBudget budget, BooleanSupplier cancelled) {
    return new FileTask(spec, spec.parseModel(), budget, cancelled);
  }

  /** Whether this function recomputes files whose outputs are complete instead of keeping them. */
  public boolean overwrites() {
    return spec.overwrites();
  }

  /** The same function recomputing files whose outputs are complete instead of keeping them. */
  public FileTask overwriting() {
    return new FileTask(spec.overwriting(), model, budget, cancelled);
  }

  /**
   * The same function, with the same parsed model and budget, on other paths: for a worker that
   * copies a file and its seeds into local folders laid out as the run's, and its outputs back.
   * Records written by the returned function name these paths.
   *
   * @param model a local file holding this run's model bytes ({@link RunSpec#modelJson()})
   * @param in the local folder standing for the input folder
   * @param out the local folder standing for the output folder
   * @param seeds the local folder standing for the seeds folder, or null if the run has none
   */
  public FileTask at(Path model, Path in, Path out, Path seeds) {
    return new FileTask(spec.at(model, in, out, seeds), this.model, budget, cancelled);
  }

  /**
   * Processes one file.
   *
   * @param relative the file's path relative to the input folder, {@code /} between folders, as
   *     listed by {@link PreparedRun#files()}
   * @return its outcome (failed files included, never thrown)
   * @throws CancellationException if cancelled
   */
  public FileOutcome run(String relative) {
    return run(relative, false).outcome();
  }

  /** Processes one file, keeping its contact-sheet thumbnail if asked to. */
  FileJob.Done run(String relative, boolean wantThumbnail) {
    return FileJob.run(context, InputScan.InputFile.of(spec.in(), relative), wantThumbnail);
  }

  FileJob.Done run(InputScan.InputFile file, boolean wantThumbnail) {
    return FileJob.run(context, file, wantThumbnail);
  }
}
