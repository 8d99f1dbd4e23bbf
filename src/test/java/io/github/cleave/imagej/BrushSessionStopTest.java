package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import ij.IJ;
import ij.ImagePlus;
import ij.gui.Roi;
import java.awt.Component;
import java.awt.EventQueue;
import java.awt.event.KeyEvent;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Consumer;
import org.junit.jupiter.api.Test;

/**
 * Esc during the seed brush's live cut, without windows: the cut is stopped from inside the worker
 * at a chosen phase (a hook, so no timing is involved), by each of the three ways Esc arrives (a
 * direct stop, the key listener, ImageJ's Esc flag). The last contour stays, the status line says
 * so, and the next request gives the mask that a session never stopped gives.
 */
class BrushSessionStopTest {
  private static final Path IMAGE = Path.of("sample-images", "nuclei.tif");
  private static final Path SEEDS = Path.of("sample-images", "nuclei.seeds.tif");

  @Test
  void escStopsTheCutKeepsTheContourAndTheNextStrokeRecomputes() throws Exception {
    ImagePlus imp = IJ.openImage(IMAGE.toString());
    Object pixels = imp.getProcessor().getPixelsCopy();
    AtomicReference<String> status = new AtomicReference<>("");
    BrushSession session = session(imp, status::set);
    AtomicReference<String> stopAt = new AtomicReference<>();
    AtomicReference<Consumer<BrushSession>> how = new AtomicReference<>();
    session.phaseHook =
        phase -> {
          if (phase.equals(stopAt.get())) {
            stopAt.set(null);
            how.get().accept(session);
          }
        };
    StrokePlan plan = StrokePlan.of(SEEDS);
    paint(session, plan, 1);

    // stopped while learning: no contour yet
    stopAt.set("learn");
    how.set(BrushSession::stopCut);
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> BrushSession.STOPPED.equals(status.get()), 60_000, "stop in learn");
    assertThat(session.lastMask()).isNull();

    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastMask() != null, 60_000, "first cut");
    // the first contour's status line says once what the contour is
    BrushDriver.waitFor(() -> status.get().contains(BrushSession.PREVIEW), 60_000, "preview");
    byte[] first = session.lastMask();

    // stopped while solving, by the key listener: the contour of the first cut stays. A new
    // boundary penalty makes it a full solve, long enough for the engine to poll the interrupt
    // (a small dynamic re-solve may finish first, and is then shown: there is nothing to stop)
    addStroke(session, plan);
    smoother(session);
    stopAt.set("solve");
    how.set(s -> s.stop.keys.keyPressed(escape()));
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> BrushSession.STOPPED.equals(status.get()), 60_000, "stop in solve");
    assertThat(session.lastMask()).isSameAs(first);
    EventQueue.invokeAndWait(session::redraw);
    assertThat(imp.getOverlay().toArray()).extracting(Roi::getName).contains("cut");

    // stopped again while solving, by ImageJ's Esc flag
    IJ.resetEscape();
    stopAt.set("solve");
    how.set(
        s -> {
          IJ.setKeyDown(KeyEvent.VK_ESCAPE); // what ImageJ does when Esc is pressed on its windows
          s.stop.poll();
        });
    status.set("");
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> BrushSession.STOPPED.equals(status.get()), 60_000, "stop by flag");
    assertThat(IJ.escapePressed()).as("the flag is reset when it stops a cut").isFalse();
    IJ.setKeyUp(IJ.ALL_KEYS);

    // the next request recomputes normally: the mask a session that was never stopped shows
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastMask() != first, 60_000, "cut after the stops");
    BrushDriver.waitFor(() -> status.get().contains("flow value"), 60_000, "status line");
    assertThat(status.get())
        .contains("flow value = cut value", "(checked)", "full solve")
        .doesNotContain(BrushSession.PREVIEW);
    byte[] afterStops = session.lastMask();

    ImagePlus other = IJ.openImage(IMAGE.toString());
    BrushSession plain = session(other, line -> {});
    paint(plain, plan, 1);
    EventQueue.invokeAndWait(() -> plain.request(false));
    BrushDriver.waitFor(() -> plain.lastMask() != null, 60_000, "reference first cut");
    byte[] plainFirst = plain.lastMask();
    assertThat(plainFirst).isEqualTo(first);
    addStroke(plain, plan);
    smoother(plain);
    EventQueue.invokeAndWait(() -> plain.request(false));
    BrushDriver.waitFor(() -> plain.lastMask() != plainFirst, 60_000, "reference second cut");
    assertThat(afterStops).isEqualTo(plain.lastMask());

    EventQueue.invokeAndWait(session::close);
    EventQueue.invokeAndWait(plain::close);
    assertThat(imp.getProcessor().getPixels()).isEqualTo(pixels);
  }

  @Test
  void aNewerRequestCutsShortAStaleCutStillLearning() throws Exception {
    ImagePlus imp = IJ.openImage(IMAGE.toString());
    java.util.List<String> seen = new java.util.concurrent.CopyOnWriteArrayList<>();
    java.util.List<String> lines = new java.util.concurrent.CopyOnWriteArrayList<>();
    BrushSession session = session(imp, lines::add);
    StrokePlan plan = StrokePlan.of(SEEDS);
    paint(session, plan, 1);
    session.phaseHook =
        phase -> {
          seen.add(phase);
          if (seen.size() == 1) {
            session.request(false); // a newer stroke arrives while the first cut learns
          }
        };
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastMask() != null, 60_000, "the newer request's cut");
    // the stale cut stopped after learning, before solving; the newer one learned and solved
    assertThat(seen).containsExactly("learn", "learn", "solve");
    assertThat(lines).noneMatch(BrushSession.STOPPED::equals);

    ImagePlus other = IJ.openImage(IMAGE.toString());
    BrushSession plain = session(other, line -> {});
    paint(plain, plan, 1);
    EventQueue.invokeAndWait(() -> plain.request(false));
    BrushDriver.waitFor(() -> plain.lastMask() != null, 60_000, "reference cut");
    assertThat(session.lastMask()).isEqualTo(plain.lastMask());
    EventQueue.invokeAndWait(session::close);
    EventQueue.invokeAndWait(plain::close);
  }

  static BrushSession session(ImagePlus imp, Consumer<String> status) throws Exception {
    BrushSession[] s = new BrushSession[1];
    EventQueue.invokeAndWait(() -> s[0] = new BrushSession(imp, status));
    return s[0];
  }

  private static void paint(BrushSession s, StrokePlan plan, float width) throws Exception {
    SeedStrokes strokes = plan.strokes(s.imp.getWidth(), s.imp.getHeight(), width);
    EventQueue.invokeAndWait(
        () -> {
          for (SeedStrokes.Stroke k : strokes.strokes()) {
            s.strokes.add(k);
          }
        });
  }

  /** A wider foreground stroke over the first one: new hard constraints around it. */
  private static void addStroke(BrushSession s, StrokePlan plan) throws Exception {
    SeedStrokes.Stroke wide = plan.foreground().stroke(3, 1, 0.5f);
    EventQueue.invokeAndWait(() -> s.strokes.add(wide));
  }

  private static void smoother(BrushSession s) throws Exception {
    EventQueue.invokeAndWait(
        () ->
            s.setSettings(
                s.settings().withBoundaryPenalty(2 * s.settings().boundaryPenalty()), false));
  }

  private static KeyEvent escape() {
    Component source = new Component() {};
    return new KeyEvent(
        source, KeyEvent.KEY_PRESSED, 0, 0, KeyEvent.VK_ESCAPE, KeyEvent.CHAR_UNDEFINED);
  }
}
