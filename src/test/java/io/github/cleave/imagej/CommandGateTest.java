package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.DataInputStream;
import java.io.IOException;
import java.io.InputStream;
import org.junit.jupiter.api.Test;

/** The Java version guard: its message logic and its class file version. */
class CommandGateTest {
  @Test
  void featureReleaseReadsBothVersionStyles() {
    // java.specification.version is "1.N" up to Java 8 and "N" from Java 9 (JEP 223).
    assertThat(CommandGate.featureRelease("1.6")).isEqualTo(6);
    assertThat(CommandGate.featureRelease("1.8")).isEqualTo(8);
    assertThat(CommandGate.featureRelease("9")).isEqualTo(9);
    assertThat(CommandGate.featureRelease("11")).isEqualTo(11);
    assertThat(CommandGate.featureRelease("17")).isEqualTo(17);
    assertThat(CommandGate.featureRelease("21.0.2")).isEqualTo(21);
    assertThat(CommandGate.featureRelease(null)).isEqualTo(-1);
    assertThat(CommandGate.featureRelease("")).isEqualTo(-1);
    assertThat(CommandGate.featureRelease("x")).isEqualTo(-1);
  }

  @Test
  void olderJavaGetsTheExplanationNewerRuns() {
    for (String old : new String[] {"1.6", "1.7", "1.8", "9", "11", "16"}) {
      int n = CommandGate.featureRelease(old);
      assertThat(CommandGate.problem(old))
          .startsWith("Cleave needs Java 17 or newer; this ImageJ runs Java " + n + ".");
    }
    for (String ok : new String[] {"17", "18", "21", "25", "garbled", null}) {
      assertThat(CommandGate.problem(ok)).isNull();
    }
    assertThat(CommandGate.problem(System.getProperty("java.specification.version"))).isNull();
  }

  @Test
  void gateIsJava8ClassFile() throws IOException {
    // Class file major version 52 = Java 8 (JVM specification, section 4.1).
    try (InputStream in = CommandGate.class.getResourceAsStream("CommandGate.class");
        DataInputStream data = new DataInputStream(in)) {
      assertThat(data.readInt()).isEqualTo(0xCAFEBABE);
      data.readUnsignedShort(); // minor
      assertThat(data.readUnsignedShort()).isEqualTo(52);
    }
  }

  @Test
  void everyMenuEntryGoesThroughTheGateToAnExistingCommand() throws Exception {
    String config;
    try (InputStream in = CommandGate.class.getResourceAsStream("/plugins.config")) {
      config = new String(in.readAllBytes(), java.nio.charset.StandardCharsets.UTF_8);
    }
    int entries = 0;
    for (String line : config.split("\n")) {
      if (line.isBlank() || line.startsWith("#")) {
        continue;
      }
      entries++;
      assertThat(line)
          .startsWith("Plugins>Cleave, \"")
          .contains("io.github.cleave.imagej.CommandGate(\"");
      String name = line.substring(line.indexOf("CommandGate(\"") + 13, line.lastIndexOf("\")"));
      Class<?> c = Class.forName("io.github.cleave.imagej." + name);
      assertThat(ij.plugin.PlugIn.class).isAssignableFrom(c);
      c.getDeclaredConstructor().newInstance();
    }
    assertThat(entries).isGreaterThanOrEqualTo(3);
  }
}
