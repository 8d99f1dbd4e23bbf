package io.github.cleave.cli;

import io.github.cleave.segment.Segmentation;
import java.io.PrintWriter;
import java.util.Locale;

/** The lines a segmentation command prints: a summary on standard output, warnings on error. */
final class Summary {
  private Summary() {}

  static void print(String name, Segmentation result, PrintWriter out, PrintWriter err) {
    for (String w : result.warnings()) {
      err.println("cleave: note: " + name + ": " + w);
    }
    if (result.isMultiClass()) {
      out.println(
          String.format(
              Locale.ROOT,
              "%s: %d object(s) in %d classes, %d voxel(s) in objects, energy %.3f nats (alpha-expansion),"
                  + " %.0f ms",
              name,
              result.objects().count(),
              result.classes().classCount(),
              result.foregroundCount(),
              result.energy(),
              result.timings().totalMs()));
      out.flush();
      err.flush();
      return;
    }
    out.println(
        String.format(
            Locale.ROOT,
            "%s: %d object(s), %d foreground voxel(s), cut value %d (energy %.3f nats), %.0f ms",
            name,
            result.objects().count(),
            result.foregroundCount(),
            result.flowValue(),
            result.energy(),
            result.timings().totalMs()));
    out.flush();
    err.flush();
  }
}
