package io.github.cleave.cli;

import io.github.cleave.io.TimeAxis;
import io.github.cleave.segment.TimeLapseOptions;
import java.util.Locale;
import picocli.CommandLine.Option;

/**
 * The time-lapse settings shared by {@code segment}, {@code apply} and {@code batch}: how slices
 * are read when a file has no time axis, which time point the seeds belong to, and whether each
 * time point is seeded from its neighbour. Time points are numbered from 1 on the command line.
 */
final class TimeOptions {
  @Option(
      names = "--time-axis",
      paramLabel = "auto|frames|z",
      defaultValue = "auto",
      description =
          "How the slices of a file without time points are read: 'auto' (default) reads them as"
              + " time points when the file gives a frame interval and no z spacing (a time-lapse"
              + " saved as slices) and says so; 'frames' always; 'z' never (one volume). Files"
              + " with time points are always cut one time point at a time.")
  String timeAxis;

  @Option(
      names = "--seed-time-point",
      paramLabel = "T",
      defaultValue = "1",
      description =
          "Time point (from 1) that the seeds were drawn on; the seed file has the size of one"
              + " time point (default ${DEFAULT-VALUE}).")
  int seedTimePoint;

  @Option(
      names = "--seeds-from-neighbour",
      paramLabel = "on|off",
      defaultValue = "on",
      description =
          "Seed every other time point from its neighbour's objects (each eroded as foreground,"
              + " a band around them as background), so that strokes on one time point carry"
              + " the whole time-lapse (default ${DEFAULT-VALUE}).")
  String seedsFromNeighbour;

  TimeAxis axis() {
    return switch (timeAxis.toLowerCase(Locale.ROOT)) {
      case "auto" -> TimeAxis.AUTO;
      case "frames" -> TimeAxis.SLICES_ARE_FRAMES;
      case "z" -> TimeAxis.SLICES_ARE_Z;
      default ->
          throw new InputException(
              "--time-axis " + timeAxis + ": use auto, frames (slices are time points) or z");
    };
  }

  /** The seeded time point, 0-based. */
  int seedFrame() {
    if (seedTimePoint < 1) {
      throw new InputException(
          "--seed-time-point " + seedTimePoint + ": time points are numbered from 1");
    }
    return seedTimePoint - 1;
  }

  TimeLapseOptions options() {
    boolean on =
        switch (seedsFromNeighbour.toLowerCase(Locale.ROOT)) {
          case "on" -> true;
          case "off" -> false;
          default ->
              throw new InputException(
                  "--seeds-from-neighbour " + seedsFromNeighbour + ": use on or off");
        };
    return TimeLapseOptions.defaults().withSeedsFromNeighbour(on);
  }
}
