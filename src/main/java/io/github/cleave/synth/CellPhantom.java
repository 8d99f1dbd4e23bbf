package io.github.cleave.synth;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;

/**
 * An invented three-class test image: cells on a dark background, each a dim cytoplasm with a
 * bright nucleus inside it, 16-bit grey, with its true class map and seeds for each class made from
 * the truth by a seeded generator. Never real data.
 *
 * <p>Classes follow the seed label contract: 1 nucleus (foreground), 2 background, 3 cytoplasm.
 * Cells sit on a jittered 3 × 3 grid (no cell touches another), cytoplasm ellipses with radii of 24
 * to 28 px and nuclei of 10 to 13 px placed up to 4 px off centre. Emission (photons): background
 * 40, cytoplasm 140, nucleus 320; the optics blur with σ = 1 px, the camera adds shot noise and
 * read noise of 3 ADU ({@code Randoms.camera16}). Seeds: one straight stroke across the middle of
 * two nuclei, a small disc of radius 3 px in the cytoplasm of three cells (halfway between nucleus
 * and cell edge), and two horizontal background strokes of 30 px between cell rows, every voxel at
 * least 8 px from every cell.
 *
 * @param image the pixels
 * @param truth the true class 1..3 of every pixel
 * @param seeds strokes of all three classes
 */
public record CellPhantom(Raster image, byte[] truth, SeedLabels seeds) {

  /** Class label of the nucleus. */
  public static final int NUCLEUS = 1;

  /** Class label of the cytoplasm. */
  public static final int CYTOPLASM = 3;

  /** A 256 × 256 field of nine cells, deterministic for {@code seed}. */
  public static CellPhantom make(long seed) {
    int w = 256;
    int h = 256;
    SplittableRandom random = new SplittableRandom(seed);
    double[][] cells = new double[9][]; // cx, cy, rx, ry, nx, ny, nrx, nry
    for (int i = 0; i < 9; i++) {
      double cx = 43 + 85 * (i % 3) + uniform(random, -4, 4);
      double cy = 43 + 85 * (i / 3) + uniform(random, -4, 4);
      double rx = uniform(random, 24, 28);
      double ry = uniform(random, 24, 28);
      double nrx = uniform(random, 10, 13);
      double nry = uniform(random, 10, 13);
      double nx = cx + uniform(random, -4, 4);
      double ny = cy + uniform(random, -4, 4);
      cells[i] = new double[] {cx, cy, rx, ry, nx, ny, nrx, nry};
    }
    byte[] truth = new byte[w * h];
    double[] photons = new double[w * h];
    for (int y = 0; y < h; y++) {
      for (int x = 0; x < w; x++) {
        int cls = SeedLabels.BACKGROUND;
        for (double[] c : cells) {
          if (inside(x, y, c[4], c[5], c[6], c[7])) {
            cls = NUCLEUS;
          } else if (cls == SeedLabels.BACKGROUND && inside(x, y, c[0], c[1], c[2], c[3])) {
            cls = CYTOPLASM;
          }
        }
        truth[x + w * y] = (byte) cls;
        photons[x + w * y] = cls == NUCLEUS ? 320 : cls == CYTOPLASM ? 140 : 40;
      }
    }
    double[] blurred = Fields.blur(photons, w, h, 1, 1.0, 1.0, 0);
    float[] pixels = Randoms.camera16(random, blurred, 100, 1.0, 3.0);
    Raster image =
        Raster.grey(
            w, h, 1, pixels, new VoxelSize(0.5, 0.5, 1, "\u00b5m", false), PixelKind.GREY16);
    return new CellPhantom(image, truth, new SeedLabels(w, h, 1, seeds(cells, w, h)));
  }

  /** The true mask of class {@code c}: 1 inside, 0 elsewhere. */
  public byte[] truthOf(int c) {
    byte[] out = new byte[truth.length];
    for (int i = 0; i < out.length; i++) {
      out[i] = truth[i] == c ? (byte) 1 : 0;
    }
    return out;
  }

  private static byte[] seeds(double[][] cells, int w, int h) {
    byte[] seeds = new byte[w * h];
    for (int i = 0; i < 2; i++) { // nuclei of cells 0 and 4: a stroke of 2/3 of the nucleus width
      double[] c = cells[i * 4];
      int half = (int) (c[6] * 2 / 3);
      for (int dx = -half; dx <= half; dx++) {
        seeds[(int) c[4] + dx + w * (int) c[5]] = NUCLEUS;
      }
    }
    for (int i : new int[] {1, 5, 6}) { // cytoplasm: a disc halfway between nucleus and cell edge
      double[] c = cells[i];
      double angle = Math.atan2(c[5] - c[1], c[4] - c[0]) + Math.PI; // away from the nucleus
      double inner = radiusAlong(c[6], c[7], angle) - distance(c[0], c[1], c[4], c[5]);
      double outer = radiusAlong(c[2], c[3], angle);
      double r = 0.5 * (inner + outer);
      int sx = (int) Math.round(c[0] + r * Math.cos(angle));
      int sy = (int) Math.round(c[1] + r * Math.sin(angle));
      for (int dy = -3; dy <= 3; dy++) {
        for (int dx = -3; dx <= 3; dx++) {
          if (dx * dx + dy * dy <= 9) {
            seeds[sx + dx + w * (sy + dy)] = CYTOPLASM;
          }
        }
      }
    }
    for (int row = 0; row < 2; row++) { // between cell rows, where no cell comes within 8 px
      int y = row == 0 ? lowestGapRow(cells, 0, h) : lowestGapRow(cells, 1, h);
      for (int x = 113; x < 143; x++) {
        seeds[x + w * y] = SeedLabels.BACKGROUND;
      }
    }
    return seeds;
  }

  /** The row between cell rows {@code r} and {@code r + 1} farthest from every cell. */
  private static int lowestGapRow(double[][] cells, int r, int h) {
    int best = -1;
    double bestGap = -1;
    for (int y = 85 * (r + 1) - 20; y <= 85 * (r + 1) + 20; y++) {
      double gap = Double.POSITIVE_INFINITY;
      for (double[] c : cells) {
        gap = Math.min(gap, Math.abs(y - c[1]) - c[3]);
      }
      if (gap > bestGap) {
        bestGap = gap;
        best = y;
      }
    }
    if (bestGap < 8) {
      throw new IllegalStateException("no background row 8 px from every cell");
    }
    return best;
  }

  private static boolean inside(int x, int y, double cx, double cy, double rx, double ry) {
    double u = (x + 0.5 - cx) / rx;
    double v = (y + 0.5 - cy) / ry;
    return u * u + v * v <= 1;
  }

  private static double radiusAlong(double rx, double ry, double angle) {
    double c = Math.cos(angle) / rx;
    double s = Math.sin(angle) / ry;
    return 1 / Math.sqrt(c * c + s * s);
  }

  private static double distance(double x0, double y0, double x1, double y1) {
    return Math.hypot(x1 - x0, y1 - y0);
  }

  private static double uniform(SplittableRandom random, double low, double high) {
    return low + (high - low) * random.nextDouble();
  }
}
