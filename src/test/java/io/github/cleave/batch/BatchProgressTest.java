package io.github.cleave.batch;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** The progress line: counts, rate of computed files, time left. */
class BatchProgressTest {

  @Test
  void lineShowsCountsRateAndTimeLeft() {
    // 10 done of which 2 kept: 8 computed in 4 s = 2 files/s; 30 left = 15 s
    BatchProgress p = new BatchProgress(10, 1, 2, 40, 4_000_000_000L);
    assertThat(p.rate()).isEqualTo(2.0);
    assertThat(p.secondsLeft()).isEqualTo(15.0);
    assertThat(p.line()).isEqualTo("10/40 files (1 failed, 2 kept), 2.0 files/s, about 0:15 left");
    assertThat(new BatchProgress(0, 0, 0, 5, 0).line()).isEqualTo("0/5 files");
    assertThat(new BatchProgress(5, 0, 0, 5, 1_000_000_000L).line())
        .isEqualTo("5/5 files, 5.0 files/s");
    assertThat(BatchProgress.clock(3725)).isEqualTo("1:02:05");
  }
}
