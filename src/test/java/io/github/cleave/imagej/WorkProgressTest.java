package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The progress of phased work, driven by explicit clock values (no timing). */
class WorkProgressTest {
  private static final long MS = 1_000_000L;

  /** Records what the bar and the status bar were told. */
  static final class Recorder implements WorkProgress.Sink {
    final List<Double> bar = new ArrayList<>();
    final List<String> lines = new ArrayList<>();

    @Override
    public void progress(double fraction) {
      bar.add(fraction);
    }

    @Override
    public void status(String line) {
      lines.add(line);
    }
  }

  @Test
  void shortWorkShowsNothing() {
    Recorder r = new Recorder();
    WorkProgress p = new WorkProgress(r, 0);
    p.phase("cutting", 0, 0.9, 1_000_000, 0);
    p.tick((WorkProgress.DELAY_MS - 1) * MS);
    p.close();
    assertThat(p.wasShown()).isFalse();
    assertThat(r.bar).isEmpty();
    assertThat(r.lines).isEmpty();
  }

  @Test
  void longWorkMovesForwardWithinEachPhaseAndIsClearedAtTheEnd() {
    SplittableRandom rnd = new SplittableRandom(7);
    for (int run = 0; run < 50; run++) {
      Recorder r = new Recorder();
      WorkProgress p = new WorkProgress(r, 0);
      long now = 0;
      double from = 0;
      int phases = 1 + rnd.nextInt(4);
      for (int k = 0; k < phases; k++) {
        double to = from + (0.95 - from) * (0.2 + 0.6 * rnd.nextDouble());
        p.phase("phase " + k, from, to, 1 + rnd.nextInt(5_000_000), now);
        int ticks = 1 + rnd.nextInt(20);
        for (int t = 0; t < ticks; t++) {
          now += (1 + rnd.nextInt(400)) * MS;
          int before = r.bar.size();
          p.tick(now);
          if (now >= WorkProgress.DELAY_MS * MS) {
            assertThat(r.bar).hasSize(before + 1);
            assertThat(r.lines.get(r.lines.size() - 1)).isEqualTo("phase " + k);
            assertThat(r.bar.get(before)).isLessThan(Math.max(to, from + 1e-12) + 1e-12);
          }
        }
        from = to;
      }
      for (int i = 1; i < r.bar.size(); i++) {
        assertThat(r.bar.get(i)).isGreaterThanOrEqualTo(r.bar.get(i - 1)).isLessThan(1.0);
      }
      p.close();
      p.tick(now + 1000 * MS); // after close: nothing more
      if (p.wasShown()) {
        assertThat(r.bar.get(r.bar.size() - 1)).isEqualTo(1.0); // 1 clears ImageJ's bar
      } else {
        assertThat(r.bar).isEmpty();
      }
    }
  }

  @Test
  void theBandIsApproachedButNotReached() {
    for (double t : new double[] {0, 10, 100, 1000, 10_000}) {
      double f = WorkProgress.fraction(0.2, 0.6, t, 1000);
      assertThat(f).isBetween(0.2, 0.6);
      assertThat(WorkProgress.fraction(0.2, 0.6, t + 1, 1000)).isGreaterThanOrEqualTo(f);
    }
    assertThat(WorkProgress.fraction(0.2, 0.6, 0, 1000)).isEqualTo(0.2);
    // 1 − e^(−1) of the band after the expected time (the formula of the class comment)
    assertThat(WorkProgress.fraction(0, 1, 1000, 1000)).isCloseTo(1 - Math.exp(-1), offset());
    assertThatThrownBy(() -> new WorkProgress(new Recorder(), 0).phase("x", 0.5, 0.5, 1, 0))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("[0.5, 0.5)");
  }

  private static org.assertj.core.data.Offset<Double> offset() {
    return org.assertj.core.data.Offset.offset(1e-12);
  }
}
