package io.github.cleave.synth;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * Random, non-overlapping placement of ellipses (2D) or ellipsoids (3D, axis-aligned in z, rotated
 * in the xy plane), some of them in touching pairs, and the ground-truth label image they make.
 * Isolated objects keep a gap of at least {@link #GAP} voxels (bounding circles) to every other
 * object and to the image border; the two objects of a pair overlap slightly along the line between
 * their centres, and every voxel covered by both goes to the object in whose normalised radius it
 * lies deeper, so a pair shares a straight-ish contact line.
 */
final class NucleusLayout {
  /** Smallest gap in voxels between the bounding circles of objects that must not touch. */
  static final double GAP = 4;

  /** One object: centre, semi-axes (voxels), rotation in the xy plane, relative brightness. */
  record Blob(
      double cx, double cy, double cz, double ax, double ay, double az, double angle, double gain) {

    /** Squared normalised radius of (x, y, z): below 1 inside. */
    double radius2(double x, double y, double z) {
      double dx = x - cx;
      double dy = y - cy;
      double c = StrictMath.cos(angle);
      double s = StrictMath.sin(angle);
      double u = (dx * c + dy * s) / ax;
      double v = (-dx * s + dy * c) / ay;
      double q = u * u + v * v;
      if (az > 0) {
        double wz = (z - cz) / az;
        q += wz * wz;
      }
      return q;
    }

    /** Distance from the centre to the xy outline in direction {@code phi}. */
    double reach(double phi) {
      double u = StrictMath.cos(phi - angle) / ax;
      double v = StrictMath.sin(phi - angle) / ay;
      return 1 / StrictMath.sqrt(u * u + v * v);
    }

    double bound() {
      return Math.max(ax, ay);
    }
  }

  final List<Blob> blobs = new ArrayList<>();
  int pairs;

  /**
   * Places {@code singles} isolated objects and {@code pairs} touching pairs. xy semi-axes are
   * drawn uniformly in [rMin, rMax] (aspect ratio at most 1.6), z semi-axis is {@code zScale} times
   * the mean xy semi-axis (0 in 2D), relative brightness uniform in [gainMin, gainMax].
   *
   * @throws IllegalArgumentException if the objects do not fit after many attempts
   */
  static NucleusLayout place(
      SplittableRandom random,
      int w,
      int h,
      int d,
      int singles,
      int pairs,
      double rMin,
      double rMax,
      double zScale,
      double gainMin,
      double gainMax) {
    NucleusLayout layout = new NucleusLayout();
    List<double[]> circles = new ArrayList<>(); // {cx, cy, radius} of placed units
    int total = singles + pairs;
    for (int unit = 0; unit < total; unit++) {
      boolean pair = unit < pairs; // pairs first, while there is room
      boolean placed = false;
      for (int attempt = 0; attempt < 5000 && !placed; attempt++) {
        Blob a = blob(random, w, h, d, 0, 0, rMin, rMax, zScale, gainMin, gainMax);
        Blob b = null;
        double ux = a.cx;
        double uy = a.cy;
        double ur = a.bound();
        if (pair) {
          double phi = random.nextDouble() * Math.PI * 2;
          Blob shape = blob(random, w, h, d, 0, 0, rMin, rMax, zScale, gainMin, gainMax);
          double dist = 0.85 * (a.reach(phi) + shape.reach(phi + Math.PI));
          b =
              new Blob(
                  a.cx + dist * StrictMath.cos(phi),
                  a.cy + dist * StrictMath.sin(phi),
                  a.cz,
                  shape.ax,
                  shape.ay,
                  shape.az,
                  shape.angle,
                  shape.gain);
          ux = (a.cx + b.cx) / 2;
          uy = (a.cy + b.cy) / 2;
          ur = dist / 2 + Math.max(a.bound(), b.bound());
        }
        if (ux - ur < GAP || uy - ur < GAP || ux + ur > w - 1 - GAP || uy + ur > h - 1 - GAP) {
          continue;
        }
        boolean free = true;
        for (double[] c : circles) {
          double dx = c[0] - ux;
          double dy = c[1] - uy;
          if (Math.sqrt(dx * dx + dy * dy) < c[2] + ur + GAP) {
            free = false;
            break;
          }
        }
        if (free) {
          circles.add(new double[] {ux, uy, ur});
          layout.blobs.add(a);
          if (b != null) {
            layout.blobs.add(b);
            layout.pairs++;
          }
          placed = true;
        }
      }
      if (!placed) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "%d objects do not fit into %d x %d pixels; use a larger image",
                singles + 2 * pairs,
                w,
                h));
      }
    }
    return layout;
  }

  private static Blob blob(
      SplittableRandom random,
      int w,
      int h,
      int d,
      double cx,
      double cy,
      double rMin,
      double rMax,
      double zScale,
      double gainMin,
      double gainMax) {
    double ax = rMin + random.nextDouble() * (rMax - rMin);
    double ay = Math.max(rMin, ax / (1 + 0.6 * random.nextDouble()));
    double angle = random.nextDouble() * Math.PI;
    double gain = gainMin + random.nextDouble() * (gainMax - gainMin);
    double x = random.nextDouble() * (w - 1);
    double y = random.nextDouble() * (h - 1);
    double az = d > 1 ? zScale * (ax + ay) / 2 : 0;
    double z =
        d > 1 ? (d - 1) / 2.0 + (random.nextDouble() - 0.5) * Math.max(0, d - 2 * az - 4) : 0;
    return new Blob(x + cx, y + cy, z, ax, ay, az, angle, gain);
  }

  /**
   * Ground-truth labels 1..n in placement order; each voxel (sampled at its centre) belongs to the
   * object whose squared normalised radius there is smallest and below 1. Also fills {@code
   * depthOut} (may be null) with that radius (≥ 1 outside every object).
   */
  int[] labels(int w, int h, int d, double[] depthOut) {
    int[] labels = new int[w * h * d];
    double[] best = depthOut != null ? depthOut : new double[labels.length];
    java.util.Arrays.fill(best, Double.POSITIVE_INFINITY);
    for (int k = 0; k < blobs.size(); k++) {
      Blob b = blobs.get(k);
      double r = b.bound() + 1;
      int x0 = Math.max(0, (int) Math.floor(b.cx - r));
      int x1 = Math.min(w - 1, (int) Math.ceil(b.cx + r));
      int y0 = Math.max(0, (int) Math.floor(b.cy - r));
      int y1 = Math.min(h - 1, (int) Math.ceil(b.cy + r));
      int z0 = d > 1 ? Math.max(0, (int) Math.floor(b.cz - b.az - 1)) : 0;
      int z1 = d > 1 ? Math.min(d - 1, (int) Math.ceil(b.cz + b.az + 1)) : 0;
      for (int z = z0; z <= z1; z++) {
        for (int y = y0; y <= y1; y++) {
          for (int x = x0; x <= x1; x++) {
            double q = b.radius2(x, y, z);
            int i = x + w * (y + h * z);
            if (q < 1 && q < best[i]) {
              best[i] = q;
              labels[i] = k + 1;
            }
          }
        }
      }
    }
    return labels;
  }
}
