package io.github.cleave.synth;

import ij.CompositeImage;
import ij.IJ;
import ij.ImagePlus;
import ij.ImageStack;
import ij.measure.Calibration;
import ij.process.ByteProcessor;
import ij.process.ColorProcessor;
import ij.process.ShortProcessor;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.io.AtomicFiles;
import io.github.cleave.io.TiffBytes;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;

/**
 * Saves a {@link Phantom} as three TIFF files through ImageJ's own encoder, headless-safe:
 *
 * <ul>
 *   <li>{@code NAME.tif}: the image with its calibration (pixel width, height, depth, unit): RGB as
 *       a colour image, one 16-bit channel as a plane or a z-stack, several channels as a composite
 *       hyperstack (channels first, then planes);
 *   <li>{@code NAME.seeds.tif}: 8-bit seed labels 0 none, 1 foreground, 2 background, same size;
 *   <li>{@code NAME.truth.tif}: 8-bit ground-truth mask, 0 background, 255 foreground.
 * </ul>
 *
 * Each file is written atomically ({@link AtomicFiles}); an existing file of that name is replaced.
 * Only {@link PixelKind#GREY16} and {@link PixelKind#RGB} images are supported, which is what the
 * phantoms are.
 */
public final class SampleWriter {
  private SampleWriter() {}

  /**
   * Writes the three files of {@code phantom} into {@code dir} (which must exist).
   *
   * @throws IOException if a file cannot be written; no partial file remains
   * @throws IllegalArgumentException if the image kind is not 16-bit grey or RGB, or the name is
   *     not a plain file name
   */
  public static void write(Phantom phantom, Path dir, String name) throws IOException {
    if (name.isEmpty() || name.contains("/") || name.contains("\\")) {
      throw new IllegalArgumentException(
          "sample name '" + name + "': use a plain file name without folders");
    }
    Raster image = phantom.image();
    int w = image.width();
    int h = image.height();
    int d = image.depth();
    save(imageOf(image), dir.resolve(name + ".tif"));
    ImagePlus seeds = bytes(phantom.seeds().labels(), w, h, d, 1, "seeds");
    ImagePlus truth = bytes(phantom.truth(), w, h, d, 255, "truth");
    for (ImagePlus imp : new ImagePlus[] {seeds, truth}) {
      imp.setCalibration(calibration(image.voxelSize()));
    }
    save(seeds, dir.resolve(name + ".seeds.tif"));
    save(truth, dir.resolve(name + ".truth.tif"));
  }

  /** Writes every phantom of {@code phantoms} under its own name. */
  public static void writeAll(List<Phantom> phantoms, Path dir) throws IOException {
    for (Phantom p : phantoms) {
      write(p, dir, p.name());
    }
  }

  /** The image as an ImageJ image with calibration. */
  static ImagePlus imageOf(Raster image) {
    int w = image.width();
    int h = image.height();
    int d = image.depth();
    int channels = image.channelCount();
    ImageStack stack = new ImageStack(w, h);
    ImagePlus imp;
    if (image.kind() == PixelKind.RGB) {
      if (channels != 3) {
        throw new IllegalArgumentException("RGB image with " + channels + " channels: needs 3");
      }
      for (int z = 0; z < d; z++) {
        int[] packed = new int[w * h];
        for (int i = 0; i < packed.length; i++) {
          int j = i + w * h * z;
          packed[i] =
              (clip(image.channel(0)[j], 255) << 16)
                  | (clip(image.channel(1)[j], 255) << 8)
                  | clip(image.channel(2)[j], 255);
        }
        stack.addSlice(new ColorProcessor(w, h, packed));
      }
      imp = new ImagePlus("image", stack);
    } else if (image.kind() == PixelKind.GREY16) {
      for (int z = 0; z < d; z++) {
        for (int c = 0; c < channels; c++) {
          short[] plane = new short[w * h];
          for (int i = 0; i < plane.length; i++) {
            plane[i] = (short) clip(image.channel(c)[i + w * h * z], 65535);
          }
          stack.addSlice(new ShortProcessor(w, h, plane, null));
        }
      }
      imp = new ImagePlus("image", stack);
      imp.setDimensions(channels, d, 1);
      if (channels > 1) {
        imp = new CompositeImage(imp, IJ.COMPOSITE);
      }
    } else {
      throw new IllegalArgumentException(
          "image kind " + image.kind() + ": only GREY16 and RGB phantoms can be written");
    }
    imp.setCalibration(calibration(image.voxelSize()));
    return imp;
  }

  private static ImagePlus bytes(byte[] values, int w, int h, int d, int scale, String title) {
    ImageStack stack = new ImageStack(w, h);
    for (int z = 0; z < d; z++) {
      byte[] plane = new byte[w * h];
      for (int i = 0; i < plane.length; i++) {
        int v = values[i + w * h * z] & 0xff;
        plane[i] = (byte) (scale == 1 ? v : (v != 0 ? scale : 0));
      }
      stack.addSlice(new ByteProcessor(w, h, plane));
    }
    ImagePlus imp = new ImagePlus(title, stack);
    imp.setDimensions(1, d, 1);
    return imp;
  }

  private static Calibration calibration(VoxelSize size) {
    Calibration cal = new Calibration();
    cal.pixelWidth = size.x();
    cal.pixelHeight = size.y();
    cal.pixelDepth = size.z();
    cal.setUnit(size.unit());
    return cal;
  }

  private static void save(ImagePlus imp, Path target) throws IOException {
    byte[] tiff = TiffBytes.encode(imp);
    if (tiff == null) {
      throw new IOException("could not encode " + target + " as TIFF");
    }
    AtomicFiles.write(target, out -> out.write(tiff));
  }

  private static int clip(float v, int max) {
    return (int) Math.min(max, Math.max(0, Math.rint(v)));
  }
}
