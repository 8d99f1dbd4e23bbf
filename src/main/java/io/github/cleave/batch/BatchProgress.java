package io.github.cleave.batch;

import java.util.Locale;

/**
 * A snapshot of a folder run's progress, handed to {@link BatchListener}. Immutable.
 *
 * @param done files finished (segmented, kept from an earlier run, or failed)
 * @param failed of those, files that failed
 * @param reused of those, files whose complete outputs were kept from an earlier run
 * @param total files in the run
 * @param elapsedNanos time since the files started being processed
 */
public record BatchProgress(int done, int failed, int reused, int total, long elapsedNanos) {

  /** Files per second computed in this run (kept files do not count), 0 before the first. */
  public double rate() {
    double seconds = elapsedNanos / 1e9;
    int computed = done - reused;
    return computed > 0 && seconds > 0 ? computed / seconds : 0;
  }

  /** Estimated seconds until every file is done, or NaN while no rate is known. */
  public double secondsLeft() {
    double r = rate();
    return r > 0 ? (total - done) / r : Double.NaN;
  }

  /**
   * One line for a terminal, e.g. {@code 12/40 files (1 failed, 3 kept), 8.3 files/s, about 0:03
   * left}.
   */
  public String line() {
    StringBuilder sb = new StringBuilder();
    sb.append(done).append('/').append(total).append(" files");
    if (failed > 0 || reused > 0) {
      sb.append(" (");
      if (failed > 0) {
        sb.append(failed).append(" failed");
      }
      if (reused > 0) {
        sb.append(failed > 0 ? ", " : "").append(reused).append(" kept");
      }
      sb.append(')');
    }
    double r = rate();
    if (r > 0) {
      sb.append(String.format(Locale.ROOT, ", %.1f files/s", r));
      if (done < total) {
        sb.append(", about ").append(clock(secondsLeft())).append(" left");
      }
    }
    return sb.toString();
  }

  /** Seconds as {@code m:ss} or {@code h:mm:ss}. */
  static String clock(double seconds) {
    long s = Math.round(seconds);
    if (s >= 3600) {
      return String.format(Locale.ROOT, "%d:%02d:%02d", s / 3600, s / 60 % 60, s % 60);
    }
    return String.format(Locale.ROOT, "%d:%02d", s / 60, s % 60);
  }
}
