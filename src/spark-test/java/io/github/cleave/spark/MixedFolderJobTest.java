package io.github.cleave.spark;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.apache.spark.api.java.JavaSparkContext;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;

/**
 * The set-up that the job's tests against {@code batch} share: the batch tests' model and their
 * folder of good and unusable {@value #SIZE}² images, written once per test class, and an embedded
 * {@code local[2]} context for the class's tests (test classes run one after another).
 */
abstract class MixedFolderJobTest {
  static final int SIZE = 128;

  @TempDir static Path shared;
  static Path model;
  static Path in;
  static List<String> good;
  static JavaSparkContext sc;
  private static SparkFixtures.MixedFolder fixture;

  @BeforeAll
  static void start() throws IOException {
    fixture = SparkFixtures.mixedFolder(shared, SIZE, "local[2]");
    model = fixture.model();
    in = fixture.in();
    good = fixture.good();
    sc = fixture.sc();
  }

  @AfterAll
  static void stop() {
    if (fixture != null) {
      fixture.stop();
    }
  }
}
