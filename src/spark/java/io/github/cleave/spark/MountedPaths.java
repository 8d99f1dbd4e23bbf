package io.github.cleave.spark;

import io.github.cleave.image.BadInputException;
import java.nio.file.Path;
import java.util.regex.Pattern;

/**
 * The job's rule for paths: the model, input, output and seeds paths must name a file system that
 * every node mounts at the same path (a local disk for {@code local[*]}; NFS, Lustre, GPFS, a
 * cluster file system's POSIX mount on a cluster), given as plain paths. URLs with a scheme ({@code
 * hdfs://}, {@code s3a://}, even {@code file:}) are refused with a message saying so, and on a
 * cluster (a master other than {@code local...}) so are relative paths, which each executor would
 * resolve against its own working folder.
 */
final class MountedPaths {
  /** A URL scheme of two or more characters, as Hadoop's file system URLs have. */
  private static final Pattern SCHEME = Pattern.compile("^[A-Za-z][A-Za-z0-9+.-]+:.*");

  private MountedPaths() {}

  /** Refuses a path with a URL scheme. */
  static void checkPlain(String option, Path path) {
    if (path != null && SCHEME.matcher(path.toString()).matches()) {
      throw new BadInputException(
          option
              + " "
              + path
              + ": this job reads and writes only file systems mounted at the same path on every"
              + " node (NFS, Lustre, GPFS, or a local disk for local[*]); give a plain path on such"
              + " a mount, or copy the data there first");
    }
  }

  /** Refuses a relative path when the master is not a local one. */
  static void checkAbsolute(String option, Path path, String master) {
    if (path != null && !master.startsWith("local") && !path.isAbsolute()) {
      throw new BadInputException(
          option
              + " "
              + path
              + ": on a cluster ("
              + master
              + ") give an absolute path, the same on every node; a relative path would be read"
              + " from each executor's own working folder");
    }
  }
}
