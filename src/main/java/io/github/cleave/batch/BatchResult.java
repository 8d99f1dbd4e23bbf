package io.github.cleave.batch;

import java.nio.file.Path;
import java.time.Instant;
import java.util.List;

/**
 * The outcome of a finished folder run. Immutable.
 *
 * @param files one outcome per matched file, in the run's order (relative paths sorted as strings)
 * @param out the output folder, holding {@code files.csv}, {@code objects.csv}, {@code
 *     contact-sheet.png} and {@code run.json}
 * @param started when the run started
 * @param finished when {@code run.json} was written
 * @param notes things the user should know about the folder outputs (files left off the contact
 *     sheet, files whose objects have other columns); empty if none
 */
public record BatchResult(
    List<FileOutcome> files, Path out, Instant started, Instant finished, List<String> notes) {

  /** Copies the lists. */
  public BatchResult {
    files = List.copyOf(files);
    notes = List.copyOf(notes);
  }

  /** The number of files that failed. */
  public int failedCount() {
    return (int) files.stream().filter(FileOutcome::failed).count();
  }

  /** The number of files whose complete outputs were kept from an earlier run. */
  public int reusedCount() {
    return (int) files.stream().filter(FileOutcome::reused).count();
  }

  /** True when every file was segmented. */
  public boolean allSucceeded() {
    return failedCount() == 0;
  }
}
