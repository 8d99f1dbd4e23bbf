package io.github.cleave.batch;

import io.github.cleave.image.BadInputException;
import io.github.cleave.io.Checksums;
import io.github.cleave.io.ModelFiles;
import io.github.cleave.render.DisplayRange;
import io.github.cleave.segment.SegmentationModel;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.function.BooleanSupplier;
import java.util.function.Function;

/**
 * The driver side of a folder run, shared by the local {@link BatchRunner} and a distributed job:
 * {@link #prepare} before any file, {@link #finish} after all, with the per-file function ({@link
 * FileTask}) run anywhere in between on the files of {@link #files()}.
 *
 * <p><b>Prepare</b>: reads the model and its SHA-256; finds the files ({@link InputScan}; folder
 * mistakes refused with a {@link BadInputException}); creates and locks the output folder; refuses
 * a folder whose {@code run.started.json} names another model unless {@code overwrite}; deletes
 * hidden temporary files of a killed run and an old {@code run.json}; fixes the display ranges
 * (kept from {@code run.started.json} when resuming, else from the first usable file) and writes
 * {@code run.started.json}.
 *
 * <p><b>Finish</b>: writes {@code objects.csv}, {@code files.csv}, {@code contact-sheet.png} and,
 * last, {@code run.json}. The contact sheet's thumbnails are either handed in (local runner) or
 * read back from each file's {@code NAME.overlay.png}, which gives the same pixels ({@link
 * Thumbnails}), so the sheet is the same bytes either way.
 *
 * <p>The lock is held until {@link #close}. Not thread-safe; one run per instance.
 */
public final class PreparedRun implements AutoCloseable {
  /**
   * How many files, the first in run order, the contact sheet shows (failures beyond are added).
   */
  public static final int SHEET_FILES = FolderOutputs.SHEET_FILES;

  private final BatchSettings settings;
  private final SegmentationModel model;
  private final String modelSha256;
  private final List<InputScan.InputFile> inputs;
  private final DisplayRange[] ranges;
  private final Instant started;
  private final RunSpec spec;
  private final AutoCloseable lock;

  private PreparedRun(
      BatchSettings settings,
      SegmentationModel model,
      String modelSha256,
      byte[] modelJson,
      List<InputScan.InputFile> inputs,
      DisplayRange[] ranges,
      Instant started,
      AutoCloseable lock) {
    this.settings = settings;
    this.model = model;
    this.modelSha256 = modelSha256;
    this.inputs = List.copyOf(inputs);
    this.ranges = ranges;
    this.started = started;
    this.lock = lock;
    this.spec = new RunSpec(settings, modelJson, modelSha256, InputScan.root(settings), ranges);
  }

  /**
   * Prepares a run (see the class comment); on success the output folder is locked until {@link
   * #close}.
   *
   * @throws BadInputException for a problem found before any image is segmented (model, folders,
   *     pattern, no file, name clashes, a folder of another model's run, a folder in use)
   * @throws IOException if the output folder cannot be written
   */
  public static PreparedRun prepare(BatchSettings settings) throws IOException {
    return prepare(settings, () -> InputScan.scan(settings), InputScan.InputFile::path);
  }

  /**
   * Prepares a run whose inputs were listed elsewhere (a file system other than the local one, by
   * the rules of {@link InputNames}), as {@link #prepare} does for a local folder; the model and
   * output folder are local ({@code settings.out()} stands for the real output folder: the caller
   * copies into it what it needs, such as {@code run.started.json}, and copies the run-level files
   * out). Files are not read except to fix the display ranges, through {@code fetch}.
   *
   * @param settings {@code in} is a local folder standing for the input folder (it need not hold
   *     the files)
   * @param files the inputs' relative paths ({@code /} between folders), checked with {@link
   *     InputNames#check} and sorted as strings
   * @param fetch a local copy of the input at a relative path, called in run order until one can be
   *     read with the model's channel count; throwing passes the file over
   */
  public static PreparedRun prepareListed(
      BatchSettings settings, List<String> files, Function<String, Path> fetch) throws IOException {
    for (int i = 1; i < files.size(); i++) {
      if (files.get(i - 1).compareTo(files.get(i)) >= 0) {
        throw new IllegalArgumentException(
            "inputs " + files.get(i - 1) + ", " + files.get(i) + ": give them sorted, each once");
      }
    }
    Path root = InputScan.root(settings);
    List<InputScan.InputFile> inputs = new ArrayList<>(files.size());
    for (String relative : files) {
      inputs.add(InputScan.InputFile.of(root, relative));
    }
    return prepare(settings, () -> inputs, f -> fetch.apply(f.relative()));
  }

  /** Where a run's inputs come from. */
  private interface Listing {
    List<InputScan.InputFile> files() throws IOException;
  }

  private static PreparedRun prepare(
      BatchSettings settings, Listing listing, Function<InputScan.InputFile, Path> local)
      throws IOException {
    Instant started = Instant.now();
    // one read: the model sent to the workers and its checksum are those of the same bytes
    byte[] modelJson = ModelFiles.bytes(settings.model());
    SegmentationModel model = ModelFiles.parse(modelJson, settings.model().toString());
    String modelSha = Checksums.sha256(modelJson);
    List<InputScan.InputFile> files = listing.files();
    Path out = settings.out();
    Files.createDirectories(out);
    AutoCloseable lock = RunMarkers.lock(out);
    try {
      Optional<RunMarkers.Started> earlier = RunMarkers.readStarted(out);
      if (earlier.isPresent()
          && !earlier.get().modelSha256().equals(modelSha)
          && !settings.overwrite()) {
        throw new BadInputException(
            "the output folder "
                + out
                + " holds a run of another model (SHA-256 "
                + earlier.get().modelSha256().substring(0, 12)
                + "..., this model is "
                + modelSha.substring(0, 12)
                + "...): give another --out, or --overwrite to replace that run's outputs");
      }
      RunMarkers.removeLeftoverParts(out);
      Files.deleteIfExists(out.resolve(RunMarkers.RUN));
      DisplayRange[] ranges =
          earlier.isPresent()
                  && earlier.get().modelSha256().equals(modelSha)
                  && earlier.get().ranges() != null
                  && !settings.overwrite()
              ? earlier.get().ranges()
              : DisplayRanges.first(files, model, local);
      RunJson.writeStarted(out, settings.model(), modelSha, ranges, started);
      return new PreparedRun(settings, model, modelSha, modelJson, files, ranges, started, lock);
    } catch (IOException | RuntimeException | Error e) {
      try {
        lock.close();
      } catch (Exception suppressed) {
        e.addSuppressed(suppressed);
      }
      throw e;
    }
  }

  /** The run's settings. */
  public BatchSettings settings() {
    return settings;
  }

  /**
   * The inputs in run order: paths relative to the input folder, {@code /} between folders, sorted
   * as strings. {@link #finish} takes one outcome per entry, in this order.
   */
  public List<String> files() {
    List<String> names = new ArrayList<>(inputs.size());
    for (InputScan.InputFile f : inputs) {
      names.add(f.relative());
    }
    return Collections.unmodifiableList(names);
  }

  /** The serialisable values from which a worker opens the per-file function ({@link FileTask}). */
  public RunSpec spec() {
    return spec;
  }

  /**
   * Whether a file name is that of a hidden temporary file a writer leaves while writing ({@code
   * .NAME.HEX.part}, HEX of 1 to 16 lower-case hexadecimal digits): the files {@link
   * #removeLeftoverParts} deletes. Copies to other file systems use such names too.
   */
  public static boolean isTemporaryName(String name) {
    return RunMarkers.isPart(name);
  }

  /**
   * The suffixes of the files a folder run may write for one input named {@code NAME} ({@code
   * NAME.mask.tif}, ...), the record last: what a copy of an earlier run's outputs must bring for a
   * resumed run to keep them.
   */
  public static List<String> outputSuffixes() {
    List<String> all = new ArrayList<>(ResumeCheck.OUTPUTS);
    all.add(".classes.tif");
    all.add(".record.json");
    return Collections.unmodifiableList(all);
  }

  /** The per-file function with the model already parsed (local runs). */
  FileTask task(MemoryBudget budget, BooleanSupplier cancelled) {
    return new FileTask(spec, model, budget, cancelled);
  }

  List<InputScan.InputFile> inputs() {
    return inputs;
  }

  /**
   * Deletes hidden temporary files ({@code .NAME.HEX.part}) in the output folder and below: those
   * of a worker stopped while writing. Call only when no worker of this run is still running.
   *
   * @return the number of files deleted
   */
  public int removeLeftoverParts() throws IOException {
    return RunMarkers.removeLeftoverParts(settings.out());
  }

  /**
   * Writes the folder outputs, thumbnails read back from each file's overlay picture.
   *
   * @param outcomes one per entry of {@link #files()}, in that order
   * @param workers how many files were processed at the same time (at least 1), recorded in {@code
   *     run.json} as the run's {@code threads}
   * @return the run's result, as {@code run.json} records it
   * @throws IllegalArgumentException if the outcomes do not match the files
   * @throws IOException if a folder output cannot be written
   */
  public BatchResult finish(List<FileOutcome> outcomes, int workers) throws IOException {
    return finish(outcomes, null, workers);
  }

  /**
   * Writes the folder outputs.
   *
   * @param thumbnails one per file (null where there is none), or null to read them back
   */
  BatchResult finish(List<FileOutcome> outcomes, List<BufferedImage> thumbnails, int workers)
      throws IOException {
    if (outcomes.size() != inputs.size()) {
      throw new IllegalArgumentException(
          outcomes.size() + " outcomes for " + inputs.size() + " files: give one per file");
    }
    Path out = settings.out();
    List<Path> outDirs = new ArrayList<>();
    List<BufferedImage> thumbs = new ArrayList<>();
    for (int i = 0; i < inputs.size(); i++) {
      InputScan.InputFile f = inputs.get(i);
      FileOutcome o = Objects.requireNonNull(outcomes.get(i), "outcome");
      if (!o.file().equals(f.relative())) {
        throw new IllegalArgumentException(
            "outcome " + i + " is for " + o.file() + ", not " + f.relative() + ": keep run order");
      }
      outDirs.add(f.outDir(out));
      if (thumbnails != null) {
        thumbs.add(thumbnails.get(i));
      } else {
        boolean shown = i < FolderOutputs.SHEET_FILES && !o.failed();
        thumbs.add(
            shown ? Thumbnails.read(f.outDir(out).resolve(f.baseName() + ".overlay.png")) : null);
      }
    }
    List<FileOutcome> noted = FolderOutputs.writeObjects(out, outcomes, outDirs);
    FolderOutputs.writeFiles(out, noted);
    List<String> notes = new ArrayList<>();
    String sheetNote = FolderOutputs.writeSheet(out, noted, thumbs);
    if (sheetNote != null) {
      notes.add(sheetNote);
    }
    BatchResult result = new BatchResult(noted, out, started, Instant.now(), notes);
    RunJson.writeRun(settings.withThreads(workers), model, modelSha256, ranges, result);
    return result;
  }

  /** Releases the output folder's lock. */
  @Override
  public void close() throws IOException {
    try {
      lock.close();
    } catch (IOException | RuntimeException e) {
      throw e;
    } catch (Exception e) {
      throw new IOException(
          "cannot release the lock of " + settings.out() + ": " + e.getMessage(), e);
    }
  }
}
