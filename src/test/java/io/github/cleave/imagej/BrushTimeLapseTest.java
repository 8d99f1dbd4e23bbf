package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import ij.IJ;
import ij.ImagePlus;
import ij.WindowManager;
import ij.gui.Roi;
import ij.io.RoiDecoder;
import ij.macro.Interpreter;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.model.ModelKind;
import io.github.cleave.model.ModelLearner;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.TimeLapseOptions;
import io.github.cleave.segment.TimeLapseResult;
import io.github.cleave.segment.TimeLapseSegmenter;
import io.github.cleave.synth.TimeLapsePhantom;
import java.awt.EventQueue;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.concurrent.atomic.AtomicReference;
import java.util.zip.ZipEntry;
import java.util.zip.ZipInputStream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The seed brush on a time-lapse, without windows: a generated time-lapse ({@link
 * TimeLapsePhantom}, one channel, one slice, four frames) shown at time point 2 is painted there
 * with strokes along the phantom's seeds. The preview is a {@link LiveCut} of that time point's
 * raster; Create mask gives the tracked masks of {@link TimeLapseSegmenter} seeded on that time
 * point; the ROI zip carries T = 2; moving the display leaves the strokes on time point 2. The same
 * frames as slices of a stack with a frame interval (read as time points) behave alike, and a
 * single plane is painted as before.
 */
class BrushTimeLapseTest {
  static TimeLapsePhantom phantom;

  @BeforeAll
  static void generate() {
    phantom = TimeLapsePhantom.generate(41, 128, 128, 4, 3);
  }

  /** Strokes one pixel wide along the largest foreground and background seed components. */
  static List<SeedStrokes.Stroke> strokes() {
    SeedLabels s = phantom.seeds();
    StrokePlan plan =
        new StrokePlan(
            StrokePlan.follow(s.labels(), s.width(), s.height(), 1),
            StrokePlan.follow(s.labels(), s.width(), s.height(), 2));
    return plan.strokes(s.width(), s.height(), 1).strokes();
  }

  static BrushSession painted(ImagePlus imp, AtomicReference<String> status) throws Exception {
    BrushSession session = BrushSessionStopTest.session(imp, status::set);
    List<SeedStrokes.Stroke> list = strokes();
    EventQueue.invokeAndWait(() -> list.forEach(session.strokes::add));
    return session;
  }

  /** The preview a live cut built from scratch gives on time point {@code t} (0-based). */
  static byte[] liveCutOn(int t, SeedLabels seeds, double lambda) {
    Raster frame = phantom.frame(t).selectChannels(new int[] {0});
    Raster f = CutInputs.liveFeatures(frame, seeds);
    LiveCut scratch = new LiveCut(f, Neighborhood.of(8));
    scratch.useModel(ModelLearner.learn(f, seeds, ModelKind.AUTO));
    return scratch.update(seeds, lambda, Double.NaN).mask();
  }

  /** The 1-based time point an overlay ROI is drawn on, by its own position. */
  static int timeOf(Roi roi, ImagePlus imp, boolean slicesAreTime) {
    if (roi.hasHyperStackPosition()) {
      return slicesAreTime ? roi.getZPosition() : roi.getTPosition();
    }
    int[] czt = imp.convertIndexToPosition(roi.getPosition());
    return slicesAreTime ? czt[1] : czt[2];
  }

  static void assertOverlayOnTime(ImagePlus imp, int t, boolean slicesAreTime) {
    Roi[] rois = imp.getOverlay().toArray();
    assertThat(rois).extracting(Roi::getName).contains("foreground-1", "background-2", "cut");
    for (Roi r : rois) {
      assertThat(r.getPosition() > 0 || r.hasHyperStackPosition()).as(r.getName()).isTrue();
      assertThat(timeOf(r, imp, slicesAreTime)).as(r.getName()).isEqualTo(t);
    }
  }

  @Test
  void paintedOnTheTimePointShownAndSegmentedOverEveryTimePoint() throws Exception {
    ImagePlus movie = TimeLapseCommandsTest.hyperstack(phantom, "brushed-movie.tif", false);
    movie.setPosition(1, 1, 2); // time point 2 is shown
    AtomicReference<String> status = new AtomicReference<>("");
    BrushSession session = painted(movie, status);
    assertThat(session.time.isTimeLapse()).isTrue();
    assertThat(session.time.time()).isEqualTo(1);
    assertThat(session.time.depth()).isEqualTo(1);
    BrushDriver.waitFor(() -> status.get().contains("4 time points"), 10_000, "start line");
    assertThat(status.get()).contains("time point 2 of 4");
    SeedLabels seeds = session.strokes.labels();

    // the live preview: a live cut of time point 2's raster
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastMask() != null, 60_000, "preview");
    double lambda = session.settings().boundaryPenalty();
    byte[] want = liveCutOn(1, seeds, lambda);
    assertThat(session.lastMask()).isEqualTo(want);
    assertThat(session.lastMask()).isNotEqualTo(liveCutOn(0, seeds, lambda)); // the cells moved
    BrushDriver.waitFor(() -> status.get().contains("flow value"), 10_000, "status line");
    assertThat(status.get()).endsWith("time point 2 of 4");
    EventQueue.invokeAndWait(session::redraw);
    assertOverlayOnTime(movie, 2, false);

    // the saved ROI zip puts every stroke on time point 2, where Segment Current Image finds it
    Path zip = Files.createTempFile("cleave-brush", ".zip");
    BrushActions actions = new BrushActions(session, line -> {});
    try {
      actions.writeRoiZip(zip);
      Roi[] rois = readZip(zip);
      assertThat(rois).hasSize(2);
      for (Roi r : rois) {
        assertThat(r.getTPosition()).isEqualTo(2);
      }
      OpenedSeries series = TimeLapseRun.series(movie, TimeSettings.defaults());
      TimeSeeds back = TimeSeeds.fromRois(rois, movie, series, 0);
      assertThat(back.frame()).isEqualTo(1);
      assertThat(back.seeds().labels()).isEqualTo(seeds.labels());
      // loaded into a brush on time point 3, the seeds of time point 2 are refused
      ImagePlus other = TimeLapseCommandsTest.hyperstack(phantom, "other-movie.tif", false);
      other.setPosition(1, 1, 3);
      BrushSession away = new BrushSession(other, line -> {});
      try {
        org.assertj.core.api.Assertions.assertThatThrownBy(
                () -> new BrushActions(away, line -> {}).load(zip))
            .isInstanceOf(io.github.cleave.image.BadInputException.class)
            .hasMessageContaining("lie on time point 2")
            .hasMessageContaining("time point 3 of 4");
      } finally {
        EventQueue.invokeAndWait(away::close);
      }
    } finally {
      Files.deleteIfExists(zip);
    }

    // moving to time point 3 leaves the strokes on time point 2 and says so
    EventQueue.invokeAndWait(
        () -> {
          movie.setPosition(1, 1, 3);
          session.imageUpdated(movie);
        });
    BrushDriver.waitFor(
        () -> status.get().startsWith("strokes and preview are on time point 2"),
        10_000,
        "away line");
    assertThat(status.get()).contains("time point 3 shown");
    boolean[] canPaint = new boolean[1];
    EventQueue.invokeAndWait(() -> canPaint[0] = session.canPaint());
    assertThat(canPaint[0]).isFalse();
    assertThat(session.strokes.strokes()).hasSize(2);
    assertThat(session.strokes.labels().labels()).isEqualTo(seeds.labels());
    assertOverlayOnTime(movie, 2, false);

    // Create mask: every time point, seeded on time point 2, as the segmenter gives it
    SegmentationSettings settings = session.settings().segmentation();
    TimeLapseImages made = actions.timeLapse(seeds, settings);
    TimeLapseResult direct =
        TimeLapseSegmenter.segment(
            phantom.series(), seeds, 1, settings, TimeLapseOptions.defaults());
    assertThat(made.result().seedFrame()).isEqualTo(1);
    assertThat(made.mask().getNFrames()).isEqualTo(4);
    for (int t = 0; t < 4; t++) {
      assertThat(made.result().frame(t).trackedLabels())
          .as("time point %d", t + 1)
          .isEqualTo(direct.frame(t).trackedLabels());
      assertThat((byte[]) made.mask().getStack().getPixels(t + 1))
          .isEqualTo(direct.frame(t).segmentation().mask());
    }
    assertThat((String) made.mask().getProperty("Info"))
        .contains("seeds: 2 brush stroke(s) on time point 2 of 4");
    // the button's way: the same images, shown (batch mode: kept, no window)
    boolean wasBatch = Interpreter.batchMode;
    Interpreter.batchMode = true;
    try {
      actions.present(BrushActions.Output.MASK);
      BrushDriver.waitFor(
          () -> WindowManager.getImage("brushed-movie.mask") != null, 60_000, "mask shown");
      ImagePlus shown = WindowManager.getImage("brushed-movie.mask");
      // a copy of the kept images, so that closing its window cannot free them
      assertThat(shown).isNotSameAs(made.mask());
      assertThat(shown.getNFrames()).isEqualTo(made.mask().getNFrames());
      for (int t = 1; t <= shown.getStackSize(); t++) {
        assertThat((byte[]) shown.getStack().getPixels(t))
            .isEqualTo(made.mask().getStack().getPixels(t));
      }
      assertThat((String) shown.getProperty("Info")).isEqualTo(made.mask().getProperty("Info"));
      Interpreter.removeBatchModeImage(shown);
    } finally {
      Interpreter.batchMode = wasBatch;
    }
    // Save model learns from the seeded time point: its raster is time point 2's
    assertThat(session.image.raster().channel(0)).isEqualTo(phantom.frame(1).channel(0));
    EventQueue.invokeAndWait(session::close);
    assertThat(movie.getOverlay()).isNull();
  }

  @Test
  void escapeStopsTheTimeLapseWithNothingKept() throws Exception {
    ImagePlus movie = TimeLapseCommandsTest.hyperstack(phantom, "stopped-movie.tif", false);
    movie.setPosition(1, 1, 2);
    BrushSession session = painted(movie, new AtomicReference<>(""));
    BrushActions actions = new BrushActions(session, line -> {});
    SeedLabels seeds = session.strokes.labels();
    SegmentationSettings settings =
        TimeLapseCommandsTest.settingsOf(movie, "boundary=2" + TimeLapseCommandsTest.FAST);
    Thread.currentThread().interrupt(); // what Esc does to the worker
    assertThatThrownBy(() -> actions.timeLapse(seeds, settings))
        .isInstanceOf(CancellationException.class);
    assertThat(Thread.interrupted()).isFalse();
    TimeLapseImages made = actions.timeLapse(seeds, settings); // nothing kept from the stopped run
    assertThat(made.result().frameCount()).isEqualTo(4);
    EventQueue.invokeAndWait(session::close);
  }

  @Test
  void stackWithFrameIntervalIsPaintedOnTheSliceShown() throws Exception {
    ImagePlus stack = TimeLapseCommandsTest.hyperstack(phantom, "brushed-slices.tif", true);
    stack.getCalibration().frameInterval = 5;
    stack.getCalibration().setTimeUnit("sec");
    stack.setSlice(2);
    AtomicReference<String> status = new AtomicReference<>("");
    BrushSession session = painted(stack, status);
    assertThat(session.time.isTimeLapse()).isTrue();
    assertThat(session.time.time()).isEqualTo(1);
    assertThat(session.time.depth()).isEqualTo(1);
    assertThat(session.time.notes()).isNotEmpty();
    BrushDriver.waitFor(() -> status.get().contains("4 time points"), 10_000, "start line");
    assertThat(status.get()).contains("slices read as time points", "time point 2 of 4");
    SeedLabels seeds = session.strokes.labels();
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastMask() != null, 60_000, "preview");
    assertThat(session.lastMask())
        .isEqualTo(liveCutOn(1, seeds, session.settings().boundaryPenalty()));
    EventQueue.invokeAndWait(session::redraw);
    assertOverlayOnTime(stack, 2, true);
    Path zip = Files.createTempFile("cleave-brush", ".zip");
    try {
      new BrushActions(session, line -> {}).writeRoiZip(zip);
      OpenedSeries series = TimeLapseRun.series(stack, TimeSettings.defaults());
      assertThat(series.timeSource()).isEqualTo(OpenedSeries.TimeSource.SLICES_AS_FRAMES);
      TimeSeeds back = TimeSeeds.fromRois(readZip(zip), stack, series, 0);
      assertThat(back.frame()).isEqualTo(1);
      assertThat(back.seeds().labels()).isEqualTo(seeds.labels());
    } finally {
      Files.deleteIfExists(zip);
    }
    EventQueue.invokeAndWait(
        () -> {
          stack.setSlice(4);
          session.imageUpdated(stack);
        });
    BrushDriver.waitFor(
        () -> status.get().contains("time point 4 shown"), 10_000, "away line on slice 4");
    assertThat(session.strokes.strokes()).extracting(SeedStrokes.Stroke::plane).containsOnly(0);
    EventQueue.invokeAndWait(session::close);
  }

  @Test
  void aSinglePlaneIsPaintedAsBefore() throws Exception {
    ImagePlus imp = IJ.openImage(Path.of("sample-images", "nuclei.tif").toString());
    AtomicReference<String> status = new AtomicReference<>("");
    BrushSession session = BrushSessionStopTest.session(imp, status::set);
    assertThat(session.time.isTimeLapse()).isFalse();
    assertThat(session.time.notes()).isEmpty();
    StrokePlan plan = StrokePlan.of(Path.of("sample-images", "nuclei.seeds.tif"));
    List<SeedStrokes.Stroke> list =
        new ArrayList<>(plan.strokes(imp.getWidth(), imp.getHeight(), 3).strokes());
    EventQueue.invokeAndWait(() -> list.forEach(session.strokes::add));
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastMask() != null, 60_000, "preview");
    BrushDriver.waitFor(() -> status.get().contains("flow value"), 10_000, "status line");
    assertThat(status.get()).doesNotContain("time point");
    EventQueue.invokeAndWait(session::redraw);
    for (Roi r : imp.getOverlay().toArray()) {
      assertThat(r.getPosition()).isZero();
      assertThat(r.hasHyperStackPosition()).isFalse();
    }
    boolean[] canPaint = new boolean[1];
    EventQueue.invokeAndWait(() -> canPaint[0] = session.canPaint());
    assertThat(canPaint[0]).isTrue();
    Path zip = Files.createTempFile("cleave-brush", ".zip");
    try {
      new BrushActions(session, line -> {}).writeRoiZip(zip);
      assertThat(Arrays.stream(readZip(zip)).mapToInt(Roi::getPosition)).containsOnly(0);
      assertThat(Arrays.stream(readZip(zip)).map(Roi::hasHyperStackPosition)).containsOnly(false);
    } finally {
      Files.deleteIfExists(zip);
    }
    EventQueue.invokeAndWait(session::close);
  }

  static Roi[] readZip(Path zip) throws Exception {
    List<Roi> out = new ArrayList<>();
    try (ZipInputStream in = new ZipInputStream(Files.newInputStream(zip))) {
      for (ZipEntry e = in.getNextEntry(); e != null; e = in.getNextEntry()) {
        out.add(new RoiDecoder(in.readAllBytes(), e.getName()).getRoi());
      }
    }
    return out.toArray(new Roi[0]);
  }
}
