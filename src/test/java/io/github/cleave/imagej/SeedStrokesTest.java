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
    return new SeedStrokes.Stroke(xs, ys, 1 + rnd.nextInt(9), 1 + rnd.nextInt(2), rnd.nextInt(d));
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
