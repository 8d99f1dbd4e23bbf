package io.github.cleave.cli;

import static io.github.cleave.cli.MaxflowCommandTest.run;
import static org.assertj.core.api.Assertions.assertThat;

import ij.IJ;
import ij.ImagePlus;
import io.github.cleave.io.ImageFiles;
import io.github.cleave.objects.RoiExport;
import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.SampleWriter;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code segment}, {@code learn}, {@code apply} and {@code demo}, run in-process on phantoms. */
class SegmentCommandsTest {
  static final String[] OUTPUTS = {
    ".mask.tif", ".labels.tif", ".objects.csv", ".rois.zip", ".overlay.png", ".record.json"
  };

  @TempDir static Path shared;
  static Path inputs;

  @BeforeAll
  static void writeInputs() throws IOException {
    inputs = Files.createDirectories(shared.resolve("in"));
    SampleWriter.write(SamplePhantoms.nuclei(11, 160, 128), inputs, "grey");
    SampleWriter.write(SamplePhantoms.stained(12, 128, 96), inputs, "colour");
  }

  @Test
  void segmentWritesEveryOutputConsistently(@TempDir Path out) throws IOException {
    MaxflowCommandTest.Run r =
        run("segment", "--image", inputs.resolve("grey.tif").toString(), "--out", out.toString());
    assertThat(r.exit()).as(r.err()).isZero();
    for (String suffix : OUTPUTS) {
      assertThat(out.resolve("grey" + suffix)).exists();
    }
    ImagePlus mask = IJ.openImage(out.resolve("grey.mask.tif").toString());
    assertThat(mask.getBitDepth()).isEqualTo(8);
    ImagePlus labels = IJ.openImage(out.resolve("grey.labels.tif").toString());
    assertThat(labels.getBitDepth()).isEqualTo(16);
    // the same object numbers in the label image, the CSV and the ROI zip (DESIGN.md)
    int maxLabel = (int) labels.getProcessor().getStatistics().max;
    List<String> rows = Files.readAllLines(out.resolve("grey.objects.csv"));
    assertThat(rows.get(0)).startsWith("object,pixels,area_um2,");
    assertThat(rows).hasSize(maxLabel + 1);
    var rois = RoiExport.readZip(Files.readAllBytes(out.resolve("grey.rois.zip")));
    assertThat(rois).hasSize(maxLabel);
    assertThat(rois).containsKey(String.format("object-%04d", maxLabel));
    assertThat(Files.readString(out.resolve("grey.record.json")))
        .contains("\"sha256\"", "\"flowValue\"", "\"boundaryPenalty\"");
    assertThat(r.out()).contains("grey: ", "object(s)");
    assertNoHiddenFiles(out);
  }

  @Test
  void learnThenApplyEqualsTheSegmentationItLearnedFrom(@TempDir Path tmp) throws IOException {
    Path model = tmp.resolve("m.json");
    Path a = tmp.resolve("a");
    Path b = tmp.resolve("b");
    String image = inputs.resolve("colour.tif").toString();
    assertThat(
            run(
                    "segment",
                    "--image",
                    image,
                    "--out",
                    a.toString(),
                    "--save-model",
                    model.toString())
                .exit())
        .isZero();
    assertThat(
            run(
                    "apply",
                    "--model",
                    model.toString(),
                    "--image",
                    image,
                    "--seeds",
                    inputs.resolve("colour.seeds.tif").toString(),
                    "--out",
                    b.toString())
                .exit())
        .isZero();
    // Applying the refined model with the same seeds re-runs the same refinement from a later
    // start; the mask must be the same segmentation (identical bytes are not promised).
    float[] m1 = ImageFiles.read(a.resolve("colour.mask.tif")).raster().channel(0);
    float[] m2 = ImageFiles.read(b.resolve("colour.mask.tif")).raster().channel(0);
    assertThat(dice(m1, m2)).isGreaterThan(0.98);
    Path learned = tmp.resolve("learned.json");
    MaxflowCommandTest.Run r = run("learn", "--image", image, "--model", learned.toString());
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(Files.readString(learned)).contains("\"format\": \"cleave-model\"");
    assertThat(run("learn", "--image", image, "--model", learned.toString()).exit()).isEqualTo(2);
  }

  @Test
  void demoSegmentsEverySampleAndWritesAContactSheet(@TempDir Path out) throws IOException {
    MaxflowCommandTest.Run r = run("demo", "--samples", inputs.toString(), "--out", out.toString());
    assertThat(r.exit()).as(r.err()).isZero();
    assertThat(out.resolve("contact-sheet.png")).exists();
    assertThat(out.resolve("grey.record.json")).exists();
    assertThat(out.resolve("colour.record.json")).exists();
    assertThat(r.out()).contains("grey: Dice against the truth", "colour: Dice against the truth");
  }

  private static double dice(float[] a, float[] b) {
    long both = 0;
    long sum = 0;
    for (int i = 0; i < a.length; i++) {
      boolean x = a[i] != 0;
      boolean y = b[i] != 0;
      both += x && y ? 1 : 0;
      sum += (x ? 1 : 0) + (y ? 1 : 0);
    }
    return 2.0 * both / sum;
  }

  static void assertNoHiddenFiles(Path folder) throws IOException {
    try (Stream<Path> s = Files.list(folder)) {
      assertThat(s.map(p -> p.getFileName().toString()).filter(n -> n.startsWith("."))).isEmpty();
    }
  }
}
