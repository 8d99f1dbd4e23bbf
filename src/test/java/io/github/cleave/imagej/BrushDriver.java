package io.github.cleave.imagej;

import ij.IJ;
import ij.ImageJ;
import ij.ImagePlus;
import ij.WindowManager;
import ij.gui.ImageCanvas;
import io.github.cleave.quality.Agreement;
import java.awt.Button;
import java.awt.Component;
import java.awt.Container;
import java.awt.EventQueue;
import java.awt.Frame;
import java.awt.Label;
import java.awt.Point;
import java.awt.Rectangle;
import java.awt.Robot;
import java.awt.Scrollbar;
import java.awt.TextField;
import java.awt.Toolkit;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Properties;
import java.util.function.BooleanSupplier;
import javax.imageio.ImageIO;

/**
 * Drives the seed brush in a real ImageJ as a user would, in a child JVM of {@link
 * SeedBrushGuiTest} (so that ImageJ's static state and preferences stay out of the test JVM): types
 * the brush width into the panel's field, paints one foreground stroke and, with Alt held, one
 * background stroke along the sample's own seed strokes ({@link StrokePlan}; their planned and
 * painted lengths go to standard output), waits for the live cut, presses "Create mask", then
 * clicks the boundary penalty slider's track and waits for the new cut; finally paints a third
 * stroke and presses Ctrl+Z on the image window (ImageJ's Edit &gt; Undo, which the brush takes
 * over), then chooses class 3 in the panel and paints a stroke beside the background stroke, and
 * waits for the three-class preview. Every mouse move, click and key press goes through the {@code
 * xdotool} program on this JVM's display ({@link Xdo}); java.awt.Robot only takes the screenshots
 * and waits for the event queue to drain after a window is raised. Writes what it saw to {@code
 * OUT/result.properties} and screenshots to {@code OUT}; exits 0 when the scenario ran (the test
 * judges the values).
 */
public final class BrushDriver {
  static final Path SAMPLES = Path.of("sample-images");

  private BrushDriver() {}

  public static void main(String[] args) {
    try {
      run(Path.of(args[0]));
    } catch (Throwable t) {
      t.printStackTrace();
      Runtime.getRuntime().halt(1); // the window threads would keep the JVM alive
    }
  }

  private static void run(Path dir) throws Exception {
    Path shots = Files.createDirectories(dir);
    Properties result = new Properties();
    ImageJ ij = new ImageJ();
    ImagePlus imp = IJ.openImage(SAMPLES.resolve("nuclei.tif").toString());
    imp.show();
    waitFor(() -> imp.getWindow() != null && imp.getCanvas().isShowing(), 20_000, "image window");
    WindowManager.setCurrentWindow(imp.getWindow());
    new CommandGate().run("SeedBrushCommand");
    BrushSession session = SeedBrushTool.get().session(imp);
    BrushPanel panel = panel();
    Robot robot = new Robot(); // screenshots and waiting for the event queue only: no input
    // No window manager under Xvfb: keep ImageJ's own window clear of the panel, and raise the
    // panel before every click (a Log or Results window may open over it).
    place(robot, panel, 0, 0);
    place(robot, imp.getWindow(), panel.getWidth() + 10, 0);
    place(robot, ij, 0, panel.getHeight() + 300);
    Thread.sleep(500);

    StrokePlan plan =
        StrokePlan.of(SAMPLES.resolve("nuclei.seeds.tif"), SAMPLES.resolve("nuclei.truth.tif"));
    // the width as a user sets it, in the panel's field, so that the screenshots show it
    TextField width = field(panel, "Brush width (pixels)");
    EventQueue.invokeAndWait(() -> width.setText("3"));
    waitFor(() -> session.settings().width() == 3, 10_000, "brush width 3 from the panel's field");
    result.setProperty("widthField", width.getText());
    result.setProperty("width", "" + session.settings().width());
    drag(robot, imp, plan.foreground(), false);
    drag(robot, imp, plan.background(), true); // Alt: the other class than the panel's
    waitFor(() -> session.strokes.strokes().size() == 2, 10_000, "two strokes");
    ImagePlus truth = IJ.openImage(SAMPLES.resolve("nuclei.truth.tif").toString());
    byte[] truthPixels = (byte[]) truth.getProcessor().getPixels();
    String[] names = {"foreground", "background"};
    StrokePlan.Polyline[] planned = {plan.foreground(), plan.background()};
    for (int k = 0; k < 2; k++) {
      SeedStrokes.Stroke painted = session.strokes.strokes().get(k);
      result.setProperty("stroke" + (k + 1), "" + painted.label());
      result.setProperty(
          names[k] + "Planned", String.format(Locale.ROOT, "%.1f", planned[k].length()));
      result.setProperty(names[k] + "Painted", String.format(Locale.ROOT, "%.1f", length(painted)));
      System.out.printf(
          Locale.ROOT,
          "%s stroke: %d points, %.1f px planned; painted %d points, %.1f px%n",
          names[k],
          planned[k].size(),
          planned[k].length(),
          painted.xs().length,
          length(painted));
    }
    byte[][] labels = new byte[1][];
    EventQueue.invokeAndWait(() -> labels[0] = session.strokes.labels().labels());
    result.setProperty("strayForeground", "" + stray(labels[0], truthPixels, 1));
    result.setProperty("strayBackground", "" + stray(labels[0], truthPixels, 2));
    waitFor(
        () -> session.lastMask() != null && panel.statusText().contains("re-learned"),
        30_000,
        "live cut after re-learning");
    byte[] before = session.lastMask();
    result.setProperty("status", panel.statusText());
    save(robot, shots.resolve("brush-contour.png"));

    Button create = button(panel, "Create mask");
    for (int attempt = 0; WindowManager.getImage("nuclei.mask") == null; attempt++) {
      if (attempt == 3) {
        save(robot, shots.resolve("brush-no-mask.png"));
        StringBuilder frames = new StringBuilder();
        for (Frame f : Frame.getFrames()) {
          frames.append(f.isShowing() ? " [" + f.getTitle() + " at " + f.getBounds() + "]" : "");
        }
        throw new AssertionError(
            "timed out waiting for mask window after three clicks on "
                + create.getLocationOnScreen()
                + "; status: "
                + panel.statusText()
                + "; windows:"
                + frames);
      }
      clickOnTop(robot, panel, create);
      holds(() -> WindowManager.getImage("nuclei.mask") != null, 60_000);
    }
    ImagePlus mask = WindowManager.getImage("nuclei.mask");
    result.setProperty(
        "dice", "" + Agreement.dice((byte[]) mask.getProcessor().getPixels(), truthPixels));
    result.setProperty("info", (String) mask.getProperty("Info"));
    mask.changes = false;
    mask.close();

    Scrollbar slider = slider(panel);
    int start = slider.getValue();
    for (int i = 0; i < 8 || slider.getValue() <= start && i < 40; i++) {
      EventQueue.invokeAndWait(panel::toFront);
      robot.waitForIdle();
      clickTrackRight(robot, slider);
    }
    waitFor(() -> slider.getValue() > start, 10_000, "slider moved");
    // The mask shown must change with the penalty; the status line may already tell of a later
    // request (another repaint or image event re-cuts the same settings: a no-op re-solve).
    waitFor(
        () -> session.lastMask() != null && !java.util.Arrays.equals(session.lastMask(), before),
        30_000,
        "cut after the slider (status: " + panel.statusText() + ")");
    byte[] after = session.lastMask();
    result.setProperty("sliderFrom", "" + start);
    result.setProperty("sliderTo", "" + slider.getValue());
    result.setProperty("changed", "" + !java.util.Arrays.equals(before, after));
    result.setProperty("boundaryBefore", "" + boundaryPairs(before, 512, 512));
    result.setProperty("boundaryAfter", "" + boundaryPairs(after, 512, 512));
    save(robot, shots.resolve("brush-after-slider.png"));

    // Ctrl+Z on the image window: ImageJ's Edit > Undo, routed to the strokes
    result.setProperty("brushSelected", "" + SeedBrushTool.isSelected());
    drag(robot, imp, plan.foreground(), false);
    waitFor(() -> session.strokes.strokes().size() == 3, 10_000, "third stroke");
    for (int attempt = 0; attempt < 3 && session.strokes.strokes().size() == 3; attempt++) {
      EventQueue.invokeAndWait(() -> imp.getWindow().toFront());
      EventQueue.invokeAndWait(() -> imp.getCanvas().requestFocus());
      robot.waitForIdle();
      Xdo.key("ctrl+z");
      holds(() -> session.strokes.strokes().size() != 3, 5_000);
    }
    holds(() -> overlayStrokes(imp) == 2, 5_000); // the redraw runs on the event thread
    result.setProperty("strokesAfterUndo", "" + session.strokes.strokes().size());
    result.setProperty("overlayStrokesAfterUndo", "" + overlayStrokes(imp));

    // a third class: chosen in the panel, painted beside the background stroke
    EventQueue.invokeAndWait(() -> panel.choosePaint(3));
    drag(robot, imp, beside(plan.background(), 6, imp.getWidth()), false);
    waitFor(() -> session.strokes.strokes().size() == 3, 10_000, "class-3 stroke");
    result.setProperty("stroke3", "" + session.strokes.strokes().get(2).label());
    waitFor(
        () -> session.lastClasses() != null && panel.statusText().startsWith("3 classes"),
        60_000,
        "three-class preview (status: " + panel.statusText() + ")");
    result.setProperty("classesStatus", panel.statusText());
    holds(() -> overlayNamed(imp, "cut-class3"), 5_000);
    result.setProperty("classContour", "" + overlayNamed(imp, "cut-class3"));
    save(robot, shots.resolve("brush-classes.png"));
    EventQueue.invokeAndWait(panel::dispose);
    result.setProperty("overlayRestored", "" + (imp.getOverlay() == null));
    try (var out = Files.newOutputStream(shots.resolve("result.properties"))) {
      result.store(out, "seed brush scenario");
    }
    Runtime.getRuntime().halt(0); // no quit: ImageJ would save its preferences
  }

  /** Whether the image's overlay holds a ROI of this name. */
  private static boolean overlayNamed(ImagePlus imp, String name) {
    ij.gui.Overlay ov = imp.getOverlay();
    return ov != null
        && java.util.Arrays.stream(ov.toArray()).anyMatch(r -> name.equals(r.getName()));
  }

  /**
   * The polyline moved {@code dx} pixels to the right, or to the left if it would leave the image.
   */
  private static StrokePlan.Polyline beside(StrokePlan.Polyline line, int dx, int width) {
    int max = java.util.Arrays.stream(line.xs()).max().orElse(0);
    int shift = max + dx < width ? dx : -dx;
    return new StrokePlan.Polyline(
        java.util.Arrays.stream(line.xs()).map(x -> x + shift).toArray(), line.ys().clone());
  }

  /** The stroke ROIs in the image's overlay. */
  private static long overlayStrokes(ImagePlus imp) {
    ij.gui.Overlay ov = imp.getOverlay();
    return ov == null
        ? 0
        : java.util.Arrays.stream(ov.toArray())
            .filter(r -> r.getName() != null && r.getName().matches("(fore|back)ground-\\d+"))
            .count();
  }

  /**
   * Paints the polyline of image pixels as one drag on the canvas, Alt held if asked: each point
   * goes to the screen pixel that shows the image pixel's centre, so the pointer is over that
   * pixel.
   */
  private static void drag(Robot robot, ImagePlus imp, StrokePlan.Polyline line, boolean alt)
      throws Exception {
    EventQueue.invokeAndWait(() -> imp.getWindow().toFront());
    robot.waitForIdle();
    ImageCanvas c = imp.getCanvas();
    Point o = c.getLocationOnScreen();
    double mag = c.getMagnification();
    Rectangle src = c.getSrcRect();
    int[] xs = new int[line.size()];
    int[] ys = new int[line.size()];
    for (int i = 0; i < xs.length; i++) {
      xs[i] = o.x + (int) Math.floor((line.xs()[i] + 0.5 - src.x) * mag);
      ys[i] = o.y + (int) Math.floor((line.ys()[i] + 0.5 - src.y) * mag);
    }
    Xdo.drag(xs, ys, alt);
    robot.waitForIdle();
  }

  /** The length of a painted stroke's polyline, in image pixels. */
  static double length(SeedStrokes.Stroke s) {
    double l = 0;
    for (int i = 1; i < s.xs().length; i++) {
      l += Math.hypot(s.xs()[i] - s.xs()[i - 1], s.ys()[i] - s.ys()[i - 1]);
    }
    return l;
  }

  /** Pixels of seed {@code label} on the other class of the truth (255 foreground). */
  static long stray(byte[] labels, byte[] truth, int label) {
    long n = 0;
    for (int i = 0; i < labels.length; i++) {
      if (labels[i] == label && (truth[i] != 0) != (label == 1)) {
        n++;
      }
    }
    return n;
  }

  /** The text field in the row of {@code label} (the component after the label). */
  private static TextField field(Container c, String label) {
    Component[] k = c.getComponents();
    for (int i = 0; i + 1 < k.length; i++) {
      if (k[i] instanceof Label l && l.getText().equals(label) && k[i + 1] instanceof TextField t) {
        return t;
      }
    }
    throw new AssertionError("no text field after the label " + label);
  }

  /**
   * Moves a top-level window to ({@code x}, {@code y}) on the screen and waits until the display
   * has it there: a move right after the window was shown can be lost (no window manager), while
   * Java already reports the new place; so the window goes by way of a neighbouring spot first,
   * which makes the toolkit send the move to the display again.
   */
  private static void place(Robot robot, java.awt.Window w, int x, int y) throws Exception {
    EventQueue.invokeAndWait(() -> w.setLocation(x + 1, y));
    robot.waitForIdle();
    Thread.sleep(100);
    for (int attempt = 0; attempt < 20; attempt++) {
      EventQueue.invokeAndWait(() -> w.setLocation(x, y));
      robot.waitForIdle();
      Thread.sleep(100);
      Point at = w.getLocationOnScreen();
      if (at.x == x && at.y == y) {
        return;
      }
    }
    throw new AssertionError(
        "window " + w.getName() + " stays at " + w.getLocationOnScreen() + ", not " + x + "," + y);
  }

  private static void click(Robot robot, Component c) {
    Point p = c.getLocationOnScreen();
    Xdo.click(p.x + c.getWidth() / 2, p.y + c.getHeight() / 2);
    robot.waitForIdle();
  }

  /**
   * Puts {@code frame} where it should be again and raises it (no window manager keeps it there or
   * on top), then clicks {@code c}.
   */
  private static void clickOnTop(Robot robot, Frame frame, Component c) throws Exception {
    place(robot, frame, frame.getX(), frame.getY());
    EventQueue.invokeAndWait(frame::toFront);
    robot.waitForIdle();
    Thread.sleep(200);
    click(robot, c);
  }

  private static void clickTrackRight(Robot robot, Scrollbar s) {
    Point p = s.getLocationOnScreen();
    Xdo.click(p.x + s.getWidth() * 17 / 20, p.y + s.getHeight() / 2); // track, right of the thumb
    robot.waitForIdle();
  }

  private static void save(Robot robot, Path file) throws Exception {
    Rectangle screen = new Rectangle(Toolkit.getDefaultToolkit().getScreenSize());
    ImageIO.write(robot.createScreenCapture(screen), "png", file.toFile());
  }

  private static BrushPanel panel() {
    for (Frame f : Frame.getFrames()) {
      if (f instanceof BrushPanel p && p.isShowing()) {
        return p;
      }
    }
    throw new AssertionError("the seed brush panel is not showing");
  }

  private static Button button(Container c, String label) {
    for (Component k : c.getComponents()) {
      if (k instanceof Button b && b.getLabel().equals(label)) {
        return b;
      }
      if (k instanceof Container inner) {
        try {
          return button(inner, label);
        } catch (AssertionError e) {
          // not in this one
        }
      }
    }
    throw new AssertionError("no button " + label);
  }

  private static Scrollbar slider(Container c) {
    for (Component k : c.getComponents()) {
      if (k instanceof Scrollbar s) {
        return s;
      }
      if (k instanceof Container inner) {
        Scrollbar s = slider(inner);
        if (s != null) {
          return s;
        }
      }
    }
    return null;
  }

  /** Foreground-background pairs of 4-neighbours: the boundary length in pixel edges. */
  static long boundaryPairs(byte[] m, int w, int h) {
    long n = 0;
    for (int y = 0; y < h; y++) {
      for (int x = 0; x < w; x++) {
        int i = y * w + x;
        if (x + 1 < w && m[i] != m[i + 1]) {
          n++;
        }
        if (y + 1 < h && m[i] != m[i + w]) {
          n++;
        }
      }
    }
    return n;
  }

  /** Whether {@code done} holds within {@code millis}. */
  static boolean holds(BooleanSupplier done, long millis) throws InterruptedException {
    long end = System.currentTimeMillis() + millis;
    while (!done.getAsBoolean()) {
      if (System.currentTimeMillis() > end) {
        return false;
      }
      Thread.sleep(50);
    }
    return true;
  }

  static void waitFor(BooleanSupplier done, long millis, String what) throws Exception {
    long end = System.currentTimeMillis() + millis;
    while (!done.getAsBoolean()) {
      if (System.currentTimeMillis() > end) {
        throw new AssertionError("timed out waiting for " + what);
      }
      Thread.sleep(50);
    }
  }
}
