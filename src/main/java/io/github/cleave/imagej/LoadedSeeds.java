package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.gui.Roi;
import ij.plugin.filter.ThresholdToSelection;
import ij.process.ByteProcessor;
import ij.process.ImageProcessor;
import io.github.cleave.render.SeedColours;
import java.awt.Color;
import java.util.ArrayList;
import java.util.List;

/**
 * Loaded seeds (the base layer of {@link SeedStrokes}, from a seed label image or ROI zip) as
 * overlay ROIs on one plane: one area per class present there, filled in its class's palette colour
 * ({@link SeedColours}, as strokes of that class are drawn) at {@value #ALPHA} of 255 opacity, so
 * that the data under large seed areas stays visible, and named by the seed ROI convention ({@code
 * foreground-loaded}, {@code background-loaded}, {@code classN-loaded}). Tracing is ImageJ's
 * threshold-to-selection, O(w · h) per class present.
 */
final class LoadedSeeds {
  /** Opacity of the fill, of 255. */
  static final int ALPHA = 160;

  private LoadedSeeds() {}

  /**
   * The areas of every class on plane {@code z} (0-based) of {@code imp}, in class order; empty
   * when {@code base} is null or marks nothing there.
   *
   * @param base seed labels of every plane of {@code imp}, or null
   */
  static List<Roi> rois(byte[] base, ImagePlus imp, int z) {
    List<Roi> out = new ArrayList<>();
    if (base == null) {
      return out;
    }
    int n = imp.getWidth() * imp.getHeight();
    byte[] plane = new byte[n];
    System.arraycopy(base, z * n, plane, 0, n);
    boolean[] present = new boolean[256];
    for (byte b : plane) {
      present[b & 0xff] = true;
    }
    for (int c = 1; c < present.length; c++) {
      if (!present[c]) {
        continue;
      }
      ByteProcessor bp = new ByteProcessor(imp.getWidth(), imp.getHeight(), plane);
      bp.setThreshold(c, c, ImageProcessor.NO_LUT_UPDATE);
      Roi r = new ThresholdToSelection().convert(bp);
      if (r == null) {
        continue;
      }
      r.setFillColor(new Color((ALPHA << 24) | SeedColours.of(c), true));
      r.setName(PaintClasses.roiPrefix(c) + "-loaded");
      CutContour.position(r, imp, z);
      out.add(r);
    }
    return out;
  }
}
