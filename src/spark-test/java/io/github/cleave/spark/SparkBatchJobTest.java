package io.github.cleave.spark;

import static io.github.cleave.spark.SparkFixtures.batch;
import static io.github.cleave.spark.SparkFixtures.job;
import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.cli.BatchFixtures;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The cluster job in {@code local[2]} against {@code batch} on the batch tests' folder of good and
 * unusable files: the same outputs and statuses, resume and {@code --overwrite} as in {@code
 * batch}, the refusals, and a job Spark gives up on.
 */
class SparkBatchJobTest extends MixedFolderJobTest {

  @Test
  void theJobWritesWhatBatchWritesAndFailsTheSameFiles(@TempDir Path tmp) throws IOException {
    Path local = tmp.resolve("batch");
    Path cluster = tmp.resolve("spark");
    SparkFixtures.Run b = batch(args(local, "--threads", "2"));
    SparkFixtures.Run s = job(sc, args(cluster, "--files-per-partition", "3"));
    assertThat(b.exit()).as(b.err()).isEqualTo(3);
    assertThat(s.exit()).as(s.err()).isEqualTo(3);
    assertThat(s.out()).isEqualTo(b.out().replace(local.toString(), cluster.toString()));
    for (String bad : List.of("corrupt.tif", "notes.tif", "colour.tif", "empty.tif")) {
      assertThat(s.err()).contains("cleave: " + bad + ": ");
    }
    assertThat(s.err()).contains("cleave: spark: 8/8 files (4 failed), 3/3 partitions");
    SparkFixtures.assertSameOutputs(local, cluster);
    for (String name : good) {
      assertThat(cluster.resolve(name + ".mask.tif")).isRegularFile();
    }
  }

  @Test
  void resumeKeepsCompleteFilesOverwriteRecomputesAnotherModelIsRefused(@TempDir Path tmp)
      throws IOException {
    Path out = tmp.resolve("out");
    assertThat(batch(args(out)).exit()).isEqualTo(3);
    byte[] record = Files.readAllBytes(out.resolve("img-02.record.json"));
    byte[] sheet = Files.readAllBytes(out.resolve("contact-sheet.png"));
    // the job resumes a folder that batch began: thumbnails read back from the overlays
    SparkFixtures.Run again = job(sc, args(out));
    assertThat(again.exit()).as(again.err()).isEqualTo(3);
    assertThat(again.out()).contains("4 kept from an earlier run");
    assertThat(Files.readAllBytes(out.resolve("img-02.record.json"))).isEqualTo(record);
    assertThat(Files.readAllBytes(out.resolve("contact-sheet.png"))).isEqualTo(sheet);
    byte[] mask = Files.readAllBytes(out.resolve("img-02.mask.tif"));
    SparkFixtures.Run over = job(sc, args(out, "--overwrite"));
    assertThat(over.exit()).isEqualTo(3);
    assertThat(over.out()).contains("0 kept from an earlier run");
    assertThat(Files.readAllBytes(out.resolve("img-02.mask.tif"))).isEqualTo(mask);
    assertThat(Files.readAllBytes(out.resolve("contact-sheet.png"))).isEqualTo(sheet);
    Path other = tmp.resolve("other.json");
    Files.writeString(other, Files.readString(model) + "\n");
    SparkFixtures.Run refused =
        job(sc, "--model", other.toString(), "--in", in.toString(), "--out", out.toString());
    assertThat(refused.exit()).isEqualTo(2);
    assertThat(refused.err()).contains("another model", "--overwrite");
    assertThat(out.resolve("run.json")).isRegularFile();
  }

  @Test
  void aJobSparkGivesUpOnExitsWith4AndARerunFinishesIt(@TempDir Path tmp) throws IOException {
    Path out = tmp.resolve("out");
    SparkFixtures.Run failed;
    System.setProperty(SparkBatchJob.FAIL_ONCE_PROPERTY, "1");
    try {
      // local[2]: spark.task.maxFailures is 1, so the injected failure aborts the job
      failed = job(sc, args(out, "--files-per-partition", "2"));
    } finally {
      System.clearProperty(SparkBatchJob.FAIL_ONCE_PROPERTY);
    }
    assertThat(failed.exit()).as(failed.err()).isEqualTo(SparkBatchJob.JOB_FAILED);
    assertThat(failed.err()).contains("the Spark job failed", "a rerun resumes");
    assertThat(out.resolve("run.json")).doesNotExist();
    SparkFixtures.Run rerun = job(sc, args(out, "--files-per-partition", "2"));
    assertThat(rerun.exit()).as(rerun.err()).isEqualTo(3);
    Path clean = tmp.resolve("clean");
    assertThat(batch(args(clean)).exit()).isEqualTo(3);
    assertThat(SparkFixtures.files(out)).isEqualTo(SparkFixtures.files(clean));
    assertThat(BatchFixtures.hiddenFiles(out)).isEmpty();
    for (String name : good) {
      assertThat(Files.readAllBytes(out.resolve(name + ".labels.tif")))
          .isEqualTo(Files.readAllBytes(clean.resolve(name + ".labels.tif")));
    }
  }

  @Test
  void aSchemeWithoutAFileSystemAndBadPartitionSizesAreRefused(@TempDir Path tmp) {
    Path out = tmp.resolve("out");
    SparkFixtures.Run unknown =
        job(sc, "--model", model.toString(), "--in", "nosuch://node/data", "--out", out.toString());
    assertThat(unknown.exit()).as(unknown.err()).isEqualTo(2);
    assertThat(unknown.err()).contains("--in nosuch://node/data", "file system client");
    SparkFixtures.Run zero = job(sc, args(out, "--files-per-partition", "0"));
    assertThat(zero.exit()).isEqualTo(2);
    assertThat(zero.err()).contains("--files-per-partition 0");
    assertThat(out).doesNotExist();
  }

  @Test
  void relativePlainPathsAreRefusedOnAClusterOnly() {
    JobPaths.checkAbsolute("--in", "data", "local[*]");
    JobPaths.checkAbsolute("--in", "hdfs://node/data", "yarn");
    try {
      JobPaths.checkAbsolute("--in", "data", "yarn");
      throw new AssertionError("a relative path on a cluster must be refused");
    } catch (io.github.cleave.image.BadInputException expected) {
      assertThat(expected.getMessage()).contains("--in data", "absolute path");
    }
    JobPaths.checkAbsolute("--in", "/data", "spark://host:7077");
    assertThat(JobPaths.isUrl("C:\\data")).isFalse();
    assertThat(JobPaths.isUrl("s3a://bucket/data")).isTrue();
  }

  private static String[] args(Path out, String... extra) {
    List<String> a =
        new java.util.ArrayList<>(
            List.of("--model", model.toString(), "--in", in.toString(), "--out", out.toString()));
    a.addAll(List.of(extra));
    return a.toArray(String[]::new);
  }
}
