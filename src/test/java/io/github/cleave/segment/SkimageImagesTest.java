package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;

import ij.IJ;
import ij.ImagePlus;
import ij.plugin.filter.GaussianBlur;
import ij.process.AutoThresholder;
import ij.process.FloatProcessor;
import ij.process.ImageProcessor;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.quality.Agreement;
import io.github.cleave.quality.OtsuBaseline;
import io.github.cleave.synth.StrokeGenerator;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * Checks on open images of Debian's {@code python3-skimage} 0.19.3 (CC0 data, see {@link
 * ExternalData}).
 *
 * <p>{@code horse.png} is a binary silhouette, so it is a ground-truth mask: rendered here as a
 * noisy, blurred, unevenly lit fluorescence-like image (recipe in {@link #render}), it must be
 * segmented from generated strokes with Dice ≥ 0.95 and better than Otsu's global threshold.
 */
class SkimageImagesTest {

  @Test
  void otsuOnCameraMatchesThePublishedThreshold() {
    // ../shared/CHECKS.md: camera.png gives 102 in scikit-image (its own test accepts 101 < t <
    // 103), and ImageJ's AutoThresholder Otsu agrees.
    ImagePlus camera = IJ.openImage(ExternalData.skimageFile("camera.png").toString());
    int[] histogram = camera.getProcessor().getHistogram();
    int t = new AutoThresholder().getThreshold(AutoThresholder.Method.Otsu, histogram);
    assertThat(t).isBetween(101, 103);
  }

  @Test
  void renderedHorseIsSegmentedBetterThanOtsuWithDiceAbove095() {
    ImagePlus horse = IJ.openImage(ExternalData.skimageFile("horse.png").toString());
    ImageProcessor ip = horse.getProcessor().convertToByte(false);
    int w = ip.getWidth();
    int h = ip.getHeight();
    byte[] truth = new byte[w * h];
    int[] truthLabels = new int[w * h];
    for (int i = 0; i < truth.length; i++) {
      boolean inside = ip.get(i) < 128; // the silhouette is dark on white in the file
      truth[i] = (byte) (inside ? 255 : 0);
      truthLabels[i] = inside ? 1 : 0;
    }
    for (long seed = 1; seed <= 3; seed++) {
      float[] pixels = render(truth, w, h, seed);
      Raster image = Raster.grey(w, h, 1, pixels, VoxelSize.PIXELS, PixelKind.FLOAT32);
      SeedLabels strokes = StrokeGenerator.strokes(truthLabels, pixels, w, h, 1, seed);
      Segmentation result = Segmenter.segment(image, strokes, SegmentationSettings.defaults());
      double dice = Agreement.dice(truth, result.mask());
      double otsu = Agreement.dice(truth, OtsuBaseline.mask(image, 0));
      assertThat(dice).as("seed %d (Otsu %.3f)", seed, otsu).isGreaterThanOrEqualTo(0.95);
      assertThat(dice).isGreaterThan(otsu);
    }
  }

  /**
   * The horse as a bright object (120 above a background of 60) under illumination falling linearly
   * from 1 to 0.35 across the image, blurred with a Gaussian of σ = 1.5 px, plus Gaussian noise of
   * σ = 12 (our recipe, no source).
   */
  static float[] render(byte[] truth, int w, int h, long seed) {
    FloatProcessor fp = new FloatProcessor(w, h);
    for (int y = 0; y < h; y++) {
      for (int x = 0; x < w; x++) {
        double light = 1 - 0.8 * (x + y) / (double) (w + h - 2);
        fp.setf(x, y, (float) (light * (60 + (truth[x + w * y] != 0 ? 120 : 0))));
      }
    }
    new GaussianBlur().blurGaussian(fp, 1.5, 1.5, 0.002);
    SplittableRandom random = new SplittableRandom(seed);
    float[] pixels = (float[]) fp.getPixels();
    for (int i = 0; i < pixels.length; i++) {
      pixels[i] += (float) (12 * gaussian(random));
    }
    return pixels;
  }

  private static double gaussian(SplittableRandom random) {
    double u = 1 - random.nextDouble();
    double v = random.nextDouble();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  }
}
