package io.github.cleave.imagej;

import io.github.cleave.image.SeedLabels;
import io.github.cleave.render.SeedColours;
import java.util.Locale;

/**
 * The seed classes the brush paints, by number: 1 foreground, 2 background, 3..{@value #MAX}
 * further classes (DESIGN.md's seed label contract), each with its palette colour ({@link
 * SeedColours}), its name in the panel, and the ROI name prefix of the seed ROI convention ({@code
 * foreground}, {@code background}, {@code classN}, as the seed ROI zip reader accepts them). The
 * brush offers as many classes as the palette has colours, so no two classes it paints look alike.
 * Stateless.
 */
final class PaintClasses {
  /** The largest class the brush paints: the palette's length. */
  static final int MAX = 7;

  /** The palette's colour names, index = class - 1 (the colours of {@link SeedColours#of}). */
  private static final String[] COLOUR_NAMES = {
    "orange", "sky blue", "bluish green", "yellow", "blue", "vermillion", "reddish purple"
  };

  private PaintClasses() {}

  /** The panel's name of class {@code c}: "Foreground (orange)", "Class 3 (bluish green)". */
  static String label(int c) {
    String colour = colourName(c);
    return switch (c) {
      case SeedLabels.FOREGROUND -> "Foreground (" + colour + ")";
      case SeedLabels.BACKGROUND -> "Background (" + colour + ")";
      default -> "Class " + c + " (" + colour + ")";
    };
  }

  /** The colour name of class {@code c} (1..{@value #MAX}). */
  static String colourName(int c) {
    check(c);
    return COLOUR_NAMES[c - 1];
  }

  /**
   * The ROI name prefix of class {@code c}: {@code foreground}, {@code background}, {@code classN}.
   */
  static String roiPrefix(int c) {
    return switch (c) {
      case SeedLabels.FOREGROUND -> "foreground";
      case SeedLabels.BACKGROUND -> "background";
      default -> "class" + c;
    };
  }

  /** Class {@code c} in a sentence: "class 1 (foreground)", "class 3 (bluish green)". */
  static String describe(int c) {
    return String.format(
        Locale.ROOT,
        "class %d (%s)",
        c,
        c == SeedLabels.FOREGROUND
            ? "foreground"
            : c == SeedLabels.BACKGROUND ? "background" : colourName(c));
  }

  /**
   * The class a stroke paints when the panel's class is {@code chosen} and Alt is held or not: Alt
   * swaps foreground and background, and paints background over any further class (the usual
   * correction: "this is not part of that class").
   */
  static int stroke(int chosen, boolean alt) {
    check(chosen);
    if (!alt) {
      return chosen;
    }
    return chosen == SeedLabels.BACKGROUND ? SeedLabels.FOREGROUND : SeedLabels.BACKGROUND;
  }

  private static void check(int c) {
    if (c < 1 || c > MAX) {
      throw new IllegalArgumentException(
          "paint class " + c + ": the brush paints classes 1 to " + MAX);
    }
  }
}
