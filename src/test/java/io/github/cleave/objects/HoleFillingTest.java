package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class HoleFillingTest {

  @Test
  void equalsABreadthFirstFloodFromTheBorderOnRandomMasks() {
    // Reference: the definition itself, background not reached from the border by axial steps
    // (a breadth-first flood, textbook, no source needed) is a hole.
    SplittableRandom random = new SplittableRandom(20261202L);
    for (int trial = 0; trial < 400; trial++) {
      int w = 1 + random.nextInt(14);
      int h = 1 + random.nextInt(14);
      int d = trial % 2 == 0 ? 1 : 1 + random.nextInt(6);
      int density = 30 + random.nextInt(50); // percent foreground
      byte[] mask = new byte[w * h * d];
      for (int i = 0; i < mask.length; i++) {
        mask[i] = (byte) (random.nextInt(100) < density ? 255 : 0);
      }
      assertThat(HoleFilling.fill(mask, w, h, d)).isEqualTo(flood(mask, w, h, d));
    }
  }

  private static byte[] flood(byte[] mask, int w, int h, int d) {
    int n = mask.length;
    boolean[] outside = new boolean[n];
    int[] queue = new int[n];
    int tail = 0;
    for (int i = 0; i < n; i++) {
      int x = i % w;
      int y = i / w % h;
      int z = i / (w * h);
      boolean border =
          x == 0 || x == w - 1 || y == 0 || y == h - 1 || (d > 1 && (z == 0 || z == d - 1));
      if (border && mask[i] == 0) {
        outside[i] = true;
        queue[tail++] = i;
      }
    }
    int[][] steps = {{1, 0, 0}, {-1, 0, 0}, {0, 1, 0}, {0, -1, 0}, {0, 0, 1}, {0, 0, -1}};
    for (int head = 0; head < tail; head++) {
      int i = queue[head];
      int x = i % w;
      int y = i / w % h;
      int z = i / (w * h);
      for (int[] s : steps) {
        int qx = x + s[0];
        int qy = y + s[1];
        int qz = z + s[2];
        if (qx < 0 || qx >= w || qy < 0 || qy >= h || qz < 0 || qz >= d) {
          continue;
        }
        int q = qx + w * (qy + h * qz);
        if (mask[q] == 0 && !outside[q]) {
          outside[q] = true;
          queue[tail++] = q;
        }
      }
    }
    byte[] out = new byte[n];
    for (int i = 0; i < n; i++) {
      out[i] = (byte) (outside[i] ? 0 : 255);
    }
    return out;
  }

  @Test
  void ringBecomesDisk() {
    int w = 40;
    byte[] disk = new byte[w * w];
    Phantoms.disk(disk, w, w, 1, 1, 20, 20, 15);
    byte[] inner = new byte[w * w];
    Phantoms.disk(inner, w, w, 1, 1, 20, 20, 8);
    byte[] ring = disk.clone();
    for (int i = 0; i < ring.length; i++) {
      if (inner[i] != 0) {
        ring[i] = 0;
      }
    }
    assertThat(HoleFilling.fill(ring, w, w, 1)).isEqualTo(disk);
  }

  @Test
  void diagonalGapKeepsHoleClosedButOpeningToBorderIsNotFilled() {
    // A 4-connected background pixel enclosed by an 8-connected outline is a hole.
    byte[] diamond = {
      0, 0, 1, 0, 0,
      0, 1, 0, 1, 0,
      1, 0, 0, 0, 1,
      0, 1, 0, 1, 0,
      0, 0, 1, 0, 0
    };
    byte[] filled = HoleFilling.fill(diamond, 5, 5, 1);
    assertThat(filled[2 + 5 * 2]).isEqualTo((byte) 255);
    assertThat(filled[1 + 5 * 2]).isEqualTo((byte) 255);
    assertThat(filled[0]).isEqualTo((byte) 0);
    // A U shape open to the image border has no hole.
    byte[] cup = {
      1, 0, 1,
      1, 0, 1,
      1, 1, 1
    };
    assertThat(HoleFilling.fill(cup, 3, 3, 1)[1]).isZero();
    assertThat(HoleFilling.fill(cup, 3, 3, 1)[4]).isZero();
  }

  @Test
  void hollowBallIsFilledButTubeOpenToLastPlaneIsNot() {
    int w = 20;
    int d = 12;
    byte[] ball = new byte[w * w * d];
    Phantoms.ball(ball, w, w, d, 1, 1, 2, 10, 10, 12, 8);
    byte[] core = new byte[ball.length];
    Phantoms.ball(core, w, w, d, 1, 1, 2, 10, 10, 12, 4);
    byte[] hollow = ball.clone();
    for (int i = 0; i < core.length; i++) {
      if (core[i] != 0) {
        hollow[i] = 0;
      }
    }
    assertThat(HoleFilling.fill(hollow, w, w, d)).isEqualTo(ball);

    // A ring on every plane: a tube whose inside reaches the first and last plane.
    byte[] tube = new byte[w * w * d];
    byte[] ring = new byte[w * w];
    Phantoms.disk(ring, w, w, 1, 1, 10, 10, 8);
    byte[] hole = new byte[w * w];
    Phantoms.disk(hole, w, w, 1, 1, 10, 10, 4);
    for (int z = 0; z < d; z++) {
      for (int i = 0; i < w * w; i++) {
        tube[i + w * w * z] = (byte) (ring[i] != 0 && hole[i] == 0 ? 255 : 0);
      }
    }
    assertThat(HoleFilling.fill(tube, w, w, d)).isEqualTo(tube);
    // The same plane alone is a ring, and its hole is filled.
    byte[] plane = java.util.Arrays.copyOfRange(tube, 0, w * w);
    assertThat(Phantoms.count(HoleFilling.fill(plane, w, w, 1))).isEqualTo(Phantoms.count(ring));
  }
}
