package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.gui.Roi;
import ij.plugin.filter.ThresholdToSelection;
import ij.process.ByteProcessor;
import ij.process.ImageProcessor;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.render.OverlayPicture;
import io.github.cleave.render.SeedColours;
import java.awt.Color;
import java.util.ArrayList;
import java.util.List;

/**
 * The live preview's contours as overlay ROIs: thin lines (never a filled wash, DESIGN.md),
 * positioned on their plane in a stack. Tracing is ImageJ's threshold-to-selection, O(w · h) per
 * outline.
 *
 * <ul>
 *   <li>Two classes: the outline of the foreground mask, in the contour colour of DESIGN.md, named
 *       {@code cut}.
 *   <li>Three or more classes: one outline per class except the background, each in its class's
 *       palette colour ({@link SeedColours}, the colour of its strokes), named {@code
 *       cut-foreground} or {@code cut-classN}. The background gets no line of its own: each of its
 *       boundaries is already the outline of the class beyond it, so every boundary between classes
 *       is drawn once, and the colour says which class a region was given. Where two further
 *       classes touch, their outlines coincide and the higher class is drawn on top.
 * </ul>
 */
final class CutContour {
  private static final Color CONTOUR = new Color(OverlayPicture.CONTOUR);

  private CutContour() {}

  /**
   * The contour on plane {@code z} (0-based) of {@code imp}, or null if there is none there.
   *
   * @param mask the mask of one plane or of the whole volume (255 foreground), or null
   * @param maskPlane the plane of {@code mask}, or -1 if it covers the volume
   */
  static Roi of(byte[] mask, int maskPlane, ImagePlus imp, int z) {
    byte[] planeMask = planeOf(mask, maskPlane, imp, z);
    if (planeMask == null) {
      return null;
    }
    return trace(planeMask, 255, CONTOUR, "cut", imp, z);
  }

  /**
   * The outlines of every class but the background on plane {@code z} of {@code imp}, highest class
   * first (empty if the plane holds none).
   *
   * @param classes the class map of one plane or of the whole volume (classes 1..K), or null
   * @param mapPlane the plane of {@code classes}, or -1 if it covers the volume
   * @param classCount K
   */
  static List<Roi> ofClasses(byte[] classes, int mapPlane, ImagePlus imp, int z, int classCount) {
    List<Roi> out = new ArrayList<>();
    byte[] plane = planeOf(classes, mapPlane, imp, z);
    if (plane == null) {
      return out;
    }
    boolean[] present = new boolean[256];
    for (byte b : plane) {
      present[b & 0xff] = true;
    }
    for (int c = classCount; c >= 1; c--) { // the lower class on top: foreground last
      if (c != SeedLabels.BACKGROUND && present[c]) {
        String name = "cut-" + PaintClasses.roiPrefix(c);
        Roi r = trace(plane, c, new Color(SeedColours.of(c)), name, imp, z);
        if (r != null) {
          out.add(r);
        }
      }
    }
    return out;
  }

  /** The plane {@code z} of a plane's or a volume's data, or null if it has none there. */
  private static byte[] planeOf(byte[] data, int dataPlane, ImagePlus imp, int z) {
    if (data == null) {
      return null;
    }
    int n = imp.getWidth() * imp.getHeight();
    if (dataPlane < 0) {
      byte[] plane = new byte[n];
      System.arraycopy(data, z * n, plane, 0, n);
      return plane;
    }
    return dataPlane == z ? data : null;
  }

  /**
   * The outline of the pixels of {@code plane} equal to {@code value}, or null if there is none.
   */
  static Roi trace(byte[] plane, int value, Color colour, String name, ImagePlus imp, int z) {
    ByteProcessor bp = new ByteProcessor(imp.getWidth(), imp.getHeight(), plane);
    bp.setThreshold(value, value, ImageProcessor.NO_LUT_UPDATE);
    Roi r = new ThresholdToSelection().convert(bp);
    if (r == null) {
      return null;
    }
    r.setStrokeColor(colour);
    r.setStrokeWidth(0);
    r.setName(name);
    position(r, imp, z);
    return r;
  }

  /** Puts an overlay ROI on plane {@code z} (0-based) of a stack; nothing for a single image. */
  static void position(Roi r, ImagePlus imp, int z) {
    if (imp.getStackSize() > 1) {
      if (imp.isHyperStack()) {
        r.setPosition(0, z + 1, 0);
      } else {
        r.setPosition(z + 1);
      }
    }
  }
}
