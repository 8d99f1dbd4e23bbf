package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.gui.Overlay;
import ij.gui.Roi;
import java.util.List;

/**
 * The overlay of a brush session, drawn bottom to top: the image's own overlay, the loaded seeds
 * ({@link LoadedSeeds}), the strokes in the order painted, the stroke being drawn, and the live
 * preview's contours ({@link CutContour}). The contours and the loaded seeds of a plane are traced
 * once and kept until the preview, the loaded seeds or the plane change, so a stroke being drawn
 * redraws cheaply. On a time-lapse every ROI of the session is put on its plane of the session's
 * time point ({@link BrushTime#position}), so ImageJ shows it there only. Event-thread only.
 */
final class BrushOverlay {
  /**
   * A preview to show.
   *
   * @param data a foreground mask (255 / 0) when {@code classCount} is 2, else a class map (1..K)
   * @param plane the plane {@code data} covers (0-based), or -1 for the volume
   * @param classCount the number of classes K
   */
  record Preview(byte[] data, int plane, int classCount) {
    /** Whether this is the two-class preview (a mask), not a class map. */
    boolean twoClass() {
      return classCount == 2;
    }
  }

  private final ImagePlus imp;
  private final Overlay original; // the image's own overlay, or null
  private final BrushTime time;
  private Preview traced; // the preview whose contours are kept
  private int tracedPlane = -2;
  private List<Roi> contours = List.of();
  private byte[] seedsTraced; // the loaded seeds whose areas are kept
  private int seedsPlane = -2;
  private List<Roi> seedAreas = List.of();

  BrushOverlay(ImagePlus imp, Overlay original, BrushTime time) {
    this.imp = imp;
    this.original = original;
    this.time = time;
  }

  /**
   * The overlay for plane {@code z} (0-based).
   *
   * @param strokes the strokes, in the order painted
   * @param base the loaded seeds of every plane, or null
   * @param drawing the stroke being drawn, or null
   * @param preview the last preview, or null
   */
  Overlay build(
      List<SeedStrokes.Stroke> strokes, byte[] base, Roi drawing, Preview preview, int z) {
    Overlay ov = new Overlay();
    if (original != null) {
      for (Roi r : original.toArray()) {
        ov.add(r);
      }
    }
    if (base != seedsTraced || z != seedsPlane) {
      seedAreas = onTime(LoadedSeeds.rois(base, imp, z), z);
      seedsTraced = base;
      seedsPlane = z;
    }
    seedAreas.forEach(ov::add);
    boolean stack = imp.getStackSize() > 1;
    boolean hyper = imp.isHyperStack();
    for (int i = 0; i < strokes.size(); i++) {
      SeedStrokes.Stroke s = strokes.get(i);
      Roi r = s.toRoi(i + 1, stack, hyper);
      if (time.isTimeLapse()) {
        time.position(r, s.plane());
      }
      ov.add(r);
    }
    if (drawing != null) {
      ov.add(drawing);
    }
    if (preview != traced || z != tracedPlane) { // strokes being drawn leave the cut as it is
      contours = onTime(contours(preview, z), z);
      traced = preview;
      tracedPlane = z;
    }
    contours.forEach(ov::add);
    return ov;
  }

  /** The ROIs of plane {@code z}, put on the session's time point of a time-lapse. */
  private List<Roi> onTime(List<Roi> rois, int z) {
    if (time.isTimeLapse()) {
      rois.forEach(r -> time.position(r, z));
    }
    return rois;
  }

  private List<Roi> contours(Preview p, int z) {
    if (p == null) {
      return List.of();
    }
    if (p.twoClass()) {
      Roi r = CutContour.of(p.data(), p.plane(), imp, z);
      return r == null ? List.of() : List.of(r);
    }
    return CutContour.ofClasses(p.data(), p.plane(), imp, z, p.classCount());
  }
}
