package io.github.cleave.bench;

import io.github.cleave.synth.SyntheticGridProblem;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Side-by-side max-flow benchmark on synthetic grid segmentation instances: this engine, JGraphT's
 * Boykov–Kolmogorov implementation and OR-tools' max flow, in the same run, with the phases defined
 * in DEVELOPERS.md (build, solve; medians over the repeats). Prints a Markdown table.
 *
 * <p>Arguments ({@code key=value}, any order): {@code instances=all|NAME,NAME...} (names as in
 * {@link BenchInstance}), {@code solvers=cleave,or-tools,jgrapht-bk}, {@code repeats=5} (this
 * engine), {@code reference-repeats=3} (the others), {@code jgrapht-max-nodes=1100000} (JGraphT
 * needs several hundred bytes per node and minutes per solve beyond that), {@code out=FILE} (also
 * write the table there), {@code dynamic=2d-1024-n8-ordinary} (instance for the dynamic re-solve
 * rows; empty for none).
 */
public final class GridBenchmark {
  private GridBenchmark() {}

  public static void main(String[] args) throws IOException {
    Map<String, String> options = new LinkedHashMap<>();
    options.put("instances", "all");
    options.put("solvers", "cleave,or-tools,jgrapht-bk");
    options.put("repeats", "5");
    options.put("reference-repeats", "3");
    options.put("jgrapht-max-nodes", "1100000");
    options.put("out", "");
    options.put("dynamic", "2d-1024-n8-ordinary");
    BenchOptions.apply(options, args);
    List<String> names =
        options.get("instances").equals("all")
            ? BenchInstance.ALL
            : List.of(options.get("instances").split(","));
    List<String> solverNames = List.of(options.get("solvers").split(","));
    int repeats = Integer.parseInt(options.get("repeats"));
    int referenceRepeats = Integer.parseInt(options.get("reference-repeats"));
    long jgraphtMax = Long.parseLong(options.get("jgrapht-max-nodes"));

    List<String> lines = new ArrayList<>();
    lines.add(BenchOptions.machine());
    lines.add("");
    lines.add(
        "| instance | solver | build ms | solve ms | flow | bytes/node | solve ratio vs this engine | note |");
    lines.add("|---|---|---:|---:|---:|---:|---:|---|");
    for (String line : lines) {
      System.out.println(line);
    }
    for (String name : names) {
      BenchInstance instance = BenchInstance.parse(name.trim());
      SyntheticGridProblem problem = instance.generate();
      List<Measurement> results = new ArrayList<>();
      for (String solverName : solverNames) {
        results.add(runOne(solverName.trim(), instance, problem, repeats, referenceRepeats, jgraphtMax));
      }
      double ours = results.get(0).solveMs();
      long flow = results.get(0).flow();
      for (Measurement m : results) {
        String agree = !m.ran() || m.flow() == flow ? "" : " FLOW DIFFERS";
        String line =
            String.format(
                Locale.ROOT,
                "| %s | %s | %s | %s | %s | %s | %s | %s%s |",
                name,
                m.solver(),
                fmt(m.buildMs()),
                fmt(m.solveMs()),
                m.ran() ? Long.toString(m.flow()) : "-",
                fmt(m.bytesPerNode()),
                m.ran() ? String.format(Locale.ROOT, "%.1f", m.solveMs() / ours) : "-",
                m.note(),
                agree);
        System.out.println(line);
        lines.add(line);
      }
    }
    if (!options.get("dynamic").isEmpty()) {
      String name = options.get("dynamic");
      List<String> dynamic = new ArrayList<>();
      dynamic.add("");
      dynamic.add(
          "| instance | change | arcs or nodes changed | re-solve ms | scratch solve ms | ratio |"
              + " same flow |");
      dynamic.add("|---|---|---:|---:|---:|---:|---|");
      dynamic.addAll(DynamicRows.run(name, BenchInstance.parse(name).generate(), repeats));
      for (String line : dynamic) {
        System.out.println(line);
      }
      lines.addAll(dynamic);
    }
    if (!options.get("out").isEmpty()) {
      Files.write(Path.of(options.get("out")), lines);
    }
  }

  private static Measurement runOne(
      String solverName,
      BenchInstance instance,
      SyntheticGridProblem problem,
      int repeats,
      int referenceRepeats,
      long jgraphtMax) {
    BenchSolver solver =
        switch (solverName) {
          case "cleave" -> new CleaveSolver();
          case "or-tools" -> new OrToolsSolver();
          case "jgrapht-bk" -> new JGraphTSolver();
          default -> throw new IllegalArgumentException("unknown solver '" + solverName + "'");
        };
    if (solver instanceof JGraphTSolver && instance.nodes() > jgraphtMax) {
      return Measurement.skipped(solver.name(), "skipped: more than " + jgraphtMax + " nodes");
    }
    Measurement m = solver.run(problem, solver instanceof CleaveSolver ? repeats : referenceRepeats);
    Timing.heapUsed();
    return m;
  }

  private static String fmt(double value) {
    return Double.isNaN(value) ? "-" : String.format(Locale.ROOT, "%.1f", value);
  }
}
