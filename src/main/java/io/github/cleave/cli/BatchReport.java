package io.github.cleave.cli;

import io.github.cleave.batch.BatchResult;
import io.github.cleave.batch.FileOutcome;
import java.io.PrintWriter;
import java.nio.file.Path;

/**
 * The end of a folder run on the console, the same for {@code batch} and the cluster job: one line
 * per failed file and per note on standard error, a summary line on standard output, and the exit
 * code ({@code 0} every file segmented, {@code 3} some failed).
 */
public final class BatchReport {
  private BatchReport() {}

  /** Prints the result of a run into {@code out} and returns its exit code. */
  public static int print(BatchResult result, Path out, PrintWriter stdout, PrintWriter err) {
    for (FileOutcome f : result.files()) {
      if (f.failed()) {
        err.println("cleave: " + f.file() + ": " + f.message());
      }
    }
    for (String note : result.notes()) {
      err.println("cleave: note: " + note);
    }
    int failed = result.failedCount();
    stdout.println(
        "batch: "
            + result.files().size()
            + " file(s): "
            + (result.files().size() - failed)
            + " segmented ("
            + result.reusedCount()
            + " kept from an earlier run), "
            + failed
            + " failed; see "
            + out.resolve("files.csv")
            + ", objects.csv, contact-sheet.png and run.json");
    stdout.flush();
    err.flush();
    return failed == 0 ? ExitCodes.OK : ExitCodes.SOME_FILES_FAILED;
  }
}
