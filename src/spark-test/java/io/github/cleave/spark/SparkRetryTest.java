package io.github.cleave.spark;

import static io.github.cleave.spark.SparkFixtures.job;
import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.atomic.AtomicInteger;
import org.apache.spark.Success$;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.scheduler.SparkListener;
import org.apache.spark.scheduler.SparkListenerTaskEnd;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A task that fails once, outside the per-file function, after it has written its first file, and
 * is retried ({@code local[2,2]}: two attempts per task): the run succeeds and leaves exactly the
 * outputs of a clean run, no duplicate, no partial or hidden temporary file; with plain paths and
 * with staged {@code file:} URLs.
 */
class SparkRetryTest {
  static final int SIZE = 128;

  @TempDir static Path shared;
  static Path model;
  static Path in;
  static JavaSparkContext sc;
  static SparkFixtures.MixedFolder fixture;
  static final AtomicInteger lostTasks = new AtomicInteger();

  @BeforeAll
  static void start() throws IOException {
    fixture = SparkFixtures.mixedFolder(shared, SIZE, "local[2,2]"); // maxFailures 2 in local mode
    model = fixture.model();
    in = fixture.in();
    sc = fixture.sc();
    sc.sc()
        .addSparkListener(
            new SparkListener() {
              @Override
              public void onTaskEnd(SparkListenerTaskEnd end) {
                if (end.reason() != Success$.MODULE$) {
                  lostTasks.incrementAndGet();
                }
              }
            });
  }

  @AfterAll
  static void stop() {
    if (fixture != null) {
      fixture.stop();
    }
  }

  @Test
  void aRetriedTaskLeavesTheOutputsOfACleanRun(@TempDir Path tmp)
      throws IOException, InterruptedException {
    Path clean = tmp.resolve("clean");
    Path retried = tmp.resolve("retried");
    SparkFixtures.Run c = cleanRun(clean);
    SparkFixtures.Run r = failingOnce("2", args(in.toString(), retried.toString()));
    assertThat(r.out()).isEqualTo(c.out().replace(clean.toString(), retried.toString()));
    SparkFixtures.assertSameOutputs(clean, retried);
  }

  @Test
  void aRetriedStagedTaskLeavesTheOutputsOfACleanRun(@TempDir Path tmp)
      throws IOException, InterruptedException {
    Path clean = tmp.resolve("clean");
    Path retried = tmp.resolve("retried");
    cleanRun(clean);
    failingOnce("1", args("file://" + in, "file://" + retried));
    Map<String, String> renamed = new LinkedHashMap<>();
    renamed.put("file://" + in, in.toString());
    renamed.put("file:" + in, in.toString());
    renamed.put("file://" + retried, clean.toString());
    SparkFixtures.assertSameOutputs(clean, retried, renamed);
  }

  /** A run without failures into {@code out}: exit 3, for the folder's bad files. */
  private static SparkFixtures.Run cleanRun(Path out) {
    SparkFixtures.Run c = job(sc, args(in.toString(), out.toString()));
    assertThat(c.exit()).as(c.err()).isEqualTo(3);
    return c;
  }

  /**
   * A run whose given partition fails once after its first file: exit 3 as a clean run, and exactly
   * one lost task.
   */
  private static SparkFixtures.Run failingOnce(String partition, String... args)
      throws InterruptedException {
    SparkFixtures.Run r;
    int lostBefore = lostTasks.get();
    System.setProperty(SparkBatchJob.FAIL_ONCE_PROPERTY, partition);
    try {
      r = job(sc, args);
    } finally {
      System.clearProperty(SparkBatchJob.FAIL_ONCE_PROPERTY);
    }
    assertThat(r.exit()).as(r.err()).isEqualTo(3);
    // listener events arrive asynchronously: wait (without a time limit on the result) for them
    for (int i = 0; i < 200 && lostTasks.get() == lostBefore; i++) {
      Thread.sleep(50);
    }
    assertThat(lostTasks.get() - lostBefore).as("the injected failure happened").isEqualTo(1);
    return r;
  }

  private static String[] args(String in, String out) {
    return new String[] {
      "--model", model.toString(), "--in", in, "--out", out, "--files-per-partition", "2"
    };
  }
}
