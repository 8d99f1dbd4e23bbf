package io.github.cleave.io;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;

/**
 * Which axis of an image holds its time points, and why: the rule of {@link Hyperstacks}, kept
 * apart from ImageJ so that it can be checked case by case.
 *
 * <p>The rule, in order: an image with frames (T above 1) is a time-lapse of those frames; an image
 * of one frame and one slice is one time point; otherwise ({@code slices > 1}, one frame) {@link
 * TimeAxis#SLICES_ARE_FRAMES} and {@link TimeAxis#SLICES_ARE_Z} decide as they say, and {@link
 * TimeAxis#AUTO} reads the slices as frames when the calibration has a frame interval ({@code
 * Calibration.frameInterval > 0}) and either no z spacing (ImageJ's default depth of 1, which its
 * TIFF writer leaves out of the file's description) or a description that names a time-lapse. Every
 * other case is read as a volume; where the image still hints at time, a warning says so and how to
 * force the other reading. The rule is ours (common practice, no source).
 *
 * @param source where the time points come from
 * @param reason one sentence: what was decided and why
 * @param warnings sentences for the user; empty when nothing was doubtful
 */
record TimeAxisDecision(OpenedSeries.TimeSource source, String reason, List<String> warnings) {
  /** Words in an image's description or info that name a time-lapse. */
  private static final Pattern TIME_WORDS =
      Pattern.compile("(?i)\\b(time[- ]?lapse|time[- ]series|time ?points?|movie)\\b");

  TimeAxisDecision {
    warnings = List.copyOf(warnings);
  }

  /**
   * @param name the image's name, for the messages
   * @param slices ImageJ's slice count (Z)
   * @param frames ImageJ's frame count (T)
   * @param frameInterval the calibration's frame interval (0 when unset)
   * @param timeUnit the calibration's time unit
   * @param pixelDepth the calibration's z spacing (1 when unset)
   * @param description the file's description and the image's info, or "" (never null)
   */
  static TimeAxisDecision decide(
      TimeAxis axis,
      String name,
      int slices,
      int frames,
      double frameInterval,
      String timeUnit,
      double pixelDepth,
      String description) {
    List<String> warnings = new ArrayList<>();
    if (frames > 1) {
      if (axis == TimeAxis.SLICES_ARE_FRAMES && slices > 1) {
        warnings.add(
            String.format(
                Locale.ROOT,
                "%s has %d frames of %d slices each; its slices stay z planes (slices are read"
                    + " as frames only in an image without frames)",
                name,
                frames,
                slices));
      }
      return new TimeAxisDecision(
          OpenedSeries.TimeSource.FRAMES,
          String.format(
              Locale.ROOT, "%s has %d frames: read as %d time points", name, frames, frames),
          warnings);
    }
    if (slices <= 1) {
      return new TimeAxisDecision(
          OpenedSeries.TimeSource.NONE,
          name + " has one frame and one slice: one time point",
          warnings);
    }
    boolean interval = frameInterval > 0 && !Double.isInfinite(frameInterval);
    boolean zUnset = pixelDepth == 1.0 || !(pixelDepth > 0) || Double.isInfinite(pixelDepth);
    boolean saysTime = TIME_WORDS.matcher(description).find();
    String intervalText =
        String.format(Locale.ROOT, "a frame interval of %s %s", number(frameInterval), timeUnit);
    switch (axis) {
      case SLICES_ARE_FRAMES:
        return new TimeAxisDecision(
            OpenedSeries.TimeSource.SLICES_AS_FRAMES,
            String.format(
                Locale.ROOT,
                "%s has %d slices and one frame: its slices read as %d time points, as asked",
                name,
                slices,
                slices),
            warnings);
      case SLICES_ARE_Z:
        return new TimeAxisDecision(
            OpenedSeries.TimeSource.NONE,
            String.format(
                Locale.ROOT,
                "%s has %d slices and one frame: read as one volume of %d z planes, as asked%s",
                name,
                slices,
                slices,
                interval ? " (it has " + intervalText + ")" : ""),
            warnings);
      default:
        break;
    }
    if (interval && (zUnset || saysTime)) {
      String why =
          zUnset
              ? intervalText + " and no z spacing"
              : intervalText + " and a description naming a time-lapse";
      warnings.add(
          String.format(
              Locale.ROOT,
              "%s has %d slices but one frame, with %s: its slices are read as %d time points;"
                  + " choose slices-are-z to segment it as one volume",
              name,
              slices,
              why,
              slices));
      return new TimeAxisDecision(
          OpenedSeries.TimeSource.SLICES_AS_FRAMES,
          String.format(
              Locale.ROOT,
              "%s has %d slices, one frame and %s: slices read as time points",
              name,
              slices,
              why),
          warnings);
    }
    if (interval || saysTime) {
      warnings.add(
          String.format(
              Locale.ROOT,
              "%s has %d slices and one frame, with %s: read as one volume of %d z planes;"
                  + " choose slices-are-frames if the slices are time points",
              name,
              slices,
              interval
                  ? intervalText + " and a z spacing of " + number(pixelDepth)
                  : "a description naming a time-lapse but no frame interval",
              slices));
    }
    return new TimeAxisDecision(
        OpenedSeries.TimeSource.NONE,
        String.format(
            Locale.ROOT, "%s has %d slices and one frame: read as one volume", name, slices),
        warnings);
  }

  private static String number(double v) {
    return v == Math.rint(v) && Math.abs(v) < 1e15
        ? Long.toString((long) v)
        : String.format(Locale.ROOT, "%.6g", v);
  }
}
