package io.github.cleave.io;

import ij.ImagePlus;
import ij.ImageStack;
import ij.process.ImageProcessor;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.FrameSeries;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.List;
import java.util.Locale;
import java.util.Objects;

/**
 * A time-lapse opened by {@link Hyperstacks}: the {@link FrameSeries} itself, what the image says
 * about itself (title, channel names, bit depth, ImageJ type, as in {@link LoadedImage}), and which
 * axis was read as time and why ({@link #timeSource()}, {@link #reason()}, {@link #warnings()}).
 *
 * <p>{@link #frame(int)} reads the planes of that time point only, through the image's stack
 * ({@code ImageStack.getProcessor}, which a virtual stack answers by reading the file), in ImageJ's
 * hyperstack order: channel {@code c}, slice {@code z}, frame {@code t} is stack plane {@code
 * ImagePlus.getStackIndex(c, z, t)}. Every call reads again (nothing is cached), so memory holds
 * one time point at a time; values are raw, as {@link ImageFiles} reads them (RGB as three
 * channels, 32-bit images refused per time point when they hold NaN or infinite values).
 *
 * <p>Not thread-safe: ImageJ's virtual stacks are not. A series opened from a file refuses to read
 * on once the file changed (size or modification time) since it was opened.
 */
public final class OpenedSeries implements FrameSeries {
  /** Where the time points of the image come from. */
  public enum TimeSource {
    /** The image's own frames (ImageJ's T dimension above 1). */
    FRAMES,
    /** Slices of an image without frames, read as time points (each one plane). */
    SLICES_AS_FRAMES,
    /** One time point: a single plane or one volume. */
    NONE
  }

  private final ImagePlus imp;
  private final ImageStack stack;
  private final Path source;
  private final long sourceSize; // file length at opening, or -1 when not watched
  private final FileTime sourceModified; // null when not watched
  private final String title;
  private final List<String> channelNames;
  private final int imageChannels; // ImageJ's channel count (1 for RGB)
  private final int depth; // z planes per time point
  private final int frames;
  private final PixelKind kind;
  private final VoxelSize voxelSize;
  private final TimeAxisDecision decision;
  private final double frameInterval; // NaN when unknown
  private final String timeUnit;

  OpenedSeries(
      ImagePlus imp,
      Path source,
      boolean watchSource,
      String title,
      List<String> channelNames,
      PixelKind kind,
      VoxelSize voxelSize,
      TimeAxisDecision decision,
      double frameInterval,
      String timeUnit) {
    this.imp = imp;
    this.stack = imp.getStack();
    this.source = source;
    this.title = Objects.requireNonNull(title);
    this.channelNames = List.copyOf(channelNames);
    this.imageChannels = imp.getNChannels();
    this.kind = kind;
    this.voxelSize = voxelSize;
    this.decision = decision;
    this.frameInterval = frameInterval;
    this.timeUnit = timeUnit;
    switch (decision.source()) {
      case FRAMES:
        depth = imp.getNSlices();
        frames = imp.getNFrames();
        break;
      case SLICES_AS_FRAMES:
        depth = 1;
        frames = imp.getNSlices();
        break;
      default:
        depth = imp.getNSlices();
        frames = 1;
        break;
    }
    long size = -1;
    FileTime modified = null;
    if (watchSource && source != null) {
      try {
        size = Files.size(source);
        modified = Files.getLastModifiedTime(source);
      } catch (IOException e) {
        throw new BadInputException("image file " + source + " cannot be read: " + e, e);
      }
    }
    this.sourceSize = size;
    this.sourceModified = modified;
  }

  @Override
  public int frameCount() {
    return frames;
  }

  /**
   * Time point {@code t} (0-based): every channel and z plane of it, read now.
   *
   * @throws IllegalArgumentException if {@code t} is outside {@code 0..frameCount()-1}
   * @throws BadInputException if the planes cannot be read, the file changed since it was opened,
   *     or a 32-bit time point holds NaN or infinite values
   */
  @Override
  public Raster frame(int t) {
    if (t < 0 || t >= frames) {
      throw new IllegalArgumentException(
          "time point " + t + " does not exist; " + title + " has time points 0.." + (frames - 1));
    }
    checkSourceUnchanged();
    int w = imp.getWidth();
    int h = imp.getHeight();
    int plane = w * h;
    float[][] values;
    try {
      values = new float[channelCount()][plane * depth];
      for (int c = 0; c < imageChannels; c++) {
        for (int z = 0; z < depth; z++) {
          int index = stackIndex(c, z, t);
          ImageProcessor ip = stack.getProcessor(index);
          if (ip == null || ip.getPixels() == null) {
            throw new BadInputException(
                "image "
                    + title
                    + ": plane "
                    + index
                    + " of time point "
                    + (t + 1)
                    + " cannot be read");
          }
          ImageFiles.copyPlane(ip.getPixels(), values, c, z * plane, plane);
        }
      }
    } catch (OutOfMemoryError e) {
      throw new BadInputException(
          "image "
              + title
              + ": time point "
              + (t + 1)
              + " does not fit in the heap; start Java with a larger -Xmx",
          e);
    }
    if (kind == PixelKind.FLOAT32) {
      ImageFiles.checkFinite(values, w, h, title + " (time point " + (t + 1) + ")");
    }
    return new Raster(w, h, depth, values, voxelSize, kind);
  }

  /** The stack plane (1-based) of channel {@code c}, z plane {@code z}, time point {@code t}. */
  int stackIndex(int c, int z, int t) {
    return decision.source() == TimeSource.SLICES_AS_FRAMES
        ? imp.getStackIndex(c + 1, t + 1, 1)
        : imp.getStackIndex(c + 1, z + 1, t + 1);
  }

  private void checkSourceUnchanged() {
    if (sourceSize < 0) {
      return;
    }
    boolean same;
    try {
      same =
          Files.size(source) == sourceSize
              && Files.getLastModifiedTime(source).equals(sourceModified);
    } catch (IOException e) {
      same = false;
    }
    if (!same) {
      throw new BadInputException(
          "image file " + source + " changed or disappeared since it was opened; open it again");
    }
  }

  /** Time between frames in {@link #timeUnit()}, or NaN when the image does not say. */
  @Override
  public double frameInterval() {
    return frameInterval;
  }

  /**
   * Unit of {@link #frameInterval()}: "s" for ImageJ's "sec", else ImageJ's; "frame" if unknown.
   */
  @Override
  public String timeUnit() {
    return timeUnit;
  }

  /**
   * Time point {@code t} with the image's description, for code that takes a {@link LoadedImage}.
   */
  public LoadedImage loadedFrame(int t) {
    return new LoadedImage(
        frame(t), source, title, channelNames, bitDepth(), imageType(), imp.isInvertedLut());
  }

  /** The first time point as a {@link LoadedImage}. */
  public LoadedImage firstFrame() {
    return loadedFrame(0);
  }

  /** The file read, or null for an image that did not come from a file. */
  public Path source() {
    return source;
  }

  public String title() {
    return title;
  }

  /** One name per raster channel where the image named them ("red", "green", "blue" for RGB). */
  public List<String> channelNames() {
    return channelNames;
  }

  /** ImageJ's bit depth: 8, 16, 24 (RGB) or 32. */
  public int bitDepth() {
    return imp.getBitDepth();
  }

  /** ImageJ's image type ({@code ImagePlus.GRAY8}, ...). */
  public int imageType() {
    return imp.getType();
  }

  /** True when an 8-bit image is shown with an inverting lookup table (values stay raw). */
  public boolean invertedLut() {
    return imp.isInvertedLut();
  }

  public int width() {
    return imp.getWidth();
  }

  public int height() {
    return imp.getHeight();
  }

  /** z planes per time point (1 when slices are read as frames). */
  public int depth() {
    return depth;
  }

  /** Channels of every frame's raster (3 for RGB). */
  public int channelCount() {
    return kind == PixelKind.RGB ? 3 : imageChannels;
  }

  public PixelKind kind() {
    return kind;
  }

  public VoxelSize voxelSize() {
    return voxelSize;
  }

  /** Which axis was read as time. */
  public TimeSource timeSource() {
    return decision.source();
  }

  /** One sentence: what was read as time and why. */
  public String reason() {
    return decision.reason();
  }

  /** Sentences for the user about doubtful readings (slices read as frames, ...); may be empty. */
  public List<String> warnings() {
    return decision.warnings();
  }

  /** Size, calibration and timing of the frames, for writing results over time. */
  public TimeLapseGeometry geometry() {
    return new TimeLapseGeometry(
        width(), height(), depth, frames, voxelSize, frameInterval, timeUnit);
  }

  @Override
  public String toString() {
    return String.format(
        Locale.ROOT,
        "%s: %d time point(s) of %d x %d x %d, %d channel(s), %s",
        title,
        frames,
        width(),
        height(),
        depth,
        channelCount(),
        kind);
  }
}
