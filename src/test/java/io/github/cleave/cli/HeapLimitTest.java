package io.github.cleave.cli;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.SampleWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * An image too large for the heap is refused before it is read, with the memory it needs, exit code
 * 2 and nothing written: checked in a child JVM started with a small heap.
 */
class HeapLimitTest {

  @Test
  void imageTooLargeForTheHeapIsRefusedUpFront(@TempDir Path tmp) throws Exception {
    SampleWriter.write(SamplePhantoms.stack(3, 128, 128, 32), tmp, "stack");
    Path out = tmp.resolve("out");
    Path log = tmp.resolve("child.log");
    Process p =
        new ProcessBuilder(
                List.of(
                    Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                    "-Xmx20m",
                    "-Djava.awt.headless=true",
                    "-cp",
                    System.getProperty("java.class.path"),
                    CleaveCommand.class.getName(),
                    "segment",
                    "--image",
                    tmp.resolve("stack.tif").toString(),
                    "--out",
                    out.toString()))
            .redirectErrorStream(true)
            .redirectOutput(log.toFile())
            .start();
    assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();
    String text = Files.readString(log);
    assertThat(p.exitValue()).as(text).isEqualTo(2);
    assertThat(text).contains("too large for the heap", "MiB", "-Xmx");
    if (Files.exists(out)) {
      try (var files = Files.list(out)) {
        assertThat(files).isEmpty();
      }
    }
  }
}
