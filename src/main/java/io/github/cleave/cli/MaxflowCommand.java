package io.github.cleave.cli;

import io.github.cleave.flow.CertificateViolation;
import io.github.cleave.flow.MaxFlowResult;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.flow.SolveStatus;
import io.github.cleave.io.DimacsFormatException;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import java.util.concurrent.Callable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code cleave maxflow FILE}: solves a DIMACS max-flow problem and prints the DIMACS solution
 * ({@code s VALUE}, with {@code --flows} the {@code f FROM TO FLOW} lines), with {@code c} lines
 * reporting the solver and the parse, build and solve times in milliseconds.
 */
@Command(
    name = "maxflow",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Solves a max-flow problem in the DIMACS format (plain or gzip-compressed) and prints the"
          + " DIMACS solution: 's VALUE', and with --flows one 'f FROM TO FLOW' line per arc"
          + " carrying flow. 'c' lines report the solver and the parse, build and solve times.",
      "Exit codes: 0 solved; 1 --check found the flow not optimal (a bug, please report);"
          + " 2 bad arguments or malformed input; 130 interrupted."
    })
final class MaxflowCommand implements Callable<Integer> {

  @Parameters(paramLabel = "FILE", description = "DIMACS max-flow file (.gz allowed)")
  Path file;

  @Option(
      names = "--grid",
      paramLabel = "W,H[,D]",
      converter = GridShape.Converter.class,
      description =
          "Read the file as a pixel grid: nodes 1..W*H*D are the pixels in row-major order"
              + " (x fastest), the terminals are the other two ids, and every other arc must join"
              + " two grid neighbours. Uses the grid engine.")
  GridShape grid;

  @Option(
      names = "--neighborhood",
      paramLabel = "K",
      description =
          "Grid neighborhood with --grid: 4, 8 or 16 in 2D (default 8), 6, 18 or 26 in 3D"
              + " (default 6).")
  Integer neighborhood;

  @Option(names = "--flows", description = "Also print the flow of every arc carrying flow.")
  boolean flows;

  @Option(
      names = "--check",
      description =
          "Verify the proof of optimality after solving: capacities, conservation, no augmenting"
              + " path, cut capacity equal to the flow value.")
  boolean check;

  @Option(
      names = "--repeat",
      paramLabel = "N",
      defaultValue = "1",
      description =
          "Solve N times from scratch and report the median solve time (c solve_ms_median).")
  int repeat;

  @Spec CommandSpec spec;

  @Override
  public Integer call() {
    Neighborhood nb = chooseNeighborhood();
    if (repeat < 1) {
      throw new ParameterException(spec.commandLine(), "--repeat must be at least 1");
    }
    if (!Files.isRegularFile(file)) {
      throw new InputException(
          file
              + (Files.exists(file) ? " is not a regular file" : " does not exist")
              + "; give the path of a DIMACS max-flow file");
    }
    PrintWriter out = spec.commandLine().getOut();
    LoadedProblem problem = load(nb);
    long[] solveNanos = new long[repeat];
    MaxFlowResult result = null;
    for (int r = 0; r < repeat; r++) {
      result = problem.solver().solve();
      solveNanos[r] = result.solveNanos();
      if (result.status() == SolveStatus.INTERRUPTED) {
        spec.commandLine().getErr().println("cleave: interrupted; no solution printed");
        return ExitCodes.INTERRUPTED;
      }
    }
    out.println("c cleave maxflow " + file);
    out.println("c solver " + problem.description());
    out.println(
        "c nodes "
            + problem.parse().header().nodes()
            + " arcs "
            + problem.parse().arcsRead()
            + " source "
            + problem.parse().header().source()
            + " sink "
            + problem.parse().header().sink());
    out.println(
        "c parse_ms "
            + ms(problem.parse().nanos())
            + (grid != null ? " (includes filling the grid solver while reading)" : ""));
    out.println("c build_ms " + ms(problem.buildNanos()));
    out.println("c solve_ms " + ms(solveNanos[0]));
    if (repeat > 1) {
      long[] sorted = solveNanos.clone();
      Arrays.sort(sorted);
      double median =
          repeat % 2 == 1
              ? sorted[repeat / 2]
              : (sorted[repeat / 2 - 1] + sorted[repeat / 2]) / 2.0;
      out.println("c solve_ms_median " + ms(median) + " over " + repeat + " solves");
    }
    if (check) {
      try {
        problem.solver().checkCertificate();
        out.println("c certificate ok");
      } catch (CertificateViolation e) {
        out.flush();
        spec.commandLine().getErr().println("cleave: the flow is not optimal: " + e.getMessage());
        return ExitCodes.CHECK_FAILED;
      }
    }
    out.println("s " + result.flowValue());
    if (flows) {
      problem.flowPrinter().print(result, out);
    }
    out.flush();
    return ExitCodes.OK;
  }

  private Neighborhood chooseNeighborhood() {
    if (grid == null) {
      if (neighborhood != null) {
        throw new ParameterException(
            spec.commandLine(), "--neighborhood needs --grid W,H[,D] to say the grid's size");
      }
      return null;
    }
    try {
      return grid.neighborhood(neighborhood);
    } catch (IllegalArgumentException e) {
      throw new ParameterException(spec.commandLine(), e.getMessage());
    }
  }

  private LoadedProblem load(Neighborhood nb) {
    boolean retain = flows || check || repeat > 1;
    try {
      return grid != null ? GridLoading.load(file, grid, nb, retain) : SparseLoading.load(file);
    } catch (DimacsFormatException e) {
      throw new InputException(file + ": " + e.getMessage());
    } catch (NoSuchFileException e) {
      throw new InputException(file + " does not exist; give the path of a DIMACS max-flow file");
    } catch (IOException e) {
      throw new InputException(
          "cannot read " + file + ": " + e.getMessage() + "; is it a DIMACS file, complete?");
    } catch (OutOfMemoryError e) {
      throw new InputException(
          file + " does not fit in memory; run java with a larger -Xmx, or use --grid for grids");
    }
  }

  private static String ms(double nanos) {
    return String.format(Locale.ROOT, "%.1f", nanos / 1e6);
  }
}
