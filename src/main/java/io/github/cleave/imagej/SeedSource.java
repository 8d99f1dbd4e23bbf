package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.ImageStack;
import ij.WindowManager;
import ij.gui.Roi;
import ij.io.RoiEncoder;
import ij.plugin.frame.RoiManager;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.SeedFiles;
import java.awt.GraphicsEnvironment;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;

/**
 * Where a command's seeds come from: an open seed label image (by title) or the ROIs of the ROI
 * Manager, named as in a seed ROI zip ({@code foreground...}, {@code background...}, see {@link
 * SeedFiles}). Stateless.
 */
final class SeedSource {
  /** The choice that takes the seeds from the ROI Manager. */
  static final String ROI_MANAGER = "ROI Manager";

  /** The choice for no seeds (apply a model without hard constraints). */
  static final String NONE = "none";

  private SeedSource() {}

  /** The choices for a seeds field: the ROI Manager, then every open image except {@code imp}. */
  static List<String> choices(ImagePlus imp, boolean withNone) {
    List<String> list = new ArrayList<>();
    if (withNone) {
      list.add(NONE);
    }
    list.add(ROI_MANAGER);
    int[] ids = WindowManager.getIDList();
    if (ids != null) {
      for (int id : ids) {
        ImagePlus other = WindowManager.getImage(id);
        if (other != null && other != imp) {
          list.add(other.getTitle());
        }
      }
    }
    return list;
  }

  /**
   * The seeds named by {@code choice} for {@code imp}: {@code null} for {@link #NONE}.
   *
   * @throws BadInputException if the image or the ROIs cannot serve as seeds of {@code imp}
   */
  static SeedLabels read(String choice, ImagePlus imp) {
    int w = imp.getWidth();
    int h = imp.getHeight();
    int d = imp.getNSlices();
    if (choice == null || choice.isBlank() || choice.equalsIgnoreCase(NONE)) {
      return null;
    }
    if (choice.equals(ROI_MANAGER)) {
      return fromRois(managerRois(), w, h, d);
    }
    ImagePlus seeds = WindowManager.getImage(choice);
    if (seeds == null) {
      throw new BadInputException(
          "seeds="
              + choice
              + ": no open image has this title; open the seed label image, or use seeds=["
              + ROI_MANAGER
              + "]");
    }
    return fromImage(seeds, w, h, d);
  }

  /** A seed label image (0 none, 1 foreground, 2 background, 3.. further classes) as seeds. */
  static SeedLabels fromImage(ImagePlus seeds, int w, int h, int d) {
    String title = seeds.getTitle();
    int bits = seeds.getBitDepth();
    if (bits != 8 && bits != 16) {
      throw new BadInputException(
          "seed image "
              + title
              + " is "
              + bits
              + "-bit; a seed label image is 8- or 16-bit (0 none, 1 foreground, 2 background)");
    }
    if (seeds.getWidth() != w
        || seeds.getHeight() != h
        || seeds.getNSlices() != d
        || seeds.getNChannels() != 1
        || seeds.getNFrames() != 1) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "seed image %s is %d x %d with %d plane(s); it must be one channel of %d x %d with"
                  + " %d plane(s), like the image",
              title,
              seeds.getWidth(),
              seeds.getHeight(),
              seeds.getStackSize(),
              w,
              h,
              d));
    }
    int plane = w * h;
    byte[] labels = new byte[plane * d];
    ImageStack stack = seeds.getStack();
    for (int z = 0; z < d; z++) {
      Object pixels = stack.getPixels(z + 1);
      for (int i = 0; i < plane; i++) {
        int v = pixels instanceof byte[] b ? b[i] & 0xff : ((short[]) pixels)[i] & 0xffff;
        if (v > SeedLabels.MAX_CLASS) {
          throw new BadInputException(
              "seed image "
                  + title
                  + " has the value "
                  + v
                  + "; seed labels go from 0 to "
                  + SeedLabels.MAX_CLASS);
        }
        labels[z * plane + i] = (byte) v;
      }
    }
    return new SeedLabels(w, h, d, labels);
  }

  /** ROIs named as seeds, rasterised exactly as a seed ROI zip holding them would be. */
  static SeedLabels fromRois(Roi[] rois, int w, int h, int d) {
    if (rois.length == 0) {
      throw new BadInputException(
          "the ROI Manager holds no ROI; add strokes named foreground... and background...");
    }
    Path zip = null;
    try {
      zip = Files.createTempFile("cleave-seeds", ".zip");
      try (OutputStream out = Files.newOutputStream(zip);
          ZipOutputStream z = new ZipOutputStream(out)) {
        int n = 0;
        for (Roi roi : rois) {
          z.putNextEntry(new ZipEntry(String.format(Locale.ROOT, "%04d.roi", ++n)));
          z.write(RoiEncoder.saveAsByteArray(roi));
          z.closeEntry();
        }
      }
      return SeedFiles.read(zip, w, h, d);
    } catch (IOException e) {
      throw new BadInputException("the ROI Manager's ROIs cannot be passed on as seeds: " + e, e);
    } finally {
      if (zip != null) {
        try {
          Files.deleteIfExists(zip);
        } catch (IOException e) {
          // a temporary file the system cleans up
        }
      }
    }
  }

  /** The ROIs of the open ROI Manager. */
  static Roi[] managerRois() {
    if (GraphicsEnvironment.isHeadless()) {
      throw new BadInputException(
          "the ROI Manager is not available without a display; give seeds=TITLE of an open seed"
              + " label image");
    }
    RoiManager rm = RoiManager.getInstance();
    if (rm == null) {
      throw new BadInputException(
          "the ROI Manager is not open; add strokes named foreground... and background... to it");
    }
    return rm.getRoisAsArray();
  }
}
