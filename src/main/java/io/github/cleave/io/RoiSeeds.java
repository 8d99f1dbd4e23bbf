package io.github.cleave.io;

import ij.gui.Roi;
import ij.io.RoiDecoder;
import ij.process.ByteProcessor;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.SeedLabels;
import java.awt.Point;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.zip.ZipEntry;
import java.util.zip.ZipInputStream;

/**
 * Seeds from an ImageJ ROI zip (as saved by the ROI Manager), rasterised with ImageJ's own drawing
 * and filling code.
 *
 * <p><b>Class of a ROI: its name.</b> The name must start, ignoring case, with {@code foreground}
 * or {@code fg} (class 1), {@code background} or {@code bg} (class 2), or {@code class} followed by
 * a number N in 1..{@value SeedLabels#MAX_CLASS} (class N; {@code class1} and {@code class2} are
 * foreground and background). Anything may follow: {@code foreground-1}, {@code bg nucleus 2},
 * {@code class3_debris}. A ROI whose name matches none of these is an error naming the ROI and
 * listing the accepted prefixes.
 *
 * <p><b>Shapes.</b> Line ROIs (straight line, segmented line, freehand line) are strokes: ImageJ
 * draws them with their own stroke width ({@code Roi.getStrokeWidth()}, at least 1 pixel; wide
 * lines get ImageJ's square-ish ends, which extend half the width past the end points). Area ROIs
 * (rectangle, oval, polygon, freehand, traced, composite) are filled: every pixel of their mask.
 * Point ROIs mark their points. A ROI that marks no pixel of the image (drawn outside it) is an
 * error.
 *
 * <p><b>Plane.</b> A ROI marks one plane: its z position ({@code Roi.getZPosition()}) if set, else
 * its stack position ({@code Roi.getPosition()}), 1-based. For a single-plane image position 0
 * (none) means plane 1. For a z-stack a ROI without position is an error (a stroke meant for one
 * slice would otherwise mark the whole stack); a position beyond the stack is an error too.
 *
 * <p><b>Overlaps.</b> ROIs are applied in the order of the zip's entries; where they overlap the
 * later ROI wins, whatever the classes.
 */
final class RoiSeeds {
  /** Accepted name prefixes, for messages. */
  static final String PREFIXES =
      "foreground or fg (class 1), background or bg (class 2), classN (class N, 1.."
          + SeedLabels.MAX_CLASS
          + ")";

  private static final Pattern CLASS_N = Pattern.compile("^class(\\d{1,9})");

  private RoiSeeds() {}

  static SeedLabels read(Path file, int width, int height, int depth) {
    String name = file.toString();
    int plane = width * height;
    byte[] labels = new byte[plane * depth];
    ByteProcessor canvas = new ByteProcessor(width, height);
    byte[] drawn = (byte[]) canvas.getPixels();
    int count = 0;
    try (InputStream raw = Files.newInputStream(file);
        ZipInputStream zip = new ZipInputStream(raw)) {
      ZipEntry entry;
      while ((entry = zip.getNextEntry()) != null) {
        if (entry.isDirectory()) {
          continue;
        }
        String entryName = entry.getName();
        if (!entryName.toLowerCase(Locale.ROOT).endsWith(".roi")) {
          throw new BadInputException(
              "seed file "
                  + name
                  + " holds '"
                  + entryName
                  + "', which is not a ROI (.roi); a seed zip holds only ImageJ ROIs");
        }
        Roi roi = decode(zip.readAllBytes(), entryName, name);
        count++;
        String roiName = roi.getName() == null ? entryName : roi.getName();
        int label = classOf(roiName, name);
        int z = planeOf(roi, roiName, name, depth);
        Arrays.fill(drawn, (byte) 0);
        rasterise(roi, canvas);
        boolean any = false;
        int offset = z * plane;
        for (int i = 0; i < plane; i++) {
          if (drawn[i] != 0) {
            labels[offset + i] = (byte) label;
            any = true;
          }
        }
        if (!any) {
          throw new BadInputException(
              String.format(
                  Locale.ROOT,
                  "ROI '%s' in %s marks no pixel of the %d x %d image (bounds %s); was it drawn"
                      + " on another image?",
                  roiName,
                  name,
                  width,
                  height,
                  boundsText(roi)));
        }
      }
    } catch (NoSuchFileException e) {
      throw new BadInputException("seed file " + name + " does not exist", e);
    } catch (IOException e) {
      throw new BadInputException(
          "seed file " + name + " is not a readable ROI zip (corrupt or not a zip): " + e, e);
    }
    if (count == 0) {
      throw new BadInputException(
          "seed file " + name + " holds no ROI; save the seed strokes from the ROI Manager");
    }
    return new SeedLabels(width, height, depth, labels);
  }

  private static Roi decode(byte[] bytes, String entryName, String file) {
    Roi roi;
    try {
      roi = new RoiDecoder(bytes, entryName).getRoi();
    } catch (IOException | RuntimeException e) {
      roi = null;
    }
    if (roi == null) {
      throw new BadInputException(
          "entry '" + entryName + "' of seed file " + file + " is not a readable ImageJ ROI");
    }
    return roi;
  }

  /** The class label of a ROI name, see the class comment. */
  static int classOf(String roiName, String file) {
    String n = roiName.strip().toLowerCase(Locale.ROOT);
    if (n.startsWith("foreground") || n.startsWith("fg")) {
      return SeedLabels.FOREGROUND;
    }
    if (n.startsWith("background") || n.startsWith("bg")) {
      return SeedLabels.BACKGROUND;
    }
    Matcher m = CLASS_N.matcher(n);
    if (m.find()) {
      long k = Long.parseLong(m.group(1));
      if (k >= 1 && k <= SeedLabels.MAX_CLASS) {
        return (int) k;
      }
    }
    throw new BadInputException(
        "ROI '"
            + roiName
            + "' in "
            + file
            + " has no seed class in its name; rename it to start with "
            + PREFIXES);
  }

  private static int planeOf(Roi roi, String roiName, String file, int depth) {
    int position = roi.getZPosition() > 0 ? roi.getZPosition() : roi.getPosition();
    if (position == 0) {
      if (depth == 1) {
        return 0;
      }
      throw new BadInputException(
          "ROI '"
              + roiName
              + "' in "
              + file
              + " has no slice position but the image has "
              + depth
              + " planes; set each ROI's position to the slice it marks");
    }
    if (position < 1 || position > depth) {
      throw new BadInputException(
          "ROI '"
              + roiName
              + "' in "
              + file
              + " is on slice "
              + position
              + " but the image has "
              + depth
              + (depth == 1 ? " plane" : " planes"));
    }
    return position - 1;
  }

  /** Draws (lines, with their stroke width) or fills (areas) {@code roi} in 255 on {@code ip}. */
  static void rasterise(Roi roi, ByteProcessor ip) {
    ip.setColor(255);
    if (roi.isLine()) {
      ip.setLineWidth(Math.max(1, Math.round(roi.getStrokeWidth())));
      roi.drawPixels(ip);
    } else if (roi.getType() == Roi.POINT) {
      for (Point p : roi.getContainedPoints()) {
        if (p.x >= 0 && p.y >= 0 && p.x < ip.getWidth() && p.y < ip.getHeight()) {
          ip.set(p.x, p.y, 255);
        }
      }
    } else {
      ip.fill(roi);
    }
  }

  private static String boundsText(Roi roi) {
    java.awt.Rectangle r = roi.getBounds();
    return "x=" + r.x + ", y=" + r.y + ", " + r.width + " x " + r.height;
  }
}
