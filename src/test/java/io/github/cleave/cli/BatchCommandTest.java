package io.github.cleave.cli;

import static io.github.cleave.cli.MaxflowCommandTest.run;
import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code batch} on a folder of generated images mixed with unusable files: per-file isolation with
 * reasons, identity with single-image {@code apply}, the same bytes whatever {@code --threads}, and
 * the refusals made before anything is segmented.
 */
class BatchCommandTest {
  static final String[] PER_IMAGE = {".mask.tif", ".labels.tif", ".objects.csv", ".rois.zip"};
  static final int SIZE = 128;

  @TempDir static Path shared;
  static Path model;
  static Path in;
  static List<String> good;

  @BeforeAll
  static void writeFolder() throws IOException {
    model = BatchFixtures.model(shared.resolve("model.json"), SIZE);
    in = shared.resolve("in");
    good = BatchFixtures.mixedFolder(in, SIZE);
  }

  @Test
  void mixedFolderSegmentsTheGoodFilesAsApplyDoesAndReportsEachBadOne(@TempDir Path tmp)
      throws IOException {
    Path out = tmp.resolve("out");
    MaxflowCommandTest.Run r =
        run("batch", "--model", model.toString(), "--in", in.toString(), "--out", out.toString());
    assertThat(r.exit()).as(r.err()).isEqualTo(3);
    List<String> rows = Files.readAllLines(out.resolve("files.csv"));
    assertThat(rows.get(0)).isEqualTo("file,status,objects,time_ms,message");
    assertThat(rows).hasSize(1 + 4 + 4); // the ._ file is not an input
    assertThat(String.join("\n", rows)).doesNotContain("._img");
    assertThat(row(rows, "corrupt.tif")).contains(",failed,", "not a readable");
    assertThat(row(rows, "notes.tif")).contains(",failed,", "not a readable TIFF");
    assertThat(row(rows, "colour.tif")).contains(",failed,", "3 channel(s)", "learned on");
    assertThat(row(rows, "empty.tif")).contains(",failed,", "empty (0 bytes)");
    for (String name : good) {
      assertThat(row(rows, name + ".tif")).contains(",ok,");
    }
    assertThat(r.err()).contains("corrupt.tif", "notes.tif", "colour.tif", "empty.tif");
    for (String name : new String[] {"files.csv", "objects.csv", "contact-sheet.png", "run.json"}) {
      assertThat(out.resolve(name)).isRegularFile();
    }
    assertThat(Files.readString(out.resolve("run.json")))
        .contains("\"cleave-batch-run\"", "\"sha256\"", "\"failed\": 4", "\"started\"");
    assertThat(BatchFixtures.hiddenFiles(out)).isEmpty();
    // every good file exactly as single-image apply writes it
    Path single = tmp.resolve("single");
    for (String name : good) {
      MaxflowCommandTest.Run a =
          run(
              "apply",
              "--model",
              model.toString(),
              "--image",
              in.resolve(name + ".tif").toString(),
              "--out",
              single.toString());
      assertThat(a.exit()).as(a.err()).isZero();
      for (String suffix : PER_IMAGE) {
        assertThat(Files.readAllBytes(out.resolve(name + suffix)))
            .as(name + suffix)
            .isEqualTo(Files.readAllBytes(single.resolve(name + suffix)));
      }
    }
    // objects.csv: each image's rows, prefixed by its file, in file order
    List<String> objects = Files.readAllLines(out.resolve("objects.csv"));
    List<String> first = Files.readAllLines(out.resolve("img-00.objects.csv"));
    assertThat(objects.get(0)).isEqualTo("file," + first.get(0));
    assertThat(objects.get(1)).isEqualTo("img-00.tif," + first.get(1));
    long expected = 0;
    for (String name : good) {
      expected += Files.readAllLines(out.resolve(name + ".objects.csv")).size() - 1;
    }
    assertThat(objects).hasSize((int) expected + 1);
  }

  @Test
  void oneAndTwoThreadsWriteTheSameBytes(@TempDir Path tmp) throws IOException {
    Path one = tmp.resolve("one");
    Path two = tmp.resolve("two");
    assertThat(batch(one, "--threads", "1").exit()).isEqualTo(3);
    assertThat(batch(two, "--threads", "2").exit()).isEqualTo(3);
    for (String name : good) {
      for (String suffix : PER_IMAGE) {
        assertThat(Files.readAllBytes(one.resolve(name + suffix)))
            .as(name + suffix)
            .isEqualTo(Files.readAllBytes(two.resolve(name + suffix)));
      }
    }
    for (String name : new String[] {"objects.csv", "contact-sheet.png"}) {
      assertThat(Files.readAllBytes(one.resolve(name)))
          .as(name)
          .isEqualTo(Files.readAllBytes(two.resolve(name)));
    }
    // files.csv: every column but time_ms (column 4, 0-based 3) is reproducible
    assertThat(BatchFixtures.withoutColumn(one.resolve("files.csv"), 3))
        .isEqualTo(BatchFixtures.withoutColumn(two.resolve("files.csv"), 3));
  }

  @Test
  void rerunKeepsCompleteFilesAndRefusesAnotherModel(@TempDir Path tmp) throws IOException {
    Path out = tmp.resolve("out");
    assertThat(batch(out).exit()).isEqualTo(3);
    byte[] record = Files.readAllBytes(out.resolve("img-02.record.json"));
    byte[] sheet = Files.readAllBytes(out.resolve("contact-sheet.png"));
    MaxflowCommandTest.Run again = batch(out);
    assertThat(again.exit()).isEqualTo(3);
    assertThat(again.out()).contains("4 kept from an earlier run");
    assertThat(Files.readAllBytes(out.resolve("img-02.record.json"))).isEqualTo(record);
    assertThat(Files.readAllBytes(out.resolve("contact-sheet.png"))).isEqualTo(sheet);
    // --overwrite recomputes: a new record (its timings differ) with the same mask
    byte[] mask = Files.readAllBytes(out.resolve("img-02.mask.tif"));
    MaxflowCommandTest.Run over = batch(out, "--overwrite");
    assertThat(over.out()).contains("0 kept from an earlier run");
    assertThat(Files.readAllBytes(out.resolve("img-02.mask.tif"))).isEqualTo(mask);
    // another model: refused up front, nothing touched
    Path other = tmp.resolve("other.json");
    Files.writeString(other, Files.readString(model) + "\n");
    MaxflowCommandTest.Run refused =
        run("batch", "--model", other.toString(), "--in", in.toString(), "--out", out.toString());
    assertThat(refused.exit()).isEqualTo(2);
    assertThat(refused.err()).contains("another model", "--overwrite");
    assertThat(out.resolve("run.json")).isRegularFile();
  }

  @Test
  void folderMistakesAreRefusedBeforeAnythingIsWritten(@TempDir Path tmp) throws IOException {
    Path out = tmp.resolve("out");
    MaxflowCommandTest.Run none = batch(out, "--pattern", "*.png");
    assertThat(none.exit()).isEqualTo(2);
    assertThat(none.err()).contains("no file matching '*.png'");
    MaxflowCommandTest.Run same =
        run("batch", "--model", model.toString(), "--in", in.toString(), "--out", in.toString());
    assertThat(same.exit()).isEqualTo(2);
    assertThat(same.err()).contains("is the input folder");
    Path clash = Files.createDirectories(tmp.resolve("clash"));
    Files.copy(in.resolve("img-00.tif"), clash.resolve("a.tif"));
    Files.copy(in.resolve("img-01.tif"), clash.resolve("a.TIFF"));
    MaxflowCommandTest.Run c =
        run(
            "batch",
            "--model",
            model.toString(),
            "--in",
            clash.toString(),
            "--out",
            out.toString());
    assertThat(c.exit()).isEqualTo(2);
    assertThat(c.err()).contains("a.TIFF", "a.tif", "same names");
    MaxflowCommandTest.Run threads = batch(out, "--threads", "0");
    assertThat(threads.exit()).isEqualTo(2);
    assertThat(out).doesNotExist();
  }

  private static MaxflowCommandTest.Run batch(Path out, String... extra) {
    List<String> args =
        new java.util.ArrayList<>(
            List.of(
                "batch",
                "--model",
                model.toString(),
                "--in",
                in.toString(),
                "--out",
                out.toString()));
    args.addAll(List.of(extra));
    return run(args.toArray(String[]::new));
  }

  private static String row(List<String> rows, String file) {
    return rows.stream().filter(l -> l.startsWith(file + ",")).findFirst().orElseThrow();
  }
}
