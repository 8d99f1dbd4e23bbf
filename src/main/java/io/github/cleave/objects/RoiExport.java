package io.github.cleave.objects;

import ij.gui.Roi;
import ij.io.RoiDecoder;
import ij.io.RoiEncoder;
import ij.plugin.filter.ThresholdToSelection;
import ij.process.ByteProcessor;
import ij.process.ImageProcessor;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.time.LocalDateTime;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.zip.ZipEntry;
import java.util.zip.ZipInputStream;
import java.util.zip.ZipOutputStream;

/**
 * Objects as ImageJ ROIs, and ImageJ ROI zips (the format ImageJ's ROI Manager opens and saves).
 *
 * <p>One ROI per object and per plane it occupies, made by ImageJ's {@code ThresholdToSelection}
 * from the object's pixels on that plane (thresholded 255..255 on a 0/255 {@code ByteProcessor}
 * cropped to the object's bounding box, then moved into place): the ROI traces pixel edges, so it
 * contains exactly the object's pixels, and holes and several separate parts survive (a composite
 * {@code ShapeRoi} where needed; a single polygon or rectangle otherwise). Names are {@code
 * object-0001} for a single plane and {@code object-0001-z0003} in a stack, with the 1-based plane
 * number in the name and in {@code roi.setPosition(plane)}. The number is the object's label.
 * Order: by object, then by plane. Zip entries are {@code NAME.roi}, with a fixed time stamp, so
 * the same labels give the same bytes. Works headless (no window, no ROI Manager).
 *
 * <p>Cost: for each object, its bounding box area times the planes it spans. Thread-safe.
 */
public final class RoiExport {
  private static final LocalDateTime STAMP = LocalDateTime.of(1980, 1, 1, 0, 0);

  private RoiExport() {}

  /** The ROI zip of all objects, as bytes. */
  public static byte[] roiZip(ObjectLabels labels) {
    return roiZip(labels, null);
  }

  /**
   * The ROI zip of all objects, as bytes, each ROI's name ending in its object's class ({@code
   * -class3}; {@code objectClasses[i]} for object i + 1) when {@code objectClasses} is not null.
   */
  public static byte[] roiZip(ObjectLabels labels, int[] objectClasses) {
    return zip(rois(labels, objectClasses));
  }

  /** A ROI zip of {@code rois} in their order, entries named {@code NAME.roi}, as bytes. */
  public static byte[] zip(List<Roi> rois) {
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    try (ZipOutputStream zip = new ZipOutputStream(bytes)) {
      for (Roi roi : rois) {
        ZipEntry entry = new ZipEntry(roi.getName() + ".roi");
        entry.setTimeLocal(STAMP);
        zip.putNextEntry(entry);
        zip.write(RoiEncoder.saveAsByteArray(roi));
        zip.closeEntry();
      }
    } catch (IOException e) {
      throw new UncheckedIOException("writing a ROI zip in memory", e);
    }
    return bytes.toByteArray();
  }

  /**
   * The ROIs of one time point of a time-lapse: those of {@link #rois(ObjectLabels, int[])}, named
   * by their tracked number and time point ({@code object-0012-t0003}, {@code
   * object-0012-z0004-t0003} in a stack, {@code object-0012-t0003-class3} with classes) and placed
   * at hyperstack position (all channels, their plane, time point {@code frame + 1}).
   *
   * @param numberOf {@code numberOf[k]} is the tracked number of object k of {@code labels}
   * @param frame the time point, 0-based
   */
  public static List<Roi> roisOfFrame(
      ObjectLabels labels, int[] objectClasses, int[] numberOf, int frame) {
    List<Roi> out = rois(labels, objectClasses);
    for (Roi roi : out) {
      String name = roi.getName(); // object-NNNN, then -zZZZZ and -classN where they apply
      int dash = name.indexOf('-', "object-".length());
      int own =
          Integer.parseInt(name.substring("object-".length(), dash < 0 ? name.length() : dash));
      String suffix = dash < 0 ? "" : name.substring(dash);
      int cls = suffix.indexOf("-class");
      String plane = cls < 0 ? suffix : suffix.substring(0, cls);
      String classPart = cls < 0 ? "" : suffix.substring(cls);
      roi.setName(
          String.format(
              Locale.ROOT, "object-%04d%s-t%04d%s", numberOf[own], plane, frame + 1, classPart));
      roi.setPosition(0, labels.depth() > 1 ? roi.getPosition() : 1, frame + 1);
    }
    return out;
  }

  /** The class in the name of a ROI made with classes ({@code ...-class3} → 3), or 0 if none. */
  public static int classOf(Roi roi) {
    String name = roi.getName();
    int at = name == null ? -1 : name.lastIndexOf("-class");
    if (at < 0) {
      return 0;
    }
    try {
      return Integer.parseInt(name.substring(at + "-class".length()));
    } catch (NumberFormatException e) {
      return 0;
    }
  }

  /** The ROIs of all objects, named and positioned, in zip order. */
  public static List<Roi> rois(ObjectLabels labels) {
    return rois(labels, null);
  }

  /**
   * As {@link #rois(ObjectLabels)}, each name ending in {@code -classN} for an object of class N
   * when {@code objectClasses} is not null. (ImageJ's ROI groups are not used: giving a ROI a group
   * looks up a colour table that a headless installation lacks, with a message per ROI.)
   */
  public static List<Roi> rois(ObjectLabels labels, int[] objectClasses) {
    int w = labels.width();
    int h = labels.height();
    int d = labels.depth();
    int n = labels.count();
    int[] raw = labels.raw();
    int[][] box = new int[6][n + 1]; // min x, min y, min z, max x, max y, max z
    for (int l = 1; l <= n; l++) {
      box[0][l] = box[1][l] = box[2][l] = Integer.MAX_VALUE;
      box[3][l] = box[4][l] = box[5][l] = -1;
    }
    int i = 0;
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++, i++) {
          int l = raw[i];
          if (l != 0) {
            box[0][l] = Math.min(box[0][l], x);
            box[1][l] = Math.min(box[1][l], y);
            box[2][l] = Math.min(box[2][l], z);
            box[3][l] = Math.max(box[3][l], x);
            box[4][l] = Math.max(box[4][l], y);
            box[5][l] = Math.max(box[5][l], z);
          }
        }
      }
    }
    List<Roi> out = new ArrayList<>();
    ThresholdToSelection tracer = new ThresholdToSelection();
    tracer.showStatus(false);
    for (int l = 1; l <= n; l++) {
      int x0 = box[0][l];
      int y0 = box[1][l];
      int bw = box[3][l] - x0 + 1;
      int bh = box[4][l] - y0 + 1;
      for (int z = box[2][l]; z <= box[5][l]; z++) {
        ByteProcessor bp = new ByteProcessor(bw, bh);
        byte[] px = (byte[]) bp.getPixels();
        boolean any = false;
        for (int y = 0; y < bh; y++) {
          int row = x0 + w * (y0 + y + h * z);
          for (int x = 0; x < bw; x++) {
            if (raw[row + x] == l) {
              px[x + bw * y] = (byte) 255;
              any = true;
            }
          }
        }
        if (!any) {
          continue;
        }
        bp.setThreshold(255, 255, ImageProcessor.NO_LUT_UPDATE);
        Roi roi = tracer.convert(bp);
        roi.setLocation(roi.getXBase() + x0, roi.getYBase() + y0);
        String name = String.format(Locale.ROOT, "object-%04d", l);
        if (d > 1) {
          name += String.format(Locale.ROOT, "-z%04d", z + 1);
          roi.setPosition(z + 1);
        }
        if (objectClasses != null) {
          name += "-class" + objectClasses[l - 1];
        }
        roi.setName(name);
        out.add(roi);
      }
    }
    return out;
  }

  /**
   * Reads a ROI zip: entry name without {@code .roi} → ROI, in zip order.
   *
   * @throws IOException if the zip or a ROI cannot be read
   */
  public static Map<String, Roi> readZip(byte[] zipBytes) throws IOException {
    Map<String, Roi> out = new LinkedHashMap<>();
    try (ZipInputStream zip = new ZipInputStream(new ByteArrayInputStream(zipBytes))) {
      for (ZipEntry e = zip.getNextEntry(); e != null; e = zip.getNextEntry()) {
        String name = e.getName();
        Roi roi = new RoiDecoder(zip.readAllBytes(), name).getRoi();
        if (roi == null) {
          throw new IOException("ROI zip entry " + name + " is not an ImageJ ROI");
        }
        out.put(name.endsWith(".roi") ? name.substring(0, name.length() - 4) : name, roi);
      }
    }
    return out;
  }
}
