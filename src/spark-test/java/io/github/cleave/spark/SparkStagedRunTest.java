package io.github.cleave.spark;

import static io.github.cleave.spark.SparkFixtures.batch;
import static io.github.cleave.spark.SparkFixtures.job;
import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.cli.BatchFixtures;
import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.SampleWriter;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The job with Hadoop file system URLs ({@code file:} URLs here, the local file system reached
 * through Hadoop's client, so every file is staged: copied to the task's local folder and its
 * outputs back) in {@code local[2]}, against {@code batch} on plain paths on the batch tests'
 * folder of good and unusable files: the same outputs byte for byte except times and the paths the
 * run files name; resume, {@code --overwrite}, leftover temporary files and the folder's marker.
 */
class SparkStagedRunTest extends MixedFolderJobTest {

  @Test
  void urlsGiveTheOutputsOfPlainPaths(@TempDir Path tmp) throws IOException {
    Path plain = tmp.resolve("plain");
    Path staged = tmp.resolve("staged");
    SparkFixtures.Run b = batch(plainArgs(plain, "--threads", "2"));
    SparkFixtures.Run s = job(sc, urlArgs(staged, "--files-per-partition", "3"));
    assertThat(b.exit()).as(b.err()).isEqualTo(3);
    assertThat(s.exit()).as(s.err()).isEqualTo(3);
    assertThat(s.out()).isEqualTo(b.out().replace(plain.toString(), url(staged)));
    for (String bad : List.of("corrupt.tif", "notes.tif", "colour.tif", "empty.tif")) {
      assertThat(s.err()).contains("cleave: " + bad + ": ");
    }
    assertThat(s.err()).contains("cleave: spark: 8/8 files (4 failed), 3/3 partitions");
    SparkFixtures.assertSameOutputs(plain, staged, renamed(staged, plain));
    // the rewriting of paths keeps every other byte: there and back gives the same file
    Path copy = tmp.resolve("copy.json");
    String far = "hdfs://node:8020/a \"b\"<c>";
    for (String name : good) {
      Path record = plain.resolve(name + ".record.json");
      Files.copy(record, copy, StandardCopyOption.REPLACE_EXISTING);
      JsonPaths.record(copy, p -> far + p);
      assertThat(Files.readString(copy))
          .contains("hdfs://node:8020/a")
          .isNotEqualTo(Files.readString(record));
      JsonPaths.record(copy, p -> p.substring(far.length()));
      assertThat(Files.readAllBytes(copy)).isEqualTo(Files.readAllBytes(record));
    }
    Files.copy(plain.resolve("run.json"), copy, StandardCopyOption.REPLACE_EXISTING);
    JsonPaths.run(copy, far, far + 1, far + 2, null);
    assertThat(Files.readString(copy))
        .doesNotContain(in.toString(), plain.toString(), model.toString());
    JsonPaths.run(copy, model.toString(), in.toString(), plain.toString(), null);
    assertThat(Files.readAllBytes(copy)).isEqualTo(Files.readAllBytes(plain.resolve("run.json")));
    Files.copy(plain.resolve("run.started.json"), copy, StandardCopyOption.REPLACE_EXISTING);
    JsonPaths.started(copy, far);
    assertThat(Files.readString(copy)).doesNotContain(model.toString());
    JsonPaths.started(copy, model.toString());
    assertThat(Files.readAllBytes(copy))
        .isEqualTo(Files.readAllBytes(plain.resolve("run.started.json")));
    for (String name : good) {
      assertThat(staged.resolve(name + ".mask.tif")).isRegularFile();
      assertThat(Files.readString(staged.resolve(name + ".record.json")))
          .contains("\"path\": \"file:" + in.resolve(name + ".tif") + "\"");
    }
  }

  @Test
  void subfoldersAndSeedsThroughUrlsGiveTheOutputsOfPlainPaths(@TempDir Path tmp)
      throws IOException {
    Path tree = tmp.resolve("tree");
    Path seeds = tmp.resolve("seeds");
    Path scratch = Files.createDirectories(tmp.resolve("scratch"));
    for (String dir : List.of("day1", "day2", ".hidden")) {
      Files.createDirectories(tree.resolve(dir));
    }
    Files.createDirectories(seeds.resolve("day2"));
    SampleWriter.write(SamplePhantoms.nuclei(3, SIZE, SIZE), scratch, "a");
    SampleWriter.write(SamplePhantoms.nuclei(4, SIZE, SIZE), scratch, "b");
    Files.copy(scratch.resolve("a.tif"), tree.resolve("day1/a.tif"));
    Files.copy(scratch.resolve("b.tif"), tree.resolve("day1/b.tif"));
    Files.copy(scratch.resolve("b.seeds.tif"), tree.resolve("day1/b.seeds.tif"));
    Files.copy(scratch.resolve("a.tif"), tree.resolve("day2/a.tif"));
    Files.copy(scratch.resolve("a.seeds.tif"), seeds.resolve("day2/a.seeds.tif"));
    Files.copy(scratch.resolve("a.tif"), tree.resolve(".hidden/a.tif"));
    Path plain = tmp.resolve("plain");
    Path staged = tmp.resolve("staged");
    SparkFixtures.Run b =
        batch(
            "--model",
            model.toString(),
            "--in",
            tree.toString(),
            "--out",
            plain.toString(),
            "--seeds",
            seeds.toString(),
            "--recursive",
            "--threads",
            "2");
    SparkFixtures.Run s =
        job(
            sc,
            "--model",
            url(model),
            "--in",
            url(tree),
            "--out",
            url(staged),
            "--seeds",
            url(seeds),
            "--recursive");
    assertThat(b.exit()).as(b.err()).isEqualTo(0);
    assertThat(s.exit()).as(s.err()).isEqualTo(0);
    Map<String, String> renamed = new LinkedHashMap<>();
    renamed.put(url(model), model.toString());
    renamed.put(url(tree), tree.toString());
    renamed.put("file:" + tree, tree.toString());
    renamed.put(url(seeds), seeds.toString());
    renamed.put("file:" + seeds, seeds.toString());
    SparkFixtures.assertSameOutputs(plain, staged, renamed);
    assertThat(SparkFixtures.files(staged))
        .contains("day1/a.mask.tif", "day1/b.mask.tif", "day2/a.mask.tif")
        .noneMatch(f -> f.contains("hidden"));
    assertThat(Files.readString(staged.resolve("day1/a.record.json"))).doesNotContain("\"seeds\"");
    assertThat(Files.readString(staged.resolve("day1/b.record.json")))
        .contains("file:" + tree.resolve("day1/b.seeds.tif"));
    assertThat(Files.readString(staged.resolve("day2/a.record.json")))
        .contains("file:" + seeds.resolve("day2/a.seeds.tif"));
  }

  @Test
  void resumeThroughUrlsKeepsCompleteFilesAndOverwriteRecomputes(@TempDir Path tmp)
      throws IOException {
    Path out = tmp.resolve("out");
    assertThat(job(sc, urlArgs(out)).exit()).isEqualTo(3);
    byte[] record = Files.readAllBytes(out.resolve("img-02.record.json"));
    byte[] sheet = Files.readAllBytes(out.resolve("contact-sheet.png"));
    byte[] mask = Files.readAllBytes(out.resolve("img-02.mask.tif"));
    Path part = out.resolve(".img-02.mask.tif.0123abcd.part");
    Files.write(part, new byte[] {1, 2, 3}); // as a killed upload leaves it
    SparkFixtures.Run again = job(sc, urlArgs(out, "--files-per-partition", "2"));
    assertThat(again.exit()).as(again.err()).isEqualTo(3);
    assertThat(again.out()).contains("4 kept from an earlier run");
    assertThat(part).doesNotExist();
    assertThat(Files.readAllBytes(out.resolve("img-02.record.json"))).isEqualTo(record);
    assertThat(Files.readAllBytes(out.resolve("contact-sheet.png"))).isEqualTo(sheet);
    SparkFixtures.Run over = job(sc, urlArgs(out, "--overwrite"));
    assertThat(over.exit()).as(over.err()).isEqualTo(3);
    assertThat(over.out()).contains("0 kept from an earlier run");
    assertThat(Files.readAllBytes(out.resolve("img-02.mask.tif"))).isEqualTo(mask);
    assertThat(Files.readAllBytes(out.resolve("contact-sheet.png"))).isEqualTo(sheet);
    assertThat(BatchFixtures.hiddenFiles(out)).isEmpty();
    Path clean = tmp.resolve("clean");
    assertThat(batch(plainArgs(clean, "--threads", "2", "--overwrite")).exit()).isEqualTo(3);
    SparkFixtures.assertSameOutputs(clean, out, renamed(out, clean));
  }

  @Test
  void aFolderBatchBeganResumesThroughAUrl(@TempDir Path tmp) throws IOException {
    Path out = tmp.resolve("out");
    assertThat(batch(plainArgs(out)).exit()).isEqualTo(3);
    byte[] record = Files.readAllBytes(out.resolve("img-02.record.json"));
    // a plain path beside a URL is staged too, as a file: path
    SparkFixtures.Run again =
        job(sc, "--model", model.toString(), "--in", in.toString(), "--out", url(out));
    assertThat(again.exit()).as(again.err()).isEqualTo(3);
    assertThat(again.err()).contains("staged through Hadoop's file system client");
    assertThat(again.out()).contains("4 kept from an earlier run");
    assertThat(Files.readAllBytes(out.resolve("img-02.record.json"))).isEqualTo(record);
  }

  @Test
  void aFolderHeldByAnotherJobAndAMissingModelAreRefused(@TempDir Path tmp) throws IOException {
    Path out = tmp.resolve("out");
    Files.createDirectories(out);
    Files.writeString(out.resolve(StagedRun.LOCK), "cleave job\n");
    SparkFixtures.Run held = job(sc, urlArgs(out));
    assertThat(held.exit()).as(held.err()).isEqualTo(2);
    assertThat(held.err()).contains("another job is writing", StagedRun.LOCK);
    assertThat(out.resolve(StagedRun.LOCK)).isRegularFile();
    Path other = tmp.resolve("other");
    SparkFixtures.Run missing =
        job(sc, "--model", url(tmp.resolve("none.json")), "--in", url(in), "--out", url(other));
    assertThat(missing.exit()).as(missing.err()).isEqualTo(2);
    assertThat(missing.err()).contains("none.json", "does not exist");
    SparkFixtures.Run noInput =
        job(sc, "--model", url(model), "--in", url(tmp.resolve("nothing")), "--out", url(other));
    assertThat(noInput.exit()).isEqualTo(2);
    assertThat(noInput.err()).contains("input folder", "does not exist");
    Path empty = Files.createDirectories(tmp.resolve("empty"));
    Files.writeString(empty.resolve("._a.tif"), "resource fork");
    SparkFixtures.Run none =
        job(sc, "--model", url(model), "--in", url(empty), "--out", url(other));
    assertThat(none.exit()).isEqualTo(2);
    assertThat(none.err()).contains("no file matching", "--recursive");
    assertThat(other.resolve("run.json")).doesNotExist();
  }

  /** A {@code file:} URL as a user types it. */
  private static String url(Path p) {
    return "file://" + p.toAbsolutePath();
  }

  /** The staged run's names for the plain run's paths (the longer first). */
  private static Map<String, String> renamed(Path staged, Path plain) {
    Map<String, String> m = new LinkedHashMap<>();
    m.put(url(model), model.toString());
    m.put(url(in), in.toString());
    m.put("file:" + in, in.toString());
    m.put(url(staged), plain.toString());
    return m;
  }

  private static String[] plainArgs(Path out, String... extra) {
    List<String> a =
        new ArrayList<>(
            List.of("--model", model.toString(), "--in", in.toString(), "--out", out.toString()));
    a.addAll(List.of(extra));
    return a.toArray(String[]::new);
  }

  private static String[] urlArgs(Path out, String... extra) {
    List<String> a =
        new ArrayList<>(List.of("--model", url(model), "--in", url(in), "--out", url(out)));
    a.addAll(List.of(extra));
    return a.toArray(String[]::new);
  }
}
