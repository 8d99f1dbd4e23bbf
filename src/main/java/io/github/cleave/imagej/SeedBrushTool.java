package io.github.cleave.imagej;

import ij.Executer;
import ij.ImagePlus;
import ij.gui.ImageCanvas;
import ij.gui.PolygonRoi;
import ij.gui.Roi;
import ij.gui.Toolbar;
import ij.plugin.tool.PlugInTool;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.render.SeedColours;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.event.MouseEvent;
import java.util.Collections;
import java.util.IdentityHashMap;
import java.util.Map;

/**
 * The seed brush: a toolbar tool that paints strokes on images that have a seed brush session
 * ({@link BrushSession}). A drag paints a stroke of the panel's class and width; with Alt held it
 * paints the other class of foreground and background, and background when the panel's class is a
 * further class (3 and up: {@link PaintClasses#stroke}); in eraser mode it removes the strokes it
 * touches. Releasing the mouse hands the stroke to the session, which redraws and recuts. On an
 * image without a session the tool does nothing; on a time-lapse it paints only on the session's
 * time point ({@link BrushSession#canPaint}).
 *
 * <p>ImageJ keeps one tool per toolbar slot, so there is one instance ({@link #get()}), which knows
 * every image being painted. While any image is painted, ImageJ's Edit &gt; Undo (Ctrl+Z) on it
 * undoes strokes when this tool is selected ({@link BrushUndo}). Event-thread only, except {@link
 * #session} and {@link #isSelected}.
 */
final class SeedBrushTool extends PlugInTool {
  private static SeedBrushTool instance;

  // read by ImageJ's command thread too (BrushUndo)
  private final Map<ImagePlus, BrushSession> sessions =
      Collections.synchronizedMap(new IdentityHashMap<>());
  private final BrushUndo undo = new BrushUndo(this, SeedBrushTool::isSelected);
  private float[] xs = new float[64];
  private float[] ys = new float[64];
  private int count;
  private int label;
  private boolean erasing;

  static synchronized SeedBrushTool get() {
    if (instance == null) {
      instance = new SeedBrushTool();
    }
    return instance;
  }

  void attach(BrushSession s) {
    if (sessions.isEmpty()) {
      Executer.addCommandListener(undo);
    }
    sessions.put(s.imp, s);
  }

  /** Whether the seed brush is the tool selected in ImageJ's toolbar (false without a toolbar). */
  static boolean isSelected() {
    return instance != null && Toolbar.getPlugInTool() == instance;
  }

  /** The session painting {@code imp}, or null. */
  BrushSession session(ImagePlus imp) {
    return sessions.get(imp);
  }

  void detach(BrushSession s) {
    sessions.remove(s.imp);
    if (sessions.isEmpty()) {
      Executer.removeCommandListener(undo);
    }
  }

  @Override
  public String getToolName() {
    return "Cleave seed brush (Alt: foreground ↔ background; on classes 3+: background)";
  }

  @Override
  public String getToolIcon() {
    return "Ce90F0088C5beF8888"; // orange and sky blue squares (ImageJ tool icon codes)
  }

  @Override
  public void mousePressed(ImagePlus imp, MouseEvent e) {
    BrushSession s = sessions.get(imp);
    if (s == null) {
      return;
    }
    if (!s.canPaint()) { // another time point than the strokes' is shown: the status line says so
      count = 0;
      e.consume();
      return;
    }
    BrushSettings b = s.settings();
    erasing = b.erasing();
    label = erasing ? SeedLabels.FOREGROUND : PaintClasses.stroke(b.paint(), e.isAltDown());
    count = 0;
    add(imp, e);
    s.drawing(preview(s));
    e.consume();
  }

  @Override
  public void mouseDragged(ImagePlus imp, MouseEvent e) {
    BrushSession s = sessions.get(imp);
    if (s == null || count == 0) {
      return;
    }
    add(imp, e);
    s.drawing(preview(s));
    e.consume();
  }

  @Override
  public void mouseReleased(ImagePlus imp, MouseEvent e) {
    BrushSession s = sessions.get(imp);
    if (s == null || count == 0) {
      return;
    }
    SeedStrokes.Stroke stroke = stroke(s);
    count = 0;
    s.drawing(null);
    boolean changed;
    if (erasing) {
      changed = s.strokes.erase(stroke);
    } else {
      s.strokes.add(stroke);
      changed = true;
    }
    if (changed) {
      s.strokesChanged();
    }
    e.consume();
  }

  private void add(ImagePlus imp, MouseEvent e) {
    ImageCanvas c = imp.getCanvas();
    float x = (float) (c == null ? e.getX() : c.offScreenXD(e.getX()));
    float y = (float) (c == null ? e.getY() : c.offScreenYD(e.getY()));
    if (count == xs.length) {
      xs = java.util.Arrays.copyOf(xs, 2 * count);
      ys = java.util.Arrays.copyOf(ys, 2 * count);
    }
    xs[count] = x;
    ys[count] = y;
    count++;
  }

  private SeedStrokes.Stroke stroke(BrushSession s) {
    return new SeedStrokes.Stroke(
        java.util.Arrays.copyOf(xs, count),
        java.util.Arrays.copyOf(ys, count),
        s.settings().width(),
        label,
        s.plane());
  }

  private Roi preview(BrushSession s) {
    Roi r = stroke(s).toRoi(0, false);
    if (erasing) {
      r.setStrokeColor(Color.WHITE);
      r.setStroke(
          new BasicStroke(
              s.settings().width(),
              BasicStroke.CAP_ROUND,
              BasicStroke.JOIN_ROUND,
              10f,
              new float[] {4f, 4f},
              0f));
    } else {
      r.setStrokeColor(new Color(SeedColours.of(label)));
    }
    if (r instanceof PolygonRoi) {
      r.setName("stroke being drawn");
    }
    return r;
  }
}
