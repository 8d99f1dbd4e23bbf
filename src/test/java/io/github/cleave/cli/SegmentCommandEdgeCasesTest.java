package io.github.cleave.cli;

import static io.github.cleave.cli.MaxflowCommandTest.run;
import static org.assertj.core.api.Assertions.assertThat;

import ij.IJ;
import ij.ImagePlus;
import ij.io.FileSaver;
import ij.measure.Calibration;
import ij.process.ShortProcessor;
import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.SampleWriter;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Edge cases of the segmentation commands: assumed calibration, empty fields, unusable paths. */
class SegmentCommandEdgeCasesTest {
  @TempDir static Path dir;
  static Path grey;

  @BeforeAll
  static void writeInputs() throws IOException {
    SampleWriter.write(SamplePhantoms.nuclei(8, 128, 128), dir, "grey");
    grey = dir.resolve("grey.tif");
  }

  @Test
  void assumedPixelSizeReachesTheMeasurementsAndTheRecord(@TempDir Path tmp) throws IOException {
    ImagePlus imp = IJ.openImage(grey.toString());
    imp.setCalibration(new Calibration()); // no calibration in the file
    Path in = Files.createDirectories(tmp.resolve("in"));
    new FileSaver(imp).saveAsTiff(in.resolve("plain.tif").toString());
    Files.copy(dir.resolve("grey.seeds.tif"), in.resolve("plain.seeds.tif"));
    Path out = tmp.resolve("out");
    MaxflowCommandTest.Run r =
        run(
            "segment",
            "--image",
            in.resolve("plain.tif").toString(),
            "--out",
            out.toString(),
            "--pixel-size",
            "0.5",
            "--unit",
            "um");
    assertThat(r.exit()).as(r.err()).isZero();
    List<String> rows = Files.readAllLines(out.resolve("plain.objects.csv"));
    assertThat(rows.get(0)).contains("area_um2", "perimeter_um");
    String[] header = rows.get(0).split(",");
    String[] first = rows.get(1).split(",");
    // area = pixels x 0.25 um^2 (the assumed pixel size), not the pixel count
    assertThat(Double.parseDouble(first[2]))
        .isCloseTo(Long.parseLong(first[1]) * 0.25, org.assertj.core.data.Offset.offset(1e-6));
    assertThat(header[1]).isEqualTo("pixels");
    assertThat(Files.readString(out.resolve("plain.record.json")))
        .contains("\"x\": 0.5", "\"assumed\": true");
    assertThat(r.err()).contains("assumed 0.5 x 0.5");
  }

  @Test
  void applyingAModelToAFieldWithoutObjectsFindsNone(@TempDir Path tmp) throws IOException {
    Path model = tmp.resolve("m.json");
    assertThat(run("learn", "--image", grey.toString(), "--model", model.toString()).exit())
        .isZero();
    ShortProcessor empty = new ShortProcessor(128, 128);
    empty.add(100);
    Path field = tmp.resolve("empty.tif");
    ImagePlus imp = new ImagePlus("empty", empty);
    imp.setCalibration(IJ.openImage(grey.toString()).getCalibration());
    new FileSaver(imp).saveAsTiff(field.toString());
    MaxflowCommandTest.Run r =
        run(
            "apply",
            "--model",
            model.toString(),
            "--image",
            field.toString(),
            "--out",
            tmp.resolve("out").toString());
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(r.out()).contains("empty: 0 object(s)");
  }

  @Test
  void unusableModelPathsAreRefusedBeforeAnyWork(@TempDir Path tmp) {
    MaxflowCommandTest.Run r =
        run(
            "learn",
            "--image",
            grey.toString(),
            "--model",
            tmp.resolve("missing-folder/m.json").toString());
    assertThat(r.exit()).isEqualTo(2);
    assertThat(r.err()).contains("does not exist").doesNotContain("Exception");
    Path out = tmp.resolve("out");
    r =
        run(
            "segment",
            "--image",
            grey.toString(),
            "--out",
            out.toString(),
            "--save-model",
            tmp.toString());
    assertThat(r.exit()).isEqualTo(2);
    assertThat(r.err()).contains("is a folder");
    assertThat(out).isEmptyDirectory();
  }

  @Test
  void aStackCutPlaneByPlaneKeepsItsPlanesApart(@TempDir Path tmp) throws IOException {
    SampleWriter.write(SamplePhantoms.stack(9, 96, 96, 12), tmp, "stack");
    Path out = tmp.resolve("out");
    MaxflowCommandTest.Run r =
        run(
            "segment",
            "--image",
            tmp.resolve("stack.tif").toString(),
            "--out",
            out.toString(),
            "--per-plane");
    assertThat(r.exit()).as(r.err()).isZero();
    ImagePlus mask = IJ.openImage(out.resolve("stack.mask.tif").toString());
    assertThat(mask.getStackSize()).isEqualTo(12);
    // a volume neighbourhood is refused in per-plane mode
    r =
        run(
            "segment",
            "--image",
            tmp.resolve("stack.tif").toString(),
            "--out",
            tmp.resolve("out2").toString(),
            "--per-plane",
            "--neighborhood",
            "6");
    assertThat(r.exit()).isEqualTo(2);
  }

  @Test
  void demoRefusesToWriteIntoItsSamplesFolder() throws IOException {
    long before;
    try (var s = Files.list(dir)) {
      before = s.count();
    }
    MaxflowCommandTest.Run r = run("demo", "--samples", dir.toString(), "--out", dir.toString());
    assertThat(r.exit()).isEqualTo(2);
    try (var s = Files.list(dir)) {
      assertThat(s.count()).isEqualTo(before);
    }
  }

  @Test
  void aLinkToTheInputFolderIsTheInputFolder(@TempDir Path tmp) throws IOException {
    Path link = Files.createSymbolicLink(tmp.resolve("link"), dir);
    MaxflowCommandTest.Run r = run("segment", "--image", grey.toString(), "--out", link.toString());
    assertThat(r.exit()).isEqualTo(2);
    assertThat(r.err()).contains("output folder");
    assertThat(dir.resolve("grey.mask.tif")).doesNotExist();
  }
}
