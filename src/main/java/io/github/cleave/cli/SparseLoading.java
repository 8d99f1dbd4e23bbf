package io.github.cleave.cli;

import io.github.cleave.flow.SparseGraphBuilder;
import io.github.cleave.flow.SparseMaxFlow;
import io.github.cleave.io.DimacsFormatException;
import io.github.cleave.io.DimacsMaxFlowReader;
import io.github.cleave.io.DimacsParseSummary;
import java.io.IOException;
import java.nio.file.Path;

/** Reads any DIMACS max-flow file into the general {@link SparseMaxFlow} solver. */
final class SparseLoading {
  private SparseLoading() {}

  static LoadedProblem load(Path file) throws IOException, DimacsFormatException {
    SparseGraphBuilder[] holder = new SparseGraphBuilder[1];
    DimacsParseSummary summary =
        DimacsMaxFlowReader.read(
            file,
            header -> {
              SparseGraphBuilder builder = new SparseGraphBuilder(header.nodes());
              holder[0] = builder;
              return (from, to, cap) -> builder.addArc(from - 1, to - 1, cap);
            });
    long t0 = System.nanoTime();
    SparseMaxFlow solver =
        holder[0]
            .setSource(summary.header().source() - 1)
            .setSink(summary.header().sink() - 1)
            .build();
    long build = System.nanoTime() - t0;
    String description = "sparse, " + solver.nodeCount() + " nodes, " + solver.arcCount() + " arcs";
    return new LoadedProblem(
        solver,
        description,
        summary,
        build,
        (result, out) ->
            result.visitArcFlows((from, to, flow) -> FlowLines.print(out, from + 1, to + 1, flow)));
  }
}
