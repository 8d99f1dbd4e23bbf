package io.github.cleave.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.jgrapht.alg.flow.PushRelabelMFImpl;
import org.jgrapht.graph.DefaultWeightedEdge;
import org.jgrapht.graph.DirectedWeightedPseudograph;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The {@code maxflow} and {@code make-maxflow} commands, run in-process. */
class MaxflowCommandTest {

  static final Path SAMPLE = Path.of("sample-images/maxflow/blobs-128x128-n8.max.gz");

  /** Exit code, standard output and standard error of one run. */
  record Run(int exit, String out, String err) {
    List<String> lines() {
      return out.lines().toList();
    }

    long value() {
      return Long.parseLong(
          lines().stream().filter(l -> l.startsWith("s ")).findFirst().orElseThrow().substring(2));
    }
  }

  static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    var cl = CleaveCommand.newCommandLine();
    cl.setOut(new PrintWriter(out, true));
    cl.setErr(new PrintWriter(err, true));
    int exit = cl.execute(args);
    return new Run(exit, out.toString(), err.toString());
  }

  @Test
  void bundledSampleGivesTheReadmeValueWithBothEnginesAndAgreesWithJGraphT() throws IOException {
    Run grid = run("maxflow", "--grid", "128,128", "--neighborhood", "8", SAMPLE.toString());
    assertThat(grid.exit()).isZero();
    assertThat(grid.value()).isEqualTo(619146); // the value the README's quick start quotes
    assertThat(grid.out()).contains("c parse_ms ", "c build_ms ", "c solve_ms ");
    Run sparse = run("maxflow", SAMPLE.toString());
    assertThat(sparse.value()).isEqualTo(619146);
    // Independent oracle: JGraphT push-relabel (test scope, CHECKS.md) on the arcs of the file.
    Run arcsOnly = run("maxflow", "--flows", SAMPLE.toString()); // parses the file once more
    assertThat(arcsOnly.exit()).isZero();
    assertThat(jgraphtValue(SAMPLE)).isEqualTo(619146);
  }

  private static long jgraphtValue(Path file) throws IOException {
    DirectedWeightedPseudograph<Integer, DefaultWeightedEdge> g =
        new DirectedWeightedPseudograph<>(DefaultWeightedEdge.class);
    int source = -1;
    int sink = -1;
    try (var in = new java.util.zip.GZIPInputStream(Files.newInputStream(file));
        var reader = new java.io.BufferedReader(new java.io.InputStreamReader(in))) {
      for (String line = reader.readLine(); line != null; line = reader.readLine()) {
        String[] t = line.trim().split("\\s+");
        switch (t[0]) {
          case "p" -> {
            for (int v = 1; v <= Integer.parseInt(t[2]); v++) {
              g.addVertex(v);
            }
          }
          case "n" -> {
            if (t[2].equals("s")) {
              source = Integer.parseInt(t[1]);
            } else {
              sink = Integer.parseInt(t[1]);
            }
          }
          case "a" ->
              g.setEdgeWeight(
                  g.addEdge(Integer.parseInt(t[1]), Integer.parseInt(t[2])),
                  Double.parseDouble(t[3]));
          default -> {}
        }
      }
    }
    return Math.round(new PushRelabelMFImpl<>(g).getMaximumFlowValue(source, sink));
  }

  @Test
  void flowLinesConserveFlowAndAddUpToTheValue() {
    for (String[] args :
        new String[][] {
          {"maxflow", "--flows", "--grid", "128,128", "--neighborhood", "8", SAMPLE.toString()},
          {"maxflow", "--flows", SAMPLE.toString()}
        }) {
      Run r = run(args);
      assertThat(r.exit()).isZero();
      Map<Integer, Long> balance = new HashMap<>();
      int source = 16385;
      int sink = 16386;
      for (String line : r.lines()) {
        if (line.startsWith("f ")) {
          String[] t = line.split(" ");
          int u = Integer.parseInt(t[1]);
          int v = Integer.parseInt(t[2]);
          long f = Long.parseLong(t[3]);
          assertThat(f).isPositive();
          balance.merge(u, f, Long::sum);
          balance.merge(v, -f, Long::sum);
        }
      }
      balance.forEach(
          (node, b) -> {
            if (node != source && node != sink) {
              assertThat(b).as("conservation at %d", node).isZero();
            }
          });
      assertThat(balance.get(source)).isEqualTo(r.value());
    }
  }

  @Test
  void everyCommandExplainsItselfWithHelp() {
    for (String command : new String[] {"maxflow", "make-maxflow"}) {
      Run r = run(command, "--help");
      assertThat(r.exit()).as(command).isZero();
      assertThat(r.out()).as(command).contains("Usage: cleave " + command, "--grid");
    }
  }

  @Test
  void checkAndRepeatReportTheirLines() {
    Run r = run("maxflow", "--check", "--repeat", "3", "--grid", "128,128", SAMPLE.toString());
    assertThat(r.exit()).isZero();
    assertThat(r.out()).contains("c certificate ok", "c solve_ms_median ", "over 3 solves");
    assertThat(r.value()).isEqualTo(619146);
  }

  @Test
  void badInputGivesOneLineAndExitCode2(@TempDir Path dir) throws IOException {
    Path broken = dir.resolve("broken.max");
    Files.writeString(broken, "p max 4 1\nn 1 s\nn 4 t\na 1 7 3\n");
    Run r = run("maxflow", broken.toString());
    assertThat(r.exit()).isEqualTo(2);
    assertThat(r.err().strip())
        .doesNotContain("\n")
        .contains("line 4", "head node 7 does not exist");

    Run missing = run("maxflow", dir.resolve("nothing.max").toString());
    assertThat(missing.exit()).isEqualTo(2);
    assertThat(missing.err()).contains("does not exist");

    Run wrongGrid = run("maxflow", "--grid", "100,100", SAMPLE.toString());
    assertThat(wrongGrid.exit()).isEqualTo(2);
    assertThat(wrongGrid.err()).contains("check --grid");

    Run badOption = run("maxflow", "--neighborhood", "8", SAMPLE.toString());
    assertThat(badOption.exit()).isEqualTo(2);
    assertThat(badOption.err()).contains("--neighborhood needs --grid");

    Run badShape = run("maxflow", "--grid", "12", SAMPLE.toString());
    assertThat(badShape.exit()).isEqualTo(2);
    assertThat(badShape.err()).contains("is not W,H or W,H,D");

    Path notGzip = dir.resolve("bad.max.gz");
    Files.write(notGzip, new byte[] {0x1f, (byte) 0x8b, 1, 2, 3});
    Run truncated = run("maxflow", notGzip.toString());
    assertThat(truncated.exit()).isEqualTo(2);
    assertThat(truncated.err()).contains("cannot read");
  }

  @Test
  void makeMaxflowWritesAReproducibleFileAndNeverOverwritesWithoutForce(@TempDir Path dir)
      throws IOException {
    Path a = dir.resolve("a.max");
    Path b = dir.resolve("b.max");
    assertThat(run("make-maxflow", "--grid", "16,12", "--flavour", "boundary", a.toString()).exit())
        .isZero();
    assertThat(run("make-maxflow", "--grid", "16,12", "--flavour", "boundary", b.toString()).exit())
        .isZero();
    assertThat(Files.readAllBytes(a)).isEqualTo(Files.readAllBytes(b));
    byte[] before = Files.readAllBytes(a);
    Run again = run("make-maxflow", "--grid", "8,8", a.toString());
    assertThat(again.exit()).isEqualTo(2);
    assertThat(again.err()).contains("exists already", "--force");
    assertThat(Files.readAllBytes(a)).isEqualTo(before);
    assertThat(run("make-maxflow", "--grid", "8,8", "--force", a.toString()).exit()).isZero();
    assertThat(Files.readAllBytes(a)).isNotEqualTo(before);
    Run solved = run("maxflow", "--check", "--grid", "8,8", a.toString());
    assertThat(solved.exit()).isZero();
    assertThat(run("maxflow", a.toString()).value()).isEqualTo(solved.value());
    try (var files = Files.list(dir)) {
      assertThat(files.map(p -> p.getFileName().toString())).noneMatch(n -> n.endsWith(".part"));
    }
  }
}
