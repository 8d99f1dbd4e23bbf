package io.github.cleave.objects.reference;

import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;

/**
 * Seeded random masks for cross-checks of the objects phase: a plane or a stack with touching and
 * overlapping ellipses or ellipsoids at any angle, lumpy blobs, holes and cavities, objects cut by
 * the image edge, thin lines and single-voxel specks. Foreground is 255 (or another nonzero value,
 * since callers must accept any nonzero byte). Deterministic for a given random state.
 */
public final class RandomMasks {
  private RandomMasks() {}

  /** A mask of {@code w·h·d} voxels drawn from {@code rnd}. */
  public static byte[] mask(SplittableRandom rnd, int w, int h, int d) {
    byte[] m = new byte[w * h * d];
    byte on = rnd.nextInt(8) == 0 ? (byte) rnd.nextInt(1, 256) : (byte) 255;
    int shapes = rnd.nextInt(0, 3 + (w * h * d) / 300);
    for (int s = 0; s < shapes; s++) {
      double cx = rnd.nextDouble(-0.1, 1.1) * w;
      double cy = rnd.nextDouble(-0.1, 1.1) * h;
      double cz = rnd.nextDouble(-0.1, 1.1) * d;
      double r = rnd.nextDouble(0.5, 2 + Math.min(w, h) / 4.0);
      switch (rnd.nextInt(5)) {
        case 0, 1 -> { // a touching or overlapping pair
          double a = rnd.nextDouble(Math.PI);
          double r2 = r * rnd.nextDouble(0.5, 1.5);
          double gap = (r + r2) * rnd.nextDouble(0.6, 1.05);
          ellipsoid(m, w, h, d, on, cx, cy, cz, r, r * rnd.nextDouble(0.6, 1), r, a);
          ellipsoid(
              m,
              w,
              h,
              d,
              on,
              cx + gap * Math.cos(a),
              cy + gap * Math.sin(a),
              cz + rnd.nextDouble(-1, 1),
              r2,
              r2 * rnd.nextDouble(0.6, 1),
              r2,
              rnd.nextDouble(Math.PI));
        }
        case 2 -> blob(rnd, m, w, h, d, on, cx, cy, cz, r);
        case 3 ->
            ellipsoid(
                m,
                w,
                h,
                d,
                on,
                cx,
                cy,
                cz,
                r,
                r * rnd.nextDouble(0.3, 1),
                r,
                rnd.nextDouble(Math.PI));
        default -> line(rnd, m, w, h, d, on);
      }
    }
    int holes = rnd.nextInt(0, 2 + shapes / 2);
    for (int k = 0; k < holes; k++) { // holes, cavities and notches
      double r = rnd.nextDouble(0.5, 1 + Math.min(w, h) / 10.0);
      ellipsoid(
          m,
          w,
          h,
          d,
          (byte) 0,
          rnd.nextDouble() * w,
          rnd.nextDouble() * h,
          rnd.nextDouble() * d,
          r,
          r * rnd.nextDouble(0.4, 1),
          r,
          rnd.nextDouble(Math.PI));
    }
    int specks = rnd.nextInt(0, 1 + m.length / 200);
    for (int k = 0; k < specks; k++) {
      int i = rnd.nextInt(m.length);
      m[i] = m[i] == 0 ? on : 0;
    }
    return m;
  }

  /** A random calibration: isotropic pixels, typical anisotropic stacks, or arbitrary sides. */
  public static VoxelSize voxelSize(SplittableRandom rnd) {
    return switch (rnd.nextInt(4)) {
      case 0 -> VoxelSize.PIXELS;
      case 1 -> new VoxelSize(0.2, 0.2, 0.6, "um", false);
      case 2 -> new VoxelSize(1, 1, rnd.nextInt(2, 5), "um", false);
      default ->
          new VoxelSize(
              rnd.nextDouble(0.1, 2), rnd.nextDouble(0.1, 2), rnd.nextDouble(0.1, 3), "um", false);
    };
  }

  /** Random strokes: short segments, some inside the mask, some outside. */
  public static byte[] strokes(SplittableRandom rnd, int w, int h, int d) {
    byte[] s = new byte[w * h * d];
    int count = rnd.nextInt(0, 8);
    for (int k = 0; k < count; k++) {
      line(rnd, s, w, h, d, (byte) 1);
    }
    return s;
  }

  /** Voxels whose centre lies in the ellipsoid with half-axes (a, b, c), turned by angle in xy. */
  private static void ellipsoid(
      byte[] m,
      int w,
      int h,
      int d,
      byte value,
      double cx,
      double cy,
      double cz,
      double a,
      double b,
      double c,
      double angle) {
    double cos = Math.cos(angle);
    double sin = Math.sin(angle);
    double reach = Math.max(a, Math.max(b, c)) + 1;
    int x0 = Math.max(0, (int) Math.floor(cx - reach));
    int x1 = Math.min(w - 1, (int) Math.ceil(cx + reach));
    int y0 = Math.max(0, (int) Math.floor(cy - reach));
    int y1 = Math.min(h - 1, (int) Math.ceil(cy + reach));
    int z0 = d == 1 ? 0 : Math.max(0, (int) Math.floor(cz - reach));
    int z1 = d == 1 ? 0 : Math.min(d - 1, (int) Math.ceil(cz + reach));
    for (int z = z0; z <= z1; z++) {
      double t = d == 1 ? 0 : (z + 0.5 - cz) / c;
      for (int y = y0; y <= y1; y++) {
        for (int x = x0; x <= x1; x++) {
          double px = x + 0.5 - cx;
          double py = y + 0.5 - cy;
          double u = (cos * px + sin * py) / a;
          double v = (-sin * px + cos * py) / b;
          if (u * u + v * v + t * t <= 1) {
            m[x + w * (y + h * z)] = value;
          }
        }
      }
    }
  }

  /** A lumpy blob: a random walk of small balls. */
  private static void blob(
      SplittableRandom rnd,
      byte[] m,
      int w,
      int h,
      int d,
      byte on,
      double cx,
      double cy,
      double cz,
      double r) {
    int steps = rnd.nextInt(2, 12);
    for (int k = 0; k < steps; k++) {
      double rr = r * rnd.nextDouble(0.3, 0.8);
      ellipsoid(m, w, h, d, on, cx, cy, cz, rr, rr, rr, 0);
      cx += rnd.nextDouble(-rr, rr);
      cy += rnd.nextDouble(-rr, rr);
      cz += d == 1 ? 0 : rnd.nextDouble(-rr, rr) / 2;
    }
  }

  /** A straight line one voxel thick between two random points. */
  private static void line(SplittableRandom rnd, byte[] m, int w, int h, int d, byte on) {
    double x = rnd.nextDouble() * w;
    double y = rnd.nextDouble() * h;
    double z = rnd.nextDouble() * d;
    double dx = rnd.nextDouble(-1, 1);
    double dy = rnd.nextDouble(-1, 1);
    double dz = d == 1 ? 0 : rnd.nextDouble(-0.5, 0.5);
    int length = rnd.nextInt(1, 2 + Math.max(w, h));
    for (int k = 0; k < length; k++, x += dx, y += dy, z += dz) {
      if (x >= 0 && x < w && y >= 0 && y < h && z >= 0 && z < d) {
        m[(int) x + w * ((int) y + h * (int) z)] = on;
      }
    }
  }
}
