package io.github.cleave.spark;

import java.nio.file.Path;
import org.apache.spark.SparkEnv;
import org.apache.spark.SparkFiles;

/**
 * Where a task keeps its local copies: the executor's own working folder as Spark gives it ({@link
 * SparkFiles#getRootDirectory}), which the cluster manager removes with the executor's container,
 * so that the copies of an executor killed mid-task (memory, preemption) do not pile up in a shared
 * {@code /tmp}. Embedded ({@code local[*]}) it is the context's temporary folder, removed when the
 * context stops. Outside a Spark process (a unit test of one file), the JVM's temporary folder.
 */
final class Scratch {
  private Scratch() {}

  /** The folder for the present task's local copies. */
  static Path folder() {
    if (SparkEnv.get() == null) {
      return Path.of(System.getProperty("java.io.tmpdir")).toAbsolutePath();
    }
    return Path.of(SparkFiles.getRootDirectory()).toAbsolutePath();
  }
}
