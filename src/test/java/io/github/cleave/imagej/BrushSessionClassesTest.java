package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import ij.ImagePlus;
import ij.gui.Roi;
import io.github.cleave.energy.AlphaExpansion;
import io.github.cleave.energy.ContrastScale;
import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.energy.PottsEnergy;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.ImageFiles;
import io.github.cleave.model.LikelihoodModel;
import io.github.cleave.model.ModelKind;
import io.github.cleave.model.ModelLearner;
import java.awt.Color;
import java.awt.EventQueue;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Test;

/**
 * The seed brush with three or more classes, without windows: the preview is the expansion of the
 * Potts energy (recomputed here through the energy package's public API), drawn as one contour per
 * class but the background in the class's colour; back to two classes it is the two-class cut
 * again; a class without a stroke is named in the status line; a stopped expansion leaves the last
 * contours.
 */
class BrushSessionClassesTest {
  /** Bluish green of the Okabe–Ito palette (render.SeedColours; values from memory there). */
  private static final Color BLUISH_GREEN = new Color(0x009E73);

  @Test
  void threeClassesGiveTheExpansionOfThePottsEnergy() throws Exception {
    for (long seed = 1; seed <= 3; seed++) {
      ImagePlus imp = ClassImages.threeDiscs(seed);
      AtomicReference<String> status = new AtomicReference<>("");
      BrushSession session = BrushSessionStopTest.session(imp, status::set);
      List<SeedStrokes.Stroke> strokes =
          List.of(ClassImages.foreground(), ClassImages.background(), ClassImages.third());
      add(session, strokes);
      EventQueue.invokeAndWait(() -> session.request(false));
      BrushDriver.waitFor(() -> session.lastClasses() != null, 60_000, "three-class preview");
      SeedLabels seeds = labels(session);
      assertThat(session.lastClasses()).as("seed %d", seed).isEqualTo(expansion(imp, seeds));
      assertThat(session.lastMask()).isNull();
      BrushDriver.waitFor(() -> status.get().contains("classes"), 10_000, "status line");
      assertThat(status.get()).startsWith("3 classes: full re-cut per stroke");
      // every class found where its disc is
      byte[] map = session.lastClasses();
      assertThat(map[32 * ClassImages.W + 20]).isEqualTo((byte) 1);
      assertThat(map[32 * ClassImages.W + 58]).isEqualTo((byte) 3);
      assertThat(map[60 * ClassImages.W + 40]).isEqualTo((byte) 2);
      // contours: one per class but the background, in the class's colour; no filled area
      EventQueue.invokeAndWait(session::redraw);
      Roi[] rois = imp.getOverlay().toArray();
      assertThat(rois).extracting(Roi::getName).contains("cut-foreground", "cut-class3");
      assertThat(rois).extracting(Roi::getName).doesNotContain("cut-background", "cut");
      Roi third = named(rois, "cut-class3");
      assertThat(third.getStrokeColor()).isEqualTo(BLUISH_GREEN);
      assertThat(third.getFillColor()).isNull();
      assertThat(named(rois, "class3-3").getStrokeColor()).isEqualTo(BLUISH_GREEN);
      EventQueue.invokeAndWait(session::close);
    }
  }

  @Test
  void backToTwoClassesTheTwoClassCutReturns() throws Exception {
    ImagePlus imp = ClassImages.threeDiscs(7);
    AtomicReference<String> status = new AtomicReference<>("");
    BrushSession session = BrushSessionStopTest.session(imp, status::set);
    add(session, List.of(ClassImages.foreground(), ClassImages.background()));
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastMask() != null, 60_000, "two-class cut");
    byte[] twoFirst = session.lastMask();
    add(session, List.of(ClassImages.third()));
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastClasses() != null, 60_000, "three-class preview");
    // the class-3 stroke undone: two classes again
    EventQueue.invokeAndWait(session::undo);
    BrushDriver.waitFor(() -> session.lastMask() != null, 60_000, "two-class cut again");
    assertThat(session.lastClasses()).isNull();
    assertThat(session.lastMask()).isEqualTo(twoFirst);
    BrushDriver.waitFor(() -> status.get().contains("flow value"), 10_000, "status line");
    // the same as a fresh session, and as a live cut built from scratch on the same seeds
    ImagePlus other = ClassImages.threeDiscs(7);
    BrushSession fresh = BrushSessionStopTest.session(other, line -> {});
    add(fresh, List.of(ClassImages.foreground(), ClassImages.background()));
    EventQueue.invokeAndWait(() -> fresh.request(false));
    BrushDriver.waitFor(() -> fresh.lastMask() != null, 60_000, "fresh two-class cut");
    assertThat(session.lastMask()).isEqualTo(fresh.lastMask());
    SeedLabels seeds = labels(session);
    Raster f = CutInputs.liveFeatures(features(imp), seeds);
    LiveCut scratch = new LiveCut(f, Neighborhood.of(8));
    scratch.useModel(ModelLearner.learn(f, seeds, ModelKind.AUTO));
    assertThat(session.lastMask())
        .isEqualTo(scratch.update(seeds, session.settings().boundaryPenalty(), Double.NaN).mask());
    EventQueue.invokeAndWait(session::redraw);
    assertThat(imp.getOverlay().toArray()).extracting(Roi::getName).contains("cut");
    EventQueue.invokeAndWait(session::close);
    EventQueue.invokeAndWait(fresh::close);
  }

  @Test
  void aClassWithoutAStrokeIsNamedInTheStatusLine() throws Exception {
    ImagePlus imp = ClassImages.threeDiscs(11);
    List<String> lines = new CopyOnWriteArrayList<>();
    BrushSession session = BrushSessionStopTest.session(imp, lines::add);
    add(
        session,
        List.of(
            ClassImages.foreground(),
            ClassImages.background(),
            ClassImages.stroke(4, 53, 63, 32.5f)));
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> !lines.isEmpty(), 60_000, "status line");
    assertThat(lines).containsExactly(StatusLines.missing(3, 4));
    assertThat(lines.get(0)).startsWith("class 3 (bluish green) needs a stroke");
    assertThat(session.lastClasses()).isNull();
    assertThat(session.lastMask()).isNull();
    // painted, the class-3 stroke completes the classes
    add(session, List.of(ClassImages.stroke(3, 30, 40, 55.5f)));
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastClasses() != null, 60_000, "four-class preview");
    assertThat(lines.get(lines.size() - 1)).startsWith("4 classes: full re-cut per stroke");
    // without class 1: the foreground is named
    SeedLabels noForeground = new SeedLabels(2, 1, 1, new byte[] {2, 3}); // classes 2 and 3 only
    assertThat(CutInputs.missingClass(noForeground)).isEqualTo(1);
    assertThat(StatusLines.missing(1, 3)).startsWith("class 1 (foreground) needs a stroke");
    EventQueue.invokeAndWait(session::close);
  }

  @Test
  void stoppingAThreeClassPreviewKeepsTheLastContours() throws Exception {
    ImagePlus imp = ClassImages.threeDiscs(5);
    List<String> lines = new CopyOnWriteArrayList<>();
    BrushSession session = BrushSessionStopTest.session(imp, lines::add);
    AtomicReference<String> stopAt = new AtomicReference<>();
    session.phaseHook =
        phase -> {
          if (phase.equals(stopAt.get())) {
            stopAt.set(null);
            session.stopCut(); // an interrupt of the worker, as Esc or a newer stroke gives
          }
        };
    add(session, List.of(ClassImages.foreground(), ClassImages.background(), ClassImages.third()));
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastClasses() != null, 60_000, "first preview");
    byte[] first = session.lastClasses();
    add(session, List.of(ClassImages.stroke(3, 50, 66, 30.5f)));
    stopAt.set("solve");
    lines.clear();
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> !lines.isEmpty(), 60_000, "stopped preview");
    assertThat(lines).containsExactly(BrushSession.STOPPED);
    assertThat(session.lastClasses()).isSameAs(first);
    EventQueue.invokeAndWait(session::redraw);
    assertThat(imp.getOverlay().toArray())
        .extracting(Roi::getName)
        .contains("cut-foreground", "cut-class3");
    // the next request expands in full: the map of the present seeds
    EventQueue.invokeAndWait(() -> session.request(false));
    BrushDriver.waitFor(() -> session.lastClasses() != first, 60_000, "preview after the stop");
    assertThat(session.lastClasses()).isEqualTo(expansion(imp, labels(session), firstModelSeeds()));
    EventQueue.invokeAndWait(session::close);
  }

  /** The seeds the model of the stop test was learned from (the first three strokes). */
  private static SeedLabels firstModelSeeds() {
    SeedStrokes s = new SeedStrokes(ClassImages.W, ClassImages.H, 1);
    s.add(ClassImages.foreground());
    s.add(ClassImages.background());
    s.add(ClassImages.third());
    return s.labels();
  }

  /**
   * The class map of the Potts energy for these seeds with the session's default settings, through
   * the energy package alone: model learned from the seeds, σ estimated, 8-neighbourhood, expansion
   * from the background for at most 6 cycles (the pipeline's cap, segment.MultiClassCut).
   */
  static byte[] expansion(ImagePlus imp, SeedLabels seeds) {
    return expansion(imp, seeds, seeds);
  }

  static byte[] expansion(ImagePlus imp, SeedLabels seeds, SeedLabels learnedFrom) {
    Raster f = CutInputs.liveFeatures(features(imp), learnedFrom);
    LikelihoodModel m = ModelLearner.learn(f, learnedFrom, ModelKind.AUTO);
    float[][] costs = new float[m.classCount()][f.size()];
    m.costs(f, costs);
    Neighborhood nb = Neighborhood.of(8);
    EnergyParameters p =
        new EnergyParameters(
            BrushSettings.defaults().boundaryPenalty(),
            ContrastScale.estimate(f, nb),
            nb,
            f.voxelSize());
    PottsEnergy energy = PottsEnergy.build(f, costs, seeds, p);
    byte[] start = seeds.labels().clone();
    for (int i = 0; i < start.length; i++) {
      start[i] = start[i] == 0 ? SeedLabels.BACKGROUND : start[i];
    }
    return AlphaExpansion.run(energy, start, 6).labels();
  }

  static Raster features(ImagePlus imp) {
    return ImageFiles.fromImagePlus(imp, imp.getTitle()).raster().selectChannels(new int[] {0});
  }

  private static SeedLabels labels(BrushSession s) throws Exception {
    SeedLabels[] out = new SeedLabels[1];
    EventQueue.invokeAndWait(() -> out[0] = s.strokes.labels());
    return out[0];
  }

  private static void add(BrushSession s, List<SeedStrokes.Stroke> strokes) throws Exception {
    EventQueue.invokeAndWait(() -> strokes.forEach(s.strokes::add));
  }

  private static Roi named(Roi[] rois, String name) {
    return Arrays.stream(rois)
        .filter(r -> name.equals(r.getName()))
        .findFirst()
        .orElseThrow(() -> new AssertionError("no overlay ROI named " + name));
  }
}
