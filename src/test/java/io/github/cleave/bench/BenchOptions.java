package io.github.cleave.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;

/**
 * What the benchmarks share: their {@code key=value} arguments and the line that names the machine
 * a table was measured on. It lives in the test sources so that the benchmarks of the {@code bench}
 * profile and the cluster benchmark of the {@code spark} profile both see it.
 */
public final class BenchOptions {
  private BenchOptions() {}

  /**
   * Puts each {@code key=value} of {@code args} into {@code options}, whose keys are the known
   * arguments and whose values are their defaults; the word {@code all} is ignored.
   *
   * @throws IllegalArgumentException naming the known keys for an unknown or malformed argument
   */
  public static void apply(Map<String, String> options, String[] args) {
    for (String arg : args) {
      if (arg.equals("all")) {
        continue;
      }
      int eq = arg.indexOf('=');
      if (eq < 0 || !options.containsKey(arg.substring(0, eq))) {
        throw new IllegalArgumentException(
            "unknown argument '" + arg + "'; known: " + options.keySet());
      }
      options.put(arg.substring(0, eq), arg.substring(eq + 1));
    }
  }

  /** Date, cores, CPU model, JVM and maximum heap, for the first line of a results table. */
  public static String machine() {
    String cpu = "unknown CPU";
    try {
      for (String line : Files.readAllLines(Path.of("/proc/cpuinfo"))) {
        if (line.startsWith("model name")) {
          cpu = line.substring(line.indexOf(':') + 1).trim();
          break;
        }
      }
    } catch (IOException e) {
      // keep "unknown CPU"
    }
    return String.format(
        Locale.ROOT,
        "%s · %d cores · %s · %s %s · max heap %d MiB",
        java.time.LocalDate.now(),
        Runtime.getRuntime().availableProcessors(),
        cpu,
        System.getProperty("java.vm.name"),
        System.getProperty("java.runtime.version"),
        Runtime.getRuntime().maxMemory() >> 20);
  }
}
