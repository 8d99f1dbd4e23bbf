package io.github.cleave.image;

import java.util.Arrays;
import java.util.Locale;

/**
 * Seeds as a label per voxel (DESIGN.md contract): 0 no seed, 1 foreground, 2 background, 3..K
 * further classes. Same size and node order as the {@link Raster} it marks. The label array is
 * shared, not copied: immutable by convention.
 */
public final class SeedLabels {
  /** Label of unmarked voxels. */
  public static final int NONE = 0;

  /** Label of foreground seeds. */
  public static final int FOREGROUND = 1;

  /** Label of background seeds. */
  public static final int BACKGROUND = 2;

  /** Largest class label supported. */
  public static final int MAX_CLASS = 255;

  private final int width;
  private final int height;
  private final int depth;
  private final byte[] labels; // labels[x + width * (y + height * z)] & 0xff, 0..MAX_CLASS

  /**
   * @throws IllegalArgumentException if the array length is not {@code width * height * depth}
   */
  public SeedLabels(int width, int height, int depth, byte[] labels) {
    if ((long) width * height * depth != labels.length) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "seed labels: %d values for a %d x %d x %d image",
              labels.length,
              width,
              height,
              depth));
    }
    this.width = width;
    this.height = height;
    this.depth = depth;
    this.labels = labels;
  }

  /** Empty seeds for an image of this size. */
  public static SeedLabels empty(int width, int height, int depth) {
    return new SeedLabels(width, height, depth, new byte[width * height * depth]);
  }

  public int width() {
    return width;
  }

  public int height() {
    return height;
  }

  public int depth() {
    return depth;
  }

  /** Voxel count. */
  public int size() {
    return labels.length;
  }

  /** The class label of voxel {@code i} (0 = none). */
  public int label(int i) {
    return labels[i] & 0xff;
  }

  /** The label array; shared, do not modify. */
  public byte[] labels() {
    return labels;
  }

  /** The largest label present (0 when there is no seed). */
  public int maxLabel() {
    return countsPerLabel().length - 1;
  }

  /**
   * The first voxel at or after {@code from} with a label other than 0, or {@code labels.length} if
   * there is none. Unlabelled voxels are passed over eight at a time, so a loop over the seeds,
   * {@code for (p = nextLabelled(l, 0); p < l.length; p = nextLabelled(l, p + 1))}, costs about an
   * eighth of a pass over the image plus the seeds themselves (seeds are a few strokes).
   */
  public static int nextLabelled(byte[] labels, int from) {
    return ByteWords.nextNonZero(labels, from, labels.length);
  }

  /** Number of seed voxels per label, indexed by label 0..maxLabel. */
  public long[] countsPerLabel() {
    // seeds are sparse: counting only the labelled voxels avoids a chain of increments of one
    // counter (label 0) that would wait for each other; label 0 is what remains
    long[] counts = new long[256];
    for (int p = nextLabelled(labels, 0); p < labels.length; p = nextLabelled(labels, p + 1)) {
      counts[labels[p] & 0xff]++;
    }
    long labelled = 0;
    for (int label = 1; label < counts.length; label++) {
      labelled += counts[label];
    }
    counts[0] = labels.length - labelled;
    int max = 255;
    while (max > 0 && counts[max] == 0) {
      max--;
    }
    return Arrays.copyOf(counts, max + 1);
  }

  /** True when this has the size of {@code raster}. */
  public boolean fits(Raster raster) {
    return width == raster.width() && height == raster.height() && depth == raster.depth();
  }
}
