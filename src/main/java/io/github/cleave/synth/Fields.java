package io.github.cleave.synth;

import java.util.SplittableRandom;

/**
 * Dense double-valued fields on a W×H×D grid (index {@code x + W (y + H z)}) for the phantom
 * recipes: separable Gaussian blur and smooth random texture.
 */
final class Fields {
  private Fields() {}

  /**
   * Gaussian blur with standard deviations (in voxels) per axis, kernel cut at 3.5 σ and
   * normalised, edges replicated. A σ of 0 leaves that axis alone. O(N · Σ kernel widths).
   */
  static double[] blur(double[] in, int w, int h, int d, double sx, double sy, double sz) {
    double[] out = in.clone();
    out = blurAxis(out, w, h, d, sx, 1, w);
    out = blurAxis(out, w, h, d, sy, w, h);
    out = blurAxis(out, w, h, d, sz, w * h, d);
    return out;
  }

  private static double[] blurAxis(
      double[] in, int w, int h, int d, double sigma, int stride, int length) {
    if (sigma <= 0 || length == 1) {
      return in;
    }
    int radius = (int) Math.ceil(3.5 * sigma);
    double[] kernel = new double[2 * radius + 1];
    double sum = 0;
    for (int i = -radius; i <= radius; i++) {
      kernel[i + radius] = StrictMath.exp(-0.5 * i * i / (sigma * sigma));
      sum += kernel[i + radius];
    }
    for (int i = 0; i < kernel.length; i++) {
      kernel[i] /= sum;
    }
    double[] out = new double[in.length];
    double[] line = new double[length];
    int n = w * h * d;
    for (int start = 0; start < n; start++) {
      // a line starts where the coordinate along this axis is 0
      if ((start / stride) % length != 0) {
        continue;
      }
      for (int i = 0; i < length; i++) {
        line[i] = in[start + i * stride];
      }
      for (int i = 0; i < length; i++) {
        double acc = 0;
        for (int k = -radius; k <= radius; k++) {
          int j = Math.min(length - 1, Math.max(0, i + k));
          acc += kernel[k + radius] * line[j];
        }
        out[start + i * stride] = acc;
      }
    }
    return out;
  }

  /**
   * Smooth random texture: white Gaussian noise blurred with σ per axis, then scaled to mean 0 and
   * standard deviation 1 over the grid.
   */
  static double[] texture(
      SplittableRandom random, int w, int h, int d, double sx, double sy, double sz) {
    double[] noise = new double[w * h * d];
    for (int i = 0; i < noise.length; i++) {
      noise[i] = Randoms.gaussian(random);
    }
    double[] smooth = blur(noise, w, h, d, sx, sy, sz);
    double mean = 0;
    for (double v : smooth) {
      mean += v;
    }
    mean /= smooth.length;
    double var = 0;
    for (double v : smooth) {
      var += (v - mean) * (v - mean);
    }
    double sd = Math.sqrt(var / smooth.length);
    for (int i = 0; i < smooth.length; i++) {
      smooth[i] = sd > 0 ? (smooth[i] - mean) / sd : 0;
    }
    return smooth;
  }

  /**
   * Uneven illumination in (0, 1]: a linear ramp from {@code low} to 1 along a direction at angle
   * {@code angle} across the field of view, times a radial fall-off {@code 1 − vignette · r²} (r =
   * distance from the centre over the half diagonal). One plane; the caller repeats it over z.
   */
  static double[] illumination(int w, int h, double angle, double low, double vignette) {
    double[] field = new double[w * h];
    double cos = StrictMath.cos(angle);
    double sin = StrictMath.sin(angle);
    double cx = (w - 1) / 2.0;
    double cy = (h - 1) / 2.0;
    double halfDiagonalSq = cx * cx + cy * cy;
    double extent = Math.abs(cos) * cx + Math.abs(sin) * cy; // max projection from the centre
    for (int y = 0; y < h; y++) {
      for (int x = 0; x < w; x++) {
        double dx = x - cx;
        double dy = y - cy;
        double t = extent > 0 ? 0.5 + 0.5 * (dx * cos + dy * sin) / extent : 1; // 0..1
        double ramp = low + (1 - low) * t;
        double fall = 1 - vignette * (dx * dx + dy * dy) / Math.max(halfDiagonalSq, 1e-12);
        field[x + w * y] = ramp * fall;
      }
    }
    return field;
  }

  /**
   * Out-of-focus haze: one broad Gaussian bump, 1 at a random centre inside the field of view,
   * standard deviation {@code fraction} of the larger side. One plane.
   */
  static double[] haze(SplittableRandom random, int w, int h, double fraction) {
    double cx = random.nextDouble() * (w - 1);
    double cy = random.nextDouble() * (h - 1);
    double sigma = fraction * Math.max(w, h);
    double[] field = new double[w * h];
    for (int y = 0; y < h; y++) {
      for (int x = 0; x < w; x++) {
        double dx = x - cx;
        double dy = y - cy;
        field[x + w * y] = StrictMath.exp(-0.5 * (dx * dx + dy * dy) / (sigma * sigma));
      }
    }
    return field;
  }
}
