package io.github.cleave.synth;

import io.github.cleave.image.FrameSeries;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * An invented time-lapse of drifting, slowly growing fluorescent cells with its ground truth per
 * frame, for tests and demos; generated from a seed, never real data. Same seed and sizes, same
 * pixels, bit for bit ({@link StrictMath} and one {@link SplittableRandom}).
 *
 * <p>Recipe. {@code cells} ellipses, semi-axes uniform in [10, 16] px (aspect ratio at most 1.5),
 * relative brightness g uniform in [0.5, 1.3]. Each cell moves at a constant speed uniform in [0.5,
 * {@value #MAX_DRIFT}] px per frame along a direction that turns by up to 0.1 rad per frame, grows
 * by a factor uniform in [1, 1 + {@value #MAX_GROWTH}] per frame and turns by at most {@value
 * #MAX_TURN} rad per frame. Cells are placed (by rejection) so that on every frame their bounding
 * circles stay {@value #GAP} px apart and {@value #BORDER} px inside the image: no cell touches
 * another, enters or leaves. Emission per frame = illumination × (40 + 300 · g · 0.985^t · (1 +
 * 0.25 · texture)) photons in cells, 40 elsewhere (0.985^t: photobleaching of 1.5 % per frame;
 * texture a smooth random field, σ = 1.5 px, new every frame); illumination a ramp from 0.4 to 1 at
 * a random angle times (1 − 0.2 r²), the same on every frame; Gaussian PSF σ = 1.3 px; camera:
 * Poisson counts × 2 ADU + 100 ADU offset + Gaussian read noise σ = 3 ADU, 16 bit. Pixel 0.325 µm.
 *
 * <p>Between consecutive frames no point of a cell's outline moves farther than {@link
 * #maxBoundaryShift()} (centre drift plus growth and rotation times the largest semi-axis).
 *
 * <p>Truth labels use the cell's id 1..cells on every frame (the same id for the same cell). Seeds
 * are strokes on frame 0 by {@link StrokeGenerator#strokes} with seed {@code seed + 1}. Immutable
 * by convention: arrays are shared, do not modify them.
 */
public final class TimeLapsePhantom {
  /** Largest centre displacement of a cell between two frames, pixels. */
  public static final double MAX_DRIFT = 2.0;

  /** Largest relative growth of a cell's semi-axes per frame. */
  public static final double MAX_GROWTH = 0.03;

  /** Largest rotation of a cell per frame, radians. */
  public static final double MAX_TURN = 0.02;

  /** Smallest gap between the bounding circles of two cells on any frame, pixels. */
  public static final double GAP = 8;

  /** Smallest gap between a cell's bounding circle and the image border on any frame, pixels. */
  public static final double BORDER = 4;

  private static final double BACKGROUND = 40;
  private static final double CELL = 300;

  private final Raster[] frames;
  private final int[][] labels;
  private final SeedLabels seeds;
  private final int cellCount;
  private final double maxBoundaryShift;

  private TimeLapsePhantom(
      Raster[] frames, int[][] labels, SeedLabels seeds, int cellCount, double shift) {
    this.frames = frames;
    this.labels = labels;
    this.seeds = seeds;
    this.cellCount = cellCount;
    this.maxBoundaryShift = shift;
  }

  /** One cell's path: frame 0 shape and its change per frame. */
  private record Track(
      double cx,
      double cy,
      double ax,
      double ay,
      double angle,
      double gain,
      double speed,
      double heading,
      double bend,
      double growth,
      double spin) {

    NucleusLayout.Blob at(int t) {
      double x = cx;
      double y = cy;
      for (int s = 0; s < t; s++) {
        double phi = heading + bend * s;
        x += speed * StrictMath.cos(phi);
        y += speed * StrictMath.sin(phi);
      }
      double scale = StrictMath.pow(growth, t);
      return new NucleusLayout.Blob(x, y, 0, ax * scale, ay * scale, 0, angle + spin * t, gain);
    }
  }

  /**
   * Generates the time-lapse.
   *
   * @throws IllegalArgumentException if a size is below 96 px, there are fewer than 1 frame or
   *     cell, or the cells do not fit
   */
  public static TimeLapsePhantom generate(
      long seed, int width, int height, int frameCount, int cells) {
    if (width < 96 || height < 96 || frameCount < 1 || cells < 1) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "time-lapse phantom %d x %d, %d frame(s), %d cell(s): use at least 96 x 96, one"
                  + " frame and one cell",
              width,
              height,
              frameCount,
              cells));
    }
    SplittableRandom random = new SplittableRandom(seed);
    List<Track> tracks = place(random, width, height, frameCount, cells);
    double[] illumination =
        Fields.illumination(width, height, random.nextDouble() * 2 * Math.PI, 0.4, 0.2);
    VoxelSize size = new VoxelSize(0.325, 0.325, 1, "\u00b5m", false);
    Raster[] frames = new Raster[frameCount];
    int[][] labels = new int[frameCount][];
    float[] first = null;
    double shift = 0;
    for (int t = 0; t < frameCount; t++) {
      NucleusLayout layout = new NucleusLayout();
      for (Track track : tracks) {
        layout.blobs.add(track.at(t));
        if (t > 0) {
          shift = Math.max(shift, shift(track.at(t - 1), track.at(t)));
        }
      }
      labels[t] = layout.labels(width, height, 1, null);
      double[] texture = Fields.texture(random, width, height, 1, 1.5, 1.5, 0);
      double bleach = StrictMath.pow(0.985, t);
      double[] emission = new double[width * height];
      for (int i = 0; i < emission.length; i++) {
        int k = labels[t][i];
        double signal =
            k > 0 ? CELL * layout.blobs.get(k - 1).gain() * bleach * (1 + 0.25 * texture[i]) : 0;
        emission[i] = illumination[i] * (BACKGROUND + Math.max(0, signal));
      }
      double[] photons = Fields.blur(emission, width, height, 1, 1.3, 1.3, 0);
      float[] pixels = Randoms.camera16(random, photons, 100, 2, 3);
      first = t == 0 ? pixels : first;
      frames[t] = Raster.grey(width, height, 1, pixels, size, PixelKind.GREY16);
    }
    SeedLabels seeds = StrokeGenerator.strokes(labels[0], first, width, height, 1, seed + 1);
    return new TimeLapsePhantom(frames, labels, seeds, cells, shift);
  }

  private static List<Track> place(
      SplittableRandom random, int w, int h, int frameCount, int cells) {
    List<Track> tracks = new ArrayList<>();
    List<NucleusLayout.Blob[]> paths = new ArrayList<>();
    for (int cell = 0; cell < cells; cell++) {
      boolean placed = false;
      for (int attempt = 0; attempt < 20000 && !placed; attempt++) {
        double ax = 10 + 6 * random.nextDouble();
        double ay = Math.max(10, ax / (1 + 0.5 * random.nextDouble()));
        Track track =
            new Track(
                random.nextDouble() * (w - 1),
                random.nextDouble() * (h - 1),
                ax,
                ay,
                random.nextDouble() * Math.PI,
                0.5 + 0.8 * random.nextDouble(),
                0.5 + (MAX_DRIFT - 0.5) * random.nextDouble(),
                random.nextDouble() * 2 * Math.PI,
                0.2 * (random.nextDouble() - 0.5),
                1 + MAX_GROWTH * random.nextDouble(),
                MAX_TURN * (2 * random.nextDouble() - 1));
        NucleusLayout.Blob[] path = new NucleusLayout.Blob[frameCount];
        boolean free = true;
        for (int t = 0; t < frameCount && free; t++) {
          NucleusLayout.Blob b = track.at(t);
          path[t] = b;
          double r = b.bound();
          free =
              b.cx() - r >= BORDER
                  && b.cy() - r >= BORDER
                  && b.cx() + r <= w - 1 - BORDER
                  && b.cy() + r <= h - 1 - BORDER;
          for (int other = 0; other < paths.size() && free; other++) {
            NucleusLayout.Blob o = paths.get(other)[t];
            double dx = o.cx() - b.cx();
            double dy = o.cy() - b.cy();
            free = Math.sqrt(dx * dx + dy * dy) >= r + o.bound() + GAP;
          }
        }
        if (free) {
          tracks.add(track);
          paths.add(path);
          placed = true;
        }
      }
      if (!placed) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "%d moving cells over %d frames do not fit into %d x %d pixels; use a larger image"
                    + " or fewer cells",
                cells,
                frameCount,
                w,
                h));
      }
    }
    return tracks;
  }

  /** A bound on how far any outline point moves from {@code a} to {@code b}. */
  private static double shift(NucleusLayout.Blob a, NucleusLayout.Blob b) {
    double drift = Math.hypot(b.cx() - a.cx(), b.cy() - a.cy());
    double grow = Math.max(b.ax() - a.ax(), b.ay() - a.ay());
    double turn = Math.abs(b.angle() - a.angle()) * b.bound();
    return drift + grow + turn;
  }

  /** The frames as a series in memory. */
  public FrameSeries series() {
    return FrameSeries.of(frames);
  }

  public int frameCount() {
    return frames.length;
  }

  /** Frame {@code t} (0-based). */
  public Raster frame(int t) {
    return frames[t];
  }

  /** Ground-truth mask of frame {@code t}: 1 in a cell, 0 elsewhere (a new array). */
  public byte[] truth(int t) {
    byte[] m = new byte[labels[t].length];
    for (int i = 0; i < m.length; i++) {
      m[i] = (byte) (labels[t][i] != 0 ? 1 : 0);
    }
    return m;
  }

  /**
   * Ground-truth cell ids of frame {@code t}: 0 background, the cell's id 1..cells on every frame.
   */
  public int[] truthLabels(int t) {
    return labels[t];
  }

  /** Strokes on frame 0: 1 foreground, 2 background. */
  public SeedLabels seeds() {
    return seeds;
  }

  public int cellCount() {
    return cellCount;
  }

  /**
   * The largest distance, in pixels, by which a point of a cell's outline moves between two
   * consecutive frames (a bound: drift + growth of the larger semi-axis + rotation × bounding
   * radius), over all cells and frames; 0 for a single frame.
   */
  public double maxBoundaryShift() {
    return maxBoundaryShift;
  }
}
