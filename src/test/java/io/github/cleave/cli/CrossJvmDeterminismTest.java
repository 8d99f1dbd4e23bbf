package io.github.cleave.cli;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.SampleWriter;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Two separate JVMs, with different default locales and processor counts, write byte-identical
 * masks, label images and measurement tables for the same input.
 */
class CrossJvmDeterminismTest {

  @Test
  void separateJvmsWriteIdenticalOutputs(@TempDir Path tmp) throws Exception {
    Path in = Files.createDirectories(tmp.resolve("in"));
    SampleWriter.write(SamplePhantoms.nuclei(21, 128, 128), in, "grey");
    SampleWriter.write(SamplePhantoms.twoChannel(22, 128, 128), in, "two");
    Path a = tmp.resolve("a");
    Path b = tmp.resolve("b");
    runChild(
        List.of("-Duser.language=de", "-Duser.country=DE", "-XX:ActiveProcessorCount=1"), in, a);
    runChild(
        List.of("-Duser.language=en", "-Duser.country=US", "-XX:ActiveProcessorCount=2"), in, b);
    for (String name : new String[] {"grey", "two"}) {
      for (String suffix : new String[] {".mask.tif", ".labels.tif", ".objects.csv"}) {
        assertThat(Files.readAllBytes(a.resolve(name + suffix)))
            .as(name + suffix)
            .isEqualTo(Files.readAllBytes(b.resolve(name + suffix)));
      }
    }
    assertThat(Files.readString(a.resolve("grey.objects.csv"))).doesNotContain(";");
  }

  private static void runChild(List<String> jvmOptions, Path in, Path out)
      throws IOException, InterruptedException {
    List<String> command = new ArrayList<>();
    command.add(Path.of(System.getProperty("java.home"), "bin", "java").toString());
    command.addAll(jvmOptions);
    command.add("-Djava.awt.headless=true");
    command.add("-cp");
    command.add(System.getProperty("java.class.path"));
    command.add(CleaveCommand.class.getName());
    command.add("demo");
    command.add("--samples");
    command.add(in.toString());
    command.add("--out");
    command.add(out.toString());
    Process p =
        new ProcessBuilder(command)
            .redirectErrorStream(true)
            .redirectOutput(out.resolveSibling(out.getFileName() + ".log").toFile())
            .start();
    assertThat(p.waitFor(240, TimeUnit.SECONDS)).as("child finished").isTrue();
    assertThat(p.exitValue())
        .as(Files.readString(out.resolveSibling(out.getFileName() + ".log")))
        .isZero();
  }
}
