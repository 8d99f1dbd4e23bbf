package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.fail;

import ij.IJ;
import ij.ImagePlus;
import ij.io.RoiEncoder;
import java.awt.GraphicsEnvironment;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.jar.JarOutputStream;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The plugin in a real ImageJ with menus, in a child JVM ({@link MacroRunner}: a watchdog fails the
 * run on any dialog window, and every run has a time limit): the recorder's line for {@code Segment
 * Current Image...}, replayed twice in a fresh ImageJ, gives the command line's mask both times;
 * the example macros of {@code macros/} run and write what they promise. Needs a display (CI:
 * Xvfb); with {@code CLEAVE_REQUIRE_DISPLAY=1} a missing display fails instead of skipping.
 */
class MacroExamplesGuiTest {
  static final Path SAMPLES = Path.of("sample-images").toAbsolutePath();

  @TempDir Path tmp;
  Path ijpath;

  @BeforeEach
  void needsDisplayAndAPluginsFolder() throws IOException {
    if (GraphicsEnvironment.isHeadless()) {
      if ("1".equals(System.getenv("CLEAVE_REQUIRE_DISPLAY"))) {
        fail("CLEAVE_REQUIRE_DISPLAY=1 but there is no display: run under xvfb-run");
      }
      Assumptions.abort("no display");
    }
    // ImageJ reads menu entries from plugins.config in a jar with an underscore in plugins/; the
    // classes themselves come from the class path of the child JVM.
    ijpath = Files.createDirectories(tmp.resolve("ij"));
    Path plugins = Files.createDirectories(ijpath.resolve("plugins"));
    try (OutputStream out = Files.newOutputStream(plugins.resolve("Cleave_.jar"));
        JarOutputStream jar = new JarOutputStream(out)) {
      jar.putNextEntry(new ZipEntry("plugins.config"));
      try (var in = MacroExamplesGuiTest.class.getResourceAsStream("/plugins.config")) {
        jar.write(in.readAllBytes());
      }
      jar.closeEntry();
    }
  }

  private void runImageJ(String... args) throws Exception {
    List<String> cmd = new ArrayList<>();
    cmd.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    cmd.add("-cp");
    cmd.add(System.getProperty("java.class.path"));
    cmd.add("-Duser.home=" + Files.createDirectories(tmp.resolve("home")));
    cmd.add("-Xmx1g");
    cmd.add(MacroRunner.class.getName());
    cmd.add(args[0]);
    cmd.add(ijpath.toString());
    for (int i = 1; i < args.length; i++) {
      cmd.add(args[i]);
    }
    Path log = tmp.resolve("child.log");
    Process p =
        new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(log.toFile()).start();
    if (!p.waitFor(240, TimeUnit.SECONDS)) {
      p.destroyForcibly();
      fail("ImageJ did not finish within 240 s: " + Files.readString(log));
    }
    assertThat(p.exitValue()).as(Files.readString(log)).isZero();
  }

  private Path macro(String text) throws IOException {
    Path m = tmp.resolve("m" + System.nanoTime() + ".ijm");
    Files.writeString(m, text, StandardCharsets.UTF_8);
    return m;
  }

  private static byte[] pixels(Path tif) {
    ImagePlus imp = IJ.openImage(tif.toString());
    assertThat(imp).as(tif.toString()).isNotNull();
    return (byte[]) imp.getProcessor().getPixels();
  }

  @Test
  void recordedLineReplayedInAFreshImageJGivesTheCommandLinesMaskTwice() throws Exception {
    Path recorded = tmp.resolve("recorded.txt");
    runImageJ(
        "record",
        SAMPLES.resolve("nuclei.tif").toString(),
        SAMPLES.resolve("nuclei.seeds.tif").toString(),
        recorded.toString());
    String line =
        Files.readAllLines(recorded).stream()
            .filter(l -> l.startsWith("run(\"Segment Current Image...\""))
            .findFirst()
            .orElseThrow(
                () ->
                    new AssertionError(
                        "nothing recorded: "
                            + readQuietly(recorded)
                            + readQuietly(tmp.resolve("child.log"))));
    assertThat(line).contains("seeds=nuclei.seeds.tif", "boundary=3.5");
    Path out = Files.createDirectories(tmp.resolve("out"));
    String replay =
        "open(\""
            + SAMPLES.resolve("nuclei.tif")
            + "\");\n"
            + "open(\""
            + SAMPLES.resolve("nuclei.seeds.tif")
            + "\");\n"
            + "for (i = 0; i < 2; i++) {\n"
            + "  selectImage(\"nuclei.tif\");\n"
            + "  "
            + line
            + "\n"
            + "  selectImage(\"nuclei.mask\");\n"
            + "  saveAs(\"Tiff\", \""
            + out
            + "/mask\" + i + \".tif\");\n"
            + "  close();\n"
            + "}\n";
    runImageJ("macro", macro(replay).toString());
    Path cli = tmp.resolve("cli");
    assertThat(
            SegmentCommandsInImageJTest.cli(
                "segment",
                "--image",
                SAMPLES.resolve("nuclei.tif").toString(),
                "--seeds",
                SAMPLES.resolve("nuclei.seeds.tif").toString(),
                "--boundary-penalty",
                "3.5",
                "--out",
                cli.toString()))
        .isZero();
    byte[] expected = pixels(cli.resolve("nuclei.mask.tif"));
    assertThat(pixels(out.resolve("mask0.tif"))).isEqualTo(expected);
    assertThat(pixels(out.resolve("mask1.tif"))).isEqualTo(expected);
    assertThat(IJ.openImage(out.resolve("mask0.tif").toString()).getInfoProperty())
        .contains("Made by Cleave", "\"boundaryPenalty\":3.5");
  }

  @Test
  void segmentWithRoiSeedsExample() throws Exception {
    Path folder = Files.createDirectories(tmp.resolve("data"));
    Path image = folder.resolve("nuclei.tif");
    Files.copy(SAMPLES.resolve("nuclei.tif"), image);
    Path zip = folder.resolve("strokes.zip");
    SeedStrokes strokes = StrokePlan.of(SAMPLES.resolve("nuclei.seeds.tif")).strokes(512, 512, 3);
    try (OutputStream out = Files.newOutputStream(zip);
        ZipOutputStream z = new ZipOutputStream(out)) {
      int i = 0;
      for (SeedStrokes.Stroke s : strokes.strokes()) {
        var roi = s.toRoi(++i, false);
        z.putNextEntry(new ZipEntry(roi.getName() + ".roi"));
        z.write(RoiEncoder.saveAsByteArray(roi));
        z.closeEntry();
      }
    }
    runImageJ(
        "macro",
        Path.of("macros/segment-with-roi-seeds.ijm").toAbsolutePath().toString(),
        "image=" + image + " seeds=" + zip);
    Path cli = tmp.resolve("cli");
    assertThat(
            SegmentCommandsInImageJTest.cli(
                "segment",
                "--image",
                image.toString(),
                "--seeds",
                zip.toString(),
                "--out",
                cli.toString()))
        .isZero();
    assertThat(pixels(folder.resolve("nuclei.mask.tif")))
        .isEqualTo(pixels(cli.resolve("nuclei.mask.tif")));
    assertThat(folder.resolve("nuclei.labels.tif")).exists();
    assertThat(Files.readAllLines(folder.resolve("nuclei.objects.csv")))
        .hasSameSizeAs(Files.readAllLines(cli.resolve("nuclei.objects.csv")));
  }

  @Test
  void applyModelToFolderExample() throws Exception {
    Path in = Files.createDirectories(tmp.resolve("in"));
    Path out = Files.createDirectories(tmp.resolve("results"));
    Files.copy(SAMPLES.resolve("nuclei.tif"), in.resolve("a.tif"));
    Files.copy(SAMPLES.resolve("nuclei.tif"), in.resolve("b.tif"));
    Path model = tmp.resolve("model.json");
    assertThat(
            SegmentCommandsInImageJTest.cli(
                "learn",
                "--image",
                SAMPLES.resolve("nuclei.tif").toString(),
                "--seeds",
                SAMPLES.resolve("nuclei.seeds.tif").toString(),
                "--model",
                model.toString()))
        .isZero();
    runImageJ(
        "macro",
        Path.of("macros/apply-model-to-folder.ijm").toAbsolutePath().toString(),
        "model=" + model + " input=" + in + " output=" + out);
    Path cli = tmp.resolve("cli");
    assertThat(
            SegmentCommandsInImageJTest.cli(
                "apply",
                "--model",
                model.toString(),
                "--image",
                in.resolve("a.tif").toString(),
                "--out",
                cli.toString()))
        .isZero();
    byte[] expected = pixels(cli.resolve("a.mask.tif"));
    assertThat(pixels(out.resolve("a.mask.tif"))).isEqualTo(expected);
    assertThat(pixels(out.resolve("b.mask.tif"))).isEqualTo(expected);
    assertThat(out.resolve("a.objects.csv")).exists();
  }

  private static String readQuietly(Path p) {
    try {
      return Files.readString(p);
    } catch (IOException e) {
      return e.toString();
    }
  }
}
