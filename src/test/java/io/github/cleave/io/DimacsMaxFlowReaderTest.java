package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.flow.GridArcSink;
import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.flow.SparseGraphBuilder;
import io.github.cleave.flow.SparseMaxFlow;
import io.github.cleave.synth.SyntheticGridProblem;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class DimacsMaxFlowReaderTest {

  static SparseMaxFlow readSparse(InputStream in) throws IOException, DimacsFormatException {
    SparseGraphBuilder[] holder = new SparseGraphBuilder[1];
    DimacsParseSummary s =
        DimacsMaxFlowReader.read(
            in,
            header -> {
              holder[0] = new SparseGraphBuilder(header.nodes());
              return (u, v, c) -> holder[0].addArc(u - 1, v - 1, c);
            });
    return holder[0].setSource(s.header().source() - 1).setSink(s.header().sink() - 1).build();
  }

  private static InputStream text(String s) {
    return new ByteArrayInputStream(s.getBytes(StandardCharsets.US_ASCII));
  }

  @Test
  void formatDescriptionExampleHasFlow15() throws Exception {
    // DIMACS implementation challenge, max-flow problem format description: value 15.
    try (InputStream in = getClass().getResourceAsStream("/dimacs/format-example.max")) {
      SparseMaxFlow solver = readSparse(in);
      assertThat(solver.solve().flowValue()).isEqualTo(15);
      assertThat(solver.checkCertificate()).isTrue();
    }
  }

  @Test
  void boostExampleHasFlow13AndTheExpectedFlowValue() throws Exception {
    // Boost Graph Library 1.74 example max_flow.dat (Debian libboost1.74-doc, BSL-1.0):
    // max_flow.expected gives 's 13'.
    try (InputStream in = getClass().getResourceAsStream("/flow/boost/max_flow.dat")) {
      SparseMaxFlow solver = readSparse(in);
      MaxFlowResult result = solver.solve();
      assertThat(result.flowValue()).isEqualTo(13);
      assertThat(solver.checkCertificate()).isTrue();
    }
    String expected =
        new String(
            getClass().getResourceAsStream("/flow/boost/max_flow.expected").readAllBytes(),
            StandardCharsets.US_ASCII);
    assertThat(expected).contains("s 13");
  }

  @Test
  void gzipIsRecognisedByContent() throws Exception {
    byte[] plain = getClass().getResourceAsStream("/dimacs/format-example.max").readAllBytes();
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    try (GZIPOutputStream gz = new GZIPOutputStream(bytes)) {
      gz.write(plain);
    }
    SparseMaxFlow solver = readSparse(new ByteArrayInputStream(bytes.toByteArray()));
    assertThat(solver.solve().flowValue()).isEqualTo(15);
  }

  @Test
  void blankLinesCommentsTabsAndCarriageReturnsAreAccepted() throws Exception {
    String file = "c x\r\n\r\np\tmax 3  2\r\nc between\r\nn 1 s\r\nn 3 t\r\na 1 2 4\r\n\na 2 3 9";
    assertThat(readSparse(text(file)).solve().flowValue()).isEqualTo(4);
  }

  /** Malformed files: the line reported and a fragment of the message (our documented errors). */
  @ParameterizedTest(name = "{0}")
  @CsvSource(
      delimiter = '|',
      value = {
        "no problem line      | c only\\n                                        | 0 | no problem line",
        "arc before p         | a 1 2 3\\n                                       | 1 | before the problem line",
        "two problem lines    | p max 3 0\\np max 3 0\\n                         | 2 | a second problem line",
        "min-cost problem     | p min 3 0\\n                                     | 1 | problem type 'min'",
        "bad node count       | p max one 2\\n                                   | 1 | is not 'p max NODES ARCS'",
        "one node             | p max 1 0\\n                                     | 1 | 2 <= NODES",
        "unknown line         | p max 3 0\\nx 1 2\\n                              | 2 | unknown line 'x 1 2'",
        "bad terminal role    | p max 3 0\\nn 1 q\\n                              | 2 | is not 'n ID s' or 'n ID t'",
        "terminal id too big  | p max 3 0\\nn 4 s\\n                              | 2 | terminal node 4 does not exist",
        "source equals sink   | p max 3 0\\nn 1 s\\nn 1 t\\n                       | 3 | both the source and the sink",
        "two sources          | p max 3 0\\nn 1 s\\nn 2 s\\n                       | 3 | a second source",
        "missing sink         | p max 3 1\\nn 1 s\\na 1 2 3\\n                     | 3 | no sink",
        "missing source       | p max 3 0\\nn 3 t\\n                              | 2 | no source",
        "unknown tail         | p max 3 1\\nn 1 s\\nn 3 t\\na 0 2 3\\n              | 4 | tail node 0 does not exist",
        "unknown head         | p max 3 1\\nn 1 s\\nn 3 t\\na 1 9 3\\n              | 4 | head node 9 does not exist",
        "negative capacity    | p max 3 1\\nn 1 s\\nn 3 t\\na 1 2 -3\\n             | 4 | capacity -3",
        "capacity too big     | p max 3 1\\nn 1 s\\nn 3 t\\na 1 2 2147483648\\n     | 4 | capacity 2147483648",
        "missing field        | p max 3 1\\nn 1 s\\nn 3 t\\na 1 2\\n                | 4 | is not 'a FROM TO CAPACITY'",
        "trailing garbage     | p max 3 1\\nn 1 s\\nn 3 t\\na 1 2 3 4\\n            | 4 | is not 'a FROM TO CAPACITY'",
        "not a number         | p max 3 1\\nn 1 s\\nn 3 t\\na 1 2 3x\\n             | 4 | is not 'a FROM TO CAPACITY'",
        "too many arcs        | p max 3 1\\nn 1 s\\nn 3 t\\na 1 2 3\\na 2 3 3\\n    | 5 | more arcs than the 1 announced",
        "too few arcs         | p max 3 2\\nn 1 s\\nn 3 t\\na 1 2 3\\n              | 4 | announces 2",
        "terminal after arcs  | p max 3 1\\nn 1 s\\nn 3 t\\na 1 2 3\\nn 2 s\\n      | 5 | after the first arc",
      })
  void malformedFilesNameTheLineAndWhatWasExpected(
      String name, String content, long line, String fragment) {
    String file = content.strip().replace("\\n", "\n");
    assertThatThrownBy(() -> readSparse(text(file)))
        .isInstanceOf(DimacsFormatException.class)
        .hasMessageContaining(fragment)
        .satisfies(e -> assertThat(((DimacsFormatException) e).line()).isEqualTo(line));
  }

  @Test
  void arcThatIsNotAGridNeighbourIsReportedWithItsLine() {
    String file = "p max 11 1\nn 10 s\nn 11 t\na 1 5 3\n"; // 3x3 grid: pixels 1 and 5 are diagonal
    assertThatThrownBy(
            () ->
                DimacsMaxFlowReader.read(
                    text(file),
                    h ->
                        new GridArcSink(
                            new GridMaxFlow(3, 3, 1, Neighborhood.N4), h.source(), h.sink())))
        .isInstanceOf(DimacsFormatException.class)
        .hasMessageContaining("line 4")
        .hasMessageContaining("not 4-neighbours");
  }

  @Test
  void writtenGridProblemsReadBackToTheSameMaximumFlow(@TempDir Path dir) throws Exception {
    // Round trip through our own writer, checked against a direct solve (common practice).
    SplittableRandom random = new SplittableRandom(8);
    List<Neighborhood> all = new ArrayList<>(List.of(Neighborhood.values()));
    for (int trial = 0; trial < 12; trial++) {
      Neighborhood nb = all.get(trial % all.size());
      int d = nb.isThreeDimensional() ? 4 + random.nextInt(3) : 1;
      SyntheticGridProblem problem =
          SyntheticGridProblem.generate(
              4 + random.nextInt(20),
              4 + random.nextInt(20),
              d,
              nb,
              trial % 2 == 0
                  ? SyntheticGridProblem.Flavour.ORDINARY
                  : SyntheticGridProblem.Flavour.BOUNDARY_DOMINATED,
              trial);
      Path file = dir.resolve("p" + trial + (trial % 3 == 0 ? ".max.gz" : ".max"));
      DimacsMaxFlowWriter.write(problem, file, "round trip " + trial);
      long expected = problem.toSolver(true).solve().flowValue();
      GridMaxFlow grid =
          new GridMaxFlow(problem.width(), problem.height(), problem.depth(), nb, true);
      DimacsMaxFlowReader.read(file, h -> new GridArcSink(grid, h.source(), h.sink()));
      assertThat(grid.solve().flowValue()).as("grid, trial %d", trial).isEqualTo(expected);
      try (InputStream in = Files.newInputStream(file)) {
        assertThat(readSparse(in).solve().flowValue())
            .as("sparse, trial %d", trial)
            .isEqualTo(expected);
      }
    }
  }
}
