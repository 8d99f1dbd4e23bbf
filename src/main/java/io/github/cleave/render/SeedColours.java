package io.github.cleave.render;

/**
 * Colours of seed classes in every picture: the colour-blind-safe palette of Okabe and Ito ("Color
 * Universal Design", 2002/2008; values as published, from memory): class 1 (foreground) orange
 * {@code #E69F00}, class 2 (background) sky blue {@code #56B4E9}, then bluish green {@code
 * #009E73}, yellow {@code #F0E442}, blue {@code #0072B2}, vermillion {@code #D55E00} and reddish
 * purple {@code #CC79A7}; classes beyond 7 repeat the list. Black, the palette's eighth colour, is
 * left out: it would vanish on dark images.
 */
public final class SeedColours {
  /** RGB of classes 1..7, index = class - 1. */
  private static final int[] PALETTE = {
    0xE69F00, 0x56B4E9, 0x009E73, 0xF0E442, 0x0072B2, 0xD55E00, 0xCC79A7
  };

  /** Foreground seeds, orange. */
  public static final int FOREGROUND = PALETTE[0];

  /** Background seeds, sky blue. */
  public static final int BACKGROUND = PALETTE[1];

  private SeedColours() {}

  /**
   * The {@code 0xRRGGBB} colour of seed class {@code label} (1-based).
   *
   * @throws IllegalArgumentException if {@code label < 1}
   */
  public static int of(int label) {
    if (label < 1) {
      throw new IllegalArgumentException("seed class " + label + "; classes start at 1");
    }
    return PALETTE[(label - 1) % PALETTE.length];
  }
}
