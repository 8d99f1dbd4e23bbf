package io.github.cleave.cli;

import picocli.CommandLine.Model.CommandSpec;

/** Progress lines on standard error, so that standard output stays clean for results. */
final class Progress {
  private Progress() {}

  static void say(CommandSpec spec, String line) {
    spec.commandLine().getErr().println("cleave: " + line + " ...");
    spec.commandLine().getErr().flush();
  }
}
