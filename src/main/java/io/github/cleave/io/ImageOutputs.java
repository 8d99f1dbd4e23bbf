package io.github.cleave.io;

import ij.ImagePlus;
import ij.ImageStack;
import ij.measure.Calibration;
import ij.process.ByteProcessor;
import ij.process.FloatProcessor;
import ij.process.ShortProcessor;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.VoxelSize;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Collection;
import java.util.Locale;

/**
 * Writes the image outputs of a segmentation (DESIGN.md contracts), each atomically through {@link
 * AtomicFiles}, so that no partial file is ever visible and no temporary file remains:
 *
 * <ul>
 *   <li>masks: 8-bit TIFF, 0 background, 255 foreground (ImageJ's binary convention), a z-stack for
 *       3D;
 *   <li>label images: 16-bit TIFF, 0 background, 1..n objects; 32-bit float only beyond 65535
 *       objects (exact up to 2<sup>24</sup> objects, more are refused);
 *   <li>pictures: PNG through {@code javax.imageio}, cached in memory (no temporary files).
 * </ul>
 *
 * <p>TIFFs are encoded by ImageJ in one fixed byte order ({@link TiffBytes}), so ImageJ reads them
 * back with the same values, bit depth and calibration. The calibration is written whenever the
 * voxel size has a unit other than "pixel", also when it was {@link VoxelSize#assumed() assumed}
 * (for instance given on the command line), so that outputs measure the way the segmentation did.
 *
 * <p>No output may overwrite an input: callers check each output path with {@link
 * #checkNotInput(Path, Collection)}. Stateless, thread-safe.
 */
public final class ImageOutputs {
  /** Largest object count a 32-bit float label image holds exactly (2^24). */
  public static final int MAX_FLOAT_LABEL = 1 << 24;

  private ImageOutputs() {}

  /**
   * Writes a mask as an 8-bit TIFF.
   *
   * @param mask {@code width * height * depth} values, each 0 or 255 ({@code (byte) 255})
   * @throws IllegalArgumentException if the array length or a value is wrong
   * @throws IOException if the file cannot be written; nothing is left behind then
   */
  public static void writeMask(
      Path file, byte[] mask, int width, int height, int depth, VoxelSize voxelSize)
      throws IOException {
    checkSize(mask.length, width, height, depth, "mask");
    for (int i = 0; i < mask.length; i++) {
      if (mask[i] != 0 && mask[i] != (byte) 255) {
        throw new IllegalArgumentException(
            "mask value " + (mask[i] & 0xff) + " at index " + i + "; masks hold only 0 and 255");
      }
    }
    ImageStack stack = new ImageStack(width, height);
    addBytePlanes(stack, mask, width, height, depth);
    writeTiff(file, stack, depth, voxelSize, "mask");
  }

  /**
   * Writes a class map as an 8-bit TIFF (class 1..K per voxel, the seed label contract).
   *
   * @param classes {@code width * height * depth} values in {@code 1..classCount}
   * @throws IllegalArgumentException if the array length or a value is wrong
   * @throws IOException if the file cannot be written; nothing is left behind then
   */
  public static void writeClassMap(
      Path file, byte[] classes, int classCount, int width, int height, int depth, VoxelSize size)
      throws IOException {
    checkSize(classes.length, width, height, depth, "class map");
    for (int i = 0; i < classes.length; i++) {
      int c = classes[i] & 0xff;
      if (c < 1 || c > classCount) {
        throw new IllegalArgumentException(
            "class " + c + " at index " + i + "; a class map holds 1.." + classCount);
      }
    }
    ImageStack stack = new ImageStack(width, height);
    addBytePlanes(stack, classes, width, height, depth);
    writeTiff(file, stack, depth, size, "classes");
  }

  /**
   * Writes a label image: 16-bit TIFF when {@code count <= 65535}, else 32-bit float.
   *
   * @param labels {@code width * height * depth} values in {@code 0..count}
   * @param count number of objects n (labels 1..n)
   * @throws IllegalArgumentException if the array length or a label is wrong, or {@code count}
   *     exceeds {@link #MAX_FLOAT_LABEL}
   * @throws IOException if the file cannot be written; nothing is left behind then
   */
  public static void writeLabels(
      Path file, int[] labels, int count, int width, int height, int depth, VoxelSize voxelSize)
      throws IOException {
    checkSize(labels.length, width, height, depth, "label image");
    if (count < 0 || count > MAX_FLOAT_LABEL) {
      throw new IllegalArgumentException(
          "object count " + count + "; label images hold 0.." + MAX_FLOAT_LABEL + " objects");
    }
    for (int i = 0; i < labels.length; i++) {
      if (labels[i] < 0 || labels[i] > count) {
        throw new IllegalArgumentException(
            "label " + labels[i] + " at index " + i + "; labels must lie in 0.." + count);
      }
    }
    ImageStack stack = new ImageStack(width, height);
    addLabelPlanes(stack, labels, width, height, depth, count <= 65535);
    ImagePlus imp = image(stack, depth, voxelSize, "labels");
    imp.setDisplayRange(0, Math.max(1, count));
    write(file, imp);
  }

  /**
   * Writes a picture as PNG ({@link PngEncoder}: 8-bit RGB, fast compression).
   *
   * @throws IOException if the file cannot be written; nothing is left behind then
   */
  public static void writePng(Path file, BufferedImage picture) throws IOException {
    AtomicFiles.write(file, out -> PngEncoder.write(picture, out));
  }

  /**
   * @throws BadInputException if {@code output} names the same file as one of {@code inputs}
   *     (compared as absolute normalised paths, and as the same file on disk where both exist)
   */
  public static void checkNotInput(Path output, Collection<Path> inputs) {
    Path out = output.toAbsolutePath().normalize();
    for (Path input : inputs) {
      Path in = input.toAbsolutePath().normalize();
      boolean same = out.equals(in);
      if (!same && Files.exists(out) && Files.exists(in)) {
        try {
          same = Files.isSameFile(out, in);
        } catch (IOException e) {
          same = false;
        }
      }
      if (same) {
        throw new BadInputException(
            "output "
                + output
                + " would overwrite the input "
                + input
                + "; choose another output folder");
      }
    }
  }

  private static int checkSize(int length, int width, int height, int depth, String what) {
    if (width < 1 || height < 1 || depth < 1 || (long) width * height * depth != length) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "%s: %d values for a %d x %d x %d image",
              what,
              length,
              width,
              height,
              depth));
    }
    return width * height;
  }

  private static void writeTiff(
      Path file, ImageStack stack, int depth, VoxelSize voxelSize, String title)
      throws IOException {
    write(file, image(stack, depth, voxelSize, title));
  }

  private static ImagePlus image(ImageStack stack, int depth, VoxelSize voxelSize, String title) {
    ImagePlus imp = new ImagePlus(title, stack);
    imp.setDimensions(1, depth, 1);
    if (voxelSize != null && !isPixelUnit(voxelSize.unit())) {
      Calibration cal = new Calibration();
      cal.pixelWidth = voxelSize.x();
      cal.pixelHeight = voxelSize.y();
      cal.pixelDepth = voxelSize.z();
      cal.setUnit(voxelSize.unit());
      imp.setCalibration(cal);
    }
    return imp;
  }

  private static boolean isPixelUnit(String unit) {
    String u = unit.toLowerCase(Locale.ROOT);
    return u.equals("pixel") || u.equals("pixels");
  }

  /** Adds the planes of one w × h × d label volume: 16-bit if {@code shorts}, else 32-bit float. */
  public static void addLabelPlanes(
      ImageStack stack, int[] labels, int w, int h, int depth, boolean shorts) {
    int plane = w * h;
    for (int z = 0; z < depth; z++) {
      int offset = z * plane;
      if (shorts) {
        short[] p = new short[plane];
        for (int i = 0; i < plane; i++) {
          p[i] = (short) labels[offset + i];
        }
        stack.addSlice(null, new ShortProcessor(w, h, p, null));
      } else {
        float[] p = new float[plane];
        for (int i = 0; i < plane; i++) {
          p[i] = labels[offset + i];
        }
        stack.addSlice(null, new FloatProcessor(w, h, p));
      }
    }
  }

  /** Adds the planes of one w × h × d byte volume (a mask or a class map). */
  public static void addBytePlanes(ImageStack stack, byte[] values, int w, int h, int depth) {
    int plane = w * h;
    for (int z = 0; z < depth; z++) {
      stack.addSlice(
          null, new ByteProcessor(w, h, Arrays.copyOfRange(values, z * plane, (z + 1) * plane)));
    }
  }

  static void write(Path file, ImagePlus imp) throws IOException {
    byte[] bytes = TiffBytes.encode(imp);
    if (bytes == null) {
      throw new IOException("ImageJ could not encode " + file + " as TIFF");
    }
    AtomicFiles.write(file, out -> out.write(bytes));
  }
}
