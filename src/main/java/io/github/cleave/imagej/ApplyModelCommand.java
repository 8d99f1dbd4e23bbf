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
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.Segmenter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CancellationException;

/**
 * {@code Plugins > Cleave > Apply Model...}: segments the current image with a saved model (JSON
 * from {@code Segment Current Image...}, the seed brush, or the command line's {@code learn}), the
 * same pipeline as the command line's {@code apply}. Seeds are optional hard constraints. Results:
 * see {@link ResultImages}. Esc stops the cut. The current image is only read.
 *
 * <p>A time-lapse (see {@link SegmentImageCommand}) is segmented time point by time point from the
 * time point of the seeds, or, without seeds, from the seed frame setting (0: the image's current
 * time point), each other time point seeded from its neighbour when the setting says so.
 */
public final class ApplyModelCommand implements PlugIn {
  /** The menu command's name, without the dots. */
  public static final String TITLE = "Apply Model";

  /** Creates the command (ImageJ calls this through {@link CommandGate}). */
  public ApplyModelCommand() {}

  @Override
  public void run(String arg) {
    ImagePlus imp = WindowManager.getCurrentImage();
    if (imp == null) {
      Problems.report(TITLE, "no image is open; open the image to segment first");
      return;
    }
    try {
      Map<String, String> values = form(imp).read(null, ApplyModelCommand::check);
      if (values == null) {
        return;
      }
      SegmentImageCommand.present(TITLE, run(imp, values), Boolean.parseBoolean(values.get("add")));
    } catch (BadInputException e) {
      Problems.report(TITLE, e.getMessage());
    } catch (CancellationException e) {
      Problems.report(TITLE, "stopped (Esc); nothing was made");
    }
  }

  static Form form(ImagePlus imp) {
    List<String> seeds = SeedSource.choices(imp, true);
    List<FormField> fields = new ArrayList<>();
    fields.add(FormField.file("Model file (JSON)", ""));
    fields.add(FormField.choice("Seeds (optional fixed marks)", SeedSource.NONE, seeds));
    fields.addAll(SettingsFields.timeFields());
    fields.add(FormField.check("Add objects to the ROI Manager", false));
    return new Form(TITLE, "apply", fields);
  }

  private static void check(Map<String, String> values) {
    String model = values.get("model");
    if (model == null || model.isBlank()) {
      throw new BadInputException("model=: give the model file (JSON) to apply");
    }
    SettingsFields.time(values);
  }

  /**
   * Applies the model named by the values to {@code imp}, without showing anything: a {@link
   * SegmentImageCommand.Result} for one time point, {@link TimeLapseImages} for a time-lapse.
   */
  static Presentable run(ImagePlus imp, Map<String, String> values) {
    check(values);
    Path file = Path.of(values.get("model"));
    SegmentationModel model = ModelFiles.read(file);
    TimeSettings time = SettingsFields.time(values);
    OpenedSeries series = TimeLapseRun.series(imp, time);
    for (String warning : series.warnings()) {
      IJ.showStatus("Cleave: " + warning);
    }
    if (series.frameCount() > 1) {
      TimeSeeds seeds = TimeSeeds.read(values.get("seeds"), imp, series, time);
      return TimeLapseRun.apply(
          imp, series, model, seeds, time, TITLE, List.of("model: " + file.toAbsolutePath()));
    }
    SeedLabels seeds = SeedSource.read(values.get("seeds"), imp);
    LoadedImage image = ImageFiles.fromImagePlus(imp, imp.getTitle());
    IJ.showStatus("Cleave: applying " + file.getFileName() + " to " + imp.getTitle());
    Segmentation result;
    try (EscapeWatch esc = EscapeWatch.interrupting(Thread.currentThread());
        WorkProgress progress = WorkProgress.start()) {
      progress.phase(
          "applying " + file.getFileName() + " (Esc stops)", 0, 0.95, image.raster().size());
      result = Segmenter.apply(model, image.raster(), seeds);
    } finally {
      Thread.interrupted();
    }
    List<String> inputs =
        List.of("model: " + file.toAbsolutePath(), "seeds: " + values.get("seeds"));
    return new SegmentImageCommand.Result(
        result, ResultImages.of(imp, image.raster(), result, TITLE, inputs), series.warnings());
  }
}
