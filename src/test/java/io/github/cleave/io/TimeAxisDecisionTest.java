package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The time axis rule over many random images (the rule is ours: common practice, no source): real
 * frames always win; forced settings are obeyed; AUTO reads slices as frames exactly when there is
 * a frame interval and no z spacing or a description naming a time-lapse; every doubtful volume
 * carries one warning.
 */
class TimeAxisDecisionTest {
  private static final String[] DESCRIPTIONS = {
    "", "ImageJ=1.54p\nimages=12\n", "a time-lapse of dividing cells", "Time points: 12", "z-stack"
  };

  @Test
  void ruleHoldsOverRandomImages() {
    SplittableRandom random = new SplittableRandom(2024);
    for (int k = 0; k < 2000; k++) {
      TimeAxis axis = TimeAxis.values()[random.nextInt(3)];
      int slices = 1 + random.nextInt(6);
      int frames = random.nextInt(3) == 0 ? 1 + random.nextInt(5) : 1;
      double interval = random.nextBoolean() ? 0 : 0.5 * (1 + random.nextInt(10));
      double depth = random.nextBoolean() ? 1 : 0.1 * (1 + random.nextInt(20));
      String description = DESCRIPTIONS[random.nextInt(DESCRIPTIONS.length)];
      boolean saysTime = description.toLowerCase(java.util.Locale.ROOT).contains("time");

      TimeAxisDecision d =
          TimeAxisDecision.decide(
              axis, "img.tif", slices, frames, interval, "sec", depth, description);

      OpenedSeries.TimeSource expected;
      if (frames > 1) {
        expected = OpenedSeries.TimeSource.FRAMES;
      } else if (slices == 1) {
        expected = OpenedSeries.TimeSource.NONE;
      } else if (axis == TimeAxis.SLICES_ARE_FRAMES) {
        expected = OpenedSeries.TimeSource.SLICES_AS_FRAMES;
      } else if (axis == TimeAxis.SLICES_ARE_Z) {
        expected = OpenedSeries.TimeSource.NONE;
      } else {
        expected =
            interval > 0 && (depth == 1 || saysTime)
                ? OpenedSeries.TimeSource.SLICES_AS_FRAMES
                : OpenedSeries.TimeSource.NONE;
      }
      String what =
          axis
              + " slices="
              + slices
              + " frames="
              + frames
              + " interval="
              + interval
              + " depth="
              + depth
              + " description="
              + description;
      assertThat(d.source()).as(what).isEqualTo(expected);
      assertThat(d.reason()).as(what).contains("img.tif");

      boolean autoChoice = axis == TimeAxis.AUTO && frames == 1 && slices > 1;
      boolean doubtful =
          autoChoice
              && (expected == OpenedSeries.TimeSource.SLICES_AS_FRAMES || interval > 0 || saysTime);
      boolean ignoredSetting = frames > 1 && slices > 1 && axis == TimeAxis.SLICES_ARE_FRAMES;
      assertThat(d.warnings()).as(what).hasSize(doubtful || ignoredSetting ? 1 : 0);
      if (autoChoice && expected == OpenedSeries.TimeSource.SLICES_AS_FRAMES) {
        assertThat(d.warnings().get(0)).contains(slices + " time points", "slices-are-z");
      } else if (doubtful) {
        assertThat(d.warnings().get(0)).contains("slices-are-frames");
      }
    }
  }
}
