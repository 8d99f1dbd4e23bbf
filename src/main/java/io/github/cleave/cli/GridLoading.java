package io.github.cleave.cli;

import io.github.cleave.flow.GridArcSink;
import io.github.cleave.flow.GridMaxFlow;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.io.DimacsFormatException;
import io.github.cleave.io.DimacsHeader;
import io.github.cleave.io.DimacsMaxFlowReader;
import io.github.cleave.io.DimacsParseSummary;
import java.io.IOException;
import java.nio.file.Path;

/**
 * Reads a grid-structured DIMACS file straight into a {@link GridMaxFlow}: the solver is allocated
 * when the header has been read and filled arc by arc while the file is read, so memory is the
 * solver's alone.
 */
final class GridLoading {
  private GridLoading() {}

  static LoadedProblem load(Path file, GridShape shape, Neighborhood nb, boolean retain)
      throws IOException, DimacsFormatException {
    GridMaxFlow[] holder = new GridMaxFlow[1];
    long[] allocation = new long[1];
    DimacsParseSummary summary =
        DimacsMaxFlowReader.read(
            file,
            header -> {
              checkSize(header, shape);
              long t0 = System.nanoTime();
              GridMaxFlow grid =
                  new GridMaxFlow(shape.width(), shape.height(), shape.depth(), nb, retain);
              allocation[0] = System.nanoTime() - t0;
              holder[0] = grid;
              return new GridArcSink(grid, header.source(), header.sink());
            });
    GridMaxFlow grid = holder[0];
    int source = summary.header().source();
    int sink = summary.header().sink();
    String description =
        "grid "
            + shape
            + ", "
            + nb.size()
            + "-neighborhood, "
            + grid.capacityWidth()
            + "-bit residuals";
    return new LoadedProblem(
        grid,
        description,
        summary,
        allocation[0],
        (result, out) ->
            result.visitArcFlows(
                (from, to, flow) ->
                    FlowLines.print(
                        out,
                        from == GridMaxFlow.SOURCE ? source : from + 1,
                        to == GridMaxFlow.SINK ? sink : to + 1,
                        flow)));
  }

  private static void checkSize(DimacsHeader header, GridShape shape) {
    long expected = shape.pixels() + 2;
    if (header.nodes() != expected) {
      throw new IllegalArgumentException(
          "the problem has "
              + header.nodes()
              + " nodes, but a "
              + shape
              + " grid has "
              + shape.pixels()
              + " pixels plus 2 terminals = "
              + expected
              + "; check --grid");
    }
  }
}
