package io.github.cleave.render;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import java.util.Arrays;
import java.util.Locale;

/**
 * A fixed linear mapping of raw values to display grey levels: {@code min} shows black, {@code max}
 * white, values between are scaled linearly and values outside are clipped. Computed from the data,
 * never taken from a window's setting, so that every picture of a run can share one range per
 * channel. Immutable.
 *
 * @param min raw value shown black
 * @param max raw value shown white, greater than {@code min}
 */
public record DisplayRange(double min, double max) {
  /** Lower percentile used by {@link #of(Raster, int)}. */
  public static final double LOW_PERCENT = 0.1;

  /** Upper percentile used by {@link #of(Raster, int)}. */
  public static final double HIGH_PERCENT = 99.9;

  /** At most this many values are sorted; larger channels are sampled at a fixed stride. */
  static final int MAX_SAMPLES = 1 << 22;

  /**
   * @throws IllegalArgumentException unless both are finite and {@code min < max}
   */
  public DisplayRange {
    if (!Double.isFinite(min) || !Double.isFinite(max) || !(min < max)) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT, "display range %s..%s: need finite values with min < max", min, max));
    }
  }

  /**
   * The range of channel {@code c} (0-based) over the whole image: 0..255 for RGB images (their
   * natural colours), otherwise the {@value #LOW_PERCENT} and {@value #HIGH_PERCENT} percentiles of
   * its values (see {@link #percentiles}).
   */
  public static DisplayRange of(Raster raster, int c) {
    if (raster.kind() == PixelKind.RGB) {
      return new DisplayRange(0, 255);
    }
    return percentiles(raster.channel(c), LOW_PERCENT, HIGH_PERCENT);
  }

  /**
   * The {@code low} and {@code high} percentiles (0..100) of {@code values} by the nearest-rank
   * rule on the sorted values: index {@code round(p / 100 * (n - 1))} (common practice, no source).
   * Beyond {@link #MAX_SAMPLES} values every k-th value is used, k fixed by the length, so the
   * result is deterministic. Non-finite values are ignored. A constant channel gets {@code v..v+1}.
   *
   * @throws IllegalArgumentException if there is no finite value or the percentiles are out of
   *     order
   */
  public static DisplayRange percentiles(float[] values, double low, double high) {
    if (!(0 <= low && low < high && high <= 100)) {
      throw new IllegalArgumentException(
          "percentiles " + low + ", " + high + ": need 0 <= low < high <= 100");
    }
    int stride = (int) Math.max(1, (values.length + (long) MAX_SAMPLES - 1) / MAX_SAMPLES);
    float[] sample = new float[(values.length + stride - 1) / stride];
    int n = 0;
    for (int i = 0; i < values.length; i += stride) {
      if (Float.isFinite(values[i])) {
        sample[n++] = values[i];
      }
    }
    if (n == 0) {
      throw new IllegalArgumentException("no finite value to compute a display range from");
    }
    Arrays.sort(sample, 0, n);
    double lo = sample[(int) Math.round(low / 100 * (n - 1))];
    double hi = sample[(int) Math.round(high / 100 * (n - 1))];
    if (!(hi > lo)) {
      hi = lo + 1;
    }
    return new DisplayRange(lo, hi);
  }

  /** The grey level 0..255 of raw value {@code v}. */
  public int grey(float v) {
    double g = (v - min) / (max - min) * 255.0;
    if (!(g > 0)) {
      return 0;
    }
    return g >= 255 ? 255 : (int) Math.round(g);
  }
}
