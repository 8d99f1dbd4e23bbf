package io.github.cleave.imagej;

import ij.IJ;
import ij.ImagePlus;
import ij.ImageStack;
import ij.gui.Roi;
import ij.io.FileSaver;
import ij.io.OpenDialog;
import ij.io.RoiEncoder;
import ij.io.SaveDialog;
import ij.plugin.frame.RoiManager;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.ModelFiles;
import io.github.cleave.io.SeedFiles;
import io.github.cleave.objects.RoiExport;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.Segmenter;
import java.awt.EventQueue;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CancellationException;
import java.util.function.Consumer;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;

/**
 * The panel's actions on a brush session. Results come from the whole pipeline ({@link
 * Segmenter#segment}, the same as {@code Segment Current Image...} with the panel's settings), run
 * off the event thread with Esc to stop; the last result is kept while seeds and settings stay the
 * same, so mask, label image, ROIs and measurements of one state agree.
 *
 * <p>With strokes of three or more classes, the mask action also shows the class map (8-bit, seed
 * palette), the measurements have a {@code class} column and the ROIs are grouped and coloured by
 * class ({@link ResultImages}).
 *
 * <p>On a time-lapse ({@link BrushTime}) the results cover every time point: the strokes are the
 * seeds of the session's time point, and {@link TimeLapseRun#segment} (the path of {@code Segment
 * Current Image...} on a time-lapse) cuts that time point, then the others from their neighbours'
 * objects, with progress per time point; Esc stops it and nothing is shown. The results are {@link
 * TimeLapseImages} (hyperstacks over time, tracked numbers, a {@code frame} column, ROIs at their
 * time point). Save model learns from the session's time point; the ROI zip carries it as T
 * position.
 */
final class BrushActions {
  private final BrushSession session;
  private final Consumer<String> status;
  private Segmentation last;
  private SeedLabels lastSeeds;
  private SegmentationSettings lastSettings;
  private TimeLapseImages lastTimeLapse;

  BrushActions(BrushSession session, Consumer<String> status) {
    this.session = session;
    this.status = status;
  }

  /** What an action does with the segmentation of the present seeds. */
  enum Output {
    MASK,
    LABELS,
    ROIS,
    MEASURE
  }

  /** Segments with the present seeds and settings (if needed) and presents {@code output}. */
  void present(Output output) {
    SeedLabels seeds = session.strokes.labels();
    SegmentationSettings settings = session.settings().segmentation();
    if (session.time.isTimeLapse()) {
      background(
          () -> {
            TimeLapseImages made = timeLapse(seeds, settings);
            // the kept images are never shown themselves: closing a window frees its pixels
            switch (output) {
              case MASK -> {
                copyOf(made.mask()).show();
                if (made.classes() != null) {
                  copyOf(made.classes()).show();
                }
              }
              case LABELS -> copyOf(made.labels()).show();
              case MEASURE -> made.table().show(ResultImages.TABLE);
              case ROIS -> made.rois().forEach(RoiManager.getRoiManager()::addRoi);
            }
            status.accept(made.summary());
          });
      return;
    }
    background(
        () -> {
          try (WorkProgress progress = WorkProgress.start()) {
            ResultImages images = images(seeds, settings, progress);
            progress.phase("showing the results", 0.9, 0.95, seeds.size());
            switch (output) {
              case MASK -> {
                images.mask().show();
                if (images.classes() != null) {
                  images.classes().show();
                }
              }
              case LABELS -> images.labels().show();
              case MEASURE -> images.table().show(ResultImages.TABLE);
              case ROIS -> {
                RoiManager rm = RoiManager.getRoiManager();
                for (Roi roi : images.rois()) {
                  rm.addRoi(roi);
                }
              }
            }
          }
          status.accept(SegmentImageCommand.summary(last));
        });
  }

  /**
   * The result images of the present seeds and settings, segmenting again only if they changed.
   * Only reads the session's image: its pixels, overlay, calibration and display range stay as they
   * are.
   */
  synchronized ResultImages images(
      SeedLabels seeds, SegmentationSettings settings, WorkProgress progress) {
    if (last == null
        || !settings.equals(lastSettings)
        || !java.util.Arrays.equals(seeds.labels(), lastSeeds.labels())) {
      if (!LiveCut.hasBothClasses(seeds)) {
        throw new BadInputException("paint at least one foreground and one background stroke");
      }
      status.accept("segmenting with the whole pipeline (Esc stops)");
      progress.phase("segmenting with the whole pipeline (Esc stops)", 0, 0.8, seeds.size());
      last = Segmenter.segment(session.image.raster(), seeds, settings);
      lastSeeds = seeds;
      lastSettings = settings;
    }
    progress.phase("making the result images", 0.8, 0.9, seeds.size());
    return ResultImages.of(
        session.imp,
        session.image.raster(),
        last,
        "Seed Brush",
        List.of("seeds: " + session.strokes.strokes().size() + " stroke(s) painted"));
  }

  /**
   * The results of every time point of a time-lapse from the present seeds (the session's time
   * point) and settings, segmenting again only if they changed (see the class comment).
   *
   * @throws BadInputException without a foreground and a background seed
   * @throws CancellationException if Esc was pressed
   */
  synchronized TimeLapseImages timeLapse(SeedLabels seeds, SegmentationSettings settings) {
    if (lastTimeLapse == null
        || !settings.equals(lastSettings)
        || !java.util.Arrays.equals(seeds.labels(), lastSeeds.labels())) {
      if (!LiveCut.hasBothClasses(seeds)) {
        throw new BadInputException("paint at least one foreground and one background stroke");
      }
      BrushTime time = session.time;
      status.accept("segmenting every time point with the whole pipeline (Esc stops)");
      TimeSettings axis = TimeSettings.defaults(); // as the session read it; neighbours' seeds on
      TimeSeeds from =
          new TimeSeeds(
              seeds,
              time.time(),
              session.strokes.strokes().size() + " brush stroke(s) on " + time.where());
      lastTimeLapse =
          TimeLapseRun.segment(
              session.imp,
              TimeLapseRun.series(session.imp, axis),
              from,
              settings,
              axis,
              SeedBrushCommand.TITLE,
              List.of());
      lastSeeds = seeds;
      lastSettings = settings;
    }
    return lastTimeLapse;
  }

  /** A copy of a kept result image to show: pixels, dimensions, calibration, title and info. */
  private static ImagePlus copyOf(ImagePlus kept) {
    ImagePlus copy = kept.duplicate();
    copy.setTitle(kept.getTitle());
    Object info = kept.getProperty("Info");
    if (info != null) {
      copy.setProperty("Info", info);
    }
    return copy;
  }

  /** Saves the strokes as a ROI zip that {@code Segment Current Image...} and the CLI read. */
  void saveRoiZip() {
    List<SeedStrokes.Stroke> list = session.strokes.strokes();
    if (list.isEmpty()) {
      status.accept("no stroke to save (loaded seed images are saved with Save seed image)");
      return;
    }
    SaveDialog sd = new SaveDialog("Save seeds as ROI zip", base() + ".seeds", ".zip");
    if (sd.getFileName() == null) {
      return;
    }
    Path file = Path.of(sd.getDirectory(), sd.getFileName());
    try {
      writeRoiZip(file);
      status.accept("seeds saved to " + file);
    } catch (IOException e) {
      IJ.error("Cleave", "cannot write " + file + ": " + e.getMessage());
    }
  }

  /**
   * Writes the strokes as a seed ROI zip: each on its z plane (in a stack) and, on a time-lapse, on
   * the session's time point (T position, {@link BrushTime#positionForFile}).
   */
  void writeRoiZip(Path file) throws IOException {
    List<SeedStrokes.Stroke> list = session.strokes.strokes();
    BrushTime time = session.time;
    boolean stack = time.depth() > 1;
    try (OutputStream out = Files.newOutputStream(file);
        ZipOutputStream zip = new ZipOutputStream(out)) {
      for (int i = 0; i < list.size(); i++) {
        Roi roi = list.get(i).toRoi(i + 1, stack);
        if (time.isTimeLapse()) {
          time.positionForFile(roi, list.get(i).plane());
        }
        zip.putNextEntry(new ZipEntry(roi.getName() + ".roi"));
        zip.write(RoiEncoder.saveAsByteArray(roi));
        zip.closeEntry();
      }
    }
  }

  /** Saves the seeds as a seed label image (8-bit TIFF: 0 none, 1 foreground, 2 background). */
  void saveSeedImage() {
    SaveDialog sd = new SaveDialog("Save seed image", base() + ".seeds", ".tif");
    if (sd.getFileName() == null) {
      return;
    }
    SeedLabels s = session.strokes.labels();
    ImageStack stack = ResultImages.byteStack(s.labels(), s.width(), s.height(), s.depth());
    ImagePlus imp = new ImagePlus(sd.getFileName(), stack);
    String path = Path.of(sd.getDirectory(), sd.getFileName()).toString();
    if (new FileSaver(imp).saveAsTiff(path)) {
      BrushTime time = session.time;
      status.accept(
          "seed image saved to "
              + path
              + (time.isTimeLapse()
                  ? " (seeds of time point "
                      + (time.time() + 1)
                      + ": give seed_frame="
                      + (time.time() + 1)
                      + ")"
                  : ""));
    }
  }

  /**
   * Loads seeds from a seed label image or a ROI zip, replacing the strokes (undo brings them
   * back).
   */
  void load() {
    OpenDialog od = new OpenDialog("Load seeds (seed image or ROI zip)");
    if (od.getFileName() == null) {
      return;
    }
    Path file = Path.of(od.getDirectory(), od.getFileName());
    try {
      load(file);
      status.accept("seeds loaded from " + file);
    } catch (BadInputException e) {
      IJ.error("Cleave", e.getMessage());
    }
  }

  /**
   * Loads seeds from {@code file} onto the session's planes (event thread).
   *
   * @throws BadInputException if the file is unusable, or a ROI of it lies on another time point
   *     than the session's (seeds drawn for another time point must not be laid on this one)
   */
  void load(Path file) {
    ImagePlus imp = session.imp;
    if (session.time.isTimeLapse() && file.toString().toLowerCase(Locale.ROOT).endsWith(".zip")) {
      try {
        for (Roi roi : RoiExport.readZip(java.nio.file.Files.readAllBytes(file)).values()) {
          if (roi.hasHyperStackPosition() && roi.getTPosition() != session.time.time() + 1) {
            throw new BadInputException(
                String.format(
                    Locale.ROOT,
                    "the seeds of %s lie on time point %d, but the brush works on %s: show time"
                        + " point %d and start the brush there",
                    file.getFileName(),
                    roi.getTPosition(),
                    session.time.where(),
                    roi.getTPosition()));
          }
        }
      } catch (java.io.IOException e) {
        throw new BadInputException("seed file " + file + " cannot be read: " + e.getMessage(), e);
      }
    }
    session.strokes.load(
        SeedFiles.read(file, imp.getWidth(), imp.getHeight(), session.time.depth()));
    session.strokesChanged();
  }

  /** Learns a model from the present seeds and settings and saves it (JSON, for folders). */
  void saveModel() {
    SaveDialog sd = new SaveDialog("Save model", base() + ".model", ".json");
    if (sd.getFileName() == null) {
      return;
    }
    Path file = Path.of(sd.getDirectory(), sd.getFileName());
    SeedLabels seeds = session.strokes.labels();
    SegmentationSettings settings = session.settings().segmentation();
    background(
        () -> {
          if (!LiveCut.hasBothClasses(seeds)) {
            throw new BadInputException("paint at least one foreground and one background stroke");
          }
          try (WorkProgress progress = WorkProgress.start()) {
            progress.phase("learning the model (Esc stops)", 0, 0.9, seeds.size());
            ModelFiles.write(file, Segmenter.learn(session.image.raster(), seeds, settings));
          }
          status.accept("model saved to " + file + " (for Apply Model and Segment Folder)");
        });
  }

  private String base() {
    return ResultImages.baseTitle(session.imp.getTitle());
  }

  /** Work that may fail with a message. */
  interface Work {
    void run() throws IOException;
  }

  private void background(Work work) {
    Thread t =
        new Thread(
            () -> {
              try (EscapeWatch esc = EscapeWatch.interrupting(Thread.currentThread())) {
                work.run();
              } catch (BadInputException | IOException e) {
                String m = e.getMessage();
                EventQueue.invokeLater(() -> IJ.error("Cleave", m));
              } catch (CancellationException e) {
                status.accept("stopped (Esc)");
              }
            },
            "Cleave action");
    t.setDaemon(true);
    t.start();
  }
}
