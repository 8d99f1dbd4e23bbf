package io.github.cleave.io;

import ij.ImagePlus;
import ij.ImageStack;
import ij.io.FileInfo;
import ij.measure.Calibration;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.VoxelSize;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.LongUnaryOperator;

/**
 * Opens images as time-lapses ({@link OpenedSeries}, a {@link io.github.cleave.image.FrameSeries})
 * without reading every time point: from a file ({@link #openSeries}) or from an image already open
 * in ImageJ ({@link #of}), possibly a virtual stack.
 *
 * <p>Order: planes are addressed as ImageJ orders a hyperstack, channels fastest, then slices, then
 * frames ("CZT"): channel c, slice z, frame t (1-based) is stack plane {@code
 * ImagePlus.getStackIndex(c, z, t) = c + (z - 1) * C + (t - 1) * C * Z} (ImageJ API documentation,
 * {@code ij.ImagePlus.getStackIndex}). A time point is a raster of all C channels (three for RGB)
 * and all Z planes of that frame, converted as {@link ImageFiles} converts an image (raw values,
 * same pixel kinds, same calibration to voxel size).
 *
 * <p>Which axis is time: an image with frames (T above 1) is a time-lapse of those frames. An image
 * of one frame and several slices is decided by {@link TimeAxis}: {@link TimeAxis#AUTO} reads the
 * slices as time points (each one plane) when the calibration has a frame interval and no z spacing
 * or a description naming a time-lapse, and otherwise as one volume, with a warning when the image
 * hints at time (the rule in full: {@link TimeAxisDecision}). {@link OpenedSeries#reason()} and
 * {@link OpenedSeries#warnings()} say what was decided; a detected time-lapse is never cut silently
 * as one volume.
 *
 * <p>Files: a TIFF is opened virtually ({@link VirtualTiffs}, over ImageJ's {@code
 * FileInfoVirtualStack}): its header is checked as {@link ImageFiles} checks it (exists, decodable,
 * not truncated), then only the first plane is read, and {@link OpenedSeries#frame(int)} reads the
 * C·Z planes of its time point. A PNG or a zipped TIFF is read whole. The memory check ({@link
 * MemoryEstimate}) is made for one time point, not for the whole file, before any time point is
 * read. Refused as by {@link ImageFiles}: 8-bit indexed colour, RGB with several channels, bit
 * depths other than 8, 16, 24 and 32, frames of more than {@code Integer.MAX_VALUE - 64} voxels.
 *
 * <p>Stateless; the series returned are not thread-safe (see {@link OpenedSeries}).
 */
public final class Hyperstacks {
  private Hyperstacks() {}

  /**
   * Whether {@code file} may hold more than one time point, from its header alone: false for a PNG
   * and for a TIFF of one plane, true otherwise (a stack may be a time-lapse or hold slices that
   * {@link TimeAxis} reads as time points; a zip or an unreadable header cannot tell). Lets a
   * folder run open single planes the plain way ({@link ImageFiles}) without opening them twice.
   */
  public static boolean mayHoldTime(Path file) {
    String lower = file.getFileName().toString().toLowerCase(Locale.ROOT);
    if (lower.endsWith(".png")) {
      return false;
    }
    if (lower.endsWith(".tif") || lower.endsWith(".tiff")) {
      try {
        FileInfo[] infos = ij.io.Opener.getTiffFileInfo(file.toAbsolutePath().toString());
        if (infos != null && infos.length == 1 && infos[0].nImages <= 1) {
          return false;
        }
      } catch (RuntimeException | LinkageError e) {
        return true; // the reader that opens it says what is wrong
      }
    }
    return true;
  }

  /**
   * Opens {@code file} as a time-lapse, reading no time point yet.
   *
   * @throws BadInputException if the file cannot be used (see the class comment), or one time point
   *     does not fit in the free heap
   */
  public static OpenedSeries openSeries(Path file, TimeAxis axis) {
    return openSeries(file, axis, MemoryEstimate::availableFor);
  }

  /** As {@link #openSeries(Path, TimeAxis)}, with the free heap given for a need (for tests). */
  static OpenedSeries openSeries(Path file, TimeAxis axis, LongUnaryOperator available) {
    ImagePlus imp = ImageOpening.openForSeries(file, "image");
    String title = file.getFileName().toString();
    OpenedSeries series = build(imp, axis, title, file, true);
    long needed = bytesPerTimePoint(series);
    MemoryEstimate.check(
        file.toString(),
        String.format(
            Locale.ROOT,
            "%d x %d x %d planes per time point",
            series.width(),
            series.height(),
            (long) imp.getNChannels() * series.depth()),
        needed,
        available.applyAsLong(needed));
    return series;
  }

  /**
   * The time-lapse of an image already open in ImageJ (for the plugin); planes are read through
   * {@code imp.getStack().getProcessor(index)} when a time point is asked for, so a virtual stack
   * reads only that time point's planes. The source is the image's original file if ImageJ knows
   * it. No memory check: the image is open already.
   *
   * @throws BadInputException for the images refused by {@link #openSeries}
   */
  public static OpenedSeries of(ImagePlus imp, TimeAxis axis) {
    String title = imp.getTitle() == null || imp.getTitle().isBlank() ? "image" : imp.getTitle();
    FileInfo original = imp.getOriginalFileInfo();
    Path source = null;
    if (original != null && original.directory != null && original.fileName != null) {
      source = Path.of(original.directory, original.fileName);
    }
    return build(imp, axis, title, source, false);
  }

  private static OpenedSeries build(
      ImagePlus imp, TimeAxis axis, String title, Path source, boolean watchSource) {
    if (axis == null) {
      throw new IllegalArgumentException("time axis must not be null; use TimeAxis.AUTO");
    }
    String name = source != null ? source.toString() : title;
    ImageFiles.checkPixelKind(imp, name);
    int bitDepth = imp.getBitDepth();
    int channels = imp.getNChannels();
    PixelKind kind = ImageFiles.kindOf(bitDepth, name);
    Calibration cal = imp.getCalibration();
    TimeAxisDecision decision =
        TimeAxisDecision.decide(
            axis,
            name,
            imp.getNSlices(),
            imp.getNFrames(),
            cal.frameInterval,
            cal.getTimeUnit(),
            cal.pixelDepth,
            description(imp));
    boolean slicesAreFrames = decision.source() == OpenedSeries.TimeSource.SLICES_AS_FRAMES;
    long depth = slicesAreFrames ? 1 : imp.getNSlices();
    long voxels = (long) imp.getWidth() * imp.getHeight() * depth;
    if (voxels > Integer.MAX_VALUE - 64) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "image %s has %d voxels per time point (%d x %d x %d); at most %d are supported,"
                  + " crop or bin it",
              name,
              voxels,
              imp.getWidth(),
              imp.getHeight(),
              depth,
              Integer.MAX_VALUE - 64));
    }
    VoxelSize size = ImageFiles.voxelSize(cal);
    if (slicesAreFrames && !size.assumed()) {
      size = new VoxelSize(size.x(), size.y(), 1, size.unit(), false);
    }
    double interval = Double.NaN;
    String unit = "frame";
    if (decision.source() != OpenedSeries.TimeSource.NONE
        && cal.frameInterval > 0
        && cal.frameInterval < Double.MAX_VALUE) {
      interval = cal.frameInterval;
      unit = timeUnit(cal.getTimeUnit());
    }
    String imageTitle = imp.getTitle() == null || imp.getTitle().isBlank() ? title : imp.getTitle();
    return new OpenedSeries(
        imp,
        source,
        watchSource,
        imageTitle,
        channelNames(imp, kind),
        kind,
        size,
        decision,
        interval,
        unit);
  }

  /** ImageJ's time unit as the project writes it: "s" for ImageJ's default "sec". */
  static String timeUnit(String imageJUnit) {
    if (imageJUnit == null || imageJUnit.isBlank()) {
      return "frame";
    }
    String u = imageJUnit.strip();
    return u.equals("sec") || u.equals("second") || u.equals("seconds") ? "s" : u;
  }

  /** The file's description and the image's info text, for the time-lapse hints. */
  private static String description(ImagePlus imp) {
    StringBuilder sb = new StringBuilder();
    FileInfo fi = imp.getOriginalFileInfo();
    if (fi != null && fi.description != null) {
      sb.append(fi.description).append('\n');
    }
    String info = imp.getInfoProperty();
    if (info != null) {
      sb.append(info);
    }
    return sb.toString();
  }

  private static List<String> channelNames(ImagePlus imp, PixelKind kind) {
    if (kind == PixelKind.RGB) {
      return List.of("red", "green", "blue");
    }
    int channels = imp.getNChannels();
    if (channels < 2) {
      return List.of();
    }
    ImageStack stack = imp.getStack();
    List<String> names = new ArrayList<>();
    boolean anyName = false;
    for (int c = 0; c < channels; c++) {
      String label = stack.getShortSliceLabel(imp.getStackIndex(c + 1, 1, 1));
      anyName |= label != null && !label.isBlank();
      names.add(label == null ? "" : label.strip());
    }
    return anyName ? names : List.of();
  }

  /** {@link MemoryEstimate} for one time point of {@code series}. */
  /**
   * The heap a segmentation of {@code series} time point by time point needs: one time point's work
   * ({@link MemoryEstimate}) plus the results of every time point kept until they are written
   * (mask, class map, label image and tracked labels: about 16 bytes per voxel, with the file
   * buffers).
   */
  public static long estimateHeapBytes(OpenedSeries series) {
    long voxels = (long) series.width() * series.height() * series.depth();
    return bytesPerTimePoint(series) + 16L * voxels * series.frameCount();
  }

  static long bytesPerTimePoint(OpenedSeries series) {
    int bitDepth = series.bitDepth();
    int bytesPerPixel = bitDepth == 8 ? 1 : bitDepth == 16 ? 2 : 4;
    int imageChannels = series.kind() == PixelKind.RGB ? 1 : series.channelCount();
    return MemoryEstimate.bytesNeeded(
        series.width(),
        series.height(),
        (long) imageChannels * series.depth(),
        imageChannels,
        bytesPerPixel,
        series.kind() == PixelKind.RGB ? 3 : 1);
  }
}
