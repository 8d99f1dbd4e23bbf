package io.github.cleave.cli;

import static io.github.cleave.cli.MaxflowCommandTest.run;
import static org.assertj.core.api.Assertions.assertThat;

import ij.ImagePlus;
import ij.io.FileSaver;
import ij.process.ByteProcessor;
import ij.process.FloatProcessor;
import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.SampleWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Bad input to the segmentation commands: each case gives exit code 2, one line on standard error
 * that names what was wrong, and writes nothing into the output folder.
 */
class SegmentBadInputTest {
  @TempDir static Path dir;
  static Path grey;
  static Path colour;

  @BeforeAll
  static void writeInputs() throws IOException {
    SampleWriter.write(SamplePhantoms.nuclei(3, 96, 96), dir, "grey");
    SampleWriter.write(SamplePhantoms.stained(4, 96, 96), dir, "colour");
    grey = dir.resolve("grey.tif");
    colour = dir.resolve("colour.tif");
  }

  private static void assertRefused(Path out, String expectedText, String... args)
      throws IOException {
    MaxflowCommandTest.Run r = run(args);
    assertThat(r.exit()).as(r.err()).isEqualTo(2);
    // progress lines end in "..."; the error is exactly one other line
    var errors = r.err().lines().filter(l -> !l.endsWith(" ...")).toList();
    assertThat(errors).as(r.err()).hasSize(1);
    assertThat(errors.get(0)).startsWith("cleave: ").containsIgnoringCase(expectedText);
    if (Files.exists(out)) {
      try (Stream<Path> files = Files.list(out)) {
        assertThat(files).as("nothing written").isEmpty();
      }
    }
  }

  private static Path seedImage(String name, int w, int h, int... labels) throws IOException {
    ByteProcessor ip = new ByteProcessor(w, h);
    for (int i = 0; i < labels.length; i += 3) {
      ip.set(labels[i], labels[i + 1], labels[i + 2]);
    }
    Path p = dir.resolve(name);
    new FileSaver(new ImagePlus(name, ip)).saveAsTiff(p.toString());
    return p;
  }

  @Test
  void noSeeds(@TempDir Path out) throws IOException {
    Path lonely = dir.resolve("lonely.tif");
    Files.copy(grey, lonely);
    assertRefused(
        out, "no seeds", "segment", "--image", lonely.toString(), "--out", out.toString());
  }

  @Test
  void seedsOfOneClassOnly(@TempDir Path out) throws IOException {
    Path seeds = seedImage("one-class.tif", 96, 96, 10, 10, 1, 11, 10, 1);
    assertRefused(
        out,
        "background",
        "segment",
        "--image",
        grey.toString(),
        "--seeds",
        seeds.toString(),
        "--out",
        out.toString());
  }

  @Test
  void seedImageOfTheWrongSize(@TempDir Path out) throws IOException {
    Path seeds = seedImage("small.tif", 50, 40, 10, 10, 1, 30, 30, 2);
    assertRefused(
        out,
        "50",
        "segment",
        "--image",
        grey.toString(),
        "--seeds",
        seeds.toString(),
        "--out",
        out.toString());
  }

  @Test
  void notANumberPixels(@TempDir Path out) throws IOException {
    FloatProcessor fp = new FloatProcessor(96, 96);
    fp.setf(5, 7, Float.NaN);
    Path nan = dir.resolve("nan.tif");
    new FileSaver(new ImagePlus("nan", fp)).saveAsTiff(nan.toString());
    assertRefused(
        out,
        "NaN",
        "segment",
        "--image",
        nan.toString(),
        "--seeds",
        dir.resolve("grey.seeds.tif").toString(),
        "--out",
        out.toString());
  }

  @Test
  void unsupportedFileType(@TempDir Path out) throws IOException {
    Path text = dir.resolve("notes.txt");
    Files.writeString(text, "not an image", StandardCharsets.UTF_8);
    assertRefused(out, "notes.txt", "segment", "--image", text.toString(), "--out", out.toString());
  }

  @Test
  void corruptTiffAndPng(@TempDir Path out) throws IOException {
    byte[] tiff = Files.readAllBytes(grey);
    Path truncated = dir.resolve("truncated.tif");
    Files.write(truncated, java.util.Arrays.copyOf(tiff, tiff.length / 2));
    assertRefused(
        out,
        "truncated.tif",
        "segment",
        "--image",
        truncated.toString(),
        "--seeds",
        dir.resolve("grey.seeds.tif").toString(),
        "--out",
        out.toString());
    Path png = dir.resolve("broken.png");
    Files.write(png, new byte[] {(byte) 0x89, 'P', 'N', 'G', 1, 2, 3});
    assertRefused(out, "broken.png", "segment", "--image", png.toString(), "--out", out.toString());
  }

  @Test
  void corruptModelAndRoiZip(@TempDir Path out) throws IOException {
    Path model = dir.resolve("broken.json");
    Files.writeString(
        model, "{\"format\": \"cleave-model\", \"formatVersion\": 1", StandardCharsets.UTF_8);
    assertRefused(
        out,
        "broken.json",
        "apply",
        "--model",
        model.toString(),
        "--image",
        grey.toString(),
        "--out",
        out.toString());
    Path foreign = dir.resolve("foreign.json");
    Files.writeString(foreign, "{\"colour\": 3}", StandardCharsets.UTF_8);
    assertRefused(
        out,
        "not a Cleave model",
        "apply",
        "--model",
        foreign.toString(),
        "--image",
        grey.toString(),
        "--out",
        out.toString());
    Path zip = dir.resolve("broken.seeds.zip");
    Files.write(zip, new byte[] {'P', 'K', 3, 4, 0, 0});
    assertRefused(
        out,
        "broken.seeds.zip",
        "segment",
        "--image",
        grey.toString(),
        "--seeds",
        zip.toString(),
        "--out",
        out.toString());
  }

  @Test
  void modelOfAnotherChannelCount(@TempDir Path tmp) throws IOException {
    Path model = tmp.resolve("grey.json");
    assertThat(run("learn", "--image", grey.toString(), "--model", model.toString()).exit())
        .isZero();
    Path out = tmp.resolve("out");
    assertRefused(
        out,
        "channel",
        "apply",
        "--model",
        model.toString(),
        "--image",
        colour.toString(),
        "--out",
        out.toString());
  }

  @Test
  void outputFolderIsTheInputFolder() throws IOException {
    long before;
    try (Stream<Path> s = Files.list(dir)) {
      before = s.count();
    }
    MaxflowCommandTest.Run r = run("segment", "--image", grey.toString(), "--out", dir.toString());
    assertThat(r.exit()).isEqualTo(2);
    assertThat(r.err()).contains("output folder");
    try (Stream<Path> s = Files.list(dir)) {
      assertThat(s.count()).isEqualTo(before);
    }
  }

  @Test
  void badSettingValues(@TempDir Path out) throws IOException {
    assertRefused(
        out,
        "boundary penalty",
        "segment",
        "--image",
        grey.toString(),
        "--out",
        out.toString(),
        "--boundary-penalty",
        "-1");
    assertRefused(
        out,
        "channel",
        "segment",
        "--image",
        grey.toString(),
        "--out",
        out.toString(),
        "--channels",
        "4");
    assertRefused(
        out,
        "neighborhood",
        "segment",
        "--image",
        grey.toString(),
        "--out",
        out.toString(),
        "--neighborhood",
        "6");
  }
}
