package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.process.ShortProcessor;
import java.util.SplittableRandom;

/**
 * Test images of three classes and strokes on them, generated from a seed: a dark background (level
 * 100), a disc of level 400 on the left (class 1) and one of level 900 on the right (class 3),
 * radius 12, with Gaussian noise of standard deviation 30. Strokes are 3 pixels wide along the
 * middle row of each disc and along row 5 (class 2).
 */
final class ClassImages {
  static final int W = 80;
  static final int H = 64;

  private ClassImages() {}

  static ImagePlus threeDiscs(long seed) {
    SplittableRandom rnd = new SplittableRandom(seed);
    short[] v = new short[W * H];
    for (int y = 0; y < H; y++) {
      for (int x = 0; x < W; x++) {
        double level = 100;
        if (sq(x - 20) + sq(y - 32) < 144) {
          level = 400;
        } else if (sq(x - 58) + sq(y - 32) < 144) {
          level = 900;
        }
        v[y * W + x] = (short) Math.max(0, Math.round(level + 30 * rnd.nextGaussian()));
      }
    }
    return new ImagePlus("three discs", new ShortProcessor(W, H, v, null));
  }

  /** A horizontal stroke of class {@code label}, 3 pixels wide, on plane 0. */
  static SeedStrokes.Stroke stroke(int label, float x0, float x1, float y) {
    return new SeedStrokes.Stroke(new float[] {x0, x1}, new float[] {y, y}, 3, label, 0);
  }

  static SeedStrokes.Stroke foreground() {
    return stroke(1, 15, 25, 32.5f);
  }

  static SeedStrokes.Stroke background() {
    return stroke(2, 5, 75, 5.5f);
  }

  static SeedStrokes.Stroke third() {
    return stroke(3, 53, 63, 32.5f);
  }

  private static int sq(int a) {
    return a * a;
  }
}
