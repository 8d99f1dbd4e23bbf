package io.github.cleave.batch;

import java.io.Serializable;
import java.util.Objects;

/**
 * What became of one file of a folder run: one row of {@code files.csv}. Immutable and
 * serialisable, so that a distributed run can send it from a worker to the driver.
 *
 * @param file the path relative to the input folder, with {@code /} between folders
 * @param status whether the file was segmented
 * @param message why it failed, or a note for a segmented file; empty if none
 * @param objectCount objects found, or -1 for a failed file
 * @param timeMs segmentation time in milliseconds as recorded in its {@code NAME.record.json} (for
 *     a failed file, the time until it failed); the only value that differs between reruns
 * @param reused whether the outputs were already complete and kept (resume) rather than computed
 */
public record FileOutcome(
    String file, Status status, String message, int objectCount, double timeMs, boolean reused)
    implements Serializable {

  /** Whether a file was segmented. */
  public enum Status {
    /** Segmented; every output of the file is complete. */
    OK,
    /** Not segmented; the message says why. */
    FAILED
  }

  /** Checks that the file and status are given. */
  public FileOutcome {
    Objects.requireNonNull(file, "file");
    Objects.requireNonNull(status, "status");
    message = message == null ? "" : message;
  }

  /** True for {@link Status#FAILED}. */
  public boolean failed() {
    return status == Status.FAILED;
  }

  FileOutcome withMessage(String note) {
    return new FileOutcome(file, status, note, objectCount, timeMs, reused);
  }
}
