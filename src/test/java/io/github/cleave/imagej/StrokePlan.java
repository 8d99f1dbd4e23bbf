package io.github.cleave.imagej;

import ij.IJ;
import ij.ImagePlus;
import java.nio.file.Path;

/**
 * Two strokes to paint on a sample image, read from its bundled seed image (sample-images/
 * README.md: strokes generated from the ground truth): the longest horizontal run of foreground
 * seed pixels and the longest run of background seed pixels, as image coordinates.
 *
 * @param foreground {x0, y, x1} of the foreground stroke
 * @param background {x0, y, x1} of the background stroke
 */
record StrokePlan(int[] foreground, int[] background) {
  static StrokePlan of(Path seedImage) {
    ImagePlus seeds = IJ.openImage(seedImage.toString());
    byte[] p = (byte[]) seeds.getProcessor().getPixels();
    return new StrokePlan(
        longestRun(p, seeds.getWidth(), seeds.getHeight(), 1),
        longestRun(p, seeds.getWidth(), seeds.getHeight(), 2));
  }

  static int[] longestRun(byte[] p, int w, int h, int label) {
    int[] best = null;
    for (int y = 0; y < h; y++) {
      int start = -1;
      for (int x = 0; x <= w; x++) {
        boolean in = x < w && p[y * w + x] == label;
        if (in && start < 0) {
          start = x;
        } else if (!in && start >= 0) {
          if (best == null || x - 1 - start > best[2] - best[0]) {
            best = new int[] {start, y, x - 1};
          }
          start = -1;
        }
      }
    }
    return best;
  }

  /** The strokes as brush strokes of {@code width} on plane 0. */
  SeedStrokes strokes(int w, int h, float width) {
    SeedStrokes s = new SeedStrokes(w, h, 1);
    for (int[] r : new int[][] {foreground, background}) {
      s.add(
          new SeedStrokes.Stroke(
              new float[] {r[0] + 0.5f, r[2] + 0.5f},
              new float[] {r[1] + 0.5f, r[1] + 0.5f},
              width,
              r == foreground ? 1 : 2,
              0));
    }
    return s;
  }
}
