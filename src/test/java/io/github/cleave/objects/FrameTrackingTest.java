package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.HashMap;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import java.util.SplittableRandom;
import java.util.TreeMap;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;

// The numbering rule is ours (common practice, no source); these tests hold the implementation to
// the rule as written in FrameTracking's class comment, re-implemented plainly with maps below.
class FrameTrackingTest {

  private static int max(int[] a) {
    int m = 0;
    for (int v : a) {
      m = Math.max(m, v);
    }
    return m;
  }

  /** The rule, written out with maps and sets for clarity, not speed. */
  static int[] reference(int[] previous, int[] current, int firstNew) {
    Map<Integer, Map<Integer, Integer>> overlap = new TreeMap<>();
    Set<Integer> objects = new TreeSet<>();
    for (int i = 0; i < current.length; i++) {
      if (current[i] != 0) {
        objects.add(current[i]);
        if (previous[i] != 0) {
          overlap
              .computeIfAbsent(current[i], k -> new HashMap<>())
              .merge(previous[i], 1, Integer::sum);
        }
      }
    }
    Map<Integer, Integer> choice = new HashMap<>();
    Map<Integer, Integer> choiceSize = new HashMap<>();
    for (int c : objects) {
      int best = 0;
      int bestN = 0;
      for (Map.Entry<Integer, Integer> e : overlap.getOrDefault(c, Map.of()).entrySet()) {
        if (e.getValue() > bestN || (e.getValue() == bestN && e.getKey() < best)) {
          best = e.getKey();
          bestN = e.getValue();
        }
      }
      if (best != 0) {
        choice.put(c, best);
        choiceSize.put(c, bestN);
      }
    }
    Map<Integer, Integer> number = new HashMap<>();
    int next = firstNew;
    for (int c : objects) {
      Integer p = choice.get(c);
      boolean wins = p != null;
      for (int other : objects) {
        if (wins && other != c && p.equals(choice.get(other))) {
          int mine = choiceSize.get(c);
          int theirs = choiceSize.get(other);
          if (theirs > mine || (theirs == mine && other < c)) {
            wins = false;
          }
        }
      }
      number.put(c, wins ? p : next++);
    }
    int[] out = new int[current.length];
    for (int i = 0; i < out.length; i++) {
      out[i] = current[i] == 0 ? 0 : number.get(current[i]);
    }
    return out;
  }

  /** Random label image of rectangles numbered from {@code numbers}; later ones paint over. */
  static int[] rectangles(SplittableRandom rnd, int w, int h, int count, int maxNumber) {
    int[] labels = new int[w * h];
    for (int b = 0; b < count; b++) {
      int k = rnd.nextInt(1, maxNumber + 1);
      int x0 = rnd.nextInt(w);
      int y0 = rnd.nextInt(h);
      int x1 = Math.min(w - 1, x0 + rnd.nextInt(1, w / 2 + 2));
      int y1 = Math.min(h - 1, y0 + rnd.nextInt(1, h / 2 + 2));
      for (int y = y0; y <= y1; y++) {
        for (int x = x0; x <= x1; x++) {
          labels[x + w * y] = k;
        }
      }
    }
    return labels;
  }

  @Test
  void aRenumberedCopyGetsTheOldNumbersBack() {
    SplittableRandom rnd = new SplittableRandom(7001);
    for (int trial = 0; trial < 300; trial++) {
      int w = rnd.nextInt(4, 30);
      int h = rnd.nextInt(4, 30);
      int[] previous = rectangles(rnd, w, h, rnd.nextInt(0, 12), 1000);
      // a random one-to-one renaming of the previous objects
      Map<Integer, Integer> rename = new HashMap<>();
      Set<Integer> used = new HashSet<>();
      int[] current = new int[previous.length];
      for (int i = 0; i < previous.length; i++) {
        int p = previous[i];
        if (p != 0) {
          current[i] =
              rename.computeIfAbsent(
                  p,
                  k -> {
                    int n;
                    do {
                      n = rnd.nextInt(1, 200);
                    } while (!used.add(n));
                    return n;
                  });
        }
      }
      int firstNew = max(previous) + 1 + rnd.nextInt(5);
      assertThat(FrameTracking.track(previous, current, firstNew)).isEqualTo(previous);
      assertThat(FrameTracking.match(previous, current, firstNew).nextNumber()).isEqualTo(firstNew);
    }
  }

  @Test
  void objectsOverlappingNothingGetNewNumbersInTheirOwnOrder() {
    SplittableRandom rnd = new SplittableRandom(7002);
    for (int trial = 0; trial < 200; trial++) {
      int w = rnd.nextInt(4, 30);
      int h = rnd.nextInt(4, 30);
      int[] previous = rectangles(rnd, w, h, rnd.nextInt(0, 6), 50);
      int[] painted = rectangles(rnd, w, h, rnd.nextInt(1, 8), 30);
      int[] current = new int[painted.length];
      for (int i = 0; i < current.length; i++) {
        current[i] = previous[i] == 0 ? painted[i] : 0; // disjoint from every previous object
      }
      int firstNew = max(previous) + 1;
      int[] tracked = FrameTracking.track(previous, current, firstNew);
      TreeSet<Integer> inputs = new TreeSet<>();
      for (int c : current) {
        if (c != 0) {
          inputs.add(c);
        }
      }
      int expected = firstNew;
      Map<Integer, Integer> want = new HashMap<>();
      for (int c : inputs) {
        want.put(c, expected++);
      }
      for (int i = 0; i < current.length; i++) {
        assertThat(tracked[i]).isEqualTo(current[i] == 0 ? 0 : want.get(current[i]));
      }
    }
  }

  @Test
  void randomFramesFollowTheRuleAndNeverRepeatANumber() {
    SplittableRandom rnd = new SplittableRandom(7003);
    for (int trial = 0; trial < 500; trial++) {
      int w = rnd.nextInt(3, 25);
      int h = rnd.nextInt(3, 25);
      int[] previous = rectangles(rnd, w, h, rnd.nextInt(0, 10), 1 + rnd.nextInt(40));
      int[] current = rectangles(rnd, w, h, rnd.nextInt(0, 10), 1 + rnd.nextInt(40));
      int firstNew = max(previous) + 1 + rnd.nextInt(3);
      FrameTracking.Renumbering r = FrameTracking.match(previous, current, firstNew);
      int[] tracked = r.relabel(current);
      assertThat(tracked).as("trial %d", trial).isEqualTo(reference(previous, current, firstNew));
      // one number per object and one object per number
      Map<Integer, Integer> objectOf = new HashMap<>();
      Set<Integer> previousNumbers = new HashSet<>();
      for (int p : previous) {
        previousNumbers.add(p);
      }
      for (int i = 0; i < current.length; i++) {
        assertThat(tracked[i] == 0).isEqualTo(current[i] == 0);
        if (current[i] != 0) {
          Integer before = objectOf.putIfAbsent(tracked[i], current[i]);
          assertThat(before == null || before == current[i])
              .as("number %d reused", tracked[i])
              .isTrue();
          assertThat(previousNumbers.contains(tracked[i]) || tracked[i] >= firstNew).isTrue();
          assertThat(tracked[i]).isLessThan(r.nextNumber());
        }
      }
    }
  }

  @Test
  void divisionKeepsTheNumberOnTheLargerPartAndMergeOnTheLargerOverlap() {
    // one row of voxels; previous: object 5 on 0..5, object 9 on 8..9
    int[] previous = {5, 5, 5, 5, 5, 5, 0, 0, 9, 9};
    // 1 and 2 split object 5 (2 has the larger overlap); 3 lies on 9 and on background
    int[] current = {1, 1, 0, 2, 2, 2, 0, 3, 3, 0};
    assertThat(FrameTracking.track(previous, current, 10))
        .containsExactly(10, 10, 0, 5, 5, 5, 0, 9, 9, 0);
    // equal overlaps: the object with the lower input number wins; choice ties to the lower number
    int[] even = {4, 4, 4, 4, 0, 7, 7, 0, 0, 0}; // 1 and 2 claim 4 with 2 voxels each
    int[] sameSize = {1, 1, 2, 2, 0, 0, 0, 0, 0, 0};
    assertThat(FrameTracking.track(even, sameSize, 8))
        .containsExactly(4, 4, 8, 8, 0, 0, 0, 0, 0, 0);
    int[] straddle = {0, 0, 0, 3, 3, 3, 3, 0, 0, 0}; // 2 voxels on 4, 2 on 7
    int[] tie = {4, 4, 0, 4, 4, 7, 7, 0, 0, 0};
    assertThat(FrameTracking.track(tie, straddle, 8)).containsExactly(0, 0, 0, 4, 4, 4, 4, 0, 0, 0);
  }

  @Test
  void worksOnObjectLabels() {
    int[] previous = {0, 7, 7, 0, 3, 3};
    ObjectLabels current = ObjectLabels.renumbered(6, 1, 1, new int[] {0, 0, 0, 5, 5, 2});
    FrameTracking.Renumbering r = FrameTracking.match(previous, current, 8);
    assertThat(r.relabel(current.labels())).containsExactly(0, 0, 0, 3, 3, 8);
    assertThat(r.nextNumber()).isEqualTo(9);
  }

  @Test
  void refusesBadArguments() {
    assertThatThrownBy(() -> FrameTracking.track(new int[] {0, 4}, new int[] {1, 1}, 4))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("first new number 4");
    assertThatThrownBy(() -> FrameTracking.track(new int[] {0}, new int[] {1, 1}, 4))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("same size");
    assertThatThrownBy(() -> FrameTracking.track(new int[] {0, 0}, new int[] {1, -2}, 4))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("-2");
  }
}
