package io.github.cleave.image;

import java.util.Locale;

/**
 * A grey or multichannel image of one plane or a z-stack, as raw pixel values in {@code float}
 * (never display-scaled). Channel {@code c} of voxel (x, y, z) is {@code channel(c)[x + width * (y
 * + height * z)]}: row-major, x fastest, the same node order as the max-flow grid. An RGB image is
 * three channels (red, green, blue, values 0..255).
 *
 * <p>The channel arrays are shared, not copied, for speed: a {@code Raster} is immutable by
 * convention, and neither its maker nor its users may write into the arrays after construction.
 * Safe to read from several threads.
 */
public final class Raster {
  private final int width;
  private final int height;
  private final int depth;
  private final float[][] channels; // channels[c].length == width * height * depth
  private final VoxelSize voxelSize;
  private final PixelKind kind;
  // per channel, null until first asked: computed at most a few times, since racing threads
  // compute equal values and publish them safely (a record's fields are final)
  private final WholeNumbers[] wholeNumbers;

  /** Whole numbers up to this magnitude are exact in float, int and double alike. */
  private static final float EXACT_INTEGER = 1 << 24;

  /**
   * @param channels one array per channel, each of length {@code width * height * depth}
   * @throws IllegalArgumentException naming the offending value if a dimension is not positive, the
   *     voxel count exceeds {@code Integer.MAX_VALUE}, there is no channel, or an array has the
   *     wrong length
   */
  public Raster(
      int width, int height, int depth, float[][] channels, VoxelSize voxelSize, PixelKind kind) {
    if (width < 1 || height < 1 || depth < 1) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "image size %d x %d x %d: every dimension must be at least 1",
              width,
              height,
              depth));
    }
    long n = (long) width * height * depth;
    if (n > Integer.MAX_VALUE - 64) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "image size %d x %d x %d has %d voxels; at most %d are supported",
              width,
              height,
              depth,
              n,
              Integer.MAX_VALUE - 64));
    }
    if (channels.length == 0) {
      throw new IllegalArgumentException("an image needs at least one channel");
    }
    for (int c = 0; c < channels.length; c++) {
      if (channels[c].length != n) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "channel %d has %d values; a %d x %d x %d image needs %d",
                c + 1,
                channels[c].length,
                width,
                height,
                depth,
                n));
      }
    }
    this.width = width;
    this.height = height;
    this.depth = depth;
    this.channels = channels.clone();
    this.voxelSize = voxelSize;
    this.kind = kind;
    this.wholeNumbers = new WholeNumbers[channels.length];
  }

  /** A single-channel image. */
  public static Raster grey(
      int width, int height, int depth, float[] values, VoxelSize voxelSize, PixelKind kind) {
    return new Raster(width, height, depth, new float[][] {values}, voxelSize, kind);
  }

  public int width() {
    return width;
  }

  public int height() {
    return height;
  }

  /** Number of planes; 1 for a single plane. */
  public int depth() {
    return depth;
  }

  /** Voxel count {@code width * height * depth}. */
  public int size() {
    return width * height * depth;
  }

  public int channelCount() {
    return channels.length;
  }

  /** The values of channel {@code c} (0-based); shared, do not modify. */
  public float[] channel(int c) {
    if (c < 0 || c >= channels.length) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "channel %d does not exist; this image has channels 1..%d",
              c + 1,
              channels.length));
    }
    return channels[c];
  }

  /**
   * {@code max − min} of channel {@code c} if every value is a whole number of magnitude at most
   * 2²⁴ (exact in float, int and double alike: 8- and 16-bit images, and whole-valued 32-bit ones),
   * else -1; 0 for an empty channel. Computed once, in O(n), then kept: the boundary term and the
   * contrast scale use it to work on whole numbers by table look-up.
   */
  public int wholeNumberRange(int c) {
    return wholeNumbers(c).range();
  }

  /**
   * The smallest value of channel {@code c} when {@link #wholeNumberRange} is at least 0 (so the
   * largest is that plus the range), found by the same pass and kept likewise; 0 otherwise.
   */
  public int wholeNumberMinimum(int c) {
    return wholeNumbers(c).minimum();
  }

  private WholeNumbers wholeNumbers(int c) {
    float[] values = channel(c);
    WholeNumbers found = wholeNumbers[c];
    if (found == null) {
      found = WholeNumbers.of(values);
      wholeNumbers[c] = found;
    }
    return found;
  }

  /** What {@link #wholeNumberRange} and {@link #wholeNumberMinimum} report for one channel. */
  private record WholeNumbers(int minimum, int range) {
    static WholeNumbers of(float[] values) {
      int min = Integer.MAX_VALUE;
      int max = Integer.MIN_VALUE;
      for (float v : values) {
        int i = (int) v;
        if (v != i || !(Math.abs(v) <= EXACT_INTEGER)) {
          return new WholeNumbers(0, -1); // NaN, infinite, too large, or a fraction
        }
        min = Math.min(min, i);
        max = Math.max(max, i);
      }
      return values.length == 0 ? new WholeNumbers(0, 0) : new WholeNumbers(min, max - min);
    }
  }

  public VoxelSize voxelSize() {
    return voxelSize;
  }

  /** How the pixel values were stored in the file. */
  public PixelKind kind() {
    return kind;
  }

  /** The same pixels with another voxel size. */
  public Raster withVoxelSize(VoxelSize size) {
    return new Raster(width, height, depth, channels, size, kind);
  }

  /** The image made of the chosen channels (0-based), in that order; arrays are shared. */
  public Raster selectChannels(int[] chosen) {
    float[][] picked = new float[chosen.length][];
    for (int i = 0; i < chosen.length; i++) {
      picked[i] = channel(chosen[i]);
    }
    return new Raster(width, height, depth, picked, voxelSize, kind);
  }

  @Override
  public String toString() {
    return String.format(
        Locale.ROOT,
        "%d x %d x %d, %d channel(s), %s",
        width,
        height,
        depth,
        channels.length,
        kind);
  }
}
