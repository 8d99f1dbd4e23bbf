package io.github.cleave.imagej;

import java.util.Locale;

/** The status lines of the brush session's live preview, one per outcome. Stateless. */
final class StatusLines {
  private StatusLines() {}

  /**
   * After a two-class cut: the flow value (= cut value), whether its certificate was checked, the
   * solve time and kind, and the time from the request to the result.
   */
  static String twoClass(LiveCut.Outcome o, boolean relearned, long askedNanos) {
    return String.format(
        Locale.ROOT,
        "flow value = cut value = %d%s · solve %.1f ms (%s) · stroke to cut %.0f ms",
        o.flowValue(),
        o.certified() ? " (checked)" : "",
        o.solveNanos() / 1e6,
        o.dynamic() ? "dynamic re-solve" : relearned ? "re-learned, full solve" : "full solve",
        (System.nanoTime() - askedNanos) / 1e6);
  }

  /** After an expansion of K ≥ 3 classes: says it is a full re-cut, with its energy and times. */
  static String classes(LiveClasses.Outcome o, long askedNanos) {
    return String.format(
        Locale.ROOT,
        "%d classes: full re-cut per stroke · energy %d · %d expansion moves · solve %.1f ms"
            + " · stroke to cut %.0f ms",
        o.classCount(),
        o.energy(),
        o.moves(),
        o.solveNanos() / 1e6,
        (System.nanoTime() - askedNanos) / 1e6);
  }

  /** When class {@code missing} has no stroke among classes 1..{@code classes}. */
  static String missing(int missing, int classes) {
    return String.format(
        Locale.ROOT,
        "%s needs a stroke: the strokes use classes 1 to %d, and each needs one to see the cut",
        PaintClasses.describe(missing),
        classes);
  }
}
