package io.github.cleave.quality;

import ij.process.AutoThresholder;
import io.github.cleave.image.Raster;

/**
 * The plain global-threshold baseline that a seeded segmentation should beat: Otsu's method (N.
 * Otsu, "A threshold selection method from gray-level histograms", IEEE Trans. Systems, Man, and
 * Cybernetics SMC-9(1):62–66, 1979) as computed by ImageJ's {@link AutoThresholder} on a 256-bin
 * histogram.
 *
 * <p>The histogram spans the channel's own minimum to maximum over the whole image (all planes):
 * value v falls in bin {@code floor((v − min) · 256 / (max − min))}, the maximum in bin 255.
 * Foreground is every voxel whose bin is above the threshold bin (bright objects on a dark
 * background). No polarity guess, no smoothing, no size filter: for dark objects on a bright
 * background take the complement. A constant channel gives an empty mask. O(N). Stateless,
 * thread-safe.
 */
public final class OtsuBaseline {
  /** Number of histogram bins. */
  public static final int BINS = 256;

  private OtsuBaseline() {}

  /**
   * The Otsu mask of channel {@code channel} (0-based): 1 foreground, 0 background.
   *
   * @throws IllegalArgumentException if the channel does not exist
   */
  public static byte[] mask(Raster image, int channel) {
    return mask(image.channel(channel));
  }

  /** The Otsu mask of the given values: 1 where the value's bin is above the threshold bin. */
  public static byte[] mask(float[] values) {
    byte[] mask = new byte[values.length];
    double[] range = range(values);
    if (!(range[1] > range[0])) {
      return mask;
    }
    int threshold = thresholdBin(values);
    for (int i = 0; i < values.length; i++) {
      mask[i] = (byte) (bin(values[i], range[0], range[1]) > threshold ? 1 : 0);
    }
    return mask;
  }

  /**
   * Otsu's threshold as a histogram bin 0..255 of the min..max histogram (foreground: bins above
   * it); 255 for a constant channel.
   */
  public static int thresholdBin(float[] values) {
    double[] range = range(values);
    if (!(range[1] > range[0])) {
      return BINS - 1;
    }
    int[] histogram = new int[BINS];
    for (float v : values) {
      histogram[bin(v, range[0], range[1])]++;
    }
    return new AutoThresholder().getThreshold(AutoThresholder.Method.Otsu, histogram);
  }

  private static int bin(float v, double min, double max) {
    int b = (int) Math.floor((v - min) * BINS / (max - min));
    return Math.min(BINS - 1, Math.max(0, b));
  }

  private static double[] range(float[] values) {
    double min = Double.POSITIVE_INFINITY;
    double max = Double.NEGATIVE_INFINITY;
    for (float v : values) {
      min = Math.min(min, v);
      max = Math.max(max, v);
    }
    return new double[] {min, max};
  }
}
