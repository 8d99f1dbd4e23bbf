package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import ij.IJ;
import ij.ImagePlus;
import ij.ImageStack;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/**
 * The panel's Create mask / Create label image / Measure (the whole pipeline on the painted seeds)
 * only read the painted image: its pixels on every plane, display range, calibration, title, image
 * info and "changed" flag stay as they were, and the results share no pixel array with it.
 */
class BrushResultsLeaveImageTest {
  @Test
  void creatingResultsLeavesTheOriginalAsItWas() throws Exception {
    for (String name : new String[] {"nuclei", "stained"}) {
      ImagePlus imp = IJ.openImage(Path.of("sample-images", name + ".tif").toString());
      imp.setDisplayRange(imp.getDisplayRangeMin() + 1, imp.getDisplayRangeMax() - 1);
      double min = imp.getDisplayRangeMin();
      double max = imp.getDisplayRangeMax();
      Object[] pixels = copies(imp.getStack());
      String calibration = imp.getCalibration().toString();
      Object info = imp.getProperty("Info");
      BrushSession session = BrushSessionStopTest.session(imp, line -> {});
      StrokePlan plan = StrokePlan.of(Path.of("sample-images", name + ".seeds.tif"));
      for (SeedStrokes.Stroke s : plan.strokes(imp.getWidth(), imp.getHeight(), 3).strokes()) {
        java.awt.EventQueue.invokeAndWait(() -> session.strokes.add(s));
      }
      BrushActions actions = new BrushActions(session, line -> {});
      ResultImages results;
      try (WorkProgress progress = new WorkProgress(new WorkProgressTest.Recorder(), 0)) {
        results =
            actions.images(session.strokes.labels(), session.settings().segmentation(), progress);
      }
      java.awt.EventQueue.invokeAndWait(session::close);

      assertThat(results.mask().getStackSize()).isEqualTo(imp.getNSlices());
      assertThat(results.table().size()).isPositive();
      assertThat(String.valueOf(results.mask().getProperty("Info"))).contains("Made by Cleave");
      Object[] now = imp.getStack().getImageArray();
      for (int z = 0; z < pixels.length; z++) {
        assertThat(java.util.Objects.deepEquals(now[z], pixels[z]))
            .as("%s plane %d unchanged", name, z)
            .isTrue();
        assertThat(now[z]).isNotSameAs(results.mask().getStack().getPixels(z + 1));
        assertThat(now[z]).isNotSameAs(results.labels().getStack().getPixels(z + 1));
      }
      assertThat(imp.getDisplayRangeMin()).isEqualTo(min);
      assertThat(imp.getDisplayRangeMax()).isEqualTo(max);
      assertThat(imp.getCalibration().toString()).isEqualTo(calibration);
      assertThat(imp.getTitle()).isEqualTo(name + ".tif");
      assertThat(imp.getProperty("Info")).isEqualTo(info);
      assertThat(imp.changes).isFalse();
      assertThat(imp.getOverlay()).isNull(); // the session's overlay went with it
    }
  }

  private static Object[] copies(ImageStack stack) {
    Object[] out = new Object[stack.getSize()];
    for (int z = 0; z < out.length; z++) {
      out[z] = stack.getProcessor(z + 1).getPixelsCopy();
    }
    return out;
  }
}
