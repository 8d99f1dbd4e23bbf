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
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.Segmenter;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CancellationException;

/**
 * {@code Plugins > Cleave > Apply Model...}: segments the current image with a saved model (JSON
 * from {@code Segment Current Image...}, the seed brush, or the command line's {@code learn}), the
 * same pipeline as the command line's {@code apply}. Seeds are optional hard constraints. Results:
 * see {@link ResultImages}. Esc stops the cut. The current image is only read.
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
      SegmentImageCommand.Result r = run(imp, values);
      r.images().show(r.segmentation(), Boolean.parseBoolean(values.get("add")));
      IJ.showStatus(SegmentImageCommand.summary(r.segmentation()));
    } catch (BadInputException e) {
      Problems.report(TITLE, e.getMessage());
    } catch (CancellationException e) {
      Problems.report(TITLE, "stopped (Esc); nothing was made");
    }
  }

  static Form form(ImagePlus imp) {
    List<String> seeds = SeedSource.choices(imp, true);
    return new Form(
        TITLE,
        "apply",
        List.of(
            FormField.file("Model file (JSON)", ""),
            FormField.choice("Seeds (optional fixed marks)", SeedSource.NONE, seeds),
            FormField.check("Add objects to the ROI Manager", false)));
  }

  private static void check(Map<String, String> values) {
    String model = values.get("model");
    if (model == null || model.isBlank()) {
      throw new BadInputException("model=: give the model file (JSON) to apply");
    }
  }

  /** Applies the model named by the values to {@code imp}, without showing anything. */
  static SegmentImageCommand.Result run(ImagePlus imp, Map<String, String> values) {
    check(values);
    Path file = Path.of(values.get("model"));
    SegmentationModel model = ModelFiles.read(file);
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
        result, ResultImages.of(imp, image.raster(), result, TITLE, inputs));
  }
}
