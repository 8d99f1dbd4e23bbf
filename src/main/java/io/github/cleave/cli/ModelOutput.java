package io.github.cleave.cli;

import java.nio.file.Files;
import java.nio.file.Path;

/** Checks a model file to be written before any work is done, so a run never fails at its end. */
final class ModelOutput {
  private ModelOutput() {}

  /**
   * @param replace whether an existing file may be replaced
   * @throws InputException if the folder is missing, the path is a folder, or the file exists and
   *     may not be replaced
   */
  static void check(Path model, String option, boolean replace) {
    Path parent = model.toAbsolutePath().getParent();
    if (parent == null || !Files.isDirectory(parent)) {
      throw new InputException(
          option + " " + model + ": the folder " + parent + " does not exist; create it first");
    }
    if (Files.isDirectory(model)) {
      throw new InputException(option + " " + model + " is a folder: give a file name");
    }
    if (Files.exists(model) && !replace) {
      String hint = option.equals("--model") ? " or use --force to replace it" : "";
      throw new InputException(option + " " + model + " exists: choose a new name" + hint);
    }
  }
}
