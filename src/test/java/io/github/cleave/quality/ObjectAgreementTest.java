package io.github.cleave.quality;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class ObjectAgreementTest {

  @Test
  void handCheckedCases() {
    // reference: object 1 = pixels 0..3, object 2 = pixels 6..9, object 3 = pixel 11
    int[] ref = {1, 1, 1, 1, 0, 0, 2, 2, 2, 2, 0, 3};
    // found: 7 = pixels 0..2 (IoU 3/4 with 1: match), 8 = pixels 5..9 (IoU 4/5 with 2: match),
    // 9 = pixel 10 (no overlap: false positive); object 3 missed
    int[] found = {7, 7, 7, 0, 0, 8, 8, 8, 8, 8, 9, 0};
    ObjectScore s = Agreement.objects(ref, found);
    assertThat(s).isEqualTo(new ObjectScore(2, 1, 1));
    assertThat(s.precision()).isEqualTo(2.0 / 3);
    assertThat(s.recall()).isEqualTo(2.0 / 3);
    assertThat(s.f1()).isEqualTo(2.0 / 3);
  }

  @Test
  void mergedObjectsMatchAtMostOne() {
    // two reference objects of 4 pixels, found as one object of 8: IoU 0.5 with each; the tie is
    // broken by the smaller label, so one match, one miss
    int[] ref = {1, 1, 1, 1, 2, 2, 2, 2};
    int[] found = {5, 5, 5, 5, 5, 5, 5, 5};
    assertThat(Agreement.objects(ref, found)).isEqualTo(new ObjectScore(1, 0, 1));
    // a split below IoU 0.5: 3 pixels of an object of 8 -> no match
    int[] whole = {1, 1, 1, 1, 1, 1, 1, 1};
    int[] split = {2, 2, 2, 3, 3, 3, 4, 4};
    assertThat(Agreement.objects(whole, split)).isEqualTo(new ObjectScore(0, 3, 1));
  }

  @Test
  void emptyImagesScoreOne() {
    ObjectScore s = Agreement.objects(new int[5], new int[5]);
    assertThat(s).isEqualTo(new ObjectScore(0, 0, 0));
    assertThat(s.f1()).isEqualTo(1.0);
    assertThat(s.precision()).isEqualTo(1.0);
    assertThat(s.recall()).isEqualTo(1.0);
  }

  @Test
  void scoresDoNotDependOnLabelNumbersAndSwapWithRoles() {
    SplittableRandom random = new SplittableRandom(5);
    for (int trial = 0; trial < 200; trial++) {
      int n = 20 + random.nextInt(200);
      int[] ref = randomRuns(random, n);
      int[] found = randomRuns(random, n);
      ObjectScore s = Agreement.objects(ref, found);
      ObjectScore relabelled = Agreement.objects(relabel(random, ref), relabel(random, found));
      assertThat(relabelled).isEqualTo(s);
      ObjectScore swapped = Agreement.objects(found, ref);
      assertThat(swapped.truePositives()).isEqualTo(s.truePositives());
      assertThat(swapped.precision()).isEqualTo(s.recall());
      assertThat(swapped.recall()).isEqualTo(s.precision());
      assertThat(Agreement.objects(ref, ref).f1()).isEqualTo(1.0);
    }
  }

  @Test
  void negativeLabelsAreRefused() {
    assertThatThrownBy(() -> Agreement.objects(new int[] {0, -1}, new int[2]))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("-1");
  }

  /** Runs of random length with random labels 0..5 (objects may be split into several runs). */
  private static int[] randomRuns(SplittableRandom random, int n) {
    int[] labels = new int[n];
    int i = 0;
    while (i < n) {
      int len = 1 + random.nextInt(8);
      int label = random.nextInt(6);
      for (int k = 0; k < len && i < n; k++) {
        labels[i++] = label;
      }
    }
    return labels;
  }

  /** The same partition with object labels permuted into 1000.. (background stays 0). */
  private static int[] relabel(SplittableRandom random, int[] labels) {
    List<Integer> targets = new ArrayList<>();
    for (int k = 0; k < 6; k++) {
      targets.add(1000 + 7 * k);
    }
    Collections.shuffle(targets, new java.util.Random(random.nextLong()));
    int[] out = new int[labels.length];
    for (int i = 0; i < labels.length; i++) {
      out[i] = labels[i] == 0 ? 0 : targets.get(labels[i]);
    }
    return out;
  }
}
