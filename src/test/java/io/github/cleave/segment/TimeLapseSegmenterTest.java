package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.image.BadInputException;
import io.github.cleave.image.FrameSeries;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.objects.ObjectMeasurement;
import io.github.cleave.quality.Agreement;
import io.github.cleave.synth.TimeLapsePhantom;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.CancellationException;
import org.junit.jupiter.api.Test;

class TimeLapseSegmenterTest {

  /** For each true cell, the tracked number that covers most of it in this frame (0: none). */
  private static int[] numberPerCell(int[] truth, int[] tracked, int cells) {
    List<Map<Integer, Integer>> votes = new ArrayList<>();
    for (int k = 0; k <= cells; k++) {
      votes.add(new HashMap<>());
    }
    for (int i = 0; i < truth.length; i++) {
      if (truth[i] != 0 && tracked[i] != 0) {
        votes.get(truth[i]).merge(tracked[i], 1, Integer::sum);
      }
    }
    int[] out = new int[cells + 1];
    for (int k = 1; k <= cells; k++) {
      out[k] =
          votes.get(k).entrySet().stream()
              .max(Map.Entry.comparingByValue())
              .map(Map.Entry::getKey)
              .orElse(0);
    }
    return out;
  }

  private static void checkQualityAndNumbers(TimeLapsePhantom p, TimeLapseResult result) {
    assertThat(result.frameCount()).isEqualTo(p.frameCount());
    int[] first = null;
    for (int t = 0; t < p.frameCount(); t++) {
      TimeLapseFrame frame = result.frame(t);
      // Dice coefficient: Dice, Ecology 26(3):297-302, 1945 (quality.Agreement)
      assertThat(Agreement.dice(frame.segmentation().mask(), p.truth(t)))
          .as("Dice on frame %d", t)
          .isGreaterThanOrEqualTo(0.95);
      int[] tracked = frame.trackedLabels();
      int[] numbers = numberPerCell(p.truthLabels(t), tracked, p.cellCount());
      Set<Integer> distinct = new HashSet<>();
      for (int k = 1; k <= p.cellCount(); k++) {
        assertThat(numbers[k]).as("frame %d cell %d found", t, k).isPositive();
        distinct.add(numbers[k]);
      }
      assertThat(distinct).hasSize(p.cellCount());
      if (first == null) {
        first = numbers;
      } else {
        assertThat(numbers).as("numbers on frame %d", t).isEqualTo(first);
      }
      // measurements carry the tracked numbers, in ascending order, with matching sizes
      Map<Integer, Long> sizes = new HashMap<>();
      for (int l : tracked) {
        if (l != 0) {
          sizes.merge(l, 1L, Long::sum);
        }
      }
      List<Integer> labels = new ArrayList<>();
      for (ObjectMeasurement m : frame.measurements()) {
        assertThat(sizes.get(m.label())).isEqualTo(m.voxelCount());
        labels.add(m.label());
      }
      assertThat(labels).isSorted().hasSize(sizes.size()).doesNotHaveDuplicates();
      assertThat(frame.index()).isEqualTo(t);
    }
  }

  @Test
  void strokesOnTheFirstFrameSegmentAndTrackEveryFrame() {
    TimeLapsePhantom p = TimeLapsePhantom.generate(31, 256, 256, 8, 8);
    List<int[]> calls = new ArrayList<>();
    TimeLapseOptions options =
        TimeLapseOptions.defaults().withListener((t, count) -> calls.add(new int[] {t, count}));
    TimeLapseResult result =
        TimeLapseSegmenter.segment(
            p.series(), p.seeds(), 0, SegmentationSettings.defaults(), options);
    checkQualityAndNumbers(p, result);
    assertThat(result.seedFrame()).isZero();
    assertThat(calls).hasSize(8);
    for (int i = 0; i < 8; i++) {
      assertThat(calls.get(i)).containsExactly(i, i + 1);
    }
  }

  @Test
  void seedsOnALaterFrameGoBackwardToo() {
    TimeLapsePhantom p = TimeLapsePhantom.generate(32, 256, 256, 6, 7);
    // the phantom reversed in time: the stroked picture (phantom frame 0) is the last frame, so
    // every other frame is done backward from it
    Raster[] reversed = new Raster[6];
    for (int t = 0; t < 6; t++) {
      reversed[t] = p.frame(5 - t);
    }
    List<Integer> doneOrder = new ArrayList<>();
    TimeLapseResult result =
        TimeLapseSegmenter.segment(
            FrameSeries.of(reversed),
            p.seeds(),
            5,
            SegmentationSettings.defaults(),
            TimeLapseOptions.defaults().withListener((t, count) -> doneOrder.add(t)));
    assertThat(doneOrder).containsExactly(5, 4, 3, 2, 1, 0);
    int[] first = null;
    for (int t = 0; t < 6; t++) {
      TimeLapseFrame frame = result.frame(t);
      assertThat(Agreement.dice(frame.segmentation().mask(), p.truth(5 - t)))
          .as("Dice on frame %d", t)
          .isGreaterThanOrEqualTo(0.95);
      int[] numbers = numberPerCell(p.truthLabels(5 - t), frame.trackedLabels(), p.cellCount());
      if (first == null) {
        first = numbers;
        assertThat(
                java.util.Arrays.stream(numbers, 1, numbers.length).distinct().filter(k -> k > 0))
            .hasSize(p.cellCount());
      }
      assertThat(numbers).isEqualTo(first);
    }
  }

  @Test
  void withoutFrameSeedsTheModelAloneStillSegments() {
    TimeLapsePhantom p = TimeLapsePhantom.generate(33, 192, 192, 4, 5);
    TimeLapseResult result =
        TimeLapseSegmenter.segment(
            p.series(),
            p.seeds(),
            0,
            SegmentationSettings.defaults(),
            TimeLapseOptions.defaults().withSeedsFromNeighbour(false));
    checkQualityAndNumbers(p, result);
  }

  @Test
  void anInterruptedThreadStopsTheRun() {
    TimeLapsePhantom p = TimeLapsePhantom.generate(34, 128, 128, 3, 3);
    TimeLapseOptions stopAfterFirst =
        TimeLapseOptions.defaults().withListener((t, count) -> Thread.currentThread().interrupt());
    try {
      assertThatThrownBy(
              () ->
                  TimeLapseSegmenter.segment(
                      p.series(), p.seeds(), 0, SegmentationSettings.defaults(), stopAfterFirst))
          .isInstanceOf(CancellationException.class)
          .hasMessageContaining("frame 2");
    } finally {
      Thread.interrupted(); // clear the flag for the next test
    }
  }

  @Test
  void refusesASeedFrameOutsideTheSeries() {
    TimeLapsePhantom p = TimeLapsePhantom.generate(35, 96, 96, 2, 2);
    SeedLabels seeds = p.seeds();
    assertThatThrownBy(
            () ->
                TimeLapseSegmenter.segment(
                    p.series(),
                    seeds,
                    2,
                    SegmentationSettings.defaults(),
                    TimeLapseOptions.defaults()))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("frame 3")
        .hasMessageContaining("1..2");
  }
}
