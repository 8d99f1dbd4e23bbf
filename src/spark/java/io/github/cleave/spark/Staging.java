package io.github.cleave.spark;

import java.io.Serializable;
import org.apache.hadoop.fs.Path;

/**
 * Where a staged run's files live, for its tasks: the input, output and seeds folders as qualified
 * Hadoop paths (seeds null if none), the model as the user named it (recorded in each file's
 * record), and the driver's Hadoop configuration. Immutable, serialisable.
 */
record Staging(String in, String out, String seeds, String model, HadoopConf conf)
    implements Serializable {

  Path inPath() {
    return new Path(in);
  }

  Path outPath() {
    return new Path(out);
  }

  Path seedsPath() {
    return seeds == null ? null : new Path(seeds);
  }

  /** The Hadoop path of {@code relative} ({@code /} between folders) below {@code folder}. */
  static Path below(Path folder, String relative) {
    return relative.isEmpty() ? folder : new Path(folder, relative);
  }
}
