package io.github.cleave.cli;

import static io.github.cleave.cli.MaxflowCommandTest.run;
import static org.assertj.core.api.Assertions.assertThat;

import ij.IJ;
import ij.ImagePlus;
import ij.ImageStack;
import ij.io.FileSaver;
import ij.measure.Calibration;
import ij.process.ByteProcessor;
import ij.process.ShortProcessor;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.objects.RoiExport;
import io.github.cleave.quality.Agreement;
import io.github.cleave.synth.CellPhantom;
import io.github.cleave.synth.TimeLapsePhantom;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code segment} and {@code apply} on three classes and on time-lapses, run in-process on
 * generated images written as files. Agreement is the Dice coefficient (L. R. Dice, Ecology
 * 26(3):297–302, 1945); floors are the goals for these phantoms (0.93 per class, 0.95 per time
 * point). ImageJ's hyperstack order (channel, slice, frame) is that of {@code
 * ImagePlus.getStackIndex} in the ImageJ API documentation.
 */
class ClassesAndTimeCommandsTest {
  private static final int FRAMES = 5;

  @TempDir static Path shared;
  static Path cells;
  static Path lapse;
  static Path asSlices;
  static TimeLapsePhantom phantom;

  @BeforeAll
  static void writeInputs() throws IOException {
    Path in = Files.createDirectories(shared.resolve("in"));
    CellPhantom p = CellPhantom.make(21);
    cells = in.resolve("cells.tif");
    save(grey16(List.of(p.image()), 1, 1), cells);
    save(bytes(p.seeds()), in.resolve("cells.seeds.tif"));
    phantom = TimeLapsePhantom.generate(5, 160, 128, FRAMES, 5);
    java.util.ArrayList<Raster> frames = new java.util.ArrayList<>();
    for (int t = 0; t < FRAMES; t++) {
      frames.add(phantom.frame(t));
    }
    lapse = in.resolve("lapse.tif");
    ImagePlus hyper = grey16(frames, 1, FRAMES);
    hyper.getCalibration().frameInterval = 30;
    hyper.getCalibration().setTimeUnit("s");
    save(hyper, lapse);
    save(bytes(phantom.seeds()), in.resolve("lapse.seeds.tif"));
    asSlices = in.resolve("slices.tif");
    ImagePlus slices = grey16(frames, FRAMES, 1);
    slices.getCalibration().frameInterval = 30;
    save(slices, asSlices);
    save(bytes(phantom.seeds()), in.resolve("slices.seeds.tif"));
  }

  @Test
  void threeClassSeedsWriteAClassMapAndAClassColumn(@TempDir Path out) throws IOException {
    MaxflowCommandTest.Run r = run("segment", "--image", cells.toString(), "--out", out.toString());
    assertThat(r.exit()).as(r.err()).isZero();
    ImagePlus classes = IJ.openImage(out.resolve("cells.classes.tif").toString());
    assertThat(classes.getBitDepth()).isEqualTo(8);
    byte[] values = (byte[]) classes.getProcessor().getPixels();
    CellPhantom truth = CellPhantom.make(21);
    for (int c = 1; c <= 3; c++) {
      assertThat(Agreement.dice(ones(values, c), truth.truthOf(c)))
          .as("class %d", c)
          .isGreaterThanOrEqualTo(0.93);
    }
    List<String> rows = Files.readAllLines(out.resolve("cells.objects.csv"));
    assertThat(rows.get(0)).startsWith("object,class,pixels,");
    assertThat(rows.stream().skip(1).map(l -> l.split(",")[1]).distinct().sorted())
        .containsExactly("1", "3");
    var rois = RoiExport.readZip(Files.readAllBytes(out.resolve("cells.rois.zip")));
    assertThat(rois).hasSize(rows.size() - 1);
    assertThat(rois.keySet().stream().map(k -> k.substring(k.indexOf("-class"))).distinct())
        .containsExactlyInAnyOrder("-class1", "-class3");
    assertThat(Files.readString(out.resolve("cells.record.json")))
        .contains("\"classes\": 3", "\"objectsPerClass\"");
  }

  @Test
  void aTimeLapseIsCutTimePointByTimePointWithStableNumbers(@TempDir Path out) throws IOException {
    MaxflowCommandTest.Run r = run("segment", "--image", lapse.toString(), "--out", out.toString());
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(r.err()).contains(FRAMES + " time points");
    checkTimeLapse(out, "lapse");
    assertThat(Files.readString(out.resolve("lapse.record.json")))
        .contains("\"timeLapse\"", "\"timePoints\": " + FRAMES);
  }

  @Test
  void slicesWithAFrameIntervalAreReadAsTimePointsUnlessToldOtherwise(@TempDir Path out)
      throws IOException {
    MaxflowCommandTest.Run r =
        run("segment", "--image", asSlices.toString(), "--out", out.toString());
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(r.err()).contains("cleave: note: ");
    checkTimeLapse(out, "slices");
    // told that the slices are z planes, the file is one volume: the seeds of one time point no
    // longer fit it
    r =
        run(
            "segment",
            "--image",
            asSlices.toString(),
            "--time-axis",
            "z",
            "--out",
            out.resolve("volume").toString());
    assertThat(r.exit()).isEqualTo(2);
    assertThat(r.err()).contains("160 x 128 x " + FRAMES);
    assertThat(
            run(
                    "segment",
                    "--image",
                    asSlices.toString(),
                    "--time-axis",
                    "later",
                    "--out",
                    out.resolve("bad").toString())
                .exit())
        .isEqualTo(2);
  }

  @Test
  void aSavedModelAppliesToEveryTimePoint(@TempDir Path tmp) throws IOException {
    Path model = tmp.resolve("m.json");
    MaxflowCommandTest.Run r =
        run(
            "segment",
            "--image",
            lapse.toString(),
            "--out",
            tmp.resolve("a").toString(),
            "--save-model",
            model.toString());
    assertThat(r.exit()).as(r.err()).isZero();
    Path out = tmp.resolve("b");
    r =
        run(
            "apply",
            "--model",
            model.toString(),
            "--image",
            lapse.toString(),
            "--seeds",
            lapse.resolveSibling("lapse.seeds.tif").toString(),
            "--out",
            out.toString());
    assertThat(r.exit()).as(r.err()).isZero();
    checkTimeLapse(out, "lapse");
    Path learned = tmp.resolve("learned.json");
    r = run("learn", "--image", lapse.toString(), "--model", learned.toString());
    assertThat(r.exit()).as(r.err()).isZero();
    r =
        run(
            "learn",
            "--image",
            lapse.toString(),
            "--seed-time-point",
            "9",
            "--model",
            tmp.resolve("late.json").toString());
    assertThat(r.exit()).isEqualTo(2);
    assertThat(r.err()).contains("--seed-time-point 9", "time points 1 to " + FRAMES);
  }

  @Test
  void aFolderRunCutsATimeLapseBesideSinglePlanes(@TempDir Path tmp) throws IOException {
    Path model = tmp.resolve("m.json");
    assertThat(
            run(
                    "segment",
                    "--image",
                    lapse.toString(),
                    "--out",
                    tmp.resolve("a").toString(),
                    "--save-model",
                    model.toString())
                .exit())
        .isZero();
    Path folder = Files.createDirectories(tmp.resolve("folder"));
    Files.copy(lapse, folder.resolve("lapse.tif"));
    save(grey16(List.of(phantom.frame(0)), 1, 1), folder.resolve("single.tif"));
    Path out = tmp.resolve("out");
    MaxflowCommandTest.Run r =
        run(
            "batch",
            "--model",
            model.toString(),
            "--in",
            folder.toString(),
            "--out",
            out.toString(),
            "--threads",
            "2");
    assertThat(r.exit()).as(r.err()).isZero();
    checkTimeLapse(out, "lapse");
    ImagePlus single = IJ.openImage(out.resolve("single.mask.tif").toString());
    assertThat(single.getStackSize()).isEqualTo(1);
    assertThat(Files.readString(out.resolve("files.csv"))).contains("lapse.tif", "single.tif");
    String[] again = {
      "batch", "--model", model.toString(), "--in", folder.toString(), "--out", out.toString()
    };
    r = run(again);
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(r.out()).contains("2 kept from an earlier run");
    // other time settings: the time-lapse is cut again, the single plane kept
    String[] other = java.util.Arrays.copyOf(again, again.length + 2);
    other[again.length] = "--seeds-from-neighbour";
    other[again.length + 1] = "off";
    r = run(other);
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(r.out()).contains("1 kept from an earlier run");
  }

  /** Every time point agrees with the truth and every cell keeps one number. */
  private static void checkTimeLapse(Path out, String name) throws IOException {
    ImagePlus mask = IJ.openImage(out.resolve(name + ".mask.tif").toString());
    ImagePlus labels = IJ.openImage(out.resolve(name + ".labels.tif").toString());
    assertThat(mask.getNFrames()).isEqualTo(FRAMES);
    assertThat(labels.getNFrames()).isEqualTo(FRAMES);
    Map<Integer, Integer> numberOfCell = new HashMap<>();
    for (int t = 0; t < FRAMES; t++) {
      byte[] m = (byte[]) mask.getStack().getPixels(mask.getStackIndex(1, 1, t + 1));
      assertThat(Agreement.dice(m, phantom.truth(t)))
          .as("time point %d", t + 1)
          .isGreaterThan(0.95);
      short[] l = (short[]) labels.getStack().getPixels(labels.getStackIndex(1, 1, t + 1));
      int[] cells = phantom.truthLabels(t);
      Map<Integer, int[]> votes = new HashMap<>();
      for (int i = 0; i < l.length; i++) {
        if (cells[i] != 0 && l[i] != 0) {
          votes.computeIfAbsent(cells[i], k -> new int[65536])[l[i] & 0xffff]++;
        }
      }
      for (var e : votes.entrySet()) {
        int best = 0;
        for (int k = 1; k < e.getValue().length; k++) {
          best = e.getValue()[k] > e.getValue()[best] ? k : best;
        }
        Integer before = numberOfCell.putIfAbsent(e.getKey(), best);
        assertThat(before == null ? best : before)
            .as("cell %d at t %d", e.getKey(), t + 1)
            .isEqualTo(best);
      }
    }
    List<String> rows = Files.readAllLines(out.resolve(name + ".objects.csv"));
    // the frame interval of 30 s gives a time column
    assertThat(rows.get(0)).startsWith("frame,time_s,object,pixels,");
    assertThat(rows.get(rows.size() - 1)).startsWith(FRAMES + "," + (FRAMES - 1) * 30 + ".000000,");
    assertThat(rows.stream().skip(1).map(row -> row.split(",")[0]).distinct()).hasSize(FRAMES);
    var rois = RoiExport.readZip(Files.readAllBytes(out.resolve(name + ".rois.zip")));
    assertThat(rois).hasSize(rows.size() - 1);
    assertThat(rois.keySet()).allMatch(k -> k.matches("object-\\d{4}-t\\d{4}"));
    assertThat(rois.values()).allMatch(roi -> roi.getTPosition() >= 1);
    assertThat(out.resolve(name + ".overlay.png")).exists();
  }

  private static byte[] ones(byte[] values, int c) {
    byte[] out = new byte[values.length];
    for (int i = 0; i < out.length; i++) {
      out[i] = values[i] == c ? (byte) 1 : 0;
    }
    return out;
  }

  /** Rasters as a 16-bit hyperstack of {@code slices} × {@code frames}, one plane each. */
  private static ImagePlus grey16(List<Raster> planes, int slices, int frames) {
    Raster first = planes.get(0);
    ImageStack stack = new ImageStack(first.width(), first.height());
    for (Raster r : planes) {
      float[] v = r.channel(0);
      short[] s = new short[v.length];
      for (int i = 0; i < v.length; i++) {
        s[i] = (short) Math.round(v[i]);
      }
      stack.addSlice(null, new ShortProcessor(r.width(), r.height(), s, null));
    }
    ImagePlus imp = new ImagePlus("phantom", stack);
    imp.setDimensions(1, slices, frames);
    if (frames > 1) {
      imp.setOpenAsHyperStack(true);
    }
    Calibration cal = imp.getCalibration();
    cal.pixelWidth = first.voxelSize().x();
    cal.pixelHeight = first.voxelSize().y();
    cal.setUnit("um");
    return imp;
  }

  private static ImagePlus bytes(SeedLabels seeds) {
    return new ImagePlus(
        "seeds", new ByteProcessor(seeds.width(), seeds.height(), seeds.labels().clone()));
  }

  private static void save(ImagePlus imp, Path file) throws IOException {
    if (!new FileSaver(imp).saveAsTiff(file.toString())) {
      throw new IOException("could not save " + file);
    }
  }
}
