package io.github.cleave.objects;

import java.util.SplittableRandom;

/**
 * Rasterised test shapes: a pixel or voxel belongs to a shape when its centre {@code ((x + 0.5)·sx,
 * (y + 0.5)·sy, (z + 0.5)·sz)} lies inside it (calibrated coordinates).
 */
final class Phantoms {
  private Phantoms() {}

  /** Adds the disk of radius r (calibrated) centred at (cx, cy) to plane 0 of {@code mask}. */
  static void disk(
      byte[] mask, int w, int h, double sx, double sy, double cx, double cy, double r) {
    ellipse(mask, w, h, sx, sy, cx, cy, r, r);
  }

  /** Adds the axis-aligned ellipse with half-axes a (x) and b (y). */
  static void ellipse(
      byte[] mask, int w, int h, double sx, double sy, double cx, double cy, double a, double b) {
    for (int y = 0; y < h; y++) {
      for (int x = 0; x < w; x++) {
        double u = ((x + 0.5) * sx - cx) / a;
        double v = ((y + 0.5) * sy - cy) / b;
        if (u * u + v * v <= 1) {
          mask[x + w * y] = (byte) 255;
        }
      }
    }
  }

  /** Adds the ball of radius r (calibrated) centred at (cx, cy, cz). */
  static void ball(
      byte[] mask,
      int w,
      int h,
      int d,
      double sx,
      double sy,
      double sz,
      double cx,
      double cy,
      double cz,
      double r) {
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          double u = (x + 0.5) * sx - cx;
          double v = (y + 0.5) * sy - cy;
          double t = (z + 0.5) * sz - cz;
          if (u * u + v * v + t * t <= r * r) {
            mask[x + w * (y + h * z)] = (byte) 255;
          }
        }
      }
    }
  }

  /** Random blobs: each voxel foreground with probability p, then optionally thickened. */
  static byte[] noise(SplittableRandom rnd, int n, double p) {
    byte[] m = new byte[n];
    for (int i = 0; i < n; i++) {
      if (rnd.nextDouble() < p) {
        m[i] = 1;
      }
    }
    return m;
  }

  static long count(byte[] mask) {
    long c = 0;
    for (byte b : mask) {
      if (b != 0) {
        c++;
      }
    }
    return c;
  }
}
