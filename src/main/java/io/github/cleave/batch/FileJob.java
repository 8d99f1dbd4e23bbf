package io.github.cleave.batch;

import io.github.cleave.batch.FileOutcome.Status;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.Hyperstacks;
import io.github.cleave.io.ImageFiles;
import io.github.cleave.io.LoadedImage;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.io.SeedFiles;
import io.github.cleave.io.SegmentationFiles;
import io.github.cleave.io.TimeLapseFiles;
import io.github.cleave.render.DisplayRange;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.Segmenter;
import io.github.cleave.segment.TimeLapseFrame;
import io.github.cleave.segment.TimeLapseOptions;
import io.github.cleave.segment.TimeLapseResult;
import io.github.cleave.segment.TimeLapseSegmenter;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.CancellationException;
import java.util.function.BooleanSupplier;

/**
 * One file of a folder run, isolated (messages name the file by its path relative to the input
 * folder): keeps complete outputs of an earlier run (unless overwriting), otherwise reserves the
 * heap the image needs, reads it and its seeds, applies the model and writes the image's outputs
 * (overlay with the run's display ranges). Any failure of the file (unreadable, corrupt, wrong
 * channels, too large, seeds that do not fit, a write error, even an unexpected error) becomes a
 * failed {@link FileOutcome} and removes a stale record, so the run goes on; only cancellation
 * propagates.
 */
final class FileJob {
  /** A file's outcome and its contact-sheet thumbnail (null if failed or not shown). */
  record Done(FileOutcome outcome, BufferedImage thumbnail) {}

  /** What every file of a run shares. */
  record Context(
      BatchSettings settings,
      SegmentationModel model,
      String modelSha256,
      DisplayRange[] ranges,
      MemoryBudget budget,
      BooleanSupplier cancelled) {}

  private FileJob() {}

  static Done run(Context c, InputScan.InputFile f, boolean wantThumbnail) {
    long start = System.nanoTime();
    Path outDir = f.outDir(c.settings().out());
    String name = f.baseName();
    try {
      Optional<Path> seedFile = SeedFiles.find(f.path(), f.seedsDir(c.settings().seeds()));
      if (!c.settings().overwrite()) {
        Optional<ResumeCheck.Done> done =
            ResumeCheck.completed(
                outDir, name, f.path(), seedFile.orElse(null), c.modelSha256(), c.settings());
        if (done.isPresent()) {
          BufferedImage thumb =
              wantThumbnail ? Thumbnails.read(outDir.resolve(name + ".overlay.png")) : null;
          return new Done(
              new FileOutcome(
                  f.relative(), Status.OK, "", done.get().objects(), done.get().timeMs(), true),
              thumb);
        }
      }
      // a file that may hold time is opened (its header, one plane) to know how it will be cut
      OpenedSeries series =
          Hyperstacks.mayHoldTime(f.path())
              ? Hyperstacks.openSeries(f.path(), c.settings().timeAxis())
              : null;
      boolean timeLapse = series != null && series.frameCount() > 1;
      long need =
          timeLapse
              ? Hyperstacks.estimateHeapBytes(series)
              : ImageFiles.estimateHeapBytes(f.path());
      long reserved = c.budget().reserve(need, f.path().toString());
      try {
        return timeLapse
            ? segmentTimeLapse(c, f, outDir, seedFile.orElse(null), series, wantThumbnail)
            : segment(c, f, outDir, seedFile.orElse(null), wantThumbnail);
      } finally {
        c.budget().release(reserved);
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new CancellationException("interrupted");
    } catch (CancellationException e) {
      throw e;
    } catch (BadInputException e) {
      return failed(c, f, outDir, e.getMessage(), start);
    } catch (IOException | UncheckedIOException e) {
      checkCancelled(c);
      return failed(c, f, outDir, "cannot read or write a file: " + e.getMessage(), start);
    } catch (OutOfMemoryError e) {
      return failed(
          c,
          f,
          outDir,
          "ran out of heap while segmenting it; start Java with a larger -Xmx or use fewer"
              + " --threads",
          start);
    } catch (RuntimeException e) {
      checkCancelled(c);
      return failed(c, f, outDir, "unexpected error: " + e, start);
    }
  }

  private static Done segment(
      Context c, InputScan.InputFile f, Path outDir, Path seedFile, boolean wantThumbnail)
      throws IOException {
    LoadedImage image = ImageFiles.read(f.path());
    Raster r = image.raster();
    SeedLabels seeds =
        seedFile == null ? null : SeedFiles.read(seedFile, r.width(), r.height(), r.depth());
    checkCancelled(c);
    Segmentation result = Segmenter.apply(c.model(), r, seeds);
    SegmentationFiles.Inputs inputs =
        new SegmentationFiles.Inputs(f.path(), seedFile, c.settings().model());
    Files.createDirectories(outDir);
    DisplayRange[] ranges = c.ranges();
    if (ranges != null && ranges.length < SegmentationFiles.displayChannels(r, c.model()).length) {
      ranges = null; // the run's ranges are for another kind of image; this one gets its own
    }
    BufferedImage picture =
        SegmentationFiles.write(
            outDir, f.baseName(), image, seeds, result, inputs, "batch", ranges);
    return new Done(
        new FileOutcome(
            f.relative(),
            Status.OK,
            "",
            result.objects().count(),
            result.timings().totalMs(),
            false),
        wantThumbnail ? Thumbnails.of(picture) : null);
  }

  /** A time-lapse: every time point with the run's model, outputs over time. */
  private static Done segmentTimeLapse(
      Context c,
      InputScan.InputFile f,
      Path outDir,
      Path seedFile,
      OpenedSeries series,
      boolean wantThumbnail)
      throws IOException {
    SeedLabels seeds =
        seedFile == null
            ? null
            : SeedFiles.read(seedFile, series.width(), series.height(), series.depth());
    checkCancelled(c);
    BatchSettings s = c.settings();
    if (s.seedFrame() >= series.frameCount()) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "seed time point %d, but this file has time points 1 to %d: give a time point it has"
                  + " (--seed-time-point, or seed_frame in ImageJ), or segment this file on its own",
              s.seedFrame() + 1,
              series.frameCount()));
    }
    TimeLapseResult result =
        TimeLapseSegmenter.apply(
            c.model(),
            series,
            seeds,
            s.seedFrame(),
            TimeLapseOptions.defaults().withSeedsFromNeighbour(s.seedsFromNeighbour()));
    SegmentationFiles.Inputs inputs = new SegmentationFiles.Inputs(f.path(), seedFile, s.model());
    Files.createDirectories(outDir);
    BufferedImage picture =
        TimeLapseFiles.write(
            outDir,
            f.baseName(),
            series,
            seeds,
            result,
            inputs,
            "batch",
            s.timeAxis(),
            s.seedsFromNeighbour());
    int objects = 0;
    double ms = 0;
    for (TimeLapseFrame frame : result.frames()) {
      objects += frame.objectCount();
      ms += frame.segmentation().timings().totalMs();
    }
    return new Done(
        new FileOutcome(f.relative(), Status.OK, "", objects, ms, false),
        wantThumbnail ? Thumbnails.of(picture) : null);
  }

  private static Done failed(
      Context c, InputScan.InputFile f, Path outDir, String message, long start) {
    try {
      Files.deleteIfExists(SegmentationFiles.recordFile(outDir, f.baseName()));
    } catch (IOException e) {
      // the record names another model or image, so a rerun does not trust it anyway
    }
    double ms = (System.nanoTime() - start) / 1e6;
    String oneLine =
        message == null
            ? "unknown reason"
            : message.replace(f.path().toString(), f.relative()).replace('\n', ' ').strip();
    return new Done(new FileOutcome(f.relative(), Status.FAILED, oneLine, -1, ms, false), null);
  }

  private static void checkCancelled(Context c) {
    if (c.cancelled().getAsBoolean() || Thread.currentThread().isInterrupted()) {
      throw new CancellationException("interrupted");
    }
  }
}
