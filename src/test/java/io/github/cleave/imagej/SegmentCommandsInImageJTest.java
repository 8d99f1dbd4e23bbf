package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import ij.IJ;
import ij.ImagePlus;
import ij.macro.Interpreter;
import io.github.cleave.cli.CleaveCommand;
import io.github.cleave.image.BadInputException;
import io.github.cleave.io.ImageOutputs;
import io.github.cleave.segment.Segmentation;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The macro-recordable commands run in-process with macro options, as a recorded {@code run(...)}
 * line runs them, and compared with the command line on the bundled samples.
 */
class SegmentCommandsInImageJTest {
  static final Path SAMPLES = Path.of("sample-images");

  @TempDir static Path shared;
  static ImagePlus image;
  static ImagePlus seeds;
  static Path cliOut;
  static boolean wasBatch;

  @BeforeAll
  static void openAndRunTheCommandLine() {
    image = IJ.openImage(SAMPLES.resolve("nuclei.tif").toString());
    seeds = IJ.openImage(SAMPLES.resolve("nuclei.seeds.tif").toString());
    wasBatch = Interpreter.batchMode;
    Interpreter.batchMode = true;
    Interpreter.addBatchModeImage(image); // open images the seeds field can name
    Interpreter.addBatchModeImage(seeds);
    cliOut = shared.resolve("cli");
    int exit =
        cli(
            "segment",
            "--image",
            SAMPLES.resolve("nuclei.tif").toString(),
            "--seeds",
            SAMPLES.resolve("nuclei.seeds.tif").toString(),
            "--boundary-penalty",
            "3.5",
            "--save-model",
            shared.resolve("cli-model.json").toString(),
            "--out",
            cliOut.toString());
    assertThat(exit).isZero();
  }

  @AfterAll
  static void close() {
    Interpreter.removeBatchModeImage(seeds);
    Interpreter.removeBatchModeImage(image);
    Interpreter.batchMode = wasBatch;
  }

  static int cli(String... args) {
    var cl = CleaveCommand.newCommandLine();
    cl.setOut(new PrintWriter(new StringWriter(), true));
    cl.setErr(new PrintWriter(new StringWriter(), true));
    return cl.execute(args);
  }

  static SegmentImageCommand.Result segment(String options) throws Exception {
    return MacroThread.call(
        options,
        image,
        () -> {
          Map<String, String> values =
              SegmentImageCommand.form(image).read(null, SettingsFields::settings);
          return (SegmentImageCommand.Result) SegmentImageCommand.run(image, values);
        });
  }

  @Test
  void recordedLineGivesTheCommandLinesMaskByteForByte(@TempDir Path tmp) throws Exception {
    byte[] before = pixelsOf(image);
    double min = image.getDisplayRangeMin();
    double max = image.getDisplayRangeMax();
    SegmentImageCommand.Result r = segment("seeds=nuclei.seeds.tif boundary=3.5");
    Segmentation s = r.segmentation();
    Path mine = tmp.resolve("nuclei.mask.tif");
    ImageOutputs.writeMask(mine, s.mask(), 512, 512, 1, s.voxelSize());
    assertThat(Files.readAllBytes(mine))
        .isEqualTo(Files.readAllBytes(cliOut.resolve("nuclei.mask.tif")));
    ImagePlus cliMask = IJ.openImage(cliOut.resolve("nuclei.mask.tif").toString());
    assertThat((byte[]) r.images().mask().getProcessor().getPixels())
        .isEqualTo((byte[]) cliMask.getProcessor().getPixels());
    // the label image and the objects of the command line
    ImagePlus cliLabels = IJ.openImage(cliOut.resolve("nuclei.labels.tif").toString());
    assertThat((short[]) r.images().labels().getProcessor().getPixels())
        .isEqualTo((short[]) cliLabels.getProcessor().getPixels());
    List<String> csv = Files.readAllLines(cliOut.resolve("nuclei.objects.csv"));
    assertThat(r.images().table().size()).isEqualTo(csv.size() - 1);
    assertThat(r.images().table().getColumnHeadings()).contains("area_um2");
    // calibrated units: the first object's area as in the CSV (0.325 um pixels, sample README)
    double area = Double.parseDouble(csv.get(1).split(",")[2]);
    assertThat(r.images().table().getValue("area_um2", 0)).isCloseTo(area, within(1e-6));
    // the original image is only read
    assertThat(pixelsOf(image)).isEqualTo(before);
    assertThat(image.getDisplayRangeMin()).isEqualTo(min);
    assertThat(image.getDisplayRangeMax()).isEqualTo(max);
    // the image info says how the mask was made
    String info = (String) r.images().mask().getProperty("Info");
    assertThat(info)
        .contains("Made by Cleave ", "Segment Current Image", "\"boundaryPenalty\":3.5")
        .contains("flow value = cut value: " + s.flowValue(), "seeds: nuclei.seeds.tif");
    assertThat(r.images().mask().getCalibration().getUnit())
        .isEqualTo(image.getCalibration().getUnit());
  }

  @Test
  void sameLineTwiceGivesTheSameOutput() throws Exception {
    String line = "seeds=nuclei.seeds.tif boundary=1 refine=0 illumination=keep";
    Segmentation a = segment(line).segmentation();
    Segmentation b = segment(line).segmentation();
    assertThat(b.mask()).isEqualTo(a.mask());
    assertThat(b.objects().labels()).isEqualTo(a.objects().labels());
    assertThat(b.flowValue()).isEqualTo(a.flowValue());
  }

  @Test
  void applyModelAndSaveModelMatchTheCommandLine(@TempDir Path tmp) throws Exception {
    Path model = tmp.resolve("plugin-model.json");
    segment("seeds=nuclei.seeds.tif boundary=3.5 save=[" + model + "]");
    // the model saved by the plugin is the command line's, byte for byte
    assertThat(Files.readAllBytes(model))
        .isEqualTo(Files.readAllBytes(shared.resolve("cli-model.json")));
    Path out = tmp.resolve("cli-apply");
    assertThat(
            cli(
                "apply",
                "--model",
                model.toString(),
                "--image",
                SAMPLES.resolve("nuclei.tif").toString(),
                "--out",
                out.toString()))
        .isZero();
    SegmentImageCommand.Result r =
        MacroThread.call(
            "model=[" + model + "] seeds=none",
            image,
            () ->
                (SegmentImageCommand.Result)
                    ApplyModelCommand.run(
                        image, ApplyModelCommand.form(image).read(null, v -> {})));
    ImagePlus cliMask = IJ.openImage(out.resolve("nuclei.mask.tif").toString());
    assertThat((byte[]) r.images().mask().getProcessor().getPixels())
        .isEqualTo((byte[]) cliMask.getProcessor().getPixels());
  }

  @Test
  void invalidValuesAreRefusedNamingTheKey() {
    String[][] cases = {
      {"seeds=nuclei.seeds.tif boundary=-1", "boundary=-1"},
      {"seeds=nuclei.seeds.tif boundary=abc", "boundary=abc"},
      {"seeds=nuclei.seeds.tif contrast=0", "contrast=0"},
      {"seeds=nuclei.seeds.tif neighborhood=5", "neighborhood=5"},
      {"seeds=nuclei.seeds.tif likelihood=magic", "likelihood=magic"},
      {"seeds=nuclei.seeds.tif refine=21", "refinement rounds 21"},
      {"seeds=nuclei.seeds.tif channels=0", "channels=0"},
      {"seeds=nuclei.seeds.tif split=half", "split=half"},
      {"seeds=nuclei.seeds.tif min=-3", "min=-3"},
      {"seeds=missing.tif", "seeds=missing.tif"},
      {"seeds=nuclei.tif", "seed image nuclei.tif has the value"},
    };
    for (String[] c : cases) {
      assertThatThrownBy(() -> segment(c[0]))
          .as(c[0])
          .isInstanceOf(BadInputException.class)
          .hasMessageContaining(c[1]);
    }
  }

  @Test
  void commandEntryLogsAProblemInsteadOfThrowing() throws Exception {
    // The whole menu entry, as ImageJ calls it: an invalid value is reported (Log line and macro
    // abort), no exception escapes and no result image appears.
    int before = Interpreter.getBatchModeImageCount();
    MacroThread.call(
        "seeds=nuclei.seeds.tif boundary=-1",
        image,
        () -> {
          new CommandGate().run("SegmentImageCommand");
          return null;
        });
    assertThat(Interpreter.getBatchModeImageCount()).isEqualTo(before);
  }

  @Test
  void dialogKeysAreUniqueAndTheCommandLinesNames() {
    List<String> keys =
        SegmentImageCommand.form(image).fields().stream().map(FormField::key).toList();
    assertThat(keys)
        .doesNotHaveDuplicates()
        .containsExactly(
            "seeds",
            "boundary",
            "contrast",
            "neighborhood",
            "likelihood",
            "refine",
            "channels",
            "measure",
            "illumination",
            "flatten",
            "per-plane",
            "holes",
            "split",
            "min",
            "max",
            "exclude",
            "edge",
            "time",
            "frame_seeds",
            "seed_frame",
            "save",
            "add");
    assertThat(ApplyModelCommand.form(image).fields().stream().map(FormField::key).toList())
        .containsExactly("model", "seeds", "time", "frame_seeds", "seed_frame", "add");
    assertThat(SegmentFolderCommand.form().fields().stream().map(FormField::key).toList())
        .containsExactly(
            "model",
            "input",
            "output",
            "seeds",
            "pattern",
            "threads",
            "recursive",
            "overwrite",
            "time",
            "frame_seeds",
            "seed_frame");
  }

  static org.assertj.core.data.Offset<Double> within(double d) {
    return org.assertj.core.data.Offset.offset(d);
  }

  private static byte[] pixelsOf(ImagePlus imp) {
    short[] p = (short[]) imp.getProcessor().getPixels();
    byte[] b = new byte[p.length * 2];
    for (int i = 0; i < p.length; i++) {
      b[2 * i] = (byte) p[i];
      b[2 * i + 1] = (byte) (p[i] >> 8);
    }
    return Arrays.copyOf(b, b.length);
  }
}
