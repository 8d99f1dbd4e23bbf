package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayDeque;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class ConnectedComponentsTest {

  /**
   * Independent oracle: a plain flood fill over coordinates with an ArrayDeque, neighbours by the
   * definition (Chebyshev distance 1: 8 in a plane, 26 in a stack), starting floods in row-major
   * order. Common practice, no source.
   */
  private static int[] oracle(byte[] mask, int w, int h, int d) {
    int[] labels = new int[mask.length];
    int next = 0;
    for (int z = 0; z < d; z++) {
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          int i = x + w * (y + h * z);
          if (mask[i] == 0 || labels[i] != 0) {
            continue;
          }
          next++;
          labels[i] = next;
          ArrayDeque<int[]> todo = new ArrayDeque<>();
          todo.push(new int[] {x, y, z});
          while (!todo.isEmpty()) {
            int[] p = todo.pop();
            for (int qz = p[2] - 1; qz <= p[2] + 1; qz++) {
              for (int qy = p[1] - 1; qy <= p[1] + 1; qy++) {
                for (int qx = p[0] - 1; qx <= p[0] + 1; qx++) {
                  if (qx < 0 || qy < 0 || qz < 0 || qx >= w || qy >= h || qz >= d) {
                    continue;
                  }
                  int q = qx + w * (qy + h * qz);
                  if (mask[q] != 0 && labels[q] == 0) {
                    labels[q] = next;
                    todo.push(new int[] {qx, qy, qz});
                  }
                }
              }
            }
          }
        }
      }
    }
    return labels;
  }

  @Test
  void agreesWithPlainFloodFillOnRandomMasks() {
    SplittableRandom rnd = new SplittableRandom(11);
    for (int trial = 0; trial < 300; trial++) {
      int w = 1 + rnd.nextInt(30);
      int h = 1 + rnd.nextInt(30);
      int d = trial % 3 == 0 ? 1 + rnd.nextInt(8) : 1;
      byte[] mask = Phantoms.noise(rnd, w * h * d, rnd.nextDouble(0.1, 0.7));
      ObjectLabels labels = ConnectedComponents.of(mask, w, h, d);
      int[] expected = oracle(mask, w, h, d);
      assertThat(labels.labels()).as("trial %d, %d x %d x %d", trial, w, h, d).isEqualTo(expected);
      int max = 0;
      for (int l : expected) {
        max = Math.max(max, l);
      }
      assertThat(labels.count()).isEqualTo(max);
    }
  }

  @Test
  void diagonalTouchConnectsAndNumberingFollowsFirstVoxel() {
    // 0 1 0 0
    // 1 0 0 1
    // 0 0 1 1
    byte[] mask = {0, 1, 0, 0, 1, 0, 0, 1, 0, 0, 1, 1};
    ObjectLabels labels = ConnectedComponents.of(mask, 4, 3, 1);
    assertThat(labels.labels()).containsExactly(0, 1, 0, 0, 1, 0, 0, 2, 0, 0, 2, 2);
    // Stacks: corner contact across planes connects (26-connectivity).
    byte[] stack = {1, 0, 0, 0, 0, 0, 0, 1};
    assertThat(ConnectedComponents.of(stack, 2, 2, 2).count()).isEqualTo(1);
  }

  @Test
  void renumberingUsesFirstVoxelOrder() {
    int[] raw = {0, 7, 7, 3, 0, 9, 3, 0};
    ObjectLabels labels = ObjectLabels.renumbered(4, 2, 1, raw);
    assertThat(labels.labels()).containsExactly(0, 1, 1, 2, 0, 3, 2, 0);
    assertThat(labels.count()).isEqualTo(3);
    assertThat(raw[1]).isEqualTo(7); // input not modified
  }
}
