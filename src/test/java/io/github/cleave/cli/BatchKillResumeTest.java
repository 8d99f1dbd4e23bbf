package io.github.cleave.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A batch killed with SIGKILL halfway (a child JVM, {@code Process.destroyForcibly}, which is
 * SIGKILL on Unix) and rerun: the final outputs equal those of an uninterrupted run, no partial or
 * temporary file remains, and files completed before the kill are not recomputed.
 */
class BatchKillResumeTest {
  static final int FILES = 14;
  static final int SIZE = 192;

  @Test
  void killedBatchResumesToTheSameOutputs(@TempDir Path tmp) throws Exception {
    Path model = BatchFixtures.model(tmp.resolve("model.json"), SIZE);
    Path in = tmp.resolve("in");
    List<String> names = BatchFixtures.greyImages(in, FILES, SIZE);
    Path killed = tmp.resolve("killed");
    Process child = start(model, in, killed, tmp.resolve("child.log"));
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(180);
    while (records(killed) < 3 && child.isAlive() && System.nanoTime() < deadline) {
      Thread.sleep(5);
    }
    child.destroyForcibly();
    assertThat(child.waitFor(60, TimeUnit.SECONDS)).isTrue();
    int doneBeforeKill = records(killed);
    assertThat(doneBeforeKill)
        .as("killed halfway: " + Files.readString(tmp.resolve("child.log")))
        .isBetween(1, FILES - 1);
    assertThat(killed.resolve("run.json")).doesNotExist();
    assertThat(killed.resolve("run.started.json")).isRegularFile();
    Map<String, FileTime> kept = new HashMap<>();
    Map<String, byte[]> keptBytes = new HashMap<>();
    for (String n : names) {
      Path record = killed.resolve(n + ".record.json");
      if (Files.exists(record)) {
        kept.put(n, Files.getLastModifiedTime(record));
        keptBytes.put(n, Files.readAllBytes(record));
      }
    }

    MaxflowCommandTest.Run rerun =
        MaxflowCommandTest.run(
            "batch",
            "--model",
            model.toString(),
            "--in",
            in.toString(),
            "--out",
            killed.toString());
    assertThat(rerun.exit()).as(rerun.err()).isZero();
    assertThat(rerun.out()).contains(kept.size() + " kept from an earlier run");
    for (Map.Entry<String, FileTime> e : kept.entrySet()) {
      Path record = killed.resolve(e.getKey() + ".record.json");
      assertThat(Files.getLastModifiedTime(record)).isEqualTo(e.getValue());
      assertThat(Files.readAllBytes(record)).isEqualTo(keptBytes.get(e.getKey()));
    }
    assertThat(BatchFixtures.hiddenFiles(killed)).isEmpty();

    Path fresh = tmp.resolve("fresh");
    MaxflowCommandTest.Run whole =
        MaxflowCommandTest.run(
            "batch", "--model", model.toString(), "--in", in.toString(), "--out", fresh.toString());
    assertThat(whole.exit()).as(whole.err()).isZero();
    for (String n : names) {
      for (String suffix : BatchCommandTest.PER_IMAGE) {
        assertThat(Files.readAllBytes(killed.resolve(n + suffix)))
            .as(n + suffix)
            .isEqualTo(Files.readAllBytes(fresh.resolve(n + suffix)));
      }
    }
    for (String name : new String[] {"objects.csv", "contact-sheet.png"}) {
      assertThat(Files.readAllBytes(killed.resolve(name)))
          .as(name)
          .isEqualTo(Files.readAllBytes(fresh.resolve(name)));
    }
    assertThat(BatchFixtures.withoutColumn(killed.resolve("files.csv"), 3))
        .isEqualTo(BatchFixtures.withoutColumn(fresh.resolve("files.csv"), 3));
    assertThat(listing(killed)).isEqualTo(listing(fresh));
  }

  private static Process start(Path model, Path in, Path out, Path log) throws IOException {
    List<String> command = new ArrayList<>();
    command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    command.add("-Djava.awt.headless=true");
    command.add("-cp");
    command.add(System.getProperty("java.class.path"));
    command.add(CleaveCommand.class.getName());
    command.addAll(
        List.of(
            "batch",
            "--threads",
            "1",
            "--model",
            model.toString(),
            "--in",
            in.toString(),
            "--out",
            out.toString()));
    return new ProcessBuilder(command)
        .redirectErrorStream(true)
        .redirectOutput(log.toFile())
        .start();
  }

  private static int records(Path out) throws IOException {
    if (!Files.isDirectory(out)) {
      return 0;
    }
    try (Stream<Path> s = Files.list(out)) {
      return (int) s.filter(p -> p.getFileName().toString().endsWith(".record.json")).count();
    }
  }

  private static List<String> listing(Path dir) throws IOException {
    try (Stream<Path> s = Files.list(dir)) {
      return s.map(p -> p.getFileName().toString()).sorted().toList();
    }
  }
}
