package io.github.cleave.cli;

import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.MaxFlowSolver;
import io.github.cleave.io.DimacsParseSummary;
import java.io.PrintWriter;

/**
 * A max-flow problem read from a file into a solver.
 *
 * @param solver the filled solver
 * @param description one line naming the solver and the problem's size
 * @param parse what reading found and how long it took
 * @param buildNanos time to fill the solver's arrays beyond what happened while reading
 * @param flowPrinter writes the {@code f FROM TO FLOW} lines of a result in the file's ids
 */
record LoadedProblem(
    MaxFlowSolver solver,
    String description,
    DimacsParseSummary parse,
    long buildNanos,
    FlowPrinter flowPrinter) {

  /** Writes the flow lines of a result. */
  @FunctionalInterface
  interface FlowPrinter {
    void print(MaxFlowResult result, PrintWriter out);
  }
}
