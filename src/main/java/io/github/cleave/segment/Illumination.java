package io.github.cleave.segment;

import ij.plugin.filter.BackgroundSubtracter;
import ij.process.FloatProcessor;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.Arrays;

/**
 * Flattening of uneven illumination with ImageJ's rolling-ball background ({@link
 * BackgroundSubtracter}; S. R. Sternberg, "Biomedical image processing", IEEE Computer 16(1):22–34,
 * 1983, doi:10.1109/MC.1983.1654163), plane by plane and channel by channel.
 *
 * <p>The flattened value is {@code I − B + m}, with {@code B} the rolling-ball background of the
 * plane (a ball of the given radius in pixels rolled under the intensity surface, or over it for a
 * light background) and {@code m} the mean of {@code B} over the whole channel: the slow trend is
 * removed while values stay in the original range, so histograms and Gaussian models see the same
 * kind of numbers.
 *
 * <p><b>When AUTO flattens.</b> The trend strength of a channel is the spread of its background,
 * {@code P95(B) − P5(B)} over all voxels, divided by the seed contrast {@code |median I over
 * foreground seeds − median I over background seeds|}. A channel whose trend strength is at least
 * {@value #STRONG_GRADIENT} is said to show a strong gradient: the illumination alone then changes
 * a pixel's value by more than a fifth of the difference between object and background, enough to
 * move a global likelihood across the boundary (threshold: common practice, no source). The
 * background is light when the background seeds are brighter than the foreground seeds. AUTO also
 * refuses a flattening that lost more than half of the seed contrast ({@link #KEPT_CONTRAST}): then
 * the objects are larger than the ball, and a larger radius is needed.
 *
 * <p>AUTO never flattens an image with a light background (transmitted light, stained sections):
 * there the rolling ball follows the texture of the tissue (fibres, stroma) as much as the
 * illumination, and subtracting it blurs the contrast at the object edges. On the stained phantom
 * of {@code SamplePhantoms} (an illumination ramp from 0.6 to 1) flattening lowered the Dice
 * coefficient from about 0.95 to 0.91 on every phantom seed tried, while the trend strength (0.5 to
 * 0.9) was no different from that of fluorescence images that need flattening (our measurement, no
 * outside source). Users can still force it with {@link IlluminationMode#ON}.
 *
 * <p>Cost: a rolling ball shrinks the image for large radii (ImageJ's own speed-up); about the cost
 * of a few filters per plane. Thread-safe (no shared state).
 */
public final class Illumination {
  /**
   * Share of the seed contrast that flattening must keep on every channel for AUTO to use it: a
   * rolling ball smaller than the objects takes the objects for background and flattens them away,
   * which shows as the foreground seeds coming down to the level of the background seeds (our rule,
   * no source).
   */
  public static final double KEPT_CONTRAST = 0.5;

  /** Background values sampled for the trend's percentiles. */
  private static final int PERCENTILE_SAMPLES = 1 << 16;

  /** Trend strength from which AUTO flattens. */
  public static final double STRONG_GRADIENT = 0.2;

  private Illumination() {}

  /** The result of estimating the background: the flattened features and the decision data. */
  public record Flattening(
      Raster flattened, double[] trendStrength, double[] contrastKept, boolean lightBackground) {

    /** True when every channel kept at least {@link #KEPT_CONTRAST} of its seed contrast. */
    public boolean keepsObjects() {
      for (double k : contrastKept) {
        if (k < KEPT_CONTRAST) {
          return false;
        }
      }
      return true;
    }
  }

  /**
   * Estimates the rolling-ball background of every channel of {@code features} and returns the
   * flattened image, with the trend strength per channel ({@code NaN} when seeds of a class are
   * missing).
   *
   * @param radius rolling-ball radius in pixels, larger than the largest object
   * @param lightBackground whether the background is brighter than the objects
   */
  public static Flattening flatten(
      Raster features, SeedLabels seeds, double radius, boolean lightBackground) {
    int channels = features.channelCount();
    float[][] out = new float[channels][];
    double[] strength = new double[channels];
    double[] kept = new double[channels];
    for (int c = 0; c < channels; c++) {
      float[] values = features.channel(c);
      float[] background = background(features, c, radius, lightBackground);
      out[c] = flattened(values, background);
      double contrast = seedContrast(values, seeds);
      strength[c] = trendStrength(background, contrast);
      kept[c] = seedContrast(out[c], seeds) / contrast;
    }
    return new Flattening(withChannels(features, out), strength, kept, lightBackground);
  }

  /**
   * The flattened image alone, as {@link #flatten} computes it, without the data of AUTO's decision
   * (for applying a model that has already decided).
   */
  public static Raster flattened(Raster features, double radius, boolean lightBackground) {
    float[][] out = new float[features.channelCount()][];
    for (int c = 0; c < out.length; c++) {
      out[c] = flattened(features.channel(c), background(features, c, radius, lightBackground));
    }
    return withChannels(features, out);
  }

  /** The rolling-ball background of channel c, plane by plane. */
  private static float[] background(
      Raster features, int c, double radius, boolean lightBackground) {
    int w = features.width();
    int h = features.height();
    int plane = w * h;
    // A ball wider than the image rolls the same as one as wide as the image (and ImageJ's
    // implementation fails on radii far beyond the image size).
    double ballRadius = Math.min(radius, Math.max(w, h));
    float[] values = features.channel(c);
    float[] background = new float[values.length];
    for (int z = 0; z < features.depth(); z++) {
      float[] pixels = Arrays.copyOfRange(values, z * plane, (z + 1) * plane);
      FloatProcessor fp = new FloatProcessor(w, h, pixels);
      BackgroundSubtracter subtracter = new BackgroundSubtracter();
      subtracter.rollingBallBackground(fp, ballRadius, true, lightBackground, false, true, true);
      System.arraycopy((float[]) fp.getPixels(), 0, background, z * plane, plane);
    }
    return background;
  }

  /** {@code values − background + mean(background)}: flat, at the image's mean level. */
  private static float[] flattened(float[] values, float[] background) {
    double mean = 0;
    for (float b : background) {
      mean += b;
    }
    mean /= background.length;
    float[] flat = new float[values.length];
    for (int i = 0; i < flat.length; i++) {
      flat[i] = (float) (values[i] - background[i] + mean);
    }
    return flat;
  }

  private static Raster withChannels(Raster features, float[][] channels) {
    return new Raster(
        features.width(),
        features.height(),
        features.depth(),
        channels,
        features.voxelSize(),
        features.kind());
  }

  /**
   * AUTO's decision: true when the background is dark and some channel's trend strength reaches
   * {@link #STRONG_GRADIENT} (see the class comment for why light backgrounds are left alone).
   */
  public static boolean shouldFlatten(Flattening f) {
    return !f.lightBackground() && isStrongGradient(f.trendStrength()) && f.keepsObjects();
  }

  /** |median over foreground seeds − median over background seeds|; NaN without both. */
  private static double seedContrast(float[] values, SeedLabels seeds) {
    return Math.abs(
        median(values, seeds, SeedLabels.FOREGROUND)
            - median(values, seeds, SeedLabels.BACKGROUND));
  }

  /** True when some channel's trend strength reaches {@link #STRONG_GRADIENT}. */
  public static boolean isStrongGradient(double[] trendStrength) {
    for (double s : trendStrength) {
      if (s >= STRONG_GRADIENT) {
        return true;
      }
    }
    return false;
  }

  /** Whether the background seeds are brighter than the foreground seeds, on channel 0. */
  public static boolean isLightBackground(Raster features, SeedLabels seeds) {
    float[] v = features.channel(0);
    return median(v, seeds, SeedLabels.BACKGROUND) > median(v, seeds, SeedLabels.FOREGROUND);
  }

  /** Spread of the background over the seed contrast {@code contrast}. */
  private static double trendStrength(float[] background, double contrast) {
    // percentiles of a fixed-stride sample: the background is smooth, so 2^16 values are plenty,
    // and sorting all of a stack's voxels would cost more than the rolling ball itself
    int stride = Math.max(1, background.length / PERCENTILE_SAMPLES);
    float[] sorted = new float[(background.length + stride - 1) / stride];
    for (int i = 0, j = 0; i < background.length; i += stride, j++) {
      sorted[j] = background[i];
    }
    Arrays.sort(sorted);
    double spread =
        sorted[(int) (0.95 * (sorted.length - 1))] - sorted[(int) (0.05 * (sorted.length - 1))];
    return contrast > 0 ? spread / contrast : Double.NaN;
  }

  private static double median(float[] values, SeedLabels seeds, int label) {
    byte[] labels = seeds.labels();
    int count = 0;
    for (int i = SeedLabels.nextLabelled(labels, 0);
        i < labels.length;
        i = SeedLabels.nextLabelled(labels, i + 1)) {
      if (labels[i] == label) {
        count++;
      }
    }
    if (count == 0) {
      return Double.NaN;
    }
    float[] picked = new float[count];
    int j = 0;
    for (int i = SeedLabels.nextLabelled(labels, 0);
        i < labels.length;
        i = SeedLabels.nextLabelled(labels, i + 1)) {
      if (labels[i] == label) {
        picked[j++] = values[i];
      }
    }
    Arrays.sort(picked);
    return picked[count / 2];
  }
}
