package io.github.cleave.imagej;

import ij.IJ;
import ij.plugin.PlugIn;
import io.github.cleave.batch.BatchResult;
import io.github.cleave.batch.BatchRunner;
import io.github.cleave.batch.BatchSettings;
import io.github.cleave.batch.FileOutcome;
import io.github.cleave.image.BadInputException;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CancellationException;

/**
 * {@code Plugins > Cleave > Segment Folder...}: applies a saved model to every matching image of a
 * folder with the folder runner ({@link BatchRunner}), writing the same files as the command line's
 * {@code batch}. ImageJ's progress bar follows the files; Esc stops the run cleanly (no new file
 * starts, files in progress are abandoned, every file already written is complete, a rerun
 * resumes). Every problem goes to the Log, never to a dialog, so that an unattended run cannot
 * hang.
 */
public final class SegmentFolderCommand implements PlugIn {
  /** The menu command's name, without the dots. */
  public static final String TITLE = "Segment Folder";

  /** Creates the command (ImageJ calls this through {@link CommandGate}). */
  public SegmentFolderCommand() {}

  @Override
  public void run(String arg) {
    try {
      Map<String, String> values = form().read(null, SegmentFolderCommand::settings);
      if (values == null) {
        return;
      }
      BatchResult result = run(settings(values));
      IJ.log(describe(result));
    } catch (BadInputException e) {
      Problems.log(TITLE, e.getMessage());
    } catch (CancellationException e) {
      Problems.log(
          TITLE,
          "stopped (Esc): every file written is complete; run the same command again to finish");
    } catch (IOException e) {
      Problems.log(TITLE, "a folder output could not be written: " + e.getMessage());
    } finally {
      IJ.showProgress(1.0);
    }
  }

  static Form form() {
    List<FormField> fields =
        new java.util.ArrayList<>(
            List.of(
                FormField.file("Model file (JSON)", ""),
                FormField.folder("Input folder", ""),
                FormField.folder("Output folder", ""),
                FormField.folder("Seeds folder (optional)", ""),
                FormField.text("Pattern of file names", BatchSettings.DEFAULT_PATTERN),
                FormField.text(
                    "Threads", Integer.toString(Runtime.getRuntime().availableProcessors())),
                FormField.check("Recursive (subfolders too)", false),
                FormField.check("Overwrite complete outputs", false)));
    fields.addAll(SettingsFields.timeFields());
    return new Form(TITLE, "folder", fields);
  }

  /** The folder run the values describe. */
  static BatchSettings settings(Map<String, String> v) {
    Path model = path(v, "model", "the model file (JSON)");
    Path in = path(v, "input", "the folder of images");
    Path out = path(v, "output", "the folder for the results");
    String seeds = v.get("seeds");
    int threads = SettingsFields.wholeNumber(v, "threads");
    if (threads < 1) {
      throw new BadInputException("threads=" + threads + ": give 1 or more");
    }
    TimeSettings time = SettingsFields.time(v);
    return new BatchSettings(
            model,
            in,
            out,
            SettingsFields.blank(seeds) ? null : Path.of(seeds),
            threads,
            v.get("pattern"),
            Boolean.parseBoolean(v.get("recursive")),
            Boolean.parseBoolean(v.get("overwrite")),
            0)
        .withTime(
            time.axis(),
            Math.max(0, time.seedFrame() - 1), // a folder has no current time point: 0 means 1
            time.seedsFromNeighbour());
  }

  /**
   * Runs the folder with ImageJ's progress bar and Esc, on the calling thread.
   *
   * @throws CancellationException if Esc was pressed
   */
  public static BatchResult run(BatchSettings settings) throws IOException {
    BatchRunner runner =
        new BatchRunner(
            settings,
            p -> {
              IJ.showProgress(p.done(), p.total());
              IJ.showStatus("Cleave: " + p.line() + " (Esc stops)");
            });
    IJ.showStatus("Cleave: reading " + settings.in() + " (Esc stops)");
    try (EscapeWatch esc = new EscapeWatch(runner::cancel)) {
      return runner.run();
    }
  }

  /** The lines a finished run leaves in the Log: one per failed file, then a summary. */
  static String describe(BatchResult r) {
    StringBuilder sb = new StringBuilder();
    for (FileOutcome f : r.files()) {
      if (f.failed()) {
        sb.append("Cleave: ").append(f.file()).append(" failed: ").append(f.message()).append('\n');
      }
    }
    for (String note : r.notes()) {
      sb.append("Cleave: note: ").append(note).append('\n');
    }
    sb.append(
        String.format(
            java.util.Locale.ROOT,
            "Cleave: folder done: %d file(s), %d failed, %d kept from an earlier run; results in %s",
            r.files().size(),
            r.failedCount(),
            r.reusedCount(),
            r.out()));
    return sb.toString();
  }

  private static Path path(Map<String, String> v, String key, String what) {
    String s = v.get(key);
    if (SettingsFields.blank(s)) {
      throw new BadInputException(key + "=: give " + what);
    }
    return Path.of(s);
  }
}
