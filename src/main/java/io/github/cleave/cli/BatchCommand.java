package io.github.cleave.cli;

import io.github.cleave.batch.BatchProgress;
import io.github.cleave.batch.BatchResult;
import io.github.cleave.batch.BatchRunner;
import io.github.cleave.batch.BatchSettings;
import java.io.PrintWriter;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/** {@code cleave batch}: applies a saved model to every matching image of a folder. */
@Command(
    name = "batch",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Applies a model saved by 'learn' to every matching image of a folder, several images at"
          + " a time, writing each image's outputs as 'apply' does (NAME.mask.tif, NAME.labels.tif,"
          + " NAME.objects.csv, NAME.rois.zip, NAME.overlay.png, NAME.record.json) and, for the"
          + " folder, files.csv (status, reason, object count and time per file), objects.csv"
          + " (every object, with its file), contact-sheet.png (thumbnails with contours, failed"
          + " files marked, one display range per channel for the whole run) and, last, run.json.",
      "Seeds: NAME.seeds.tif|png|zip from --seeds (or beside the image) act as fixed marks.",
      "Skipped: hidden files and ._NAME files, NAME.seeds.* and NAME.truth.* files. A file that cannot be"
          + " segmented (corrupt, unreadable, other channels than the model's, too large for the"
          + " heap) is reported in files.csv and the run goes on.",
      "Resume: a rerun keeps files whose outputs are complete (same model, image and seeds) and"
          + " tries failed files again; --overwrite recomputes everything. A folder holding a"
          + " run of another model is refused. Every file is written atomically.",
      "Results are the same bytes whatever --threads, except the time column of files.csv.",
      "Exit codes: 0 every file segmented; 2 bad arguments or unusable folder, model or pattern"
          + " (nothing segmented); 3 some files failed (see files.csv); 130 interrupted (complete"
          + " outputs stay, a rerun resumes)."
    })
final class BatchCommand implements Callable<Integer> {
  @Mixin BatchOptions options;

  @Option(
      names = "--threads",
      paramLabel = "N",
      description = "Images segmented at the same time (default: all cores).")
  Integer threads;

  @Spec CommandSpec spec;

  @Override
  public Integer call() throws Exception {
    int n = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
    if (n < 1) {
      throw new ParameterException(
          spec.commandLine(), "--threads " + n + ": give 1 or more (default: all cores)");
    }
    PrintWriter err = spec.commandLine().getErr();
    BatchSettings settings = options.settings(n);
    ProgressPrinter printer = new ProgressPrinter(err);
    BatchRunner runner = new BatchRunner(settings, printer);
    Thread stopOnCtrlC =
        new Thread(
            () -> {
              try {
                runner.cancelAndWait(10_000);
              } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
              }
            },
            "cleave-batch-stop");
    Runtime.getRuntime().addShutdownHook(stopOnCtrlC);
    BatchResult result;
    try {
      Progress.say(
          spec,
          "segmenting the files of " + options.in() + " with " + options.model().getFileName());
      result = runner.run();
    } finally {
      try {
        Runtime.getRuntime().removeShutdownHook(stopOnCtrlC);
      } catch (IllegalStateException e) {
        // the JVM is already stopping: the hook is running
      }
    }
    printer.finish();
    return BatchReport.print(
        result, options.out(), spec.commandLine().getOut(), spec.commandLine().getErr());
  }

  /** Prints the progress line on standard error at most about once a second, and at the end. */
  private static final class ProgressPrinter implements io.github.cleave.batch.BatchListener {
    private final PrintWriter err;
    private long lastPrinted;
    private BatchProgress last;

    ProgressPrinter(PrintWriter err) {
      this.err = err;
    }

    @Override
    public synchronized void progress(BatchProgress p) {
      last = p;
      long now = System.nanoTime();
      if (p.done() == p.total() || now - lastPrinted >= 1_000_000_000L) {
        lastPrinted = now;
        err.println("cleave: batch: " + p.line());
        err.flush();
      }
    }

    synchronized void finish() {
      if (last != null && last.done() != last.total()) {
        err.println("cleave: batch: " + last.line());
      }
      err.flush();
    }
  }
}
