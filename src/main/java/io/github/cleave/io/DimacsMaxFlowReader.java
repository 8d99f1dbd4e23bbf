package io.github.cleave.io;

import io.github.cleave.flow.FlowArcSink;
import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.zip.GZIPInputStream;

/**
 * Reads a max-flow problem in the DIMACS format and streams its arcs into a {@link FlowArcSink}, so
 * that a solver is filled while the file is read and no copy of the arcs is kept.
 *
 * <p>Accepted: {@code c} comment lines and blank lines anywhere; one problem line {@code p max
 * NODES ARCS} before every other line; the terminal lines {@code n ID s} and {@code n ID t}, both
 * before the first arc (the order of the DIMACS format description); then {@code ARCS} arc lines
 * {@code a FROM TO CAPACITY} with ids in {@code 1..NODES} and capacities in {@code 0..2147483647}.
 * Input compressed with gzip is recognised by its first two bytes.
 *
 * <p>Every departure is a {@link DimacsFormatException} naming the line, what was found and what
 * was expected; an {@link IllegalArgumentException} from the sink (an arc the solver cannot
 * represent, such as one joining two pixels that are not grid neighbours) becomes one too.
 */
public final class DimacsMaxFlowReader {
  private DimacsMaxFlowReader() {}

  /** Receives the header once the terminals are known and returns where the arcs go. */
  @FunctionalInterface
  public interface Handler {
    /**
     * Called once, before the first arc (or at the end of a file without arcs).
     *
     * @throws IllegalArgumentException if the problem does not fit what the caller can solve (for
     *     instance a node count that is not the grid's); reported with the problem line's number
     */
    FlowArcSink begin(DimacsHeader header);
  }

  /** Reads {@code file}, plain or gzip-compressed. */
  public static DimacsParseSummary read(Path file, Handler handler)
      throws IOException, DimacsFormatException {
    try (InputStream in = Files.newInputStream(file)) {
      return read(in, handler);
    }
  }

  /** Reads a stream, plain or gzip-compressed; does not close it. */
  public static DimacsParseSummary read(InputStream raw, Handler handler)
      throws IOException, DimacsFormatException {
    long start = System.nanoTime();
    BufferedInputStream buffered = new BufferedInputStream(raw, 1 << 16);
    buffered.mark(2);
    int b0 = buffered.read();
    int b1 = buffered.read();
    buffered.reset();
    InputStream in = b0 == 0x1f && b1 == 0x8b ? new GZIPInputStream(buffered, 1 << 16) : buffered;
    return new Parse(new LineReader(in), handler).run(start);
  }

  /** The state of one read. */
  private static final class Parse {
    private final LineReader lines;
    private final Handler handler;
    private int nodes = -1;
    private long arcs = -1;
    private long problemLine;
    private int source = -1;
    private int sink = -1;
    private FlowArcSink sinkOfArcs;
    private DimacsHeader header;
    private long arcsRead;

    Parse(LineReader lines, Handler handler) {
      this.lines = lines;
      this.handler = handler;
    }

    DimacsParseSummary run(long start) throws IOException, DimacsFormatException {
      while (lines.next()) {
        byte type = lines.firstByte();
        switch (type) {
          case 0, 'c' -> {}
          case 'p' -> problem();
          case 'n' -> terminal();
          case 'a' -> arc();
          default ->
              throw error(
                  "unknown line '"
                      + lines.text()
                      + "'; DIMACS max-flow lines start with c, p, n or a");
        }
      }
      if (nodes < 0) {
        throw new DimacsFormatException(
            0, "no problem line: a DIMACS max-flow file needs 'p max NODES ARCS' before its arcs");
      }
      if (sinkOfArcs == null) {
        begin();
      }
      if (arcsRead != arcs) {
        throw new DimacsFormatException(
            lines.lineNumber(),
            "the file ends after "
                + arcsRead
                + " arcs, but its problem line (line "
                + problemLine
                + ") announces "
                + arcs);
      }
      return new DimacsParseSummary(
          header, arcsRead, lines.lineNumber(), System.nanoTime() - start);
    }

    private void problem() throws DimacsFormatException {
      if (nodes >= 0) {
        throw error("a second problem line; the first is line " + problemLine);
      }
      lines.word(); // "p"
      String kind = lines.word();
      if (!kind.equals("max")) {
        throw error(
            "problem type '" + kind + "'; this reads maximum-flow problems, 'p max NODES ARCS'");
      }
      long n = lines.number();
      long m = lines.number();
      if (n < 2 || n > Integer.MAX_VALUE - 2 || m < 0 || lines.hasToken()) {
        throw error(
            "'"
                + lines.text()
                + "' is not 'p max NODES ARCS' with 2 <= NODES <= "
                + (Integer.MAX_VALUE - 2)
                + " and ARCS >= 0");
      }
      nodes = (int) n;
      arcs = m;
      problemLine = lines.lineNumber();
    }

    private void terminal() throws DimacsFormatException {
      requireProblem("a terminal line");
      if (sinkOfArcs != null) {
        throw error("a terminal line after the first arc; put the n lines before the a lines");
      }
      lines.word(); // "n"
      long id = lines.number();
      String role = lines.hasToken() ? lines.word() : "";
      if (id == Long.MIN_VALUE || !(role.equals("s") || role.equals("t")) || lines.hasToken()) {
        throw error("'" + lines.text() + "' is not 'n ID s' or 'n ID t'");
      }
      checkId(id, "terminal");
      if (role.equals("s")) {
        if (source >= 0) {
          throw error("a second source; node " + source + " is the source already");
        }
        source = (int) id;
      } else {
        if (sink >= 0) {
          throw error("a second sink; node " + sink + " is the sink already");
        }
        sink = (int) id;
      }
      if (source >= 0 && source == sink) {
        throw error("node " + id + " is both the source and the sink; they must differ");
      }
    }

    private void arc() throws DimacsFormatException {
      requireProblem("an arc");
      if (sinkOfArcs == null) {
        begin();
      }
      lines.word(); // "a"
      long from = lines.number();
      long to = lines.number();
      long cap = lines.number();
      if (from == Long.MIN_VALUE
          || to == Long.MIN_VALUE
          || cap == Long.MIN_VALUE
          || lines.hasToken()) {
        throw error("'" + lines.text() + "' is not 'a FROM TO CAPACITY' with integer fields");
      }
      checkId(from, "tail");
      checkId(to, "head");
      if (cap < 0 || cap > Integer.MAX_VALUE) {
        throw error("capacity " + cap + "; capacities must lie in 0.." + Integer.MAX_VALUE);
      }
      if (++arcsRead > arcs) {
        throw error("more arcs than the " + arcs + " announced on line " + problemLine);
      }
      try {
        sinkOfArcs.addArc((int) from, (int) to, cap);
      } catch (IllegalArgumentException e) {
        throw error(e.getMessage());
      }
    }

    private void begin() throws DimacsFormatException {
      if (source < 0 || sink < 0) {
        throw error(
            "no "
                + (source < 0 ? "source ('n ID s')" : "sink ('n ID t')")
                + " line before the arcs; a max-flow problem needs both terminals");
      }
      header = new DimacsHeader(nodes, arcs, source, sink);
      try {
        sinkOfArcs = handler.begin(header);
      } catch (IllegalArgumentException e) {
        throw new DimacsFormatException(problemLine, e.getMessage());
      }
    }

    private void requireProblem(String what) throws DimacsFormatException {
      if (nodes < 0) {
        throw error(what + " before the problem line; 'p max NODES ARCS' must come first");
      }
    }

    private void checkId(long id, String role) throws DimacsFormatException {
      if (id < 1 || id > nodes) {
        throw error(role + " node " + id + " does not exist; node ids are 1.." + nodes);
      }
    }

    private DimacsFormatException error(String message) {
      return new DimacsFormatException(lines.lineNumber(), message);
    }
  }
}
