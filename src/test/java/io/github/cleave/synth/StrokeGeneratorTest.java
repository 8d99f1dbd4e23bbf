package io.github.cleave.synth;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;

class StrokeGeneratorTest {
  private static final List<Phantom> PHANTOMS = SamplePhantoms.all(SamplePhantoms.DEFAULT_SEED);

  @Test
  void phantomStrokesKeepTheLimits() {
    // Limits of the seeding protocol (project convention, no source): at most two strokes per
    // class, at most 3 voxels wide, each at most 2 % of its region, foreground inside one object
    // away from its edge, background away from every object.
    for (Phantom p : PHANTOMS) {
      List<List<Integer>> fg = strokes(p.seeds(), p.image(), SeedLabels.FOREGROUND);
      List<List<Integer>> bg = strokes(p.seeds(), p.image(), SeedLabels.BACKGROUND);
      assertThat(fg).as(p.name()).hasSize(2);
      assertThat(bg).as(p.name()).hasSize(2);
      checkStrokes(p, fg, bg);
    }
  }

  @Test
  void foregroundStrokesLieInTwoObjectsAndBackgroundStrokesInBrightAndDarkParts() {
    for (Phantom p : PHANTOMS) {
      List<List<Integer>> fg = strokes(p.seeds(), p.image(), SeedLabels.FOREGROUND);
      assertThat(p.truthLabels()[fg.get(0).get(0)])
          .as(p.name())
          .isNotEqualTo(p.truthLabels()[fg.get(1).get(0)]);
      float[] v = SamplePhantomsTest.brightness(p);
      List<List<Integer>> bg = strokes(p.seeds(), p.image(), SeedLabels.BACKGROUND);
      double a = mean(v, bg.get(0));
      double b = mean(v, bg.get(1));
      // the two background strokes sample clearly different illumination (> 20 % apart)
      assertThat(Math.max(a, b) / Math.min(a, b)).as(p.name()).isGreaterThan(1.2);
    }
  }

  @Test
  void oneStrokePerObject() {
    for (Phantom p : PHANTOMS) {
      Raster r = p.image();
      SeedLabels seeds =
          StrokeGenerator.strokesPerObject(
              p.truthLabels(),
              SamplePhantomsTest.brightness(p),
              r.width(),
              r.height(),
              r.depth(),
              9);
      List<List<Integer>> fg = strokes(seeds, r, SeedLabels.FOREGROUND);
      List<List<Integer>> bg = strokes(seeds, r, SeedLabels.BACKGROUND);
      Set<Integer> objects = new HashSet<>();
      for (List<Integer> s : fg) {
        assertThat(objects.add(p.truthLabels()[s.get(0)])).as("one stroke per object").isTrue();
      }
      // every object of these phantoms is deep enough for a stroke
      assertThat(objects).as(p.name()).hasSize(p.objectCount());
      assertThat(bg).hasSize(2);
      checkStrokes(p, fg, bg);
    }
  }

  @Test
  void strokesAreDeterministicForASeed() {
    Phantom p = PHANTOMS.get(0);
    Raster r = p.image();
    float[] v = r.channel(0);
    SeedLabels a = StrokeGenerator.strokes(p.truthLabels(), v, r.width(), r.height(), 1, 4);
    SeedLabels b = StrokeGenerator.strokes(p.truthLabels(), v, r.width(), r.height(), 1, 4);
    assertThat(b.labels()).isEqualTo(a.labels());
  }

  private static void checkStrokes(Phantom p, List<List<Integer>> fg, List<List<Integer>> bg) {
    Raster r = p.image();
    int[] labels = p.truthLabels();
    int[] size = new int[p.objectCount() + 1];
    for (int k : labels) {
      size[k]++;
    }
    int[] objectDepth = StrokeGenerator.distance(labels, r.width(), r.height(), r.depth(), false);
    int[] bgDepth = StrokeGenerator.distance(labels, r.width(), r.height(), r.depth(), true);
    for (List<Integer> stroke : fg) {
      int object = labels[stroke.get(0)];
      assertThat(object).isPositive();
      assertThat((double) stroke.size())
          .isGreaterThanOrEqualTo(3)
          .isLessThanOrEqualTo(0.02 * size[object]);
      for (int i : stroke) {
        assertThat(labels[i]).isEqualTo(object);
        assertThat(objectDepth[i]).isGreaterThan(StrokeGenerator.OBJECT_MARGIN);
      }
      assertThat(thinnerThanFour(stroke, r)).isTrue();
    }
    for (List<Integer> stroke : bg) {
      assertThat((double) stroke.size())
          .isGreaterThanOrEqualTo(3)
          .isLessThanOrEqualTo(0.02 * size[0]);
      for (int i : stroke) {
        assertThat(labels[i]).isZero();
        assertThat(bgDepth[i]).isGreaterThan(StrokeGenerator.BACKGROUND_MARGIN);
      }
      assertThat(thinnerThanFour(stroke, r)).isTrue();
    }
  }

  private static List<List<Integer>> strokes(SeedLabels seeds, Raster r, int label) {
    boolean[] member = new boolean[seeds.size()];
    for (int i = 0; i < member.length; i++) {
      member[i] = seeds.label(i) == label;
    }
    return PhantomChecks.components(member, r.width(), r.height(), r.depth());
  }

  /**
   * At most 3 voxels wide: no 4 x 4 square of the plane lies wholly inside the stroke (a band of
   * width 3 at any angle cannot hold one), and the stroke lies in one plane.
   */
  private static boolean thinnerThanFour(List<Integer> stroke, Raster r) {
    int w = r.width();
    int h = r.height();
    Set<Integer> set = new HashSet<>(stroke);
    int plane = stroke.get(0) / (w * h);
    for (int i : stroke) {
      if (i / (w * h) != plane) {
        return false;
      }
      boolean full = true;
      for (int dy = 0; dy < 4 && full; dy++) {
        for (int dx = 0; dx < 4 && full; dx++) {
          full = (i % w) + dx < w && set.contains(i + dx + w * dy);
        }
      }
      if (full) {
        return false;
      }
    }
    return h > 0;
  }

  private static double mean(float[] v, List<Integer> voxels) {
    double sum = 0;
    for (int i : voxels) {
      sum += v[i];
    }
    return sum / voxels.size();
  }
}
