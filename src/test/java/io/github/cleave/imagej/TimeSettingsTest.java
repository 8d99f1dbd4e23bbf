package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import ij.ImagePlus;
import ij.ImageStack;
import ij.gui.Roi;
import ij.process.ByteProcessor;
import io.github.cleave.image.BadInputException;
import io.github.cleave.io.Hyperstacks;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.io.TimeAxis;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The time-lapse fields' macro keys, the seeds' time point, and per-frame progress. */
class TimeSettingsTest {
  static final List<String> AXES =
      List.of("auto", SettingsFields.SLICES_ARE_TIME, SettingsFields.SLICES_ARE_Z);
  static final List<TimeAxis> AXIS_VALUES =
      List.of(TimeAxis.AUTO, TimeAxis.SLICES_ARE_FRAMES, TimeAxis.SLICES_ARE_Z);

  static Form form() {
    return new Form("test", "test", SettingsFields.timeFields());
  }

  @Test
  void macroKeysArePlainAndParseOverRandomOptionStrings() {
    assertThat(form().fields().stream().map(FormField::key).toList())
        .containsExactly("time", "frame_seeds", "seed_frame");
    SplittableRandom random = new SplittableRandom(5);
    for (int n = 0; n < 300; n++) {
      int axis = random.nextInt(3);
      boolean neighbour = random.nextBoolean();
      int frame = random.nextInt(40);
      List<String> tokens = new java.util.ArrayList<>();
      tokens.add("seeds=a.tif");
      String a = AXES.get(axis);
      tokens.add("time=" + (a.contains(" ") ? "[" + a + "]" : a));
      if (neighbour) {
        tokens.add("frame_seeds");
      }
      tokens.add("seed_frame=" + frame);
      // ImageJ's macro options: key order does not matter (common practice, no source)
      java.util.Collections.shuffle(tokens, new java.util.Random(random.nextLong()));
      String options = String.join(" ", tokens);
      TimeSettings t = SettingsFields.time(form().fromOptions(options));
      assertThat(t)
          .as(options)
          .isEqualTo(new TimeSettings(AXIS_VALUES.get(axis), neighbour, frame));
    }
    // keys left out: the dialog's defaults, except the checkbox, which a macro turns on by naming
    // it
    assertThat(SettingsFields.time(form().fromOptions("seeds=a.tif")))
        .isEqualTo(new TimeSettings(TimeAxis.AUTO, false, 0));
    assertThat(SettingsFields.time(Map.of())).isEqualTo(TimeSettings.defaults());
  }

  @Test
  void invalidTimeValuesAreRefusedNamingTheKey() {
    String[][] cases = {
      {"time=sideways", "time=sideways"},
      {"seed_frame=-2", "seed_frame=-2"},
      {"seed_frame=two", "seed_frame=two"},
    };
    for (String[] c : cases) {
      assertThatThrownBy(() -> SettingsFields.time(form().fromOptions(c[0])))
          .as(c[0])
          .isInstanceOf(BadInputException.class)
          .hasMessageContaining(c[1]);
    }
  }

  static ImagePlus movie(int frames, boolean asSlices) {
    ImageStack stack = new ImageStack(32, 32);
    for (int t = 0; t < frames; t++) {
      stack.addSlice(null, new ByteProcessor(32, 32));
    }
    ImagePlus imp = new ImagePlus("m", stack);
    imp.setDimensions(1, asSlices ? frames : 1, asSlices ? 1 : frames);
    return imp;
  }

  static Roi named(String name, int x) {
    Roi r = new Roi(x, 4, 3, 3);
    r.setName(name);
    return r;
  }

  @Test
  void roisGiveTheirTimePointAndMarkTheirPlaneOnly() {
    ImagePlus imp = movie(5, false);
    OpenedSeries series = Hyperstacks.of(imp, TimeAxis.AUTO);
    Roi fg = named("foreground", 2);
    fg.setPosition(0, 0, 4);
    Roi bg = named("background", 20);
    bg.setPosition(4); // a plain stack position: plane 4 of a 1-channel, 1-slice movie is T = 4
    TimeSeeds s = TimeSeeds.fromRois(new Roi[] {fg, bg}, imp, series, 0);
    assertThat(s.frame()).isEqualTo(3);
    assertThat(s.seeds().depth()).isEqualTo(1);
    assertThat(s.seeds().labels()[3 + 32 * 5]).isEqualTo((byte) 1);
    assertThat(s.seeds().labels()[21 + 32 * 5]).isEqualTo((byte) 2);
    assertThat(fg.getTPosition()).isEqualTo(4); // the ROI Manager's ROIs are left as they were
    // without a time position: the fallback time point
    TimeSeeds none =
        TimeSeeds.fromRois(new Roi[] {named("fg", 2), named("bg", 20)}, imp, series, 2);
    assertThat(none.frame()).isEqualTo(2);
    // two time points: refused, naming them
    Roi other = named("bg", 20);
    other.setPosition(0, 0, 2);
    assertThatThrownBy(() -> TimeSeeds.fromRois(new Roi[] {fg, other}, imp, series, 0))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("[2, 4]");
    // slices read as time points: the slice is the time point
    ImagePlus slices = movie(5, true);
    OpenedSeries sliced = Hyperstacks.of(slices, TimeAxis.SLICES_ARE_FRAMES);
    Roi a = named("fg", 2);
    a.setPosition(3);
    Roi b = named("bg", 20);
    b.setPosition(3);
    assertThat(TimeSeeds.fromRois(new Roi[] {a, b}, slices, sliced, 0).frame()).isEqualTo(2);
  }

  @Test
  void seedImageOverTimeGivesTheTimePointHoldingSeeds() {
    ImagePlus imp = movie(4, false);
    OpenedSeries series = Hyperstacks.of(imp, TimeAxis.AUTO);
    ImagePlus seeds = movie(4, false);
    seeds.setTitle("s");
    seeds.getStack().getProcessor(3).set(5, 5, 1);
    seeds.getStack().getProcessor(3).set(20, 20, 2);
    TimeSeeds s = TimeSeeds.fromImage(seeds, series, 0);
    assertThat(s.frame()).isEqualTo(2);
    assertThat(s.seeds().labels()[5 + 32 * 5]).isEqualTo((byte) 1);
    seeds.getStack().getProcessor(1).set(7, 7, 2);
    assertThatThrownBy(() -> TimeSeeds.fromImage(seeds, series, 0))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("time points 1 and 3");
    // the seed frame setting: beyond the movie is refused; 0 means the current time point
    assertThatThrownBy(
            () -> TimeSeeds.fallbackFrame(imp, series, new TimeSettings(TimeAxis.AUTO, true, 9)))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("seed_frame=9");
    imp.setPosition(1, 1, 3);
    assertThat(TimeSeeds.fallbackFrame(imp, series, TimeSettings.defaults())).isEqualTo(2);
  }

  @Test
  void progressMovesThroughOnePartPerTimePoint() {
    WorkProgressTest.Recorder r = new WorkProgressTest.Recorder();
    WorkProgress p = new WorkProgress(r, 0);
    int frames = 6;
    FrameProgress fp = new FrameProgress(p, frames, 0.9, 1000);
    fp.begin(2);
    double last = -1;
    for (int count = 1; count <= frames; count++) {
      p.tick(System.nanoTime());
      double shown = r.bar.get(r.bar.size() - 1);
      assertThat(shown).isGreaterThanOrEqualTo(last).isLessThan(0.9 * count / frames);
      assertThat(shown).isGreaterThanOrEqualTo(0.9 * (count - 1) / frames - 1e-12);
      assertThat(r.lines.get(r.lines.size() - 1)).contains((count - 1) + " of " + frames + " done");
      last = shown;
      fp.frameDone(count - 1, count);
    }
    assertThat(r.lines.get(0)).contains("time point 3 (the seeds' one)");
    p.close();
  }
}
