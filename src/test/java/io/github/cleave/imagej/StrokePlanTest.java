package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import ij.IJ;
import ij.ImagePlus;
import ij.process.ByteProcessor;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.ImageFiles;
import io.github.cleave.quality.Agreement;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.Segmenter;
import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * What the GUI test paints is enough and in the right place: the two strokes that follow the
 * sample's seed strokes stay inside their class of the sample's ground truth (sample-images/
 * README.md: nuclei.truth.tif) and give a mask within Dice 0.9 of it (the threshold of the GUI
 * test); on random digital lines the plan follows the longest line from end to end through its own
 * pixels, 2 to 3 pixels a step.
 */
class StrokePlanTest {
  static final Path SAMPLES = Path.of("sample-images");

  static final Path SEEDS = SAMPLES.resolve("nuclei.seeds.tif");
  static final Path TRUTH = SAMPLES.resolve("nuclei.truth.tif");

  @Test
  void twoStrokesSegmentTheNucleiSample() {
    var image = ImageFiles.read(SAMPLES.resolve("nuclei.tif"));
    for (StrokePlan plan : List.of(StrokePlan.of(SEEDS), StrokePlan.of(SEEDS, TRUTH))) {
      SeedLabels seeds = plan.strokes(512, 512, 3).labels();
      var result = Segmenter.segment(image.raster(), seeds, SegmentationSettings.defaults());
      double dice = Agreement.dice(result.mask(), truth(TRUTH, 512));
      assertThat(dice).as("%s", plan).isGreaterThanOrEqualTo(0.9);
    }
  }

  @Test
  void strokesStayInsideTheirClassOfTheTruth() {
    StrokePlan seedsOnly = StrokePlan.of(SEEDS);
    StrokePlan plan = StrokePlan.of(SEEDS, TRUTH);
    // strokes, not dots: the background seed stroke is long, the foreground one lengthened
    assertThat(plan.foreground().length()).isGreaterThan(10);
    assertThat(plan.background().length()).isGreaterThan(10);
    assertThat(plan.background().xs()).isEqualTo(seedsOnly.background().xs());
    assertThat(plan.background().ys()).isEqualTo(seedsOnly.background().ys());
    assertContains(plan.foreground(), seedsOnly.foreground());
    assertInClass(plan, truth(TRUTH, 512), 512, 512, "nuclei");
  }

  @Test
  void extendedStrokesStayInsideRandomDiscs() {
    for (int seed = 0; seed < 200; seed++) {
      SplittableRandom rnd = new SplittableRandom(seed);
      int w = 60 + rnd.nextInt(40);
      int h = 60 + rnd.nextInt(40);
      int r = 7 + rnd.nextInt(14);
      int cx = r + rnd.nextInt(w - 2 * r);
      int cy = r + rnd.nextInt(h - 2 * r);
      ByteProcessor truth = new ByteProcessor(w, h);
      truth.setColor(255);
      truth.fillOval(cx - r, cy - r, 2 * r, 2 * r);
      // a short foreground seed line through the middle and a background one in a corner
      ByteProcessor seeds = new ByteProcessor(w, h);
      double a = rnd.nextDouble() * Math.PI;
      int dx = (int) Math.round(2 * Math.cos(a));
      int dy = (int) Math.round(2 * Math.sin(a));
      seeds.setColor(1);
      seeds.drawLine(cx - dx, cy - dy, cx + dx, cy + dy);
      seeds.setColor(2);
      seeds.drawLine(4, h - 5, 4 + rnd.nextInt(3), h - 5 - rnd.nextInt(3));
      byte[] s = (byte[]) seeds.getPixels();
      byte[] t = (byte[]) truth.getPixels();
      StrokePlan.Polyline fg = StrokePlan.follow(s, w, h, 1);
      StrokePlan.Polyline bg = StrokePlan.follow(s, w, h, 2);
      StrokePlan plan =
          new StrokePlan(
              StrokePlan.extend(fg, t, w, h, true), StrokePlan.extend(bg, t, w, h, false));
      assertContains(plan.foreground(), fg);
      assertContains(plan.background(), bg);
      assertInClass(plan, t, w, h, "seed " + seed);
    }
  }

  @Test
  void followsTheLargestOfRandomDigitalLinesEndToEnd() {
    for (int seed = 0; seed < 300; seed++) {
      SplittableRandom rnd = new SplittableRandom(seed);
      int w = 40 + rnd.nextInt(60);
      int h = 40 + rnd.nextInt(60);
      int half = w / 2;
      int[] line;
      do { // the long line in the left half, at least 13 pixels
        line =
            new int[] {
              rnd.nextInt(half - 2), rnd.nextInt(h - 1), rnd.nextInt(half - 2), rnd.nextInt(h - 1)
            };
      } while (Math.max(Math.abs(line[2] - line[0]), Math.abs(line[3] - line[1])) < 12);
      ByteProcessor ip = new ByteProcessor(w, h);
      ip.setColor(1);
      ip.drawLine(line[0], line[1], line[2], line[3]);
      byte[] longLine = ((byte[]) ip.getPixels()).clone();
      int x = half + 2 + rnd.nextInt(w - half - 10);
      int y = rnd.nextInt(h - 8);
      ip.drawLine(x, y, x + rnd.nextInt(8), y + rnd.nextInt(8)); // a shorter line on the right
      ip.setColor(2);
      ip.drawLine(0, h - 1, w - 1, h - 1); // the other class, along the bottom edge
      byte[] p = (byte[]) ip.getPixels();

      StrokePlan.Polyline l = StrokePlan.follow(p, w, h, 1);
      int n = l.size();
      assertThat(List.of(l.xs()[0], l.ys()[0], l.xs()[n - 1], l.ys()[n - 1]))
          .as("seed %d: ends", seed)
          .isIn(
              List.of(line[0], line[1], line[2], line[3]),
              List.of(line[2], line[3], line[0], line[1]));
      for (int k = 0; k < n; k++) {
        assertThat(longLine[l.ys()[k] * w + l.xs()[k]])
            .as("seed %d point %d", seed, k)
            .isEqualTo((byte) 1);
        if (k > 0) {
          double step = Math.hypot(l.xs()[k] - l.xs()[k - 1], l.ys()[k] - l.ys()[k - 1]);
          // at least SPACING along the axis; less than one pixel step (at most a diagonal) more
          assertThat(step).as("seed %d step %d", seed, k).isLessThan(4);
          if (k < n - 1) {
            assertThat(step).as("seed %d step %d", seed, k).isGreaterThanOrEqualTo(2);
          } else {
            assertThat(step).as("seed %d last step", seed).isPositive();
          }
        }
      }
      // a straight line: the polyline is as long as the segment between its ends, within 5 %
      double chord = Math.hypot(line[2] - line[0], line[3] - line[1]);
      assertThat(l.length()).as("seed %d", seed).isBetween(chord - 1e-9, chord * 1.05);
    }
  }

  /** The points of {@code part} are consecutive points of {@code whole}. */
  static void assertContains(StrokePlan.Polyline whole, StrokePlan.Polyline part) {
    StringBuilder a = new StringBuilder();
    StringBuilder b = new StringBuilder();
    for (int i = 0; i < whole.size(); i++) {
      a.append(whole.xs()[i]).append(',').append(whole.ys()[i]).append(';');
    }
    for (int i = 0; i < part.size(); i++) {
      b.append(part.xs()[i]).append(',').append(part.ys()[i]).append(';');
    }
    assertThat(";" + a).contains(";" + b);
  }

  /**
   * Painted with a brush of width 3 through the pixel centres and through the pixel corners (where
   * a drag at magnification 1 puts them), each stroke covers only pixels of its own class.
   */
  static void assertInClass(StrokePlan plan, byte[] truth, int w, int h, String what) {
    for (float offset : new float[] {0.5f, 0}) {
      SeedStrokes s = new SeedStrokes(w, h, 1);
      s.add(plan.foreground().stroke(3, 1, offset));
      s.add(plan.background().stroke(3, 2, offset));
      byte[] labels = s.labels().labels();
      for (int i = 0; i < labels.length; i++) {
        if (labels[i] != 0) {
          assertThat(truth[i] != 0 ? 1 : 2)
              .as("%s: pixel (%d, %d), offset %s", what, i % w, i / w, offset)
              .isEqualTo(labels[i]);
        }
      }
    }
  }

  private static byte[] truth(Path file, int width) {
    ImagePlus truth = IJ.openImage(file.toString());
    assertThat(truth.getWidth()).isEqualTo(width);
    return (byte[]) truth.getProcessor().getPixels();
  }
}
