package io.github.cleave.imagej;

import io.github.cleave.image.BadInputException;
import io.github.cleave.io.TimeAxis;
import io.github.cleave.model.ModelKind;
import io.github.cleave.objects.ObjectSettings;
import io.github.cleave.objects.ObjectSplit;
import io.github.cleave.segment.IlluminationMode;
import io.github.cleave.segment.SegmentationSettings;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The segmentation settings as dialog fields, with the plain names and defaults of the command
 * line's options ({@code --boundary-penalty} becomes the field "Boundary penalty", macro key {@code
 * boundary}), and their conversion into {@link SegmentationSettings}. Channel numbers are 1-based
 * in fields, as on the command line. Pixel size and unit are not fields: ImageJ images carry their
 * calibration ({@code Image > Properties}).
 *
 * <p>The time-lapse fields ({@link #timeFields()}, used by the commands that segment the current
 * image) are "Time axis" ({@code time=auto}, {@code time=[slices are time points]}, {@code
 * time=[slices are z planes]}), "Frame seeds from the neighbouring time point" (checkbox, {@code
 * frame_seeds}; on by default in the dialog, and, as for every ImageJ checkbox, on in a macro only
 * when the key is given) and "Seed frame" ({@code seed_frame=N}, 1-based; 0 = the image's current
 * time point), read into {@link TimeSettings}.
 *
 * <p>Every invalid value is refused with a {@link BadInputException} that names the macro key, the
 * value and what would be accepted.
 */
final class SettingsFields {
  private SettingsFields() {}

  /** The fields, in dialog order; their defaults are the command line's. */
  static List<FormField> fields() {
    return List.of(
        FormField.text(
            "Boundary penalty (0 or more; larger = smoother)",
            number(SegmentationSettings.DEFAULT_BOUNDARY_PENALTY)),
        FormField.text("Contrast scale (auto or a pixel-value difference)", "auto"),
        FormField.choice("Neighborhood", "auto", List.of("auto", "4", "8", "16", "6", "18", "26")),
        FormField.choice("Likelihood", "auto", List.of("auto", "histogram", "mixture")),
        FormField.text(
            "Refine rounds (0 to 20)",
            Integer.toString(SegmentationSettings.DEFAULT_REFINEMENT_ROUNDS)),
        FormField.text("Channels driving the cut (e.g. 1,2; blank = default)", ""),
        FormField.text("Measure channels (blank = all)", ""),
        FormField.choice("Illumination", "auto", List.of("auto", "flatten", "keep")),
        FormField.text(
            "Flatten radius (pixels)", number(SegmentationSettings.DEFAULT_FLATTEN_RADIUS)),
        FormField.check("Per-plane cuts (stacks)", false),
        FormField.choice("Holes", "fill", List.of("fill", "keep")),
        FormField.choice("Split touching objects", "shape", List.of("shape", "strokes", "none")),
        FormField.text("Min size (calibrated area or volume)", "0"),
        FormField.text("Max size (blank = no limit)", ""),
        FormField.check("Exclude objects touching the image edge", false),
        FormField.check("Edge planes count as edges (stacks)", false));
  }

  /** The choice of "Time axis" that reads slices as time points. */
  static final String SLICES_ARE_TIME = "slices are time points";

  /** The choice of "Time axis" that reads slices as the z planes of one volume. */
  static final String SLICES_ARE_Z = "slices are z planes";

  /** The time-lapse fields, in dialog order (see the class comment). */
  static List<FormField> timeFields() {
    return List.of(
        FormField.choice(
            "Time axis (images without frames)",
            "auto",
            List.of("auto", SLICES_ARE_TIME, SLICES_ARE_Z)),
        FormField.check("Frame_seeds from the neighbouring time point (time-lapses)", true),
        FormField.text("Seed_frame (time point of seeds without one; 0 = current)", "0"));
  }

  /** The time-lapse settings the values give; keys left out take the dialog's defaults. */
  static TimeSettings time(Map<String, String> v) {
    String axis = v.getOrDefault("time", "auto");
    TimeAxis a =
        switch (blank(axis) ? "auto" : axis.toLowerCase(Locale.ROOT).trim()) {
          case "auto" -> TimeAxis.AUTO;
          case SLICES_ARE_TIME -> TimeAxis.SLICES_ARE_FRAMES;
          case SLICES_ARE_Z -> TimeAxis.SLICES_ARE_Z;
          default ->
              throw new BadInputException(
                  "time="
                      + axis
                      + ": use auto, ["
                      + SLICES_ARE_TIME
                      + "] or ["
                      + SLICES_ARE_Z
                      + "]");
        };
    String f = v.getOrDefault("seed_frame", "0");
    int frame;
    try {
      frame = blank(f) ? 0 : Integer.parseInt(f.trim());
    } catch (NumberFormatException e) {
      frame = -1;
    }
    if (frame < 0) {
      throw new BadInputException(
          "seed_frame=" + f + ": give a time point from 1, or 0 for the image's current one");
    }
    return new TimeSettings(a, Boolean.parseBoolean(v.getOrDefault("frame_seeds", "true")), frame);
  }

  /** The settings the values give. */
  static SegmentationSettings settings(Map<String, String> v) {
    double max = blank(v.get("max")) ? Double.POSITIVE_INFINITY : positive(v, "max", true);
    try {
      return new SegmentationSettings(
          positive(v, "boundary", true),
          contrast(v.get("contrast")),
          neighborhood(v.get("neighborhood")),
          likelihood(v.get("likelihood")),
          wholeNumber(v, "refine"),
          channels(v, "channels"),
          channels(v, "measure"),
          illumination(v.get("illumination")),
          positive(v, "flatten", false),
          Boolean.parseBoolean(v.get("per-plane")),
          null,
          new ObjectSettings(
              holes(v.get("holes")),
              split(v.get("split")),
              positive(v, "min", true),
              max,
              Boolean.parseBoolean(v.get("exclude")),
              Boolean.parseBoolean(v.get("edge"))));
    } catch (IllegalArgumentException e) {
      throw new BadInputException(e.getMessage());
    }
  }

  /** The field values that give {@code s} (for the panel and for messages). */
  static String number(double x) {
    if (x == Math.rint(x) && Math.abs(x) < 1e9) {
      return Long.toString((long) x);
    }
    return Double.toString(x);
  }

  static boolean blank(String s) {
    return s == null || s.isBlank();
  }

  static double positive(Map<String, String> v, String key, boolean zeroAllowed) {
    String s = v.get(key);
    double x;
    try {
      x = Double.parseDouble(s.trim());
    } catch (NumberFormatException | NullPointerException e) {
      x = Double.NaN;
    }
    if (!(zeroAllowed ? x >= 0 : x > 0) || Double.isInfinite(x)) {
      throw new BadInputException(
          key + "=" + s + ": give a number " + (zeroAllowed ? "of 0 or more" : "above 0"));
    }
    return x;
  }

  static int wholeNumber(Map<String, String> v, String key) {
    String s = v.get(key);
    try {
      return Integer.parseInt(s.trim());
    } catch (NumberFormatException | NullPointerException e) {
      throw new BadInputException(key + "=" + s + ": give a whole number");
    }
  }

  private static double contrast(String s) {
    if (blank(s) || s.equalsIgnoreCase("auto")) {
      return Double.NaN;
    }
    try {
      double sigma = Double.parseDouble(s);
      if (sigma > 0 && !Double.isInfinite(sigma)) {
        return sigma;
      }
    } catch (NumberFormatException e) {
      // refused below
    }
    throw new BadInputException("contrast=" + s + ": give a positive number or auto");
  }

  private static int neighborhood(String s) {
    if (blank(s) || s.equalsIgnoreCase("auto")) {
      return 0;
    }
    return switch (s) {
      case "4", "8", "16", "6", "18", "26" -> Integer.parseInt(s);
      default ->
          throw new BadInputException(
              "neighborhood=" + s + ": use auto, 4, 8 or 16 (planes), 6, 18 or 26 (stacks)");
    };
  }

  /** The likelihood model named {@code s} (auto, histogram, mixture). */
  static ModelKind likelihood(String s) {
    return switch (s.toLowerCase(Locale.ROOT)) {
      case "auto" -> ModelKind.AUTO;
      case "histogram" -> ModelKind.HISTOGRAM;
      case "mixture" -> ModelKind.GAUSSIAN_MIXTURE;
      default ->
          throw new BadInputException("likelihood=" + s + ": use auto, histogram or mixture");
    };
  }

  private static IlluminationMode illumination(String s) {
    return switch (s.toLowerCase(Locale.ROOT)) {
      case "auto" -> IlluminationMode.AUTO;
      case "flatten" -> IlluminationMode.ON;
      case "keep" -> IlluminationMode.OFF;
      default -> throw new BadInputException("illumination=" + s + ": use auto, flatten or keep");
    };
  }

  private static boolean holes(String s) {
    return switch (s.toLowerCase(Locale.ROOT)) {
      case "fill" -> true;
      case "keep" -> false;
      default -> throw new BadInputException("holes=" + s + ": use fill or keep");
    };
  }

  private static ObjectSplit split(String s) {
    return switch (s.toLowerCase(Locale.ROOT)) {
      case "shape" -> ObjectSplit.DISTANCE_WATERSHED;
      case "strokes" -> ObjectSplit.PER_STROKE;
      case "none" -> ObjectSplit.NONE;
      default -> throw new BadInputException("split=" + s + ": use shape, strokes or none");
    };
  }

  private static int[] channels(Map<String, String> v, String key) {
    String s = v.get(key);
    if (blank(s)) {
      return null;
    }
    String[] parts = s.split("[,\\s]+");
    int[] out = new int[parts.length];
    for (int i = 0; i < parts.length; i++) {
      int c;
      try {
        c = Integer.parseInt(parts[i]);
      } catch (NumberFormatException e) {
        c = 0;
      }
      if (c < 1) {
        throw new BadInputException(
            key + "=" + s + ": give channel numbers from 1, separated by commas");
      }
      out[i] = c - 1;
    }
    return out;
  }
}
