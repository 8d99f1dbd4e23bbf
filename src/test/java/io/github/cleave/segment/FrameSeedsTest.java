package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.synth.TimeLapsePhantom;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class FrameSeedsTest {

  private static double between(int i, int j, int w, int h, VoxelSize s) {
    double dx = (i % w - j % w) * s.x();
    double dy = ((i / w) % h - (j / w) % h) * s.y();
    double dz = (i / (w * h) - j / (w * h)) * s.z();
    return Math.sqrt(dx * dx + dy * dy + dz * dz);
  }

  // The seeds by their definition (class comment), with brute-force Euclidean distances.
  @Test
  void seedsAreWhatTheDefinitionSays() {
    SplittableRandom rnd = new SplittableRandom(9101);
    for (int trial = 0; trial < 150; trial++) {
      int w = rnd.nextInt(2, 14);
      int h = rnd.nextInt(2, 14);
      int d = rnd.nextInt(1, 4);
      VoxelSize s =
          new VoxelSize(0.5, 0.5 * rnd.nextDouble(0.5, 2), rnd.nextDouble(0.3, 2), "um", false);
      int[] labels = new int[w * h * d];
      int blobs = rnd.nextInt(0, 4);
      for (int b = 0; b < blobs; b++) {
        int k = rnd.nextInt(1, 5);
        int x0 = rnd.nextInt(w);
        int y0 = rnd.nextInt(h);
        for (int i = 0; i < labels.length; i++) {
          int x = i % w;
          int y = (i / w) % h;
          if (Math.abs(x - x0) + Math.abs(y - y0) < rnd.nextInt(2, 8)) {
            labels[i] = k;
          }
        }
      }
      double fg = rnd.nextDouble(0, 3);
      double bg = rnd.nextDouble(0, 3);
      double reach = rnd.nextBoolean() ? Double.POSITIVE_INFINITY : bg + rnd.nextDouble(0, 5);
      SeedLabels seeds = new FrameSeeds(fg, bg, reach).from(labels, w, h, d, s);
      boolean any = false;
      for (int l : labels) {
        any |= l != 0;
      }
      for (int i = 0; i < labels.length; i++) {
        double toOther = Double.POSITIVE_INFINITY;
        double toObjects = Double.POSITIVE_INFINITY;
        for (int j = 0; j < labels.length; j++) {
          if (labels[j] != labels[i]) {
            toOther = Math.min(toOther, between(i, j, w, h, s));
          }
          if (labels[j] != 0) {
            toObjects = Math.min(toObjects, between(i, j, w, h, s));
          }
        }
        int want;
        if (!any) {
          want = SeedLabels.NONE;
        } else if (labels[i] != 0) {
          want = toOther > fg * s.x() + 1e-6 ? SeedLabels.FOREGROUND : SeedLabels.NONE;
        } else {
          want =
              toObjects > bg * s.x() + 1e-6 && toObjects <= reach * s.x() - 1e-6
                  ? SeedLabels.BACKGROUND
                  : SeedLabels.NONE;
        }
        boolean nearEdge =
            Math.abs(toOther - fg * s.x()) < 1e-5
                || Math.abs(toObjects - bg * s.x()) < 1e-5
                || Math.abs(toObjects - reach * s.x()) < 1e-5;
        if (!nearEdge) {
          assertThat(seeds.label(i)).as("trial %d voxel %d", trial, i).isEqualTo(want);
        }
      }
    }
  }

  // Known motion bound: TimeLapsePhantom#maxBoundaryShift (a bound by construction of the recipe).
  @Test
  void defaultSeedsFromOneFrameLieRightInTheNext() {
    FrameSeeds rule = FrameSeeds.defaults();
    for (long seed = 1; seed <= 3; seed++) {
      TimeLapsePhantom p = TimeLapsePhantom.generate(seed, 256, 256, 8, 8);
      assertThat(p.maxBoundaryShift() + 1).isLessThanOrEqualTo(rule.foregroundMargin());
      assertThat(p.maxBoundaryShift() + 1).isLessThanOrEqualTo(rule.backgroundMargin());
      VoxelSize size = p.frame(0).voxelSize();
      for (int t = 1; t < p.frameCount(); t++) {
        for (int[] pair : new int[][] {{t - 1, t}, {t, t - 1}}) { // forward and backward
          int[] from = p.truthLabels(pair[0]);
          int[] to = p.truthLabels(pair[1]);
          SeedLabels seeds = rule.from(from, 256, 256, 1, size);
          long[] perCell = new long[p.cellCount() + 1];
          for (int i = 0; i < to.length; i++) {
            if (seeds.label(i) == SeedLabels.FOREGROUND) {
              assertThat(to[i])
                  .as("seed %d, %d->%d, voxel %d", seed, pair[0], pair[1], i)
                  .isEqualTo(from[i]);
              perCell[from[i]]++;
            } else if (seeds.label(i) == SeedLabels.BACKGROUND) {
              assertThat(to[i]).isZero();
            }
          }
          for (int k = 1; k <= p.cellCount(); k++) {
            assertThat(perCell[k]).as("cell %d has foreground seeds", k).isPositive();
          }
        }
      }
    }
  }

  /** Balls of radius r (µm) at the given centres (µm) on an anisotropic grid. */
  private static int[] balls(int w, int h, int d, VoxelSize s, double r, double[][] centres) {
    int[] labels = new int[w * h * d];
    for (int z = 0, i = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++, i++) {
          for (int k = 0; k < centres.length; k++) {
            double dx = x * s.x() - centres[k][0];
            double dy = y * s.y() - centres[k][1];
            double dz = z * s.z() - centres[k][2];
            if (dx * dx + dy * dy + dz * dz < r * r) {
              labels[i] = k + 1;
            }
          }
        }
      }
    }
    return labels;
  }

  @Test
  void stacksWithAnisotropicVoxels() {
    VoxelSize s = new VoxelSize(0.2, 0.2, 0.6, "um", false);
    int w = 60;
    int h = 50;
    int d = 16;
    // two balls of radius 2.4 µm (12 px) that move by 0.5 µm (2.5 px) in x, y and z between frames
    double[][] before = {{3.5, 4.5, 4.5}, {8.5, 5.5, 4.5}};
    double[][] after = {{3.9, 4.2, 4.8}, {8.1, 5.9, 4.2}};
    int[] first = balls(w, h, d, s, 2.4, before);
    int[] second = balls(w, h, d, s, 2.4, after);
    SeedLabels seeds = FrameSeeds.defaults().from(first, w, h, d, s);
    long fg = 0;
    long bg = 0;
    for (int i = 0; i < first.length; i++) {
      if (seeds.label(i) == SeedLabels.FOREGROUND) {
        assertThat(second[i]).isEqualTo(first[i]);
        fg++;
      } else if (seeds.label(i) == SeedLabels.BACKGROUND) {
        assertThat(second[i]).isZero();
        bg++;
      }
    }
    assertThat(fg).isPositive();
    assertThat(bg).isPositive();
  }

  @Test
  void touchingObjectsGiveSeparateSeedsAndTinyOnesNone() {
    int w = 40;
    int h = 20;
    int[] labels = new int[w * h];
    for (int y = 2; y < 18; y++) {
      for (int x = 2; x < 38; x++) {
        labels[x + w * y] = x < 20 ? 1 : 2; // two touching 18 x 16 boxes
      }
    }
    labels[0] = 3; // a one-voxel object
    FrameSeeds rule = new FrameSeeds(4, 6, Double.POSITIVE_INFINITY);
    SeedLabels seeds = rule.from(labels, w, h, 1, VoxelSize.PIXELS);
    int lastOfFirst = -1;
    int firstOfSecond = Integer.MAX_VALUE;
    for (int i = 0; i < labels.length; i++) {
      if (seeds.label(i) == SeedLabels.FOREGROUND) {
        assertThat(labels[i]).isIn(1, 2);
        if (labels[i] == 1) {
          lastOfFirst = Math.max(lastOfFirst, i % w);
        } else {
          firstOfSecond = Math.min(firstOfSecond, i % w);
        }
      }
    }
    assertThat(lastOfFirst).isEqualTo(15); // x 16..19 lie within 4 px of object 2
    assertThat(firstOfSecond).isEqualTo(24);
    assertThat(seeds.label(0)).isEqualTo(SeedLabels.NONE);
    assertThat(seeds.label(w - 1))
        .isEqualTo(SeedLabels.NONE); // 2.8 px from object 2, within the margin
    assertThat(rule.from(new int[w * h], w, h, 1, VoxelSize.PIXELS).maxLabel()).isZero();
  }

  @Test
  void refusesBadMargins() {
    assertThatThrownBy(() -> new FrameSeeds(-1, 6, 20))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("foreground margin -1");
    assertThatThrownBy(() -> new FrameSeeds(4, Double.NaN, 20))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("background margin NaN");
    assertThatThrownBy(() -> new FrameSeeds(4, 6, 5))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("background reach 5");
  }
}
