package io.github.cleave.render;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * One picture showing every file of a folder run: a grid of equal tiles, each a thumbnail with a
 * caption under it (file name; object count and Dice when known; or {@code FAILED: reason}). A
 * failed file's tile has an empty thumbnail box framed in vermillion {@code #D55E00} with the word
 * FAILED in it, and its caption in the same colour, so failures stand out at a glance.
 *
 * <p>Layout, deterministic: tiles in the given order, row by row, {@code columns} per row (fewer if
 * there are fewer tiles); each tile is {@value #THUMBNAIL} pixels square for the thumbnail (scaled
 * to fit, aspect kept, centred) plus {@value #CAPTION_HEIGHT} pixels of caption, with {@value #GAP}
 * pixels between and around tiles; so the sheet's size depends only on the tile count and {@code
 * columns}. Text uses the logical font "SansSerif" and works headless. White background.
 */
public final class ContactSheet {
  /** Side of the square thumbnail box, pixels. */
  public static final int THUMBNAIL = 192;

  /** Height of the caption under each thumbnail, pixels (three lines). */
  public static final int CAPTION_HEIGHT = 48;

  /** Space between and around tiles, pixels. */
  public static final int GAP = 10;

  /** Columns used by {@link #render(List)}. */
  public static final int DEFAULT_COLUMNS = 6;

  private static final Color FAILED = new Color(0xD55E00);
  private static final Font FONT = new Font("SansSerif", Font.PLAIN, 12);

  private ContactSheet() {}

  /**
   * One file's tile.
   *
   * @param fileName the file's name, first caption line
   * @param picture the overlay picture, or {@code null} for a failed file
   * @param objectCount number of objects found, or -1 if unknown
   * @param dice Dice against a reference, or NaN if none
   * @param failure why the file failed, or {@code null} if it did not
   */
  public record Tile(
      String fileName, BufferedImage picture, int objectCount, double dice, String failure) {
    public Tile {
      Objects.requireNonNull(fileName, "fileName");
    }

    /** A file segmented successfully, without a reference. */
    public static Tile done(String fileName, BufferedImage picture, int objectCount) {
      return new Tile(fileName, picture, objectCount, Double.NaN, null);
    }

    /** A file segmented successfully and scored against a reference. */
    public static Tile done(String fileName, BufferedImage picture, int objectCount, double dice) {
      return new Tile(fileName, picture, objectCount, dice, null);
    }

    /** A file that failed. */
    public static Tile failed(String fileName, String reason) {
      return new Tile(fileName, null, -1, Double.NaN, reason == null ? "unknown reason" : reason);
    }

    boolean isFailed() {
      return failure != null;
    }
  }

  /** The sheet with {@link #DEFAULT_COLUMNS} columns. */
  public static BufferedImage render(List<Tile> tiles) {
    return render(tiles, DEFAULT_COLUMNS);
  }

  /**
   * The sheet.
   *
   * @throws IllegalArgumentException if there is no tile or {@code columns < 1}
   */
  public static BufferedImage render(List<Tile> tiles, int columns) {
    if (tiles.isEmpty() || columns < 1) {
      throw new IllegalArgumentException(
          tiles.size() + " tiles in " + columns + " columns: need at least one of each");
    }
    int cols = Math.min(columns, tiles.size());
    int rows = (tiles.size() + cols - 1) / cols;
    int width = GAP + cols * (THUMBNAIL + GAP);
    int height = GAP + rows * (THUMBNAIL + CAPTION_HEIGHT + GAP);
    BufferedImage sheet = new BufferedImage(width, height, BufferedImage.TYPE_INT_RGB);
    Graphics2D g = sheet.createGraphics();
    try {
      g.setColor(Color.WHITE);
      g.fillRect(0, 0, width, height);
      g.setRenderingHint(
          RenderingHints.KEY_INTERPOLATION, RenderingHints.VALUE_INTERPOLATION_BILINEAR);
      g.setRenderingHint(
          RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
      g.setFont(FONT);
      for (int t = 0; t < tiles.size(); t++) {
        int x = GAP + (t % cols) * (THUMBNAIL + GAP);
        int y = GAP + (t / cols) * (THUMBNAIL + CAPTION_HEIGHT + GAP);
        drawTile(g, tiles.get(t), x, y);
      }
    } finally {
      g.dispose();
    }
    return sheet;
  }

  private static void drawTile(Graphics2D g, Tile tile, int x, int y) {
    FontMetrics fm = g.getFontMetrics();
    int line = CAPTION_HEIGHT / 3;
    int baseline = y + THUMBNAIL + fm.getAscent() + 1;
    g.setColor(new Color(0xEEEEEE));
    g.fillRect(x, y, THUMBNAIL, THUMBNAIL);
    if (tile.isFailed()) {
      g.setColor(FAILED);
      g.setStroke(new BasicStroke(3));
      g.drawRect(x + 1, y + 1, THUMBNAIL - 3, THUMBNAIL - 3);
      String word = "FAILED";
      g.drawString(word, x + (THUMBNAIL - fm.stringWidth(word)) / 2, y + THUMBNAIL / 2);
      g.setColor(Color.BLACK);
      g.drawString(fit(fm, tile.fileName()), x, baseline);
      g.setColor(FAILED);
      String[] wrapped = wrap(fm, "FAILED: " + tile.failure());
      g.drawString(wrapped[0], x, baseline + line);
      g.drawString(wrapped[1], x, baseline + 2 * line);
      return;
    }
    BufferedImage p = tile.picture();
    if (p != null) {
      double scale =
          Math.min((double) THUMBNAIL / p.getWidth(), (double) THUMBNAIL / p.getHeight());
      int tw = Math.max(1, (int) Math.round(p.getWidth() * scale));
      int th = Math.max(1, (int) Math.round(p.getHeight() * scale));
      g.drawImage(p, x + (THUMBNAIL - tw) / 2, y + (THUMBNAIL - th) / 2, tw, th, null);
    }
    g.setColor(Color.BLACK);
    g.drawString(fit(fm, tile.fileName()), x, baseline);
    StringBuilder second = new StringBuilder();
    if (tile.objectCount() >= 0) {
      second.append(tile.objectCount()).append(tile.objectCount() == 1 ? " object" : " objects");
    }
    if (!Double.isNaN(tile.dice())) {
      second.append(second.length() > 0 ? ", " : "");
      second.append(String.format(Locale.ROOT, "Dice %.3f", tile.dice()));
    }
    g.drawString(fit(fm, second.toString()), x, baseline + line);
  }

  /** {@code text} cut to the thumbnail width, ending in "..." if cut. */
  static String fit(FontMetrics fm, String text) {
    if (fm.stringWidth(text) <= THUMBNAIL) {
      return text;
    }
    String s = text;
    while (!s.isEmpty() && fm.stringWidth(s + "...") > THUMBNAIL) {
      s = s.substring(0, s.length() - 1);
    }
    return s + "...";
  }

  /** {@code text} over two lines of the thumbnail width, the second cut with "..." if needed. */
  private static String[] wrap(FontMetrics fm, String text) {
    if (fm.stringWidth(text) <= THUMBNAIL) {
      return new String[] {text, ""};
    }
    int cut = text.length();
    while (cut > 1 && fm.stringWidth(text.substring(0, cut)) > THUMBNAIL) {
      cut--;
    }
    int space = text.lastIndexOf(' ', cut);
    if (space > 0) {
      cut = space;
    }
    return new String[] {text.substring(0, cut), fit(fm, text.substring(cut).strip())};
  }
}
