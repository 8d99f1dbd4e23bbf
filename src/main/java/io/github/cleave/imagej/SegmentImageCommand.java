package io.github.cleave.imagej;

import ij.IJ;
import ij.ImagePlus;
import ij.WindowManager;
import ij.plugin.PlugIn;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.ImageFiles;
import io.github.cleave.io.LoadedImage;
import io.github.cleave.io.ModelFiles;
import io.github.cleave.io.OpenedSeries;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.Segmenter;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CancellationException;

/**
 * {@code Plugins > Cleave > Segment Current Image...}: learns from the seeds of the current image
 * and cuts it with the same pipeline and defaults as the command line's {@code segment}, so the
 * same image, seeds and settings give the same mask, byte for byte.
 *
 * <p>Seeds: an open seed label image ({@code seeds=TITLE}) or the ROI Manager's ROIs named {@code
 * foreground...}/{@code background...} ({@code seeds=[ROI Manager]}). Settings: the fields of
 * {@link SettingsFields}; {@code save=PATH} also saves the learned model (JSON, for {@code Apply
 * Model...} and {@code Segment Folder...}). Results: see {@link ResultImages}. Esc stops the cut.
 * The current image is only read.
 */
public final class SegmentImageCommand implements PlugIn {
  /** The menu command's name, without the dots. */
  public static final String TITLE = "Segment Current Image";

  /** Creates the command (ImageJ calls this through {@link CommandGate}). */
  public SegmentImageCommand() {}

  @Override
  public void run(String arg) {
    ImagePlus imp = WindowManager.getCurrentImage();
    if (imp == null) {
      Problems.report(TITLE, "no image is open; open the image to segment first");
      return;
    }
    try {
      Form form = form(imp);
      Map<String, String> values = form.read(null, SegmentImageCommand::check);
      if (values == null) {
        return;
      }
      present(TITLE, run(imp, values), Boolean.parseBoolean(values.get("add")));
    } catch (BadInputException e) {
      Problems.report(TITLE, e.getMessage());
    } catch (CancellationException e) {
      Problems.report(TITLE, "stopped (Esc); nothing was made");
    } catch (IOException e) {
      Problems.report(TITLE, "the model could not be saved: " + e.getMessage());
    }
  }

  /** Logs the notes of {@code made}, shows it and puts its summary in the status bar. */
  static void present(String title, Presentable made, boolean roisToManager) {
    for (String note : made.notes()) {
      IJ.log("Cleave: " + title + ": " + note);
    }
    made.show(roisToManager);
    IJ.showStatus(made.summary());
  }

  private static void check(Map<String, String> values) {
    SettingsFields.settings(values);
    SettingsFields.time(values);
  }

  /** The dialog of this command for {@code imp}. */
  static Form form(ImagePlus imp) {
    List<FormField> fields = new ArrayList<>();
    List<String> seeds = SeedSource.choices(imp, false);
    fields.add(FormField.choice("Seeds (seed label image or ROI Manager)", seeds.get(0), seeds));
    fields.addAll(SettingsFields.fields());
    fields.addAll(SettingsFields.timeFields());
    fields.add(FormField.file("Save model to (optional JSON file)", ""));
    fields.add(FormField.check("Add objects to the ROI Manager", false));
    return new Form(TITLE, "segment", fields);
  }

  /**
   * The outcome of a run on an image of one time point: the segmentation and its presentation (not
   * yet shown).
   *
   * @param notes doubts about the time axis (slices that may be time points), for the Log
   */
  record Result(Segmentation segmentation, ResultImages images, List<String> notes)
      implements Presentable {
    @Override
    public void show(boolean roisToManager) {
      images.show(roisToManager);
    }

    @Override
    public String summary() {
      return SegmentImageCommand.summary(segmentation);
    }
  }

  /**
   * Segments {@code imp} with the given field values (macro keys), without showing anything: a
   * {@link Result} for an image of one time point, {@link TimeLapseImages} for a time-lapse.
   *
   * @throws BadInputException for invalid values, seeds or image
   * @throws CancellationException if Esc was pressed
   * @throws IOException if the model cannot be saved
   */
  static Presentable run(ImagePlus imp, Map<String, String> values) throws IOException {
    SegmentationSettings settings = SettingsFields.settings(values);
    TimeSettings time = SettingsFields.time(values);
    OpenedSeries series = TimeLapseRun.series(imp, time);
    for (String warning : series.warnings()) {
      IJ.showStatus("Cleave: " + warning);
    }
    String save = values.get("save");
    if (series.frameCount() > 1) {
      TimeSeeds seeds = TimeSeeds.read(values.get("seeds"), imp, series, time);
      if (seeds.seeds() == null) {
        throw new BadInputException(
            "seeds=none: segmenting needs seeds; give a seed image or use the ROI Manager");
      }
      List<String> inputs = new ArrayList<>();
      if (save != null && !save.isBlank()) {
        inputs.add("model saved to: " + Path.of(save).toAbsolutePath());
      }
      TimeLapseImages made =
          TimeLapseRun.segment(imp, series, seeds, settings, time, TITLE, inputs);
      if (save != null && !save.isBlank()) {
        ModelFiles.write(Path.of(save), made.result().model());
      }
      return made;
    }
    SeedLabels seeds = SeedSource.read(values.get("seeds"), imp);
    if (seeds == null) {
      throw new BadInputException(
          "seeds=none: segmenting needs seeds; give a seed image or use the ROI Manager");
    }
    LoadedImage image = ImageFiles.fromImagePlus(imp, imp.getTitle());
    IJ.showStatus("Cleave: segmenting " + imp.getTitle() + " (Esc stops)");
    Segmentation result;
    try (EscapeWatch esc = EscapeWatch.interrupting(Thread.currentThread());
        WorkProgress progress = WorkProgress.start()) {
      progress.phase(
          "segmenting " + imp.getTitle() + " (Esc stops)", 0, 0.95, image.raster().size());
      result = segment(image, seeds, settings);
    } finally {
      Thread.interrupted(); // a late Esc must not reach the caller's next wait
    }
    List<String> inputs = new ArrayList<>();
    inputs.add("seeds: " + values.get("seeds"));
    if (save != null && !save.isBlank()) {
      Path file = Path.of(save);
      ModelFiles.write(file, result.model());
      inputs.add("model saved to: " + file.toAbsolutePath());
    }
    return new Result(
        result, ResultImages.of(imp, image.raster(), result, TITLE, inputs), series.warnings());
  }

  /**
   * The work of this command without ImageJ's user interface: learns from {@code seeds} and cuts
   * {@code image} ({@link Segmenter#segment}).
   */
  public static Segmentation segment(
      LoadedImage image, SeedLabels seeds, SegmentationSettings settings) {
    return Segmenter.segment(image.raster(), seeds, settings);
  }

  static String summary(Segmentation s) {
    return String.format(
        java.util.Locale.ROOT,
        "Cleave: %d object(s); flow value = cut value = %d; %.0f ms",
        s.objects().count(),
        s.flowValue(),
        s.timings().totalMs());
  }
}
