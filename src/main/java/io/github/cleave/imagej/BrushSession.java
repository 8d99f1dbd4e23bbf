package io.github.cleave.imagej;

import ij.ImageListener;
import ij.ImagePlus;
import ij.gui.Overlay;
import ij.gui.Roi;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.LoadedImage;
import io.github.cleave.model.LikelihoodModel;
import io.github.cleave.model.ModelKind;
import io.github.cleave.model.ModelLearner;
import java.awt.EventQueue;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.Consumer;

/**
 * One image being painted with the seed brush: its strokes, the live cut, and the overlay that
 * shows both. The image's pixels and display settings are never changed; its own overlay is kept
 * under ours and restored by {@link #close()}.
 *
 * <p><b>Threads.</b> Strokes and the overlay belong to the event thread. Every change asks for a
 * cut ({@link #request}); cuts run on one worker thread, newest request first: a request that is no
 * longer the newest when its turn comes is skipped, and a result that is stale when it arrives is
 * not shown. A newer request also cuts short a running one that is still slow work (learning,
 * building a graph, solving from zero flow: {@link LiveCutStop#supersede}); a running dynamic
 * re-solve is left to finish, since it is quicker than redoing it from zero flow. About {@value
 * #RELEARN_MS} ms after the last stroke the likelihoods are learned again from all seeds (every
 * plane counts) and the cut rebuilt.
 *
 * <p><b>Esc.</b> Esc pressed on the image window or the panel, or recorded by ImageJ while a cut
 * runs ({@link LiveCutStop}), stops the running cut ({@link #stopCut}): the worker is interrupted,
 * the engine returns early, the last contour stays and the status line says {@value #STOPPED}. The
 * live cut marks its kept graph stale, so the next request cuts as if nothing had been stopped.
 * Long work (re-learning, a full solve) moves ImageJ's progress bar ({@link WorkProgress}).
 *
 * <p><b>Classes.</b> Strokes of classes 1 and 2 only get the two-class {@link LiveCut}. With a
 * stroke of class 3 or more, and a stroke of every class 1..K, the likelihoods of K classes are
 * learned and the preview is {@link LiveClasses}' expansion, re-run in full per request (slow work
 * throughout: a newer request or Esc stops it between and inside moves) and drawn as one contour
 * per class ({@link CutContour#ofClasses}); with a class missing, the status line names it. A
 * change of the class count re-learns at once, so back to two classes the two-class cut returns.
 *
 * <p><b>Time.</b> On an image with several time points the session works on the one shown when it
 * starts ({@link BrushTime}): strokes, preview and contours are that time point's and are drawn
 * only there. Shown another time point, the strokes stay where they are, the brush does not paint
 * and the status line says where the strokes are.
 */
final class BrushSession implements ImageListener {
  /** Pause after a stroke before the likelihoods are learned again, in milliseconds. */
  static final int RELEARN_MS = 1000;

  /** The status line after Esc stopped a cut. */
  static final String STOPPED = "cut stopped (Esc)";

  /** Said once, with the first contour: what the contour is and what the results are. */
  static final String PREVIEW = "preview: plain cut; Create mask runs the full pipeline";

  final ImagePlus imp;
  final BrushTime time;
  final LoadedImage image;
  final SeedStrokes strokes;
  private final Raster features; // driving channels, every plane
  private final Overlay original;
  private final Consumer<String> status;
  private final ExecutorService worker;
  private final ScheduledExecutorService timer;
  private final AtomicLong latest = new AtomicLong();
  private volatile BrushSettings settings = BrushSettings.defaults();
  final LiveCutStop stop = new LiveCutStop(this::undo);
  volatile Consumer<String> phaseHook; // for tests: runs on the worker at each phase of a cut

  // worker thread only
  private LiveCut live;
  private Raster cutFeatures; // the features the live cut uses: flattened when AUTO would
  private String liveKey;
  private LikelihoodModel model;
  private ModelKind modelKind;

  private LiveClasses liveClasses; // the preview of three or more classes, or null
  private String classesKey;

  // event thread only (preview is read by tests on other threads)
  private final BrushOverlay overlay;
  private volatile BrushOverlay.Preview preview; // the last preview shown, or null
  private int shownPlane = -1;
  private int shownTime = -1;
  private Roi drawing; // the stroke being drawn
  private boolean previewExplained; // the status line said once what the contour is

  BrushSession(ImagePlus imp, Consumer<String> status) {
    this.imp = imp;
    this.status = status;
    this.time = BrushTime.of(imp);
    this.image = time.image();
    Raster r = image.raster();
    this.features =
        r.selectChannels(r.kind() == PixelKind.RGB ? new int[] {0, 1, 2} : new int[] {0});
    this.strokes = new SeedStrokes(r.width(), r.height(), r.depth());
    this.original = imp.getOverlay() == null ? null : imp.getOverlay().duplicate();
    this.overlay = new BrushOverlay(imp, original, time);
    time.announce(status);
    this.worker = Executors.newSingleThreadExecutor(daemon("Cleave live cut"));
    this.timer = Executors.newSingleThreadScheduledExecutor(daemon("Cleave pause timer"));
    ImagePlus.addImageListener(this);
    stop.attach(imp);
    timer.scheduleWithFixedDelay(stop::poll, 100, 100, TimeUnit.MILLISECONDS);
  }

  /** Stops the running cut, if any (any thread); its request then shows {@value #STOPPED}. */
  void stopCut() {
    stop.stop();
  }

  /** Undoes the last change of the strokes (event thread); says so if there is none. */
  void undo() {
    if (strokes.undo()) {
      strokesChanged();
    } else {
      status.accept("nothing to undo");
    }
  }

  BrushSettings settings() {
    return settings;
  }

  private java.awt.Frame panel; // event thread

  void setPanel(java.awt.Frame p) {
    panel = p;
  }

  /** Brings the session's panel to the front. */
  void showPanel() {
    if (panel != null) {
      panel.setVisible(true);
      panel.toFront();
    }
  }

  /** Takes new panel settings; {@code recut} asks for a new cut. */
  void setSettings(BrushSettings s, boolean recut) {
    settings = s;
    if (recut) {
      request(false);
    }
  }

  /** The 0-based plane shown (within a time point). */
  int plane() {
    return time.shownPlane();
  }

  /**
   * Whether strokes may be painted now: false while another time point than the session's shows.
   */
  boolean canPaint() {
    if (time.showsSessionTime()) {
      return true;
    }
    status.accept(time.away());
    return false;
  }

  /** Shows a stroke while it is drawn (null to remove it). */
  void drawing(Roi roi) {
    drawing = roi;
    redraw();
  }

  /** After a change of the strokes: redraws them and asks for a cut, then a re-learn later. */
  void strokesChanged() {
    redraw();
    long gen = request(false);
    timer.schedule(
        () ->
            EventQueue.invokeLater(
                () -> {
                  if (latest.get() == gen) {
                    request(true);
                  }
                }),
        RELEARN_MS,
        TimeUnit.MILLISECONDS);
  }

  /** Asks for a cut of the present strokes and settings; returns the request's number. */
  long request(boolean relearn) {
    long gen = latest.incrementAndGet();
    stop.supersede(gen); // a stale cut still learning or building gives way
    long asked = System.nanoTime();
    SeedStrokes.Snapshot snap = strokes.snapshot();
    BrushSettings s = settings;
    int plane = plane();
    worker.execute(() -> cut(gen, asked, snap, s, plane, relearn));
    return gen;
  }

  private void cut(
      long gen,
      long asked,
      SeedStrokes.Snapshot snap,
      BrushSettings s,
      int plane,
      boolean relearn) {
    if (gen != latest.get()) {
      return; // a newer request replaces this one
    }
    stop.begin(gen);
    try (WorkProgress progress = WorkProgress.start()) {
      SeedLabels seeds = snap.labels();
      int classes = Math.max(2, seeds.countsPerLabel().length - 1);
      boolean learn =
          model == null || relearn || modelKind != s.likelihood() || model.classCount() != classes;
      if (classes > 2) {
        int missing = CutInputs.missingClass(seeds);
        if (missing > 0) {
          show(gen, null, StatusLines.missing(missing, classes));
          return;
        }
      } else if (learn && !LiveCut.hasBothClasses(seeds)) {
        show(gen, null, "paint a foreground and a background stroke to see the cut");
        return;
      }
      boolean volume = s.volume() && features.depth() > 1;
      if (learn) {
        progress.phase(
            "learning the likelihoods from the seeds (Esc stops)", 0, 0.5, features.size());
        phase("learn");
        Raster f = CutInputs.liveFeatures(features, seeds);
        stopIfAsked();
        LikelihoodModel m = ModelLearner.learn(f, seeds, s.likelihood());
        stopIfAsked();
        cutFeatures = f; // all three together: a stop leaves the previous ones
        model = m;
        modelKind = s.likelihood();
        live = null;
        liveClasses = null;
      }
      Neighborhood nb = CutInputs.neighborhood(s.neighborhood(), volume);
      String key = (volume ? "volume" : "plane " + plane) + " " + nb;
      SeedLabels cutSeeds = volume ? seeds : CutInputs.plane(seeds, plane);
      int voxels = volume ? features.size() : features.size() / features.depth();
      if (classes > 2) {
        cutClasses(gen, asked, cutSeeds, s, volume ? -1 : plane, nb, key, progress, voxels);
        return;
      }
      if (live == null || !key.equals(liveKey)) {
        LiveCut next = new LiveCut(volume ? cutFeatures : CutInputs.plane(cutFeatures, plane), nb);
        next.useModel(model);
        live = next;
        liveKey = key;
      }
      progress.phase("cutting (Esc stops)", 0.5, 0.95, voxels);
      phase("solve");
      boolean dynamic = live.wouldContinue(s.boundaryPenalty(), s.contrastScale());
      stop.slow(!dynamic);
      if (gen != latest.get() && !dynamic) {
        return; // superseded before the slow solve began: the newer request does it
      }
      LiveCut.Outcome o = live.update(cutSeeds, s.boundaryPenalty(), s.contrastScale());
      if (o.stopped()) {
        show(gen, null, STOPPED);
        return;
      }
      String line = StatusLines.twoClass(o, relearn, asked);
      show(gen, new BrushOverlay.Preview(o.mask(), volume ? -1 : plane, 2), line);
    } catch (CancellationException e) {
      show(gen, null, STOPPED);
    } catch (RuntimeException e) {
      show(gen, null, "cannot cut: " + e.getMessage());
    } finally {
      stop.end(); // an Esc handled here must not stop the next request
    }
  }

  /**
   * The preview of three or more classes ({@link LiveClasses}): the whole expansion again for every
   * request, slow work that a newer request or Esc cuts short (between expansion moves and inside
   * their solves); a stop throws {@link CancellationException} to {@link #cut}.
   */
  private void cutClasses(
      long gen,
      long asked,
      SeedLabels cutSeeds,
      BrushSettings s,
      int mapPlane,
      Neighborhood nb,
      String key,
      WorkProgress progress,
      int voxels) {
    if (liveClasses == null || !key.equals(classesKey)) {
      LiveClasses next =
          new LiveClasses(mapPlane < 0 ? cutFeatures : CutInputs.plane(cutFeatures, mapPlane), nb);
      next.useModel(model);
      liveClasses = next;
      classesKey = key;
    }
    int k = liveClasses.classCount();
    progress.phase("cutting " + k + " classes (Esc stops)", 0.5, 0.95, voxels);
    phase("solve");
    stop.slow(true);
    if (gen != latest.get()) {
      return; // superseded before the expansion began: the newer request does it
    }
    LiveClasses.Outcome o = liveClasses.update(cutSeeds, s.boundaryPenalty(), s.contrastScale());
    String line = StatusLines.classes(o, asked);
    show(gen, new BrushOverlay.Preview(o.classes(), mapPlane, k), line);
  }

  private void phase(String name) {
    Consumer<String> hook = phaseHook;
    if (hook != null) {
      hook.accept(name);
    }
  }

  private static void stopIfAsked() {
    if (Thread.currentThread().isInterrupted()) {
      throw new CancellationException("stopped");
    }
  }

  private void show(long gen, BrushOverlay.Preview next, String line) {
    EventQueue.invokeLater(
        () -> {
          if (gen != latest.get()) {
            return; // stale
          }
          String shown = line;
          if (next != null) {
            preview = next;
            if (!previewExplained) { // once per session, with the first contour
              previewExplained = true;
              shown = line + " · " + PREVIEW;
            }
          }
          redraw();
          status.accept(time.isTimeLapse() ? time.statusLine(shown) : shown);
        });
  }

  /** Redraws the overlay: the image's own, the seeds, the stroke being drawn, the contours. */
  void redraw() {
    int z = plane();
    imp.setOverlay(overlay.build(strokes.strokes(), strokes.baseLayer(), drawing, preview, z));
    shownPlane = z;
    shownTime = time.shownTime();
  }

  /** The foreground mask of the last two-class preview, or null: one plane or the whole volume. */
  byte[] lastMask() {
    BrushOverlay.Preview p = preview;
    return p != null && p.twoClass() ? p.data() : null;
  }

  /** The class map (1..K) of the last preview of three or more classes, or null. */
  byte[] lastClasses() {
    BrushOverlay.Preview p = preview;
    return p != null && !p.twoClass() ? p.data() : null;
  }

  /** The plane of the last preview (0-based), or -1 for the volume or none. */
  int lastMaskPlane() {
    BrushOverlay.Preview p = preview;
    return p == null ? -1 : p.plane();
  }

  @Override
  public void imageOpened(ImagePlus other) {}

  @Override
  public void imageClosed(ImagePlus other) {
    if (other == imp) {
      shutdown();
    }
  }

  @Override
  public void imageUpdated(ImagePlus other) {
    if (other == imp && (plane() != shownPlane || time.shownTime() != shownTime)) {
      EventQueue.invokeLater(
          () -> {
            boolean timeMoved = time.shownTime() != shownTime;
            BrushOverlay.Preview cut = preview;
            // against the plane last cut, not the plane last drawn: a redraw while another time
            // point was shown, or a preview drawn before this task ran, must not hide a move
            boolean planeMoved = cut != null && cut.plane() != plane();
            redraw();
            if (!time.showsSessionTime()) {
              status.accept(time.away()); // the strokes stay on their time point
            } else if (planeMoved && (!settings.volume() || time.depth() == 1)) {
              request(false);
            } else if (timeMoved) {
              status.accept("back on " + time.where() + ": paint on");
            }
          });
    }
  }

  /** Stops the worker and restores the image's own overlay. */
  void close() {
    shutdown();
    imp.setOverlay(original);
  }

  private void shutdown() {
    ImagePlus.removeImageListener(this);
    stop.detach(imp);
    latest.incrementAndGet();
    worker.shutdownNow();
    timer.shutdownNow();
  }

  private static java.util.concurrent.ThreadFactory daemon(String name) {
    return r -> {
      Thread t = new Thread(r, name);
      t.setDaemon(true);
      return t;
    };
  }
}
