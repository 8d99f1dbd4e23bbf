package io.github.cleave.spark;

import static org.assertj.core.api.Assertions.assertThat;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import io.github.cleave.cli.BatchFixtures;
import io.github.cleave.cli.CleaveCommand;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import picocli.CommandLine;

/** Runs of {@code batch} and of the job for the cluster tests, and the comparison of outputs. */
final class SparkFixtures {
  private SparkFixtures() {}

  /** What a command printed and returned. */
  record Run(int exit, String out, String err) {}

  /** The batch tests' model and mixed folder in {@code shared}, and a context for the job. */
  record MixedFolder(Path model, Path in, List<String> good, JavaSparkContext sc) {
    /** Stops the context, if one was started. */
    void stop() {
      if (sc != null) {
        sc.stop();
      }
    }
  }

  /**
   * Writes the batch tests' model and their folder of good and unusable {@code size}² images into
   * {@code shared}, and starts an embedded context on {@code master}.
   */
  static MixedFolder mixedFolder(Path shared, int size, String master) throws IOException {
    Path model = BatchFixtures.model(shared.resolve("model.json"), size);
    Path in = shared.resolve("in");
    List<String> good = BatchFixtures.mixedFolder(in, size);
    return new MixedFolder(model, in, good, context(master));
  }

  /** An embedded context without web UI, bound to the loopback interface. */
  static JavaSparkContext context(String master) {
    return new JavaSparkContext(
        new SparkConf()
            .setMaster(master)
            .setAppName("cleave-test")
            .set("spark.ui.enabled", "false")
            .set("spark.driver.host", "localhost")
            .set("spark.driver.bindAddress", "127.0.0.1"));
  }

  static Run batch(String... args) {
    List<String> all = new ArrayList<>(List.of("batch"));
    all.addAll(List.of(args));
    return execute(CleaveCommand.newCommandLine(), all.toArray(String[]::new));
  }

  static Run job(JavaSparkContext sc, String... args) {
    return execute(SparkBatchJob.commandLine(sc), args);
  }

  private static Run execute(CommandLine cl, String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    cl.setOut(new PrintWriter(out, true));
    cl.setErr(new PrintWriter(err, true));
    int exit = cl.execute(args);
    return new Run(exit, out.toString(), err.toString());
  }

  /** Every regular file below {@code dir}, relative, sorted. */
  static List<String> files(Path dir) throws IOException {
    try (Stream<Path> s = Files.walk(dir)) {
      return s.filter(Files::isRegularFile)
          .map(p -> dir.relativize(p).toString())
          .sorted()
          .toList();
    }
  }

  /**
   * Asserts that two output folders hold the same files with the same bytes, except what differs
   * between any two runs: the time column of {@code files.csv}, records' timings, and in the run
   * files the times and the output folder.
   */
  static void assertSameOutputs(Path a, Path b) throws IOException {
    assertSameOutputs(a, b, Map.of());
  }

  /**
   * As {@link #assertSameOutputs(Path, Path)}, with each key of {@code renamed} replaced by its
   * value in the JSON files of {@code b} first: the paths by which a staged run names its files.
   */
  static void assertSameOutputs(Path a, Path b, Map<String, String> renamed) throws IOException {
    assertThat(files(b)).isEqualTo(files(a));
    assertThat(BatchFixtures.hiddenFiles(b)).isEmpty();
    for (String name : files(a)) {
      Path x = a.resolve(name);
      Path y = b.resolve(name);
      if (name.equals("files.csv")) {
        assertThat(BatchFixtures.withoutColumn(y, 3))
            .as(name)
            .isEqualTo(BatchFixtures.withoutColumn(x, 3));
      } else if (name.endsWith(".record.json")) {
        assertThat(json(y, renamed, "timingsMs"))
            .as(name)
            .isEqualTo(json(x, Map.of(), "timingsMs"));
      } else if (name.equals("run.json") || name.equals("run.started.json")) {
        assertThat(runJson(y, renamed)).as(name).isEqualTo(runJson(x, Map.of()));
      } else {
        assertThat(Files.readAllBytes(y)).as(name).isEqualTo(Files.readAllBytes(x));
      }
    }
  }

  private static JsonObject json(Path file, Map<String, String> renamed, String... drop)
      throws IOException {
    String text = Files.readString(file);
    for (Map.Entry<String, String> r : renamed.entrySet()) {
      text = text.replace(r.getKey(), r.getValue());
    }
    JsonObject o = JsonParser.parseString(text).getAsJsonObject();
    for (String key : drop) {
      o.remove(key);
    }
    return o;
  }

  private static JsonObject runJson(Path file, Map<String, String> renamed) throws IOException {
    JsonObject o = json(file, renamed, "started", "finished");
    JsonObject settings = o.getAsJsonObject("settings");
    if (settings != null) {
      settings.remove("out");
    }
    if (o.has("files")) {
      for (JsonElement e : o.getAsJsonArray("files")) {
        e.getAsJsonObject().remove("timeMs");
      }
    }
    return o;
  }
}
