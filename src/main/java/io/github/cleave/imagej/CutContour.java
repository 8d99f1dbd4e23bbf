package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.gui.Roi;
import ij.plugin.filter.ThresholdToSelection;
import ij.process.ByteProcessor;
import ij.process.ImageProcessor;
import io.github.cleave.render.OverlayPicture;
import java.awt.Color;

/**
 * The live cut's contour as an overlay ROI: the outline of a foreground mask on one plane, a thin
 * line in the contour colour of DESIGN.md, named {@code cut}, positioned on its plane in a stack.
 * Tracing is ImageJ's threshold-to-selection, O(w · h).
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
    if (mask == null) {
      return null;
    }
    int w = imp.getWidth();
    int h = imp.getHeight();
    byte[] planeMask;
    if (maskPlane < 0) {
      planeMask = new byte[w * h];
      System.arraycopy(mask, z * w * h, planeMask, 0, w * h);
    } else if (maskPlane == z) {
      planeMask = mask;
    } else {
      return null;
    }
    ByteProcessor bp = new ByteProcessor(w, h, planeMask);
    bp.setThreshold(255, 255, ImageProcessor.NO_LUT_UPDATE);
    Roi r = new ThresholdToSelection().convert(bp);
    if (r == null) {
      return null;
    }
    r.setStrokeColor(CONTOUR);
    r.setStrokeWidth(0);
    r.setName("cut");
    if (imp.getStackSize() > 1) {
      if (imp.isHyperStack()) {
        r.setPosition(0, z + 1, 0);
      } else {
        r.setPosition(z + 1);
      }
    }
    return r;
  }
}
