package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import ij.ImagePlus;
import ij.gui.Roi;
import ij.macro.Interpreter;
import ij.process.LUT;
import ij.process.ShortProcessor;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.synth.CellPhantom;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

/** Three classes in the results of {@code Segment Current Image...}, on {@link CellPhantom}. */
class ClassResultsTest {
  // Okabe & Ito, "Color Universal Design" palette as DESIGN.md states it (values from memory):
  // orange, sky blue, bluish green.
  static final int[] PALETTE = {0xE69F00, 0x56B4E9, 0x009E73};

  @Test
  void classMapHasThePaletteLutAndClassesOneToThree() throws Exception {
    CellPhantom p = CellPhantom.make(7);
    float[] v = p.image().channel(0);
    short[] s = new short[v.length];
    for (int i = 0; i < v.length; i++) {
      s[i] = (short) Math.round(v[i]);
    }
    ImagePlus image = new ImagePlus("cells.tif", new ShortProcessor(256, 256, s, null));
    ImagePlus seeds = TimeLapseCommandsTest.seedImage(p.seeds(), "cells.seeds.tif");
    boolean batch = Interpreter.batchMode;
    Interpreter.batchMode = true;
    Interpreter.addBatchModeImage(seeds);
    SegmentImageCommand.Result r;
    try {
      r =
          (SegmentImageCommand.Result)
              MacroThread.call(
                  "seeds=cells.seeds.tif refine=1 illumination=keep",
                  image,
                  () -> {
                    Map<String, String> values =
                        SegmentImageCommand.form(image).read(null, SettingsFields::settings);
                    return SegmentImageCommand.run(image, values);
                  });
    } finally {
      Interpreter.removeBatchModeImage(seeds);
      Interpreter.batchMode = batch;
    }
    Segmentation seg = r.segmentation();
    assertThat(seg.isMultiClass()).isTrue();
    ImagePlus classes = r.images().classes();
    assertThat(classes).isNotNull();
    assertThat(classes.getBitDepth()).isEqualTo(8);
    byte[] px = (byte[]) classes.getProcessor().getPixels();
    assertThat(px).isEqualTo(seg.classes().labels());
    Set<Integer> values = new TreeSet<>();
    for (byte b : px) {
      values.add(b & 0xff);
    }
    assertThat(values).containsExactly(1, 2, 3);
    LUT lut = classes.getProcessor().getLut();
    assertThat(lut.getRGB(0) & 0xffffff).isZero();
    for (int k = 1; k <= 3; k++) {
      assertThat(lut.getRGB(k) & 0xffffff).as("class %d", k).isEqualTo(PALETTE[k - 1]);
    }
    assertThat(classes.getDisplayRangeMin()).isZero();
    assertThat(classes.getDisplayRangeMax()).isEqualTo(255);
    // the table's class column and the ROIs' class names and colours follow each object's class
    var table = r.images().table();
    assertThat(table.getColumnIndex("class")).isEqualTo(table.getColumnIndex("object") + 1);
    for (int row = 0; row < table.size(); row++) {
      int object = (int) table.getValue("object", row);
      assertThat((int) table.getValue("class", row)).isEqualTo(seg.classes().classOf(object));
    }
    Set<Integer> groups = new TreeSet<>();
    for (Roi roi : r.images().rois()) {
      String name = roi.getName(); // object-NNNN-classC
      int object = Integer.parseInt(name.substring(7, name.indexOf("-class")));
      int c = seg.classes().classOf(object);
      assertThat(name).endsWith("-class" + c);
      assertThat(roi.getStrokeColor().getRGB() & 0xffffff).isEqualTo(PALETTE[c - 1]);
      groups.add(c);
    }
    assertThat(groups).containsExactly(CellPhantom.NUCLEUS, CellPhantom.CYTOPLASM);
  }
}
