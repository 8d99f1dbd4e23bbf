package io.github.cleave.model;

import io.github.cleave.image.BadInputException;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Learns a {@link LikelihoodModel} from the seed voxels of an image: class c (0-based) from the
 * voxels labelled c + 1; the class count is the largest label present.
 *
 * <p>Checks, each failing with a {@link BadInputException} that says what to do: the seeds have the
 * image's size; there are at least two classes and every label 1..max has a seed voxel with finite
 * values in every channel (NaN and infinite seed values are skipped); {@link ModelKind#HISTOGRAM}
 * gets exactly one channel.
 *
 * <p>Histogram ({@link HistogramModel}): range 0..255 with 256 bins for {@link PixelKind#GREY8} and
 * {@link PixelKind#RGB}; otherwise the finite minimum..maximum of the image channel (all voxels,
 * not only seeds), with 256 bins, or for {@link PixelKind#GREY16} one bin per whole value when the
 * range holds fewer than 256 of them; a constant image gets the range {@code v..v + max(1,
 * |v|·10⁻⁶)}.
 *
 * <p>Gaussian mixture ({@link GaussianMixtureModel}): at most {@link #MAX_SAMPLES_PER_CLASS} seed
 * voxels per class (thinned by a fixed stride, see {@link SeedSamples}); per class {@code min(5,
 * max(1, n / (5 (d + 1))))} components for n samples in d channels (fewer when there are fewer
 * distinct values), fitted by {@link MixtureFitter}. Every covariance gets {@code r · I} added with
 * {@code r = 10⁻³ ·} the mean per-channel variance of all classes' samples together (or {@code 10⁻³
 * ·} their mean square, or {@code 10⁻³}, when that is zero), so that singular seed sets such as a
 * stroke over one flat colour still give a positive-definite model.
 *
 * <p>Deterministic bit for bit: the same raster and seeds give the same model on every run,
 * independent of threads and locale. Stateless; safe to call from several threads.
 */
public final class ModelLearner {
  /** Components per class of the Gaussian mixture when there are enough samples. */
  public static final int DEFAULT_COMPONENTS = 5;

  /** Largest number of seed voxels per class used to fit a Gaussian mixture. */
  public static final int MAX_SAMPLES_PER_CLASS = 20000;

  /** Covariance regularisation relative to the data variance. */
  public static final double REGULARISATION = 1e-3;

  private ModelLearner() {}

  /**
   * Learns a model of {@code features} from {@code seeds}.
   *
   * @throws BadInputException when the seeds or the choice of model cannot give a model (see the
   *     class comment)
   */
  public static LikelihoodModel learn(Raster features, SeedLabels seeds, ModelKind kind) {
    if (!seeds.fits(features)) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "the seed labels are %d x %d x %d but the image is %d x %d x %d: use a seed image"
                  + " of the same size as the image",
              seeds.width(),
              seeds.height(),
              seeds.depth(),
              features.width(),
              features.height(),
              features.depth()));
    }
    int channels = features.channelCount();
    ModelKind chosen =
        kind == ModelKind.AUTO
            ? (channels == 1 ? ModelKind.HISTOGRAM : ModelKind.GAUSSIAN_MIXTURE)
            : kind;
    if (chosen == ModelKind.HISTOGRAM && channels != 1) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "the histogram model takes one channel but the image has %d: choose one channel or"
                  + " the Gaussian mixture model",
              channels));
    }
    int classes = checkClasses(seeds);
    byte[] labels = seeds.labels();
    long[] usable = SeedSamples.usableCounts(features, labels, classes);
    for (int c = 0; c < classes; c++) {
      if (usable[c] == 0) {
        throw new BadInputException(
            String.format(
                Locale.ROOT,
                "every %s lies on a pixel with a NaN or infinite value: paint that stroke over"
                    + " valid pixels",
                seedName(c + 1)));
      }
    }
    if (chosen == ModelKind.HISTOGRAM) {
      return learnHistogram(features, labels, classes);
    }
    return learnMixture(features, labels, classes, usable);
  }

  /** The class count (largest label), after checking that every label 1..max has a seed. */
  private static int checkClasses(SeedLabels seeds) {
    long[] counts = seeds.countsPerLabel();
    int max = counts.length - 1;
    if (max == 0) {
      throw new BadInputException(
          "there are no seeds: paint at least one foreground stroke (label 1) and one background"
              + " stroke (label 2)");
    }
    if (max == 1) {
      throw new BadInputException(
          "no background seed (label 2): paint at least one background stroke");
    }
    for (int label = 1; label <= max; label++) {
      if (counts[label] == 0) {
        String hint =
            switch (label) {
              case 1 -> "paint at least one foreground stroke";
              case 2 -> "paint at least one background stroke";
              default ->
                  String.format(
                      Locale.ROOT,
                      "paint at least one stroke with label %d or renumber the classes 1..%d"
                          + " without gaps",
                      label,
                      max - 1);
            };
        throw new BadInputException(
            String.format(
                Locale.ROOT,
                "no %s although labels up to %d are used: %s",
                seedName(label),
                max,
                hint));
      }
    }
    return max;
  }

  private static String seedName(int label) {
    return switch (label) {
      case 1 -> "foreground seed (label 1)";
      case 2 -> "background seed (label 2)";
      default -> String.format(Locale.ROOT, "seed of class %d (label %d)", label, label);
    };
  }

  private static HistogramModel learnHistogram(Raster features, byte[] labels, int classes) {
    float[] values = features.channel(0);
    PixelKind kind = features.kind();
    double low;
    double high;
    int bins = HistogramModel.DEFAULT_BINS;
    if (kind == PixelKind.GREY8 || kind == PixelKind.RGB) {
      low = 0;
      high = 255;
    } else if (features.wholeNumberRange(0) >= 0) { // kept by the raster: no pass here
      low = features.wholeNumberMinimum(0);
      high = low + features.wholeNumberRange(0);
    } else {
      low = Double.POSITIVE_INFINITY;
      high = Double.NEGATIVE_INFINITY;
      for (float v : values) {
        if (Float.isFinite(v)) {
          low = Math.min(low, v);
          high = Math.max(high, v);
        }
      }
    }
    if (kind != PixelKind.GREY8 && kind != PixelKind.RGB) {
      if (kind == PixelKind.GREY16 && high - low + 1 < bins) {
        bins = (int) Math.max(1, Math.floor(high - low) + 1);
      }
      if (!(high > low)) {
        high = low + Math.max(1.0, Math.abs(low) * 1e-6);
      }
    }
    return HistogramModel.learn(values, labels, classes, low, high, bins);
  }

  private static GaussianMixtureModel learnMixture(
      Raster features, byte[] labels, int classes, long[] usable) {
    int d = features.channelCount();
    double[][] samples =
        SeedSamples.gather(features, labels, classes, usable, MAX_SAMPLES_PER_CLASS);
    double reg = REGULARISATION * pooledScale(samples, d);
    List<GaussianMixture> mixtures = new ArrayList<>(classes);
    for (int c = 0; c < classes; c++) {
      int n = samples[c].length / d;
      int k = Math.min(DEFAULT_COMPONENTS, Math.max(1, n / (5 * (d + 1))));
      mixtures.add(MixtureFitter.fit(samples[c], d, k, reg));
    }
    return GaussianMixtureModel.of(mixtures);
  }

  /**
   * Mean per-channel variance of all samples together; their mean square when that is zero; 1 when
   * both are zero.
   */
  static double pooledScale(double[][] samples, int d) {
    double[] mean = new double[d];
    long n = 0;
    for (double[] x : samples) {
      for (int s = 0; s < x.length; s += d) {
        for (int i = 0; i < d; i++) {
          mean[i] += x[s + i];
        }
        n++;
      }
    }
    for (int i = 0; i < d; i++) {
      mean[i] /= n;
    }
    double var = 0;
    double square = 0;
    for (double[] x : samples) {
      for (int s = 0; s < x.length; s += d) {
        for (int i = 0; i < d; i++) {
          double t = x[s + i] - mean[i];
          var += t * t;
          square += x[s + i] * x[s + i];
        }
      }
    }
    var /= (double) n * d;
    square /= (double) n * d;
    return var > 0 ? var : square > 0 ? square : 1.0;
  }
}
