package io.github.cleave.imagej;

import ij.IJ;
import ij.Macro;
import ij.macro.Interpreter;
import java.awt.GraphicsEnvironment;

/**
 * Tells the user that a command could not do its work. In a macro (macro options present, batch
 * mode, or no display) the message goes to the Log as one line starting with {@code "Cleave: "} and
 * the macro is aborted without a dialog, so an unattended run cannot hang on a modal window;
 * interactively it is an error dialog.
 */
final class Problems {
  private Problems() {}

  /** Whether the running command was started by a macro or without a display. */
  static boolean unattended() {
    return Macro.getOptions() != null
        || Interpreter.isBatchMode()
        || GraphicsEnvironment.isHeadless();
  }

  /** Reports {@code message} for the command {@code title}, see the class comment. */
  static void report(String title, String message) {
    if (unattended()) {
      IJ.log("Cleave: " + title + ": " + message);
      Interpreter.abort();
    } else {
      IJ.error("Cleave: " + title, message);
    }
  }

  /** Reports to the Log only, never a dialog (folder runs). */
  static void log(String title, String message) {
    IJ.log("Cleave: " + title + ": " + message);
    if (unattended()) {
      Interpreter.abort();
    }
  }
}
