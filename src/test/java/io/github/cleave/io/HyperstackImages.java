package io.github.cleave.io;

import ij.ImagePlus;
import ij.ImageStack;
import ij.process.ImageProcessor;
import io.github.cleave.image.Raster;
import java.util.SplittableRandom;

/**
 * Seeded hyperstacks for the time-lapse tests. Planes are added channel fastest, then slice, then
 * frame, the order the ImageJ API documents for hyperstacks (ImagePlus.getStackIndex: index = c +
 * (z-1)*C + (t-1)*C*Z, 1-based); pixel 0 of each plane holds the plane's own code {@link #code} (in
 * red for RGB), so a plane read from the wrong place is told apart whatever the random rest.
 */
final class HyperstackImages {
  private HyperstackImages() {}

  /** A number of its own for channel c, slice z, frame t (0-based), below 256 for C*Z*T <= 256. */
  static int code(int c, int z, int t, int channels, int slices) {
    return c + channels * (z + slices * t);
  }

  /** The 1-based stack index of (c, z, t), 0-based arguments, by the documented formula. */
  static int index(int c, int z, int t, int channels, int slices) {
    return 1 + c + z * channels + t * channels * slices;
  }

  static ImagePlus hyperstack(
      int bitDepth, int w, int h, int channels, int slices, int frames, long seed) {
    SplittableRandom random = new SplittableRandom(seed);
    ImageStack stack = new ImageStack(w, h);
    for (int t = 0; t < frames; t++) {
      for (int z = 0; z < slices; z++) {
        for (int c = 0; c < channels; c++) {
          ImageProcessor ip = TestImages.randomPlane(bitDepth, w, h, random);
          int code = code(c, z, t, channels, slices);
          if (bitDepth == 24) {
            ip.set(0, 0, code << 16 | 0x0080ff);
          } else {
            ip.setf(0, 0, code);
          }
          stack.addSlice("c" + c + "z" + z + "t" + t, ip);
        }
      }
    }
    ImagePlus imp = new ImagePlus("hyper", stack);
    imp.setDimensions(channels, slices, frames);
    if (frames > 1 || channels > 1) {
      imp.setOpenAsHyperStack(true);
    }
    return imp;
  }

  /**
   * The raw value at (x, y) of channel c, slice z, frame t of {@code imp}, from the stack plane
   * given by the documented formula (not by getStackIndex); for RGB, channel c of the raster is
   * red, green or blue.
   */
  static float expected(ImagePlus imp, int rasterChannel, int z, int t, int x, int y, boolean rgb) {
    int channels = imp.getNChannels();
    int slices = imp.getNSlices();
    int c = rgb ? 0 : rasterChannel;
    ImageProcessor ip = imp.getStack().getProcessor(index(c, z, t, channels, slices));
    if (rgb) {
      int v = ip.get(x, y);
      return (v >> (16 - 8 * rasterChannel)) & 0xff;
    }
    return ip.getf(x, y);
  }

  /** Asserts-free comparison: the first (channel, index) where raster and image differ, or null. */
  static String firstDifference(ImagePlus imp, Raster r, int t, boolean rgb) {
    int w = r.width();
    int h = r.height();
    for (int c = 0; c < r.channelCount(); c++) {
      float[] v = r.channel(c);
      for (int z = 0; z < r.depth(); z++) {
        for (int y = 0; y < h; y++) {
          for (int x = 0; x < w; x++) {
            float want = expected(imp, c, z, t, x, y, rgb);
            float got = v[x + w * (y + h * z)];
            if (Float.compare(want, got) != 0) {
              return "channel "
                  + c
                  + " z "
                  + z
                  + " t "
                  + t
                  + " x "
                  + x
                  + " y "
                  + y
                  + ": "
                  + got
                  + " instead of "
                  + want;
            }
          }
        }
      }
    }
    return null;
  }
}
