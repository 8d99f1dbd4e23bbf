package io.github.cleave.cli;

import java.io.PrintWriter;

/** The DIMACS solution line {@code f FROM TO FLOW}. */
final class FlowLines {
  private FlowLines() {}

  static void print(PrintWriter out, int from, int to, long flow) {
    out.print("f ");
    out.print(from);
    out.print(' ');
    out.print(to);
    out.print(' ');
    out.println(flow);
  }
}
