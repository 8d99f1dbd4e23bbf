package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.ImageStack;
import ij.gui.Roi;
import ij.process.LUT;
import io.github.cleave.objects.RoiExport;
import io.github.cleave.render.SeedColours;
import java.awt.Color;
import java.util.List;

/**
 * Class maps of segmentations into three or more classes as ImageJ images, and the class colours on
 * ROIs. A class map is an 8-bit image holding the class 1..K of every voxel (seed label numbers: 1
 * foreground, 2 background, 3.. further classes; 0 only where nothing was decided), shown through a
 * lookup table in the seed palette ({@link SeedColours#of}): value k is drawn in the colour of seed
 * class k, value 0 black; the display range is 0..255, so every value keeps its own colour.
 * Stateless.
 */
final class ClassMapImages {
  private ClassMapImages() {}

  /** The palette lookup table: entry 0 black, entry k the colour of seed class k. */
  static LUT paletteLut() {
    byte[] r = new byte[256];
    byte[] g = new byte[256];
    byte[] b = new byte[256];
    for (int k = 1; k < 256; k++) {
      int rgb = SeedColours.of(k);
      r[k] = (byte) (rgb >> 16);
      g[k] = (byte) (rgb >> 8);
      b[k] = (byte) rgb;
    }
    return new LUT(r, g, b);
  }

  /**
   * A class map image of {@code frames.size()} time points of {@code w × h × d} class numbers each
   * (a hyperstack of one channel, {@code d} slices and one frame per entry).
   */
  static ImagePlus image(String title, List<byte[]> frames, int w, int h, int d) {
    ImageStack stack = new ImageStack(w, h);
    for (byte[] frame : frames) {
      ImageStack planes = ResultImages.byteStack(frame, w, h, d);
      for (int z = 1; z <= d; z++) {
        stack.addSlice(null, planes.getProcessor(z));
      }
    }
    ImagePlus imp = new ImagePlus(title, stack);
    imp.setDimensions(1, d, frames.size());
    if (frames.size() > 1) {
      imp.setOpenAsHyperStack(true);
    }
    LUT lut = paletteLut();
    for (int i = 1; i <= stack.size(); i++) {
      stack.getProcessor(i).setLut(lut);
    }
    imp.getProcessor().setLut(lut);
    imp.setDisplayRange(0, 255);
    return imp;
  }

  /**
   * Draws {@code roi} in the colour of the class its name ends in ({@code -classN}, {@link
   * RoiExport#classOf}); a ROI without class is left as it is. (ImageJ's ROI groups are not used:
   * giving a ROI a group looks up a colour table that some installations lack, with a message per
   * ROI, and would draw it in that table's colour instead of the class colour.)
   */
  static void colour(Roi roi) {
    int c = RoiExport.classOf(roi);
    if (c > 0) {
      roi.setStrokeColor(new Color(SeedColours.of(c)));
    }
  }
}
