package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import ij.io.RoiEncoder;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.SeedFiles;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Painted strokes: seed labels, erasing, undo, and agreement with the saved ROI zip. */
class SeedStrokesTest {
  static SeedStrokes.Stroke random(SplittableRandom rnd, int w, int h, int d) {
    int n = 1 + rnd.nextInt(6);
    float[] xs = new float[n];
    float[] ys = new float[n];
    for (int i = 0; i < n; i++) {
      xs[i] = (float) (rnd.nextDouble() * w);
      ys[i] = (float) (rnd.nextDouble() * h);
    }
    // every class the brush paints: the ROI names must carry each one through the zip
    int label = 1 + rnd.nextInt(PaintClasses.MAX);
    return new SeedStrokes.Stroke(xs, ys, 1 + rnd.nextInt(9), label, rnd.nextInt(d));
  }

  @Test
  void labelsEqualTheSeedsOfTheSavedRoiZip(@TempDir Path tmp) throws Exception {
    for (int seed = 0; seed < 20; seed++) {
      SplittableRandom rnd = new SplittableRandom(seed);
      int w = 40 + rnd.nextInt(40);
      int h = 30 + rnd.nextInt(40);
      int d = seed % 3 == 0 ? 3 : 1;
      SeedStrokes strokes = new SeedStrokes(w, h, d);
      int count = 1 + rnd.nextInt(6);
      for (int i = 0; i < count; i++) {
        strokes.add(random(rnd, w, h, d));
      }
      Path zip = tmp.resolve("s" + seed + ".zip");
      try (OutputStream out = Files.newOutputStream(zip);
          ZipOutputStream z = new ZipOutputStream(out)) {
        List<SeedStrokes.Stroke> list = strokes.strokes();
        for (int i = 0; i < list.size(); i++) {
          var roi = list.get(i).toRoi(i + 1, d > 1);
          z.putNextEntry(new ZipEntry(roi.getName() + ".roi"));
          z.write(RoiEncoder.saveAsByteArray(roi));
          z.closeEntry();
        }
      }
      SeedLabels fromZip = SeedFiles.read(zip, w, h, d);
      assertThat(strokes.labels().labels()).as("seed %d", seed).isEqualTo(fromZip.labels());
    }
  }

  @Test
  void furtherClassesAreNamedAndColouredByTheRoiConvention() {
    // names: io.RoiSeeds' convention (foreground, background, classN); colours: the Okabe–Ito
    // palette of render.SeedColours (bluish green #009E73 for class 3; values from memory there)
    int[] colours = {0xE69F00, 0x56B4E9, 0x009E73, 0xF0E442, 0x0072B2, 0xD55E00, 0xCC79A7};
    String[] names = {"foreground", "background", "class3", "class4", "class5", "class6", "class7"};
    for (int c = 1; c <= PaintClasses.MAX; c++) {
      var stroke = new SeedStrokes.Stroke(new float[] {5, 20}, new float[] {5, 5}, 3, c, 1);
      var roi = stroke.toRoi(4, true);
      assertThat(roi.getName()).isEqualTo(names[c - 1] + "-4");
      assertThat(roi.getStrokeColor().getRGB() & 0xFFFFFF).isEqualTo(colours[c - 1]);
      assertThat(roi.getPosition()).isEqualTo(2);
    }
    var third = new SeedStrokes.Stroke(new float[] {5, 20}, new float[] {5, 5}, 3, 3, 0);
    assertThat(third.toRoi(1, false).getName()).isEqualTo("class3-1");
    assertThat(third.toRoi(1, false).getStrokeColor()).isEqualTo(new java.awt.Color(0x009E73));
  }

  @Test
  void loadedSeedsOfFurtherClassesShowInTheirColours() {
    int w = 30;
    int h = 20;
    byte[] labels = new byte[w * h * 2];
    labels[5 * w + 5] = 1;
    labels[6 * w + 6] = 2;
    labels[w * h + 7 * w + 7] = 3; // plane 2 only
    labels[w * h + 8 * w + 8] = 5;
    var imp =
        new ij.ImagePlus(
            "seeds", ResultImages.byteStack(new byte[w * h * 2], w, h, 2)); // a 2-plane stack
    var first = LoadedSeeds.rois(labels, imp, 0);
    assertThat(first)
        .extracting(ij.gui.Roi::getName)
        .containsExactly("foreground-loaded", "background-loaded");
    var second = LoadedSeeds.rois(labels, imp, 1);
    assertThat(second)
        .extracting(ij.gui.Roi::getName)
        .containsExactly("class3-loaded", "class5-loaded");
    assertThat(second.get(0).getFillColor().getRGB())
        .isEqualTo((LoadedSeeds.ALPHA << 24) | 0x009E73);
    assertThat(second.get(1).getFillColor().getRGB() & 0xFFFFFF).isEqualTo(0x0072B2);
    assertThat(second.get(0).getPosition()).isEqualTo(2);
    assertThat(second.get(0).getBounds()).isEqualTo(new java.awt.Rectangle(7, 7, 1, 1));
    assertThat(LoadedSeeds.rois(null, imp, 0)).isEmpty();
  }

  @Test
  void paintChoiceNamesAndAlt() {
    assertThat(PaintClasses.label(1)).isEqualTo("Foreground (orange)");
    assertThat(PaintClasses.label(2)).isEqualTo("Background (sky blue)");
    assertThat(PaintClasses.label(3)).isEqualTo("Class 3 (bluish green)");
    assertThat(PaintClasses.label(7)).isEqualTo("Class 7 (reddish purple)");
    // Alt swaps foreground and background, and paints background over a further class
    assertThat(PaintClasses.stroke(1, true)).isEqualTo(2);
    assertThat(PaintClasses.stroke(2, true)).isEqualTo(1);
    for (int c = 1; c <= PaintClasses.MAX; c++) {
      assertThat(PaintClasses.stroke(c, false)).isEqualTo(c);
      if (c >= 3) {
        assertThat(PaintClasses.stroke(c, true)).isEqualTo(2);
      }
    }
    org.assertj.core.api.Assertions.assertThatThrownBy(() -> PaintClasses.stroke(8, false))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("paint class 8");
    org.assertj.core.api.Assertions.assertThatThrownBy(
            () -> BrushSettings.defaults().withPaint(PaintClasses.MAX + 1))
        .isInstanceOf(IllegalArgumentException.class);
    assertThat(BrushSettings.defaults().withPaint(BrushSettings.ERASER).erasing()).isTrue();
  }

  @Test
  void eraseAndUndoRestoreEarlierStates() {
    SeedStrokes s = new SeedStrokes(50, 40, 1);
    var a = new SeedStrokes.Stroke(new float[] {5, 20}, new float[] {5, 5}, 3, 1, 0);
    var b = new SeedStrokes.Stroke(new float[] {5, 40}, new float[] {30, 30}, 3, 2, 0);
    s.add(a);
    byte[] one = s.labels().labels();
    s.add(b);
    byte[] two = s.labels().labels();
    var eraser = new SeedStrokes.Stroke(new float[] {10, 10}, new float[] {0, 10}, 2, 1, 0);
    assertThat(s.erase(eraser)).isTrue();
    assertThat(s.strokes()).containsExactly(b);
    assertThat(s.erase(eraser)).isFalse();
    assertThat(s.undo()).isTrue();
    assertThat(s.labels().labels()).isEqualTo(two);
    s.clear();
    assertThat(s.isEmpty()).isTrue();
    assertThat(s.undo()).isTrue();
    assertThat(s.labels().labels()).isEqualTo(two);
    assertThat(s.undo()).isTrue();
    assertThat(s.labels().labels()).isEqualTo(one);
    assertThat(s.undo()).isTrue();
    assertThat(s.isEmpty()).isTrue();
    assertThat(s.undo()).isFalse();
  }

  @Test
  void sliderIsLogarithmicAndRoundTrips() {
    assertThat(BrushPanel.lambdaOf(0)).isEqualTo(BrushPanel.LAMBDA_MIN);
    assertThat(BrushPanel.lambdaOf(BrushPanel.SLIDER_STEPS))
        .isCloseTo(BrushPanel.LAMBDA_MAX, org.assertj.core.data.Offset.offset(1e-9));
    // equal steps multiply λ by the same factor
    double r1 = BrushPanel.lambdaOf(101) / BrushPanel.lambdaOf(100);
    double r2 = BrushPanel.lambdaOf(301) / BrushPanel.lambdaOf(300);
    assertThat(r1).isCloseTo(r2, org.assertj.core.data.Offset.offset(1e-12));
    for (int p = 0; p <= BrushPanel.SLIDER_STEPS; p++) {
      assertThat(BrushPanel.sliderOf(BrushPanel.lambdaOf(p))).isEqualTo(p);
    }
    assertThat(BrushPanel.sliderOf(0)).isZero();
    assertThat(BrushPanel.sliderOf(1e9)).isEqualTo(BrushPanel.SLIDER_STEPS);
  }
}
