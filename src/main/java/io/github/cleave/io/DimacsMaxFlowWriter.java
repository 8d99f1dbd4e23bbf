package io.github.cleave.io;

import io.github.cleave.synth.SyntheticGridProblem;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.zip.GZIPOutputStream;

/**
 * Writes a grid problem as a grid-structured DIMACS max-flow file: pixels are nodes {@code 1 ..
 * W*H*D} in row-major order (x fastest), the source is {@code W*H*D + 1}, the sink {@code W*H*D +
 * 2}; arcs with zero capacity are left out. A name ending in {@code .gz} is gzip-compressed. The
 * file is written atomically ({@link AtomicFiles}), so no partial file remains.
 */
public final class DimacsMaxFlowWriter {
  private DimacsMaxFlowWriter() {}

  /**
   * Writes {@code problem} to {@code file}, with {@code comments} as leading {@code c} lines.
   *
   * @throws IOException if the file cannot be written; nothing is left behind then
   */
  public static void write(SyntheticGridProblem problem, Path file, String... comments)
      throws IOException {
    boolean gzip = file.getFileName().toString().endsWith(".gz");
    AtomicFiles.write(
        file,
        raw -> {
          // Closing the writer finishes the gzip trailer and frees the deflater; the raw stream
          // tolerates the second close by AtomicFiles.
          try (Writer writer =
              new BufferedWriter(
                  new OutputStreamWriter(
                      gzip ? new GZIPOutputStream(raw, 1 << 16) : raw, StandardCharsets.US_ASCII),
                  1 << 16)) {
            writeTo(problem, writer, comments);
          }
        });
  }

  private static void writeTo(SyntheticGridProblem problem, Writer w, String... comments)
      throws IOException {
    int n = problem.nodeCount();
    int source = n + 1;
    int sink = n + 2;
    int k = problem.neighborhood().size();
    for (String comment : comments) {
      w.write("c " + comment + "\n");
    }
    w.write(
        "c grid "
            + problem.width()
            + ","
            + problem.height()
            + ","
            + problem.depth()
            + " neighborhood "
            + k
            + "\n");
    w.write("p max " + (n + 2) + " " + problem.arcCount() + "\n");
    w.write("n " + source + " s\n");
    w.write("n " + sink + " t\n");
    for (int i = 0; i < n; i++) {
      int id = i + 1;
      if (problem.sourceCapacity(i) > 0) {
        line(w, source, id, problem.sourceCapacity(i));
      }
      if (problem.sinkCapacity(i) > 0) {
        line(w, id, sink, problem.sinkCapacity(i));
      }
      for (int dir = 0; dir < k; dir++) {
        int c = problem.neighborCapacity(i, dir);
        if (c > 0) {
          line(w, id, neighborId(problem, i, dir), c);
        }
      }
    }
  }

  private static int neighborId(SyntheticGridProblem p, int node, int dir) {
    int w = p.width();
    int h = p.height();
    int x = node % w + p.neighborhood().dx(dir);
    int y = (node / w) % h + p.neighborhood().dy(dir);
    int z = node / (w * h) + p.neighborhood().dz(dir);
    return x + w * (y + h * z) + 1;
  }

  private static void line(Writer w, int from, int to, int cap) throws IOException {
    w.write("a ");
    w.write(Integer.toString(from));
    w.write(' ');
    w.write(Integer.toString(to));
    w.write(' ');
    w.write(Integer.toString(cap));
    w.write('\n');
  }
}
