package io.github.cleave.imagej;

import ij.IJ;
import ij.ImagePlus;
import ij.gui.Roi;
import io.github.cleave.io.Hyperstacks;
import io.github.cleave.io.ImageFiles;
import io.github.cleave.io.LoadedImage;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.io.TimeAxis;
import java.awt.EventQueue;
import java.util.List;
import java.util.Locale;
import java.util.function.Consumer;

/**
 * The time point a brush session works on, and the map between the image's display position and the
 * session's planes.
 *
 * <p>An image with several time points (ImageJ's frames, or slices that {@link TimeAxis#AUTO} reads
 * as time points: {@link Hyperstacks#of}) is painted on <b>one</b> time point: the one shown when
 * the session starts. Its raster ({@link #image()}) is that time point's channels and z planes,
 * read once; strokes, the live preview and contours belong to it, and their overlay ROIs carry the
 * hyperstack position of their plane and that time point ({@link #position}), so ImageJ draws them
 * only there. An image of one time point is read as before ({@link ImageFiles#fromImagePlus}) and
 * its ROIs are positioned as before (by z plane in a stack).
 *
 * <p>Display to plane: in a hyperstack ImageJ's own position ({@code getZ()}, {@code getT()}); in
 * other stacks the current stack plane through {@code convertIndexToPosition}. When slices are time
 * points, a time point is one plane and the slice shown is the time point. Immutable apart from the
 * image it reads; any thread.
 */
final class BrushTime {
  private final ImagePlus imp;
  private final OpenedSeries.TimeSource source;
  private final int time;
  private final int frames;
  private final int depth;
  private final List<String> notes;
  private final LoadedImage image;

  private BrushTime(
      ImagePlus imp,
      OpenedSeries.TimeSource source,
      int time,
      int frames,
      int depth,
      List<String> notes,
      LoadedImage image) {
    this.imp = imp;
    this.source = source;
    this.time = time;
    this.frames = frames;
    this.depth = depth;
    this.notes = List.copyOf(notes);
    this.image = image;
  }

  /**
   * The session's time point of {@code imp}: the one shown now when the image has several, read
   * now.
   *
   * @throws io.github.cleave.image.BadInputException if the image cannot be read
   */
  static BrushTime of(ImagePlus imp) {
    if (imp.getStackSize() > 1) {
      OpenedSeries series = Hyperstacks.of(imp, TimeAxis.AUTO);
      if (series.frameCount() > 1) {
        int t = shownTime(imp, series.timeSource(), series.frameCount());
        return new BrushTime(
            imp,
            series.timeSource(),
            t,
            series.frameCount(),
            series.depth(),
            TimeLapseRun.notes(series),
            series.loadedFrame(t));
      }
    }
    return new BrushTime(
        imp,
        OpenedSeries.TimeSource.NONE,
        0,
        1,
        imp.getNSlices(),
        List.of(),
        ImageFiles.fromImagePlus(imp, imp.getTitle()));
  }

  /** Whether the image has several time points (the session works on one of them). */
  boolean isTimeLapse() {
    return frames > 1;
  }

  /** The session's time point, 0-based (0 for an image of one time point). */
  int time() {
    return time;
  }

  /** The image's time points (1 for an image of one time point). */
  int frameCount() {
    return frames;
  }

  /** The z planes of one time point. */
  int depth() {
    return depth;
  }

  /** How the image's time points were decided, then the warnings; empty for one time point. */
  List<String> notes() {
    return notes;
  }

  /** The session's time point as a loaded image (all channels, its z planes). */
  LoadedImage image() {
    return image;
  }

  /** The z plane shown (0-based, within a time point). */
  int shownPlane() {
    if (!isTimeLapse()) {
      return imp.getNSlices() > 1 ? imp.getZ() - 1 : 0;
    }
    if (source == OpenedSeries.TimeSource.SLICES_AS_FRAMES || depth == 1) {
      return 0;
    }
    return Math.min(depth, Math.max(1, czt(imp)[1])) - 1;
  }

  /** The time point shown, 0-based. */
  int shownTime() {
    return isTimeLapse() ? shownTime(imp, source, frames) : 0;
  }

  /** Whether the image shows the session's time point. */
  boolean showsSessionTime() {
    return shownTime() == time;
  }

  private static int shownTime(ImagePlus imp, OpenedSeries.TimeSource source, int frames) {
    int[] czt = czt(imp);
    int t = source == OpenedSeries.TimeSource.SLICES_AS_FRAMES ? czt[1] : czt[2];
    return Math.min(frames, Math.max(1, t)) - 1;
  }

  /** ImageJ's channel, slice and frame shown, 1-based. */
  private static int[] czt(ImagePlus imp) {
    if (imp.isHyperStack()) {
      return new int[] {imp.getC(), imp.getZ(), imp.getT()};
    }
    return imp.convertIndexToPosition(imp.getCurrentSlice());
  }

  /** Puts an overlay ROI on z plane {@code z} (0-based) of the session's time point. */
  void position(Roi r, int z) {
    if (!isTimeLapse()) {
      CutContour.position(r, imp, z);
      return;
    }
    boolean slicesAreTime = source == OpenedSeries.TimeSource.SLICES_AS_FRAMES;
    int slice = slicesAreTime ? time + 1 : z + 1;
    int frame = slicesAreTime ? 1 : time + 1;
    if (imp.isHyperStack()) {
      r.setPosition(0, slice, slicesAreTime ? 0 : frame);
    } else {
      r.setPosition(imp.getStackIndex(1, slice, frame));
    }
  }

  /**
   * Puts a saved seed ROI on z plane {@code z} (0-based) of the session's time point, as a ROI zip
   * holds it: its time point as T position (read back by {@link TimeSeeds#fromRois}), its z plane
   * as Z position when a time point has several planes (else none, which {@link TimeSeeds} would
   * read as the time point when slices are time points).
   */
  void positionForFile(Roi r, int z) {
    r.setPosition(0, depth > 1 ? z + 1 : 0, time + 1);
  }

  /** "time point 2 of 4", 1-based. */
  String where() {
    return String.format(Locale.ROOT, "time point %d of %d", time + 1, frames);
  }

  /** The status line while another time point is shown. */
  String away() {
    return String.format(
        Locale.ROOT,
        "strokes and preview are on time point %d (time point %d shown); go back to time point %d"
            + " to paint",
        time + 1,
        shownTime() + 1,
        time + 1);
  }

  /** A status line of the session's time point: {@code line} there, {@link #away()} elsewhere. */
  String statusLine(String line) {
    return showsSessionTime() ? line + " · " + where() : away();
  }

  /**
   * On a time-lapse: logs how time was decided and, once the caller's event has finished (the panel
   * is there then), puts {@link #started()} in the status line. Nothing for one time point.
   */
  void announce(Consumer<String> status) {
    if (isTimeLapse()) {
      notes.forEach(n -> IJ.log("Cleave: " + SeedBrushCommand.TITLE + ": " + n));
      EventQueue.invokeLater(() -> status.accept(started()));
    }
  }

  /** The status line when the session starts on a time-lapse. */
  String started() {
    return String.format(
        Locale.ROOT,
        "%d time points (%s): the brush paints %s; Create mask segments every time point",
        frames,
        source == OpenedSeries.TimeSource.SLICES_AS_FRAMES
            ? "slices read as time points"
            : "frames",
        where());
  }
}
