package io.github.cleave.io;

import ij.ImagePlus;
import ij.ImageStack;
import ij.measure.Calibration;
import io.github.cleave.image.VoxelSize;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

/**
 * Writes results over time as one ImageJ hyperstack TIFF each: one channel, {@code depth} slices
 * (Z) and one frame (T) per time point, planes in ImageJ's order (slice fastest, then frame: plane
 * {@code z + depth * t}, 0-based), with the voxel calibration, the frame interval and its time
 * unit. The contracts of DESIGN.md hold frame by frame:
 *
 * <ul>
 *   <li>masks: 8-bit, 0 background, 255 foreground;
 *   <li>label images: 16-bit, 0 background, 1..count objects; 32-bit float only when {@code count}
 *       exceeds 65535 (exact up to {@link ImageOutputs#MAX_FLOAT_LABEL}); numbers need not be
 *       consecutive within a frame (tracked objects keep their number across frames);
 *   <li>class maps: 8-bit, one class number 0..255 per voxel.
 * </ul>
 *
 * <p>Files are encoded as {@link ImageOutputs} encodes them ({@link TiffBytes}, little-endian) and
 * written atomically ({@link AtomicFiles}): no partial file is ever visible, none remains after a
 * failure. The whole file is built in memory before it is written (about twice the size of the
 * results). The calibration is written when the voxel unit is not "pixel"; the frame interval when
 * it is known (time unit "s" is written as ImageJ's "sec"). Stateless, thread-safe.
 */
public final class TimeLapseOutputs {
  private TimeLapseOutputs() {}

  /**
   * Writes one mask per time point.
   *
   * @param masks {@code geometry.frames()} arrays of {@code geometry.frameSize()} values, each 0 or
   *     {@code (byte) 255}
   * @throws IllegalArgumentException if a count, a length or a value is wrong
   * @throws IOException if the file cannot be written; nothing is left behind then
   */
  public static void writeMasks(Path file, List<byte[]> masks, TimeLapseGeometry geometry)
      throws IOException {
    checkFrames(masks.size(), geometry, "masks");
    ImageStack stack = new ImageStack(geometry.width(), geometry.height());
    for (int t = 0; t < masks.size(); t++) {
      byte[] mask = masks.get(t);
      checkLength(mask.length, geometry, t, "mask");
      for (int i = 0; i < mask.length; i++) {
        if (mask[i] != 0 && mask[i] != (byte) 255) {
          throw new IllegalArgumentException(
              String.format(
                  Locale.ROOT,
                  "mask value %d at index %d of time point %d; masks hold only 0 and 255",
                  mask[i] & 0xff,
                  i,
                  t + 1));
        }
      }
      ImageOutputs.addBytePlanes(
          stack, mask, geometry.width(), geometry.height(), geometry.depth());
    }
    ImagePlus imp = image(stack, geometry, "mask");
    imp.setDisplayRange(0, 255);
    ImageOutputs.write(file, imp);
  }

  /**
   * Writes one label image per time point: 16-bit when {@code count <= 65535}, else 32-bit float.
   *
   * @param labels {@code geometry.frames()} arrays of {@code geometry.frameSize()} values in {@code
   *     0..count}
   * @param count the largest object number over all time points
   * @throws IllegalArgumentException if a count, a length or a label is wrong, or {@code count}
   *     exceeds {@link ImageOutputs#MAX_FLOAT_LABEL}
   * @throws IOException if the file cannot be written; nothing is left behind then
   */
  public static void writeLabels(
      Path file, List<int[]> labels, int count, TimeLapseGeometry geometry) throws IOException {
    checkFrames(labels.size(), geometry, "label images");
    if (count < 0 || count > ImageOutputs.MAX_FLOAT_LABEL) {
      throw new IllegalArgumentException(
          "object count "
              + count
              + "; label images hold 0.."
              + ImageOutputs.MAX_FLOAT_LABEL
              + " objects");
    }
    boolean shorts = count <= 65535;
    int w = geometry.width();
    int h = geometry.height();
    ImageStack stack = new ImageStack(w, h);
    for (int t = 0; t < labels.size(); t++) {
      int[] frame = labels.get(t);
      checkLength(frame.length, geometry, t, "label image");
      for (int i = 0; i < frame.length; i++) {
        if (frame[i] < 0 || frame[i] > count) {
          throw new IllegalArgumentException(
              String.format(
                  Locale.ROOT,
                  "label %d at index %d of time point %d; labels must lie in 0..%d",
                  frame[i],
                  i,
                  t + 1,
                  count));
        }
      }
      ImageOutputs.addLabelPlanes(stack, frame, w, h, geometry.depth(), shorts);
    }
    ImagePlus imp = image(stack, geometry, "labels");
    imp.setDisplayRange(0, Math.max(1, count));
    ImageOutputs.write(file, imp);
  }

  /**
   * Writes one class map per time point (8-bit class numbers, any value 0..255).
   *
   * @param classes {@code geometry.frames()} arrays of {@code geometry.frameSize()} values
   * @throws IllegalArgumentException if a count or a length is wrong
   * @throws IOException if the file cannot be written; nothing is left behind then
   */
  public static void writeClassMaps(Path file, List<byte[]> classes, TimeLapseGeometry geometry)
      throws IOException {
    checkFrames(classes.size(), geometry, "class maps");
    ImageStack stack = new ImageStack(geometry.width(), geometry.height());
    int max = 0;
    for (int t = 0; t < classes.size(); t++) {
      byte[] map = classes.get(t);
      checkLength(map.length, geometry, t, "class map");
      for (byte b : map) {
        max = Math.max(max, b & 0xff);
      }
      ImageOutputs.addBytePlanes(stack, map, geometry.width(), geometry.height(), geometry.depth());
    }
    ImagePlus imp = image(stack, geometry, "classes");
    imp.setDisplayRange(0, Math.max(1, max));
    ImageOutputs.write(file, imp);
  }

  private static void checkFrames(int count, TimeLapseGeometry geometry, String what) {
    if (count != geometry.frames()) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "%d %s for a time-lapse of %d time points; give one per time point",
              count,
              what,
              geometry.frames()));
    }
  }

  private static void checkLength(int length, TimeLapseGeometry geometry, int t, String what) {
    if (length != geometry.frameSize()) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "%s of time point %d has %d values; a %d x %d x %d frame needs %d",
              what,
              t + 1,
              length,
              geometry.width(),
              geometry.height(),
              geometry.depth(),
              geometry.frameSize()));
    }
  }

  private static ImagePlus image(ImageStack stack, TimeLapseGeometry geometry, String title) {
    ImagePlus imp = new ImagePlus(title, stack);
    imp.setDimensions(1, geometry.depth(), geometry.frames());
    if (geometry.frames() > 1) {
      imp.setOpenAsHyperStack(true);
    }
    Calibration cal = new Calibration();
    VoxelSize size = geometry.voxelSize();
    String unit = size.unit().toLowerCase(Locale.ROOT);
    if (!unit.equals("pixel") && !unit.equals("pixels")) {
      cal.pixelWidth = size.x();
      cal.pixelHeight = size.y();
      cal.pixelDepth = size.z();
      cal.setUnit(size.unit());
    }
    if (!Double.isNaN(geometry.frameInterval())) {
      cal.frameInterval = geometry.frameInterval();
      String timeUnit = geometry.timeUnit();
      cal.setTimeUnit(timeUnit.equals("s") ? "sec" : timeUnit);
    }
    imp.setCalibration(cal);
    return imp;
  }
}
