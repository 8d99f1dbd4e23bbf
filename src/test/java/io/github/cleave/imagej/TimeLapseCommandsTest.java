package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import ij.ImagePlus;
import ij.ImageStack;
import ij.gui.Roi;
import ij.macro.Interpreter;
import ij.measure.Calibration;
import ij.process.ByteProcessor;
import ij.process.ShortProcessor;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.TimeLapseOptions;
import io.github.cleave.segment.TimeLapseResult;
import io.github.cleave.segment.TimeLapseSegmenter;
import io.github.cleave.synth.TimeLapsePhantom;
import java.util.Map;
import java.util.concurrent.CancellationException;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * The time-lapse path of the segmenting commands, run in-process with macro options as a recorded
 * line runs it, on a generated time-lapse ({@link TimeLapsePhantom}) turned into an ImageJ
 * hyperstack, and checked against {@link TimeLapseSegmenter} called directly.
 */
class TimeLapseCommandsTest {
  static final String FAST = " refine=1 illumination=keep";
  static TimeLapsePhantom phantom;
  static ImagePlus movie;
  static ImagePlus seeds;
  static boolean wasBatch;

  @BeforeAll
  static void open() {
    phantom = TimeLapsePhantom.generate(41, 128, 128, 4, 3);
    movie = hyperstack(phantom, "movie.tif", false);
    seeds = seedImage(phantom.seeds(), "movie.seeds.tif");
    wasBatch = Interpreter.batchMode;
    Interpreter.batchMode = true;
    Interpreter.addBatchModeImage(movie);
    Interpreter.addBatchModeImage(seeds);
  }

  @AfterAll
  static void close() {
    Interpreter.removeBatchModeImage(seeds);
    Interpreter.removeBatchModeImage(movie);
    Interpreter.batchMode = wasBatch;
  }

  /** The phantom's frames as 16-bit planes: frames of a hyperstack, or slices of a plain stack. */
  static ImagePlus hyperstack(TimeLapsePhantom p, String title, boolean asSlices) {
    int w = p.frame(0).width();
    int h = p.frame(0).height();
    ImageStack stack = new ImageStack(w, h);
    for (int t = 0; t < p.frameCount(); t++) {
      float[] v = p.frame(t).channel(0);
      short[] s = new short[v.length];
      for (int i = 0; i < v.length; i++) {
        s[i] = (short) Math.round(v[i]);
      }
      stack.addSlice(null, new ShortProcessor(w, h, s, null));
    }
    ImagePlus imp = new ImagePlus(title, stack);
    if (asSlices) {
      imp.setDimensions(1, p.frameCount(), 1);
    } else {
      imp.setDimensions(1, 1, p.frameCount());
      imp.setOpenAsHyperStack(true);
    }
    Calibration cal = imp.getCalibration();
    cal.pixelWidth = 0.325;
    cal.pixelHeight = 0.325;
    cal.setUnit("micron");
    return imp;
  }

  static ImagePlus seedImage(SeedLabels s, String title) {
    return new ImagePlus(title, new ByteProcessor(s.width(), s.height(), s.labels().clone()));
  }

  static Presentable segment(ImagePlus imp, String options) throws Exception {
    return MacroThread.call(
        options,
        imp,
        () -> {
          Map<String, String> values =
              SegmentImageCommand.form(imp).read(null, SettingsFields::settings);
          return SegmentImageCommand.run(imp, values);
        });
  }

  static SegmentationSettings settingsOf(ImagePlus imp, String options) {
    return SettingsFields.settings(SegmentImageCommand.form(imp).fromOptions(options));
  }

  @Test
  void commandGivesTheSegmentersTrackedNumbersAsHyperstacks() throws Exception {
    String options = "seeds=movie.seeds.tif boundary=2" + FAST + " frame_seeds seed_frame=1";
    TimeLapseImages made = (TimeLapseImages) segment(movie, options);
    TimeLapseResult direct =
        TimeLapseSegmenter.segment(
            phantom.series(),
            phantom.seeds(),
            0,
            settingsOf(movie, options),
            TimeLapseOptions.defaults());
    int frames = phantom.frameCount();
    int plane = 128 * 128;
    assertThat(made.result().seedFrame()).isZero();
    for (ImagePlus imp : new ImagePlus[] {made.mask(), made.labels()}) {
      assertThat(imp.getNChannels()).isEqualTo(1);
      assertThat(imp.getNSlices()).isEqualTo(1);
      assertThat(imp.getNFrames()).isEqualTo(frames);
      assertThat(imp.getNDimensions()).isEqualTo(3);
      assertThat(imp.getCalibration().pixelWidth).isEqualTo(0.325);
    }
    assertThat(made.classes()).isNull();
    assertThat(made.labels().getBitDepth()).isEqualTo(16);
    int rows = 0;
    for (int t = 0; t < frames; t++) {
      int[] want = direct.frame(t).trackedLabels();
      short[] got = (short[]) made.labels().getStack().getPixels(t + 1);
      byte[] mask = (byte[]) made.mask().getStack().getPixels(t + 1);
      for (int i = 0; i < plane; i++) {
        assertThat(got[i] & 0xffff).as("frame %d voxel %d", t, i).isEqualTo(want[i]);
      }
      assertThat(mask).isEqualTo(direct.frame(t).segmentation().mask());
      rows += direct.frame(t).objectCount();
    }
    // the phantom's cells never touch, enter or leave: every frame has objects to track
    assertThat(direct.frame(frames - 1).objectCount()).isPositive();
    assertThat(made.table().size()).isEqualTo(rows);
    assertThat(made.table().getColumnIndex("frame"))
        .isLessThan(made.table().getColumnIndex("object"));
    assertThat(made.table().getColumnIndex("object"))
        .isLessThan(made.table().getColumnIndex("pixels"));
    int row = 0;
    for (int t = 0; t < frames; t++) {
      for (var m : direct.frame(t).measurements()) {
        assertThat(made.table().getValue("frame", row)).isEqualTo(t + 1);
        assertThat(made.table().getValue("object", row)).isEqualTo(m.label());
        row++;
      }
    }
    for (Roi roi : made.rois()) {
      assertThat(roi.getName()).matches("object-\\d{4}-t000\\d");
      int t = Integer.parseInt(roi.getName().substring(13));
      assertThat(roi.getTPosition()).isEqualTo(t);
      int number = Integer.parseInt(roi.getName().substring(7, 11));
      java.awt.Rectangle b = roi.getBounds();
      int cx = b.x + b.width / 2;
      int cy = b.y + b.height / 2;
      if (roi.contains(cx, cy)) {
        assertThat(direct.frame(t - 1).trackedLabels()[cx + 128 * cy]).isEqualTo(number);
      }
    }
    assertThat((String) made.mask().getProperty("Info"))
        .contains("seeds: seed image movie.seeds.tif of one time point: time point 1");
    assertThat(made.notes()).isNotEmpty();
  }

  @Test
  void seedsWithoutTimePointBelongToTheCurrentOne() throws Exception {
    ImagePlus at3 = hyperstack(phantom, "movie3.tif", false);
    at3.setPosition(1, 1, 3);
    String options = "seeds=movie.seeds.tif boundary=2" + FAST;
    TimeLapseImages made = (TimeLapseImages) segment(at3, options);
    assertThat(made.result().seedFrame()).isEqualTo(2);
    TimeLapseResult direct =
        TimeLapseSegmenter.segment(
            phantom.series(),
            phantom.seeds(),
            2,
            settingsOf(at3, options),
            TimeLapseOptions.defaults().withSeedsFromNeighbour(false));
    for (int t = 0; t < phantom.frameCount(); t++) {
      assertThat(made.result().frame(t).trackedLabels()).isEqualTo(direct.frame(t).trackedLabels());
    }
  }

  @Test
  void stackWithFrameIntervalIsReadAsTimePointsWithAWarning() throws Exception {
    ImagePlus stack = hyperstack(phantom, "slices.tif", true);
    stack.getCalibration().frameInterval = 5;
    stack.getCalibration().setTimeUnit("sec");
    Interpreter.addBatchModeImage(stack);
    try {
      String options = "seeds=movie.seeds.tif boundary=2" + FAST + " frame_seeds";
      Presentable auto = segment(stack, options);
      assertThat(auto).isInstanceOf(TimeLapseImages.class);
      TimeLapseImages made = (TimeLapseImages) auto;
      assertThat(made.result().frameCount()).isEqualTo(phantom.frameCount());
      assertThat(made.mask().getNFrames()).isEqualTo(phantom.frameCount());
      assertThat(made.mask().getNSlices()).isEqualTo(1);
      assertThat(made.mask().getCalibration().frameInterval).isEqualTo(5);
      OpenedSeries series = TimeLapseRun.series(stack, SettingsFields.time(Map.of()));
      assertThat(series.timeSource()).isEqualTo(OpenedSeries.TimeSource.SLICES_AS_FRAMES);
      assertThat(series.warnings()).isNotEmpty();
      assertThat(made.notes()).containsAll(series.warnings()).contains(series.reason());
      // the same frames as a hyperstack give the same tracked labels
      TimeLapseImages frames = (TimeLapseImages) segment(movie, options);
      for (int t = 0; t < phantom.frameCount(); t++) {
        assertThat(made.result().frame(t).trackedLabels())
            .isEqualTo(frames.result().frame(t).trackedLabels());
      }
      // declared as z planes: one volume, no time axis (seeds on its first plane)
      ImageStack planes = new ImageStack(128, 128);
      planes.addSlice(null, seeds.getProcessor().duplicate());
      for (int z = 1; z < phantom.frameCount(); z++) {
        planes.addSlice(null, new ByteProcessor(128, 128));
      }
      ImagePlus volumeSeeds = new ImagePlus("volume.seeds.tif", planes);
      Interpreter.addBatchModeImage(volumeSeeds);
      Presentable volume;
      try {
        volume =
            segment(
                stack,
                options.replace("movie.seeds.tif", "volume.seeds.tif")
                    + " time=[slices are z planes]");
      } finally {
        Interpreter.removeBatchModeImage(volumeSeeds);
      }
      assertThat(volume).isInstanceOf(SegmentImageCommand.Result.class);
      assertThat(((SegmentImageCommand.Result) volume).images().mask().getNSlices())
          .isEqualTo(phantom.frameCount());
    } finally {
      Interpreter.removeBatchModeImage(stack);
    }
  }

  @Test
  void escapeStopsWithNothingMade() throws Exception {
    int before = Interpreter.getBatchModeImageCount();
    assertThatThrownBy(
            () ->
                MacroThread.call(
                    "seeds=movie.seeds.tif" + FAST,
                    movie,
                    () -> {
                      Map<String, String> values =
                          SegmentImageCommand.form(movie).read(null, SettingsFields::settings);
                      Thread.currentThread().interrupt(); // what Esc does to the worker
                      return SegmentImageCommand.run(movie, values);
                    }))
        .isInstanceOf(CancellationException.class);
    assertThat(Interpreter.getBatchModeImageCount()).isEqualTo(before);
  }

  @Test
  void applyModelRunsOverTimeFromTheSeedFrame() throws Exception {
    String options = "seeds=movie.seeds.tif boundary=2" + FAST + " frame_seeds";
    java.nio.file.Path model = java.nio.file.Files.createTempFile("cleave-model", ".json");
    try {
      TimeLapseImages learned = (TimeLapseImages) segment(movie, options + " save=[" + model + "]");
      TimeLapseImages applied =
          MacroThread.call(
              "model=[" + model + "] seeds=none frame_seeds seed_frame=2",
              movie,
              () ->
                  (TimeLapseImages)
                      ApplyModelCommand.run(
                          movie, ApplyModelCommand.form(movie).read(null, v -> {})));
      assertThat(applied.result().seedFrame()).isEqualTo(1);
      TimeLapseResult direct =
          TimeLapseSegmenter.apply(
              learned.result().model(), phantom.series(), null, 1, TimeLapseOptions.defaults());
      for (int t = 0; t < phantom.frameCount(); t++) {
        assertThat(applied.result().frame(t).trackedLabels())
            .isEqualTo(direct.frame(t).trackedLabels());
      }
    } finally {
      java.nio.file.Files.deleteIfExists(model);
    }
  }
}
