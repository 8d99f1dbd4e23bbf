package io.github.cleave.imagej;

import ij.gui.PolygonRoi;
import ij.gui.Roi;
import ij.process.ByteProcessor;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.render.SeedColours;
import java.awt.Color;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * The seed strokes painted on one image, with undo. A stroke is a polyline in image pixel
 * coordinates with a width, a class (1 foreground, 2 background, 3..{@value PaintClasses#MAX}
 * further classes) and the plane it was painted on (0-based). A base layer of seed labels (loaded
 * from a seed label image) lies under the strokes; strokes painted later win where they overlap it
 * and each other.
 *
 * <p>Every change (add, erase, clear, load) pushes the previous state, so {@link #undo()} restores
 * it. States are immutable lists, so a snapshot taken by the cutting thread stays valid. Not
 * thread-safe: the event thread owns an instance; the cutting thread sees {@link #labels} results.
 */
final class SeedStrokes {
  /** One stroke; immutable. */
  record Stroke(float[] xs, float[] ys, float width, int label, int plane) {
    /**
     * The stroke as an ImageJ line ROI in its class's palette colour, on its plane (1-based), named
     * by the seed ROI convention: {@code foreground-INDEX}, {@code background-INDEX}, {@code
     * classN-INDEX} for a further class N.
     */
    Roi toRoi(int index, boolean stack) {
      return toRoi(index, stack, false);
    }

    /** As {@link #toRoi(int, boolean)}, positioned by z (for hyperstacks) when {@code hyper}. */
    Roi toRoi(int index, boolean stack, boolean hyper) {
      // a click is a stroke of length 0: two equal points, drawn as a dot of the stroke's width
      float[] x = xs.length == 1 ? new float[] {xs[0], xs[0]} : xs.clone();
      float[] y = ys.length == 1 ? new float[] {ys[0], ys[0]} : ys.clone();
      PolygonRoi roi = new PolygonRoi(x, y, x.length, Roi.POLYLINE);
      roi.setStrokeWidth(width);
      roi.setStrokeColor(new Color(SeedColours.of(label)));
      roi.setName(String.format(Locale.ROOT, "%s-%d", PaintClasses.roiPrefix(label), index));
      if (hyper) {
        roi.setPosition(0, plane + 1, 0);
      } else if (stack) {
        roi.setPosition(plane + 1);
      }
      return roi;
    }
  }

  private final int width;
  private final int height;
  private final int depth;
  private List<Stroke> strokes = List.of();
  private byte[] base; // loaded seed labels, or null
  private final List<Object[]> history = new ArrayList<>(); // {strokes, base}
  // pixels covered by each stroke (strokes are immutable and compared by identity), any thread
  private final Map<Stroke, int[]> covered = new ConcurrentHashMap<>();

  SeedStrokes(int width, int height, int depth) {
    this.width = width;
    this.height = height;
    this.depth = depth;
  }

  List<Stroke> strokes() {
    return strokes;
  }

  /** The loaded seed labels under the strokes (every plane; do not modify), or null. */
  byte[] baseLayer() {
    return base;
  }

  boolean isEmpty() {
    return strokes.isEmpty() && base == null;
  }

  void add(Stroke s) {
    push();
    List<Stroke> next = new ArrayList<>(strokes);
    next.add(s);
    strokes = List.copyOf(next);
  }

  /** Removes every stroke that the eraser stroke {@code e} touches; true if any was removed. */
  boolean erase(Stroke e) {
    byte[] eraser = rasterise(e);
    List<Stroke> kept = new ArrayList<>();
    for (Stroke s : strokes) {
      boolean touched = false;
      if (s.plane() == e.plane()) {
        byte[] mine = rasterise(s);
        for (int i = 0; i < mine.length && !touched; i++) {
          touched = mine[i] != 0 && eraser[i] != 0;
        }
      }
      if (!touched) {
        kept.add(s);
      }
    }
    if (kept.size() == strokes.size()) {
      return false;
    }
    push();
    strokes = List.copyOf(kept);
    return true;
  }

  void clear() {
    push();
    strokes = List.of();
    base = null;
  }

  /** Replaces everything by loaded seed labels (a base layer) and no strokes. */
  void load(SeedLabels labels) {
    push();
    strokes = List.of();
    base = labels.labels().clone();
  }

  /** Restores the state before the last change; false if there is none. */
  boolean undo() {
    if (history.isEmpty()) {
      return false;
    }
    Object[] last = history.remove(history.size() - 1);
    @SuppressWarnings("unchecked")
    List<Stroke> s = (List<Stroke>) last[0];
    strokes = s;
    base = (byte[]) last[1];
    return true;
  }

  private void push() {
    history.add(new Object[] {strokes, base});
    if (history.size() > 200) {
      history.remove(0);
    }
  }

  /** The present strokes and base layer, immutable, for another thread. */
  Snapshot snapshot() {
    return new Snapshot(strokes, base);
  }

  /** A state of the strokes; {@link #labels()} may run on any thread. */
  final class Snapshot {
    private final List<Stroke> list;
    private final byte[] layer;

    private Snapshot(List<Stroke> list, byte[] layer) {
      this.list = list;
      this.layer = layer;
    }

    SeedLabels labels() {
      return labelsOf(list, layer);
    }
  }

  /** The seed labels of every plane: the base layer, then the strokes in order. */
  SeedLabels labels() {
    return labelsOf(strokes, base);
  }

  private SeedLabels labelsOf(List<Stroke> strokes, byte[] base) {
    int plane = width * height;
    byte[] out = base == null ? new byte[plane * depth] : base.clone();
    for (Stroke s : strokes) {
      paint(s, out, s.plane() * plane, (byte) s.label());
    }
    return new SeedLabels(width, height, depth, out);
  }

  /**
   * Paints a stroke into {@code out} (its plane at {@code offset}). The pixels a stroke covers are
   * drawn once, on the whole plane as {@link #rasterise} draws them, and kept as a list of pixel
   * indices, so that the labels of many strokes cost little more than copying a plane.
   */
  private void paint(Stroke s, byte[] out, int offset, byte label) {
    int[] pixels = covered.computeIfAbsent(s, this::coveredPixels);
    for (int i : pixels) {
      out[offset + i] = label;
    }
  }

  private int[] coveredPixels(Stroke s) {
    byte[] drawn = rasterise(s);
    int n = 0;
    for (byte b : drawn) {
      n += b != 0 ? 1 : 0;
    }
    int[] pixels = new int[n];
    int k = 0;
    for (int i = 0; i < drawn.length; i++) {
      if (drawn[i] != 0) {
        pixels[k++] = i;
      }
    }
    return pixels;
  }

  /**
   * Draws a stroke on its plane with ImageJ's line drawing, as a seed ROI zip holding it is drawn
   * ({@code SeedFiles}): a line of its stroke width.
   */
  private byte[] rasterise(Stroke s) {
    ByteProcessor ip = new ByteProcessor(width, height);
    ip.setColor(255);
    ip.setLineWidth(Math.max(1, Math.round(s.width())));
    s.toRoi(0, false).drawPixels(ip);
    return (byte[]) ip.getPixels();
  }
}
