package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import ij.IJ;
import ij.ImagePlus;
import ij.WindowManager;
import ij.gui.Roi;
import java.awt.EventQueue;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;

/**
 * ImageJ's Edit &gt; Undo (Ctrl+Z) on an image painted with the seed brush: routed to the strokes
 * while the brush is selected, so the overlay shows the strokes before the last one again; any
 * other command, tool or image is left to ImageJ.
 */
class BrushUndoTest {
  @Test
  void undoOnAPaintedImageWithTheBrushSelectedRestoresTheStrokesBeforeTheLastOne()
      throws Exception {
    ImagePlus imp = IJ.openImage(Path.of("sample-images", "nuclei.tif").toString());
    ImagePlus unpainted = IJ.openImage(Path.of("sample-images", "stained.tif").toString());
    BrushSession session = BrushSessionStopTest.session(imp, line -> {});
    SeedBrushTool tool = SeedBrushTool.get();
    AtomicBoolean selected = new AtomicBoolean();
    BrushUndo undo = new BrushUndo(tool, selected::get);
    StrokePlan plan = StrokePlan.of(Path.of("sample-images", "nuclei.seeds.tif"));
    List<SeedStrokes.Stroke> two = plan.strokes(imp.getWidth(), imp.getHeight(), 2).strokes();
    try {
      EventQueue.invokeAndWait(
          () -> {
            tool.attach(session);
            session.strokes.add(two.get(0));
            session.redraw();
          });
      List<String> before = strokeNames(imp);
      EventQueue.invokeAndWait(
          () -> {
            session.strokes.add(two.get(1));
            session.redraw();
          });
      assertThat(strokeNames(imp)).hasSize(before.size() + 1);

      WindowManager.setTempCurrentImage(imp);
      // another tool selected: ImageJ's own Undo runs
      selected.set(false);
      assertThat(undo.commandExecuting(BrushUndo.UNDO)).isEqualTo(BrushUndo.UNDO);
      // the brush selected: other commands pass, Undo is taken
      selected.set(true);
      assertThat(undo.commandExecuting("Gaussian Blur...")).isEqualTo("Gaussian Blur...");
      assertThat(undo.commandExecuting(BrushUndo.UNDO)).isNull();
      EventQueue.invokeAndWait(() -> {}); // the undo runs on the event thread
      assertThat(session.strokes.strokes()).containsExactly(two.get(0));
      assertThat(strokeNames(imp)).isEqualTo(before);
      // an image without a session: ImageJ's Undo
      WindowManager.setTempCurrentImage(unpainted);
      assertThat(undo.commandExecuting(BrushUndo.UNDO)).isEqualTo(BrushUndo.UNDO);
      WindowManager.setTempCurrentImage(null);
      assertThat(undo.routeTo(BrushUndo.UNDO, null)).isNull();
      // without a toolbar (no display) the brush is never the selected tool
      assertThat(SeedBrushTool.isSelected()).isFalse();
    } finally {
      EventQueue.invokeAndWait(
          () -> {
            tool.detach(session);
            session.close();
          });
    }
  }

  /** The names of the stroke ROIs in the image's overlay, in order (the contour left out). */
  private static List<String> strokeNames(ImagePlus imp) {
    List<String> names = new ArrayList<>();
    for (Roi r : imp.getOverlay().toArray()) {
      if (r.getName() != null && !r.getName().equals("cut")) {
        names.add(r.getName());
      }
    }
    return names;
  }
}
