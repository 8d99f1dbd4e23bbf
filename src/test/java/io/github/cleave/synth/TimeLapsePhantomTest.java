package io.github.cleave.synth;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.image.FrameSeries;
import io.github.cleave.image.SeedLabels;
import java.util.Arrays;
import org.junit.jupiter.api.Test;

class TimeLapsePhantomTest {

  @Test
  void sameSeedSamePixelsAndTruth() {
    TimeLapsePhantom a = TimeLapsePhantom.generate(11, 128, 128, 3, 3);
    TimeLapsePhantom b = TimeLapsePhantom.generate(11, 128, 128, 3, 3);
    TimeLapsePhantom c = TimeLapsePhantom.generate(12, 128, 128, 3, 3);
    for (int t = 0; t < 3; t++) {
      assertThat(a.frame(t).channel(0)).isEqualTo(b.frame(t).channel(0));
      assertThat(a.truthLabels(t)).isEqualTo(b.truthLabels(t));
    }
    assertThat(a.seeds().labels()).isEqualTo(b.seeds().labels());
    assertThat(a.frame(0).channel(0)).isNotEqualTo(c.frame(0).channel(0));
  }

  @Test
  void cellsKeepTheirIdsMoveLittleGrowAndNeverTouch() {
    for (long seed = 1; seed <= 4; seed++) {
      TimeLapsePhantom p = TimeLapsePhantom.generate(seed, 256, 256, 8, 8);
      FrameSeries series = p.series();
      assertThat(series.frameCount()).isEqualTo(8);
      assertThat(p.maxBoundaryShift()).isPositive().isLessThanOrEqualTo(3.0);
      long[] before = null;
      for (int t = 0; t < 8; t++) {
        int[] labels = p.truthLabels(t);
        long[] area = new long[p.cellCount() + 1];
        for (int l : labels) {
          area[l]++;
        }
        for (int k = 1; k <= p.cellCount(); k++) {
          assertThat(area[k]).as("seed %d frame %d cell %d", seed, t, k).isGreaterThan(250);
          if (before != null) {
            assertThat(area[k]).isGreaterThanOrEqualTo((long) (0.97 * before[k]));
          }
        }
        before = area;
        // no two cells touch: no 8-neighbours with different nonzero ids
        int w = 256;
        for (int y = 0; y < 255; y++) {
          for (int x = 0; x < 255; x++) {
            int i = x + w * y;
            for (int j : new int[] {i + 1, i + w, i + w + 1}) {
              if (labels[i] != 0 && labels[j] != 0) {
                assertThat(labels[j]).isEqualTo(labels[i]);
              }
            }
            if (labels[i + 1] != 0 && labels[i + w] != 0) {
              assertThat(labels[i + 1]).isEqualTo(labels[i + w]);
            }
          }
        }
        assertThat(series.frame(t).channel(0)).isSameAs(p.frame(t).channel(0));
      }
      long[] counts = p.seeds().countsPerLabel();
      assertThat(counts.length).isEqualTo(3);
      assertThat(counts[SeedLabels.FOREGROUND]).isPositive();
      assertThat(counts[SeedLabels.BACKGROUND]).isPositive();
      byte[] truth = p.truth(0);
      for (int i = 0; i < truth.length; i++) {
        if (p.seeds().label(i) == SeedLabels.FOREGROUND) {
          assertThat(truth[i]).isEqualTo((byte) 1);
        } else if (p.seeds().label(i) == SeedLabels.BACKGROUND) {
          assertThat(truth[i]).isEqualTo((byte) 0);
        }
      }
      assertThat(Arrays.equals(p.truthLabels(0), p.truthLabels(7))).isFalse();
    }
  }

  @Test
  void refusesTooSmallOrTooCrowded() {
    assertThatThrownBy(() -> TimeLapsePhantom.generate(1, 64, 128, 2, 2))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("at least 96 x 96");
    assertThatThrownBy(() -> TimeLapsePhantom.generate(1, 96, 96, 20, 40))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("do not fit");
  }
}
