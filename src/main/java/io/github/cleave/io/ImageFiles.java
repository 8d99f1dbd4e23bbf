package io.github.cleave.io;

import ij.ImagePlus;
import ij.ImageStack;
import ij.io.FileInfo;
import ij.measure.Calibration;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Reads images with ImageJ's own readers, headless and without dialogs, into a {@link LoadedImage}
 * of raw pixel values.
 *
 * <p>Accepted files: TIFF (single plane, z-stack, composite or hyperstack), PNG, and a TIFF zipped
 * by ImageJ. Values are the stored ones, never display-scaled: no display range, no lookup table
 * (an 8-bit image with an inverting LUT keeps its raw values, and {@link LoadedImage#invertedLut()}
 * says so), no calibration function (a signed 16-bit image keeps the stored values, offset by
 * 32768). Kinds: 8-bit grey → {@link PixelKind#GREY8}, 16-bit → {@link PixelKind#GREY16}, 32-bit →
 * {@link PixelKind#FLOAT32}, RGB → three channels red, green, blue of kind {@link PixelKind#RGB};
 * an image of C channels and Z slices becomes C channels of a {@code width x height x Z} raster.
 *
 * <p>Refused with a one-line {@link BadInputException} naming the file: a missing, empty, corrupt
 * or truncated file; a time-lapse (more than one time point: {@link Hyperstacks} opens those one
 * time point at a time); 8-bit indexed colour (convert it to RGB first); an RGB image with several
 * channels; an image whose estimated memory need ({@link MemoryEstimate}, checked from the header
 * before the pixels are read where the format allows) exceeds the free heap; and a 32-bit image
 * with NaN or infinite pixels, which the segmentation cannot weigh: the message gives their number
 * and the first position, and asks to replace them (for instance with 0 or the background level)
 * before segmenting.
 *
 * <p>Calibration: when the file has a real unit (ImageJ's {@code Calibration.scaled()}), the voxel
 * size is its pixel width, height and depth in that unit with {@code assumed = false}; otherwise
 * {@link VoxelSize#PIXELS} (1 "pixel", {@code assumed = true}), which the caller may override.
 *
 * <p>Stateless and thread-safe as far as ImageJ's readers are.
 */
public final class ImageFiles {
  private ImageFiles() {}

  /**
   * Reads {@code file}.
   *
   * @throws BadInputException if the file cannot be used, see the class comment
   */
  public static LoadedImage read(Path file) {
    ImagePlus imp = ImageOpening.open(file, "image");
    return convert(imp, file.toString(), file);
  }

  /**
   * The heap that reading and segmenting {@code file} will need, estimated from its header without
   * reading the pixels (the estimate {@link #read} checks against the free heap), or -1 when the
   * header cannot tell: a zipped TIFF, or a file that is missing, empty or unreadable ({@link
   * #read} then says what is wrong). Never throws for a bad file.
   */
  public static long estimateHeapBytes(Path file) {
    return ImageOpening.bytesNeeded(file);
  }

  /**
   * Converts an image already open in ImageJ (for the plugin). {@code name} is used in messages and
   * as the title when the image has none; the source path is the image's original file if ImageJ
   * knows it.
   *
   * @throws BadInputException for the same unusable images as {@link #read(Path)}
   */
  public static LoadedImage fromImagePlus(ImagePlus imp, String name) {
    ImageOpening.checkTimePoints(name, "image", imp.getNFrames());
    FileInfo original = imp.getOriginalFileInfo();
    Path source = null;
    if (original != null && original.directory != null && original.fileName != null) {
      source = Path.of(original.directory, original.fileName);
    }
    return convert(imp, name, source);
  }

  /**
   * Refuses what has no usable intensity per channel: 8-bit indexed colour, RGB with several
   * channels.
   */
  static void checkPixelKind(ImagePlus imp, String name) {
    if (isIndexedColour(imp)) {
      throw new BadInputException(
          "image "
              + name
              + " is 8-bit indexed colour, which has no meaningful intensity; convert it to RGB"
              + " (or to 8-bit grey) and save it again");
    }
    int channels = imp.getNChannels();
    if (imp.getBitDepth() == 24 && channels > 1) {
      throw new BadInputException(
          "image "
              + name
              + " is RGB with "
              + channels
              + " channels; split the channels or convert the image to a grey composite first");
    }
  }

  private static LoadedImage convert(ImagePlus imp, String name, Path source) {
    int type = imp.getType();
    checkPixelKind(imp, name);
    int channels = imp.getNChannels();
    int slices = imp.getNSlices();
    int w = imp.getWidth();
    int h = imp.getHeight();
    int bitDepth = imp.getBitDepth();
    long plane = (long) w * h;
    if (plane * slices > Integer.MAX_VALUE - 64) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "image %s has %d voxels (%d x %d x %d); at most %d are supported, crop or bin it",
              name,
              plane * slices,
              w,
              h,
              slices,
              Integer.MAX_VALUE - 64));
    }
    int n = (int) plane * slices;
    ImageStack stack = imp.getStack();
    int outChannels = bitDepth == 24 ? 3 : channels;
    float[][] values = new float[outChannels][n];
    List<String> names = new ArrayList<>();
    boolean anyName = false;
    for (int c = 0; c < channels; c++) {
      for (int z = 0; z < slices; z++) {
        int index = imp.getStackIndex(c + 1, z + 1, 1);
        copyPlane(stack.getPixels(index), values, c, z * (int) plane, (int) plane);
      }
      String label = stack.getShortSliceLabel(imp.getStackIndex(c + 1, 1, 1));
      anyName |= label != null && !label.isBlank() && channels > 1;
      names.add(label == null ? "" : label.strip());
    }
    PixelKind kind = kindOf(bitDepth, name);
    if (kind == PixelKind.FLOAT32) {
      checkFinite(values, w, h, name);
    }
    List<String> channelNames =
        kind == PixelKind.RGB ? List.of("red", "green", "blue") : anyName ? names : List.of();
    Raster raster = new Raster(w, h, slices, values, voxelSize(imp.getCalibration()), kind);
    String title = imp.getTitle() == null || imp.getTitle().isBlank() ? name : imp.getTitle();
    return new LoadedImage(
        raster, source, title, channelNames, bitDepth, type, imp.isInvertedLut());
  }

  /**
   * 8-bit indexed colour: ImageJ's {@code COLOR_256} type, or (as ImageJ 1.54 opens such files) an
   * 8-bit non-composite image whose lookup table is coloured but not a smooth pseudo-colour ramp.
   */
  static boolean isIndexedColour(ImagePlus imp) {
    if (imp.getType() == ImagePlus.COLOR_256) {
      return true;
    }
    return imp.getBitDepth() == 8
        && !imp.isComposite()
        && imp.getProcessor().isColorLut()
        && !imp.getProcessor().isPseudoColorLut();
  }

  static void copyPlane(Object pixels, float[][] out, int c, int offset, int count) {
    if (pixels instanceof byte[] b) {
      float[] o = out[c];
      for (int i = 0; i < count; i++) {
        o[offset + i] = b[i] & 0xff;
      }
    } else if (pixels instanceof short[] s) {
      float[] o = out[c];
      for (int i = 0; i < count; i++) {
        o[offset + i] = s[i] & 0xffff;
      }
    } else if (pixels instanceof float[] f) {
      System.arraycopy(f, 0, out[c], offset, count);
    } else if (pixels instanceof int[] rgb) {
      float[] r = out[0];
      float[] g = out[1];
      float[] b = out[2];
      for (int i = 0; i < count; i++) {
        int v = rgb[i];
        r[offset + i] = (v >> 16) & 0xff;
        g[offset + i] = (v >> 8) & 0xff;
        b[offset + i] = v & 0xff;
      }
    } else {
      throw new IllegalStateException("unexpected pixel array " + pixels);
    }
  }

  static PixelKind kindOf(int bitDepth, String name) {
    switch (bitDepth) {
      case 8:
        return PixelKind.GREY8;
      case 16:
        return PixelKind.GREY16;
      case 32:
        return PixelKind.FLOAT32;
      case 24:
        return PixelKind.RGB;
      default:
        throw new BadInputException(
            "image "
                + name
                + " has bit depth "
                + bitDepth
                + "; expected 8, 16, 32-bit grey or RGB");
    }
  }

  /**
   * The file's calibration when it has a real unit, else {@link VoxelSize#PIXELS} (also for a
   * resolution without a unit name, as TIFF writers other than ImageJ's may store it).
   */
  static VoxelSize voxelSize(Calibration cal) {
    if (cal == null || !cal.scaled() || cal.getUnit() == null || cal.getUnit().isBlank()) {
      return VoxelSize.PIXELS;
    }
    double x = cal.pixelWidth;
    double y = cal.pixelHeight;
    double z = cal.pixelDepth;
    if (!positiveFinite(x) || !positiveFinite(y)) {
      return VoxelSize.PIXELS;
    }
    return new VoxelSize(x, y, positiveFinite(z) ? z : 1, cal.getUnit(), false);
  }

  private static boolean positiveFinite(double v) {
    return v > 0 && !Double.isInfinite(v);
  }

  static void checkFinite(float[][] values, int w, int h, String name) {
    long bad = 0;
    int firstChannel = -1;
    int firstIndex = -1;
    for (int c = 0; c < values.length; c++) {
      float[] v = values[c];
      for (int i = 0; i < v.length; i++) {
        if (!Float.isFinite(v[i])) {
          if (bad++ == 0) {
            firstChannel = c;
            firstIndex = i;
          }
        }
      }
    }
    if (bad > 0) {
      int plane = w * h;
      int z = firstIndex / plane;
      int y = (firstIndex % plane) / w;
      int x = firstIndex % w;
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "image %s has %d NaN or infinite pixel(s), the first at x=%d, y=%d, z=%d, channel"
                  + " %d (0-based x, y, z; 1-based channel); replace them with a finite value,"
                  + " such as 0 or the background level, before segmenting",
              name,
              bad,
              x,
              y,
              z,
              firstChannel + 1));
    }
  }
}
