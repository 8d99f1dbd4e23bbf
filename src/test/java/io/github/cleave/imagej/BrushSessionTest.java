package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import ij.IJ;
import ij.ImagePlus;
import io.github.cleave.image.SeedLabels;
import java.awt.EventQueue;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.Test;

/**
 * A brush session without windows (the event queue runs headless too): strokes on a z-stack, the
 * live cut per plane and as a volume, the overlay, and the image left as it was.
 */
class BrushSessionTest {
  @Test
  void stackStrokesOnAnyPlaneCountAndVolumeModeCutsTheStack() throws Exception {
    ImagePlus imp = IJ.openImage(Path.of("sample-images", "stack.tif").toString());
    ImagePlus seeds = IJ.openImage(Path.of("sample-images", "stack.seeds.tif").toString());
    int w = imp.getWidth();
    int h = imp.getHeight();
    int d = imp.getNSlices();
    Object before = imp.getStack().getPixels(1);
    short[] copy = ((short[]) before).clone();
    imp.setSlice(d / 2 + 1); // the middle plane is shown
    AtomicReference<String> status = new AtomicReference<>("");
    BrushSession[] s = new BrushSession[1];
    EventQueue.invokeAndWait(() -> s[0] = new BrushSession(imp, status::set));
    BrushSession session = s[0];
    // the sample's seed strokes, as brush strokes on the planes where they were drawn
    SeedLabels labels = SeedSource.fromImage(seeds, w, h, d);
    int strokes = 0;
    for (int z = 0; z < d; z++) {
      byte[] plane = new byte[w * h];
      System.arraycopy(labels.labels(), z * w * h, plane, 0, w * h);
      for (int label = 1; label <= 2; label++) {
        int[] run = StrokePlan.longestRun(plane, w, h, label);
        if (run != null && run[2] > run[0]) {
          int zz = z;
          int ll = label;
          EventQueue.invokeAndWait(
              () ->
                  session.strokes.add(
                      new SeedStrokes.Stroke(
                          new float[] {run[0] + 0.5f, run[2] + 0.5f},
                          new float[] {run[1] + 0.5f, run[1] + 0.5f},
                          1,
                          ll,
                          zz)));
          strokes++;
        }
      }
    }
    assertThat(strokes).isGreaterThanOrEqualTo(2);
    // plane mode: the plane shown is cut, with a model learned from the strokes of every plane
    EventQueue.invokeAndWait(session::strokesChanged);
    BrushDriver.waitFor(() -> session.lastMask() != null, 60_000, "plane cut");
    assertThat(session.lastMask()).hasSize(w * h);
    assertThat(session.lastMaskPlane()).isEqualTo(session.plane());
    // volume mode: the whole stack
    EventQueue.invokeAndWait(
        () ->
            session.setSettings(
                session.settings().withCut(Double.NaN, 0, session.settings().likelihood(), true),
                true));
    BrushDriver.waitFor(
        () -> session.lastMask() != null && session.lastMask().length == w * h * d,
        120_000,
        "volume cut");
    assertThat(session.lastMaskPlane()).isEqualTo(-1);
    byte[] volume = session.lastMask();
    int fg = 0;
    for (byte b : volume) {
      fg += b != 0 ? 1 : 0;
    }
    assertThat(fg).isPositive().isLessThan(volume.length);
    assertThat(status.get()).contains("flow value = cut value = ", "(checked)");
    // the overlay holds the strokes and a contour; closing restores the image's own (none)
    EventQueue.invokeAndWait(session::redraw);
    assertThat(imp.getOverlay().size()).isGreaterThan(strokes);
    EventQueue.invokeAndWait(session::close);
    assertThat(imp.getOverlay()).isNull();
    assertThat((short[]) imp.getStack().getPixels(1)).isEqualTo(copy);
  }
}
