package io.github.cleave.io;

import ij.ImagePlus;
import ij.ImageStack;
import ij.io.FileSaver;
import ij.measure.Calibration;
import ij.process.ByteProcessor;
import ij.process.ColorProcessor;
import ij.process.FloatProcessor;
import ij.process.ImageProcessor;
import ij.process.ShortProcessor;
import java.nio.file.Path;
import java.util.SplittableRandom;

/** Seeded test images made with ImageJ's own classes, saved headless. */
final class TestImages {
  private TestImages() {}

  /** A random plane of ImageJ bit depth 8, 16, 24 (RGB) or 32. */
  static ImageProcessor randomPlane(int bitDepth, int w, int h, SplittableRandom random) {
    int n = w * h;
    switch (bitDepth) {
      case 8:
        byte[] b = new byte[n];
        for (int i = 0; i < n; i++) {
          b[i] = (byte) random.nextInt(256);
        }
        return new ByteProcessor(w, h, b);
      case 16:
        short[] s = new short[n];
        for (int i = 0; i < n; i++) {
          s[i] = (short) random.nextInt(65536);
        }
        return new ShortProcessor(w, h, s, null);
      case 24:
        int[] c = new int[n];
        for (int i = 0; i < n; i++) {
          c[i] = random.nextInt(1 << 24);
        }
        return new ColorProcessor(w, h, c);
      case 32:
        float[] f = new float[n];
        for (int i = 0; i < n; i++) {
          f[i] = (float) (random.nextGaussian() * 1000);
        }
        return new FloatProcessor(w, h, f);
      default:
        throw new IllegalArgumentException("bit depth " + bitDepth);
    }
  }

  /** A stack of {@code channels * slices} random planes, channels fastest (ImageJ's order). */
  static ImagePlus randomImage(
      int bitDepth, int w, int h, int channels, int slices, SplittableRandom random) {
    ImageStack stack = new ImageStack(w, h);
    for (int i = 0; i < channels * slices; i++) {
      stack.addSlice("plane" + i, randomPlane(bitDepth, w, h, random));
    }
    ImagePlus imp = new ImagePlus("test", stack);
    imp.setDimensions(channels, slices, 1);
    return imp;
  }

  static Calibration microns(double x, double y, double z) {
    Calibration cal = new Calibration();
    cal.pixelWidth = x;
    cal.pixelHeight = y;
    cal.pixelDepth = z;
    cal.setUnit("micron");
    return cal;
  }

  static Path saveTiff(ImagePlus imp, Path file) {
    boolean ok =
        imp.getStackSize() > 1
            ? new FileSaver(imp).saveAsTiffStack(file.toString())
            : new FileSaver(imp).saveAsTiff(file.toString());
    if (!ok) {
      throw new IllegalStateException("could not save " + file);
    }
    return file;
  }

  static Path savePng(ImagePlus imp, Path file) {
    if (!new FileSaver(imp).saveAsPng(file.toString())) {
      throw new IllegalStateException("could not save " + file);
    }
    return file;
  }

  /** The raw value ImageJ stores at (x, y) of stack plane {@code index} (1-based). */
  static float raw(ImagePlus imp, int index, int x, int y) {
    return imp.getStack().getProcessor(index).getf(x, y);
  }
}
